#pragma once
// Surface charge density and surface potential of a flat double layer in equilibrium with a
// bulk electrolyte: the Grahame equation of the nonlinear Poisson-Boltzmann theory (Grahame
// 1947, Chem. Rev. 41, 441; any mixture of ions, e.g. Hunter, Foundations of Colloid Science,
// 2nd ed. 2001, ch. 7 [memory for the chapter]):
//
//   sigma^2 = 2 eps kT sum_i n_i (exp(-z_i e psi0 / kT) - 1),   sigma with the sign of psi0,
//
// n_i the bulk number densities [1/m^3]. For a symmetric z:z salt it reduces to
// sigma = sqrt(8 eps kT n) sinh(z e psi0 / 2kT), and for small potentials to sigma = eps kappa psi0.
// Flat plates: good for spheres with kappa a >> 1 (curvature adds a relative correction of
// order 1/(kappa a)); said wherever it is used. Holding the charge fixed while temperature or
// salt changes means solving this equation for psi0 at the new conditions.
#include "potentials/electrolyte.hpp"
#include "potentials/medium.hpp"

namespace brownfloc::potentials {

// sigma [C/m^2] of a surface at potential psi0 [V] in this electrolyte and medium.
[[nodiscard]] double grahame_surface_charge_C_per_m2(double surface_potential_V, const Electrolyte& electrolyte,
                                                     const Medium& medium);

// The surface potential [V] that carries charge density sigma [C/m^2] (the inverse of the
// above; sigma(psi0) is strictly increasing). Throws InputError for an electrolyte without ions
// (no potential carries a non-zero charge then) or a non-finite sigma.
[[nodiscard]] double grahame_surface_potential_V(double surface_charge_C_per_m2, const Electrolyte& electrolyte,
                                                 const Medium& medium);

}  // namespace brownfloc::potentials
