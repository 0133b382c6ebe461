#include "potentials/double_layer.hpp"

#include <cmath>

#include "potentials/constants.hpp"

namespace brownfloc::potentials {

EnergySlope double_layer_superposition(double permittivity_F_per_m, double kappa_per_m,
                                       double psi1_eff_V, double psi2_eff_V, double a1_m,
                                       double a2_m, double h_m, SuperpositionGeometry geometry) {
    // Bell, Levine & McCartney (1970); Gregory (1975), J. Colloid Interface Sci. 51, 44:
    // U = 4 pi eps psi1 psi2 (a1 a2 / r) exp(-kappa h), r = a1 + a2 + h.
    const double r = geometry == SuperpositionGeometry::sphere ? a1_m + a2_m + h_m : a1_m + a2_m;
    const double u = 4.0 * constants::pi * permittivity_F_per_m * psi1_eff_V * psi2_eff_V * a1_m *
                     a2_m / r * std::exp(-kappa_per_m * h_m);
    const double dlnr = geometry == SuperpositionGeometry::sphere ? 1.0 / r : 0.0;
    return {u, -u * (kappa_per_m + dlnr)};
}

namespace {

// Shared by the constant-potential and constant-charge forms (they differ in the sign of
// the second term): pi eps R [2 psi1 psi2 ln((1+e)/(1-e)) +- (psi1^2+psi2^2) ln(1-e^2)],
// e = exp(-kappa h), R = a1 a2 / (a1 + a2).
EnergySlope hogg_healy_fuerstenau(double permittivity_F_per_m, double kappa_per_m, double psi1_V,
                                  double psi2_V, double a1_m, double a2_m, double h_m,
                                  double second_sign) {
    const double reduced = a1_m * a2_m / (a1_m + a2_m);
    const double prefactor = constants::pi * permittivity_F_per_m * reduced;
    const double kh = kappa_per_m * h_m;
    const double e = std::exp(-kh);
    const double one_minus_e = -std::expm1(-kh);      // 1 - e without cancellation
    const double one_minus_e2 = -std::expm1(-2 * kh);  // 1 - e^2
    const double cross = 2.0 * psi1_V * psi2_V, squares = psi1_V * psi1_V + psi2_V * psi2_V;
    // ln((1+e)/(1-e)) = log1p(2e/(1-e)) and ln(1-e^2) = log1p(-e^2) keep full relative
    // precision when e is small (large kappa h), where the plain logarithms cancel.
    const double log_ratio = std::log1p(2.0 * e / one_minus_e);
    const double log_one_minus_e2 = e < 0.5 ? std::log1p(-e * e) : std::log(one_minus_e2);
    const double u = prefactor * (cross * log_ratio + second_sign * squares * log_one_minus_e2);
    const double slope = prefactor * kappa_per_m *
                         (-2.0 * cross * e + second_sign * 2.0 * squares * e * e) / one_minus_e2;
    return {u, slope};
}

}  // namespace

EnergySlope double_layer_constant_potential(double permittivity_F_per_m, double kappa_per_m,
                                            double psi1_V, double psi2_V, double a1_m, double a2_m,
                                            double h_m) {
    return hogg_healy_fuerstenau(permittivity_F_per_m, kappa_per_m, psi1_V, psi2_V, a1_m, a2_m, h_m, +1.0);
}

EnergySlope double_layer_constant_charge(double permittivity_F_per_m, double kappa_per_m,
                                         double psi1_V, double psi2_V, double a1_m, double a2_m,
                                         double h_m) {
    return hogg_healy_fuerstenau(permittivity_F_per_m, kappa_per_m, psi1_V, psi2_V, a1_m, a2_m, h_m, -1.0);
}

}  // namespace brownfloc::potentials
