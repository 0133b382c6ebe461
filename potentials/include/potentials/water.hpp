#pragma once
// Properties of liquid water at 0.1 MPa versus temperature. Thread-safe pure functions.
namespace brownfloc::potentials {

// Range in which both correlations below are used by brownfloc (liquid water at 0.1 MPa).
inline constexpr double water_min_temperature_K = 273.15;
inline constexpr double water_max_temperature_K = 373.15;

// Shear viscosity [Pa s] at temperature_K. Patek, Hruby, Klomfar, Souckova & Harvey (2009),
// J. Phys. Chem. Ref. Data 38, 21 (0.1 MPa, 253-383 K).
[[nodiscard]] double water_viscosity_Pa_s(double temperature_K);

// Relative permittivity (dimensionless) at temperature_K. Malmberg & Maryott (1956),
// J. Res. NBS 56, 1 (0-100 degC).
[[nodiscard]] double water_relative_permittivity(double temperature_K);

// Density [kg/m^3] of air-free water at 0.1 MPa. Tanaka, Girard, Davis, Peuto & Bignell
// (2001), Metrologia 38, 301, eq. 1 (0-40 degC; 997.05 at 25 degC; coefficients from memory).
// Beyond 40 degC the fit is extrapolated: about 0.1 % low near 60 degC, a few tenths of a
// per cent near 100 degC (common practice for a buoyancy estimate, not metrology).
[[nodiscard]] double water_density_kg_per_m3(double temperature_K);

}  // namespace brownfloc::potentials
