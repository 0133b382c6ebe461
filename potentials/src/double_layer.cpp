#include "potentials/double_layer.hpp"

#include <cassert>
#include <cmath>

#include "potentials/constants.hpp"

namespace brownfloc::potentials {

EnergySlope superposition_from_exponential(double permittivity_F_per_m, double kappa_per_m, double psi1_eff_V,
                                           double psi2_eff_V, double a1_m, double a2_m, double h_m,
                                           double exp_minus_kappa_h, SuperpositionGeometry geometry) {
    // Bell, Levine & McCartney (1970); Gregory (1975), J. Colloid Interface Sci. 51, 44:
    // U = 4 pi eps psi1 psi2 (a1 a2 / r) exp(-kappa h), r = a1 + a2 + h.
    const double r = geometry == SuperpositionGeometry::sphere ? a1_m + a2_m + h_m : a1_m + a2_m;
    const double u = 4.0 * constants::pi * permittivity_F_per_m * psi1_eff_V * psi2_eff_V * a1_m * a2_m / r *
                     exp_minus_kappa_h;
    const double dlnr = geometry == SuperpositionGeometry::sphere ? 1.0 / r : 0.0;
    return {u, -u * (kappa_per_m + dlnr)};
}

EnergySlope double_layer_superposition(double permittivity_F_per_m, double kappa_per_m,
                                       double psi1_eff_V, double psi2_eff_V, double a1_m,
                                       double a2_m, double h_m, SuperpositionGeometry geometry) {
    return superposition_from_exponential(permittivity_F_per_m, kappa_per_m, psi1_eff_V, psi2_eff_V, a1_m, a2_m,
                                          h_m, std::exp(-kappa_per_m * h_m), geometry);
}

HhfKernels hhf_kernels(double kappa_per_m, double h_m) {
    const double kh = kappa_per_m * h_m;
    const double e = std::exp(-kh);
    const double one_minus_e = -std::expm1(-kh);      // 1 - e without cancellation
    const double one_minus_e2 = -std::expm1(-2 * kh);  // 1 - e^2
    // ln((1+e)/(1-e)) = log1p(2e/(1-e)) and ln(1-e^2) = log1p(-e^2) keep full relative
    // precision when e is small (large kappa h), where the plain logarithms cancel.
    return {std::log1p(2.0 * e / one_minus_e), e < 0.5 ? std::log1p(-e * e) : std::log(one_minus_e2),
            -2.0 * kappa_per_m * e / one_minus_e2, 2.0 * kappa_per_m * e * e / one_minus_e2};
}

EnergySlope hhf_from_kernels(double permittivity_F_per_m, double psi1_V, double psi2_V, double a1_m, double a2_m,
                             const HhfKernels& k, DoubleLayerModel model) {
    // Constant potential and constant charge differ only in the sign of the second term.
    assert(model != DoubleLayerModel::linear_superposition);
    const double sign = model == DoubleLayerModel::constant_potential ? 1.0 : -1.0;
    const double prefactor = constants::pi * permittivity_F_per_m * a1_m * a2_m / (a1_m + a2_m);
    const double cross = 2.0 * psi1_V * psi2_V, squares = psi1_V * psi1_V + psi2_V * psi2_V;
    return {prefactor * (cross * k.k1 + sign * squares * k.k2), prefactor * (cross * k.dk1_dh + sign * squares * k.dk2_dh)};
}

EnergySlope double_layer_constant_potential(double permittivity_F_per_m, double kappa_per_m,
                                            double psi1_V, double psi2_V, double a1_m, double a2_m,
                                            double h_m) {
    return hhf_from_kernels(permittivity_F_per_m, psi1_V, psi2_V, a1_m, a2_m, hhf_kernels(kappa_per_m, h_m),
                            DoubleLayerModel::constant_potential);
}

EnergySlope double_layer_constant_charge(double permittivity_F_per_m, double kappa_per_m,
                                         double psi1_V, double psi2_V, double a1_m, double a2_m,
                                         double h_m) {
    return hhf_from_kernels(permittivity_F_per_m, psi1_V, psi2_V, a1_m, a2_m, hhf_kernels(kappa_per_m, h_m),
                            DoubleLayerModel::constant_charge);
}

}  // namespace brownfloc::potentials
