#pragma once
// van der Waals attraction between two spheres of radii a1, a2 [m] at surface gap h [m],
// Hamaker constant A [J]. Thread-safe pure functions.
#include "potentials/energy_slope.hpp"

namespace brownfloc::potentials {

enum class VdwForm {
    hamaker_full,      // Hamaker (1937), Physica 4, 1058: exact for non-retarded pairwise sums
    derjaguin,         // small-gap limit -A a1 a2 / (6 h (a1+a2)); for comparison with textbooks
    gregory_retarded,  // Gregory (1981), J. Colloid Interface Sci. 83, 138 (Derjaguin-based)
};

// Hamaker (1937), unequal spheres. Written in x = 4 a1 a2 / (r^2 - (a1-a2)^2) so that
// r^2 - (a1+a2)^2 = h (2(a1+a2) + h) never cancels near contact and the far field
// -(16/9) A a1^3 a2^3 / r^6 comes from a series, not from cancelling logarithms.
[[nodiscard]] EnergySlope vdw_hamaker_full(double hamaker_J, double a1_m, double a2_m, double h_m);

// dU/dh of the full Hamaker form alone (no logarithm): A x^3 r q / (6 p^2), for force loops.
[[nodiscard]] double vdw_hamaker_full_slope(double hamaker_J, double a1_m, double a2_m, double h_m);

// Derjaguin limit of the above: -A a1 a2 / (6 h (a1 + a2)).
[[nodiscard]] EnergySlope vdw_derjaguin(double hamaker_J, double a1_m, double a2_m, double h_m);

// Retarded attraction as published by Gregory (1981) [equation number not checked]:
// U = -(A R / 6h) [1 - (b h / lambda) ln(1 + lambda / (b h))], R = a1 a2/(a1+a2),
// b = 5.32, lambda = 100 nm (characteristic wavelength of the dispersion interaction).
// Built on the Derjaguin form: good to about 10 % while h < 0.1 a.
[[nodiscard]] EnergySlope vdw_gregory_retarded(double hamaker_J, double a1_m, double a2_m, double h_m);

// The radius-free part of Gregory's form: {f(h)/h [1/m], d(f/h)/dh [1/m^2]} in the fields of
// an EnergySlope, so that U = -(A R / 6) f/h.
[[nodiscard]] EnergySlope gregory_kernel(double h_m);
// Gregory's U and dU/dh from that kernel (computed or tabulated): -(A R / 6) times it.
[[nodiscard]] EnergySlope vdw_gregory_from_kernel(double hamaker_J, double a1_m, double a2_m, const EnergySlope& kernel);

inline constexpr double gregory_b = 5.32;
inline constexpr double gregory_lambda_m = 100e-9;

[[nodiscard]] EnergySlope van_der_waals(VdwForm form, double hamaker_J, double a1_m, double a2_m,
                                        double h_m);

}  // namespace brownfloc::potentials
