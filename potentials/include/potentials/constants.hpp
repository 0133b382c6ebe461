#pragma once
// Physical constants, SI. CODATA 2018 (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010):
// k_B, e and N_A are exact by the 2019 SI definition; epsilon_0 is the 2018 recommended value.
namespace brownfloc::potentials::constants {

inline constexpr double boltzmann_J_per_K = 1.380649e-23;
inline constexpr double elementary_charge_C = 1.602176634e-19;
inline constexpr double avogadro_per_mol = 6.02214076e23;
inline constexpr double vacuum_permittivity_F_per_m = 8.8541878128e-12;
inline constexpr double pi = 3.14159265358979323846;
inline constexpr double zero_celsius_K = 273.15;

}  // namespace brownfloc::potentials::constants
