#pragma once
// How the z-average diameter of the "z-average-growth" criterion is "measured": the optics
// that weight each cluster size by its scattered intensity, and, for Rayleigh–Gans–Debye,
// the instrument's angle, wavelength and medium. Input keys carry the same names.
//
//   ScatteringSetup setup;                           // "rayleigh": I_k ∝ k², conservative
//   setup.optics = optics_from_name("rgd");          // Rayleigh–Gans–Debye at the angle below
//   setup.scattering_angle_deg = 173.0;              // a back-scatter instrument
//   double q_per_m = scattering_vector_per_m(setup); // 4π n sin(θ/2) / λ
//
// Pure functions; thread-safe.
#include <string_view>

namespace brownfloc::shelf {

enum class Optics {
    rayleigh,  // "rayleigh": I_k ∝ k² (small clusters; the largest weight on big clusters)
    rgd,       // "rgd": Rayleigh–Gans–Debye, I_k ∝ k² P_sphere(qa) S_k(q)
};

struct ScatteringSetup {
    Optics optics = Optics::rayleigh;
    // rgd only (ignored and not checked for rayleigh). Defaults: a 90° instrument with a
    // He–Ne laser in water (n = 1.33 near room temperature, common practice).
    double scattering_angle_deg = 90.0;    // θ, in (0, 180]
    double wavelength_nm = 633.0;          // λ in vacuum, > 0
    double medium_refractive_index = 1.33; // n of the medium, >= 1
};

// "rayleigh" or "rgd"; anything else throws std::invalid_argument naming the allowed names.
[[nodiscard]] Optics optics_from_name(std::string_view name);
[[nodiscard]] std::string_view optics_name(Optics optics);

// Throws std::invalid_argument naming the key, its value and what is allowed, for an rgd
// setup out of range, and for a fractal dimension d_f outside [1, 3] (any optics).
void validate_scattering(const ScatteringSetup& setup, double fractal_dimension);

// Scattering vector q = 4π n sin(θ/2) / λ [1/m] of a validated setup (rayleigh or rgd alike).
[[nodiscard]] double scattering_vector_per_m(const ScatteringSetup& setup);

}  // namespace brownfloc::shelf
