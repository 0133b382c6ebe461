#pragma once
// Closed-form Smoluchowski (1917), Z. Phys. Chem. 92, 129, solutions of irreversible
// coagulation, the references a simulated aggregation run is compared against. SI units;
// convention dN/dt = -1/2 k N^2 on number densities (potentials/kinetics.hpp), so the
// half-life of the total count is tau = 2 / (k n0) (potentials::fast_half_life_s).
//
//   const double tau_s = potentials::fast_half_life_s(k_m3_per_s, n0_per_m3);
//   double total = constant_kernel_fraction(10.0, tau_s);            // N / N0 at 10 s
//   double doublets = constant_kernel_size_fraction(2, 10.0, tau_s);  // n_2 / N0
//
// Pure functions; thread-safe.
namespace brownfloc::sim {

// Total cluster count of the constant-kernel solution, N/N0 = 1/(1 + t/tau).
// t_s >= 0 [s], half_life_s > 0 [s].
[[nodiscard]] double constant_kernel_fraction(double t_s, double half_life_s);

// Clusters of k primary particles in the constant-kernel solution,
// n_k/N0 = (t/tau)^(k-1) / (1 + t/tau)^(k+1). k >= 1, t_s >= 0 [s], half_life_s > 0 [s].
[[nodiscard]] double constant_kernel_size_fraction(int k, double t_s, double half_life_s);

// N/N0 with Smoluchowski's time-dependent rate k(t) = k [1 + R / sqrt(pi D_rel t)], which
// integrates to 1/n - 1/n0 = (k/2) [t + 2 R sqrt(t / (pi D_rel))]. t_s >= 0 [s], rate > 0
// [m^3/s], n0 > 0 [1/m^3], contact distance R = a1 + a2 > 0 [m], relative diffusion
// D_rel = D1 + D2 > 0 [m^2/s] (+infinity drops the transient term).
[[nodiscard]] double transient_corrected_fraction(double t_s, double rate_m3_per_s, double n0_per_m3,
                                                  double contact_distance_m,
                                                  double relative_diffusion_m2_per_s);

// The integral of k(t')/k over [0, t] [s]: t + 2 R sqrt(t / (pi D_rel)); t when D_rel is
// +infinity. Shared by the closed form above and the rate fits (rate_fit.hpp).
[[nodiscard]] double transient_integrated_time_s(double t_s, double contact_distance_m,
                                                 double relative_diffusion_m2_per_s);

}  // namespace brownfloc::sim
