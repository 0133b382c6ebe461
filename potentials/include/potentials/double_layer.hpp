#pragma once
// Electric double-layer repulsion between two spheres (radii a1, a2 [m], surface gap h [m])
// in an electrolyte of inverse Debye length kappa [1/m] and permittivity eps [F/m].
// Thread-safe pure functions; potentials in volts.
#include "potentials/energy_slope.hpp"

namespace brownfloc::potentials {

enum class DoubleLayerModel {
    linear_superposition,  // Bell, Levine & McCartney (1970); Gregory (1975): weak overlap, any psi
    constant_potential,    // Hogg, Healy & Fuerstenau (1966): Debye-Hueckel, Derjaguin
    constant_charge,       // Wiese & Healy (1970); Usui (1973): Debye-Hueckel, Derjaguin
};

// Sphere geometry factor of the linear superposition form.
enum class SuperpositionGeometry {
    sphere,     // a1 a2 / (a1 + a2 + h): Bell, Levine & McCartney (1970), any kappa a
    derjaguin,  // a1 a2 / (a1 + a2): the Derjaguin limit (for checks against closed forms)
};

// U = 4 pi eps psi1_eff psi2_eff G exp(-kappa h), with psi_eff the far-field potentials
// (effective_potential.hpp). For z:z, 4 pi eps psi_eff^2 = 64 pi eps (kT/ze)^2 gamma^2.
[[nodiscard]] EnergySlope double_layer_superposition(double permittivity_F_per_m, double kappa_per_m,
                                                     double psi1_eff_V, double psi2_eff_V,
                                                     double a1_m, double a2_m, double h_m,
                                                     SuperpositionGeometry geometry);

// Hogg, Healy & Fuerstenau (1966), Trans. Faraday Soc. 62, 1638 [equation number not checked]:
// U = pi eps R [2 psi1 psi2 ln((1+e^-kh)/(1-e^-kh)) + (psi1^2+psi2^2) ln(1-e^-2kh)],
// R = a1 a2 / (a1 + a2). Low potentials (<~ 25-50 mV), kappa a >~ 5-10.
[[nodiscard]] EnergySlope double_layer_constant_potential(double permittivity_F_per_m, double kappa_per_m,
                                                          double psi1_V, double psi2_V,
                                                          double a1_m, double a2_m, double h_m);

// Wiese & Healy (1970), Trans. Faraday Soc. 66, 490: the same with -(psi1^2+psi2^2) ln(1-e^-2kh).
// psi are the isolated-particle potentials. Diverges as h -> 0.
[[nodiscard]] EnergySlope double_layer_constant_charge(double permittivity_F_per_m, double kappa_per_m,
                                                       double psi1_V, double psi2_V,
                                                       double a1_m, double a2_m, double h_m);

// The radius-free parts of the forms above, shared with the tables of
// radius_free_interaction.hpp.

// Superposition with exp(-kappa h) supplied by the caller (computed or tabulated).
[[nodiscard]] EnergySlope superposition_from_exponential(double permittivity_F_per_m, double kappa_per_m,
                                                         double psi1_eff_V, double psi2_eff_V, double a1_m,
                                                         double a2_m, double h_m, double exp_minus_kappa_h,
                                                         SuperpositionGeometry geometry);

// Hogg-Healy-Fuerstenau kernels of h alone, e = exp(-kappa h): K1 = ln((1+e)/(1-e)),
// K2 = ln(1-e^2) (dimensionless) and their h-derivatives [1/m].
struct HhfKernels {
    double k1 = 0, k2 = 0, dk1_dh = 0, dk2_dh = 0;
};
[[nodiscard]] HhfKernels hhf_kernels(double kappa_per_m, double h_m);

// pi eps R [2 psi1 psi2 K1 +- (psi1^2+psi2^2) K2], + for constant potential, - for constant
// charge; `model` must be one of those two.
[[nodiscard]] EnergySlope hhf_from_kernels(double permittivity_F_per_m, double psi1_V, double psi2_V,
                                           double a1_m, double a2_m, const HhfKernels& kernels,
                                           DoubleLayerModel model);

}  // namespace brownfloc::potentials
