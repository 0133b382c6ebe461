#pragma once
// Smoluchowski (1917), Z. Phys. Chem. 92, 129: diffusion-limited (fast) coagulation.
// Convention: dn_i/dt = -k_ij n_i n_j for i != j and dN/dt = -1/2 k N^2 for equal spheres,
// k = 4 pi (D1 + D2)(a1 + a2) with Stokes-Einstein D = kT / (6 pi eta a).
namespace brownfloc::potentials {

// Fast collision rate constant [m^3/s]: (2kT/3 eta)(a1+a2)^2/(a1 a2); 8kT/(3 eta) for a1 = a2.
[[nodiscard]] double fast_rate_m3_per_s(double a1_m, double a2_m, double temperature_K,
                                        double viscosity_Pa_s);

// Fast half-life [s] of the total particle count at number density n0: 2 / (k n0).
[[nodiscard]] double fast_half_life_s(double rate_m3_per_s, double number_density_per_m3);

// Stokes-Einstein diffusion coefficient [m^2/s].
[[nodiscard]] double stokes_einstein_m2_per_s(double radius_m, double temperature_K,
                                              double viscosity_Pa_s);

}  // namespace brownfloc::potentials
