#pragma once
// Far-field ("effective") potential of a charged flat surface in any electrolyte, from the
// first integral of the nonlinear planar Poisson-Boltzmann equation. Far from the surface
// the potential decays as psi_eff exp(-kappa x); psi_eff replaces psi_0 in the linear
// superposition approximation (Bell, Levine & McCartney 1970; Gregory 1975).
//
// In reduced units y = e psi / kT the first integral reads (dy/dx)^2 = kappa^2 F(y) with
// F(y) = 2 sum n_i (exp(-z_i y) - 1) / sum n_i z_i^2, hence
//   ln(Y_eff / y0) = integral_0^y0 [ 1/sqrt(F(y)) - 1/y ] dy,
// one smooth 1-D quadrature. For a z:z salt Y_eff = (4/z) tanh(z y0 / 4) (Verwey &
// Overbeek 1948); for a 2:1 salt it equals Ohshima, Healy & White's closed form (1982).
#include "potentials/electrolyte.hpp"
#include "potentials/medium.hpp"

namespace brownfloc::potentials {

// Effective far-field potential [V] of a surface at surface_potential_V. Exact to ~1e-12
// relative (adaptive Gauss-Kronrod). Thread-safe. Requires ionic strength > 0.
[[nodiscard]] double effective_surface_potential_V(double surface_potential_V,
                                                   const Electrolyte& electrolyte,
                                                   const Medium& medium);

}  // namespace brownfloc::potentials
