#pragma once
// Per-size optics and hydrodynamics of the clusters that make up the z-average diameter:
// scattered intensity (relative to a single primary sphere at the same angle) and the
// hydrodynamic radius, both in units of the primary sphere radius a. The size classes are
//   k = 1     a sphere;
//   k = 2     a doublet at contact (centres 2a apart);
//   k = 3     the average of a linear chain and an equilateral triangle at contact, because
//             the constant kernel does not say which forms (we average S_3 and R_h,3);
//   k >= 4    a mass fractal with R_g = R_h = a k^(1/d_f) (d_f = 2.1 by default, slow,
//             reaction-limited aggregation; PHYSICS.md "Clusters"). The prefactor 1 is the
//             issue's choice; R_g here does not add each sphere's own (3/5)a².
//
// Pure functions; thread-safe.
#include "shelf_criteria/scattering_setup.hpp"

namespace brownfloc::shelf {

// Squared form factor of a homogeneous sphere in the Rayleigh–Gans–Debye limit,
// P(x) = [3 (sin x - x cos x) / x³]², x = q a >= 0 (dimensionless). Bohren & Huffman (1983),
// "Absorption and Scattering of Light by Small Particles", sec. 6.1 [memory for the section].
// It multiplies every cluster's intensity alike and cancels from the z-average, so its
// zeros (x ≈ 4.493, ...) do no harm there.
[[nodiscard]] double sphere_form_factor(double qa);

// Structure factor S_k(q) = I_k / (k² I_1) of a k-cluster, qa >= 0. k = 2, 3 by the Debye
// sum (1/k²) Σ_ij sin(q r_ij)/(q r_ij) over the rigid forms above; k >= 4 by the
// Fisher & Burford (1967), Phys. Rev. 156, 583, form S = [1 + 2 q² R_g² / (3 d_f)]^(-d_f/2),
// which has the Guinier limit 1 - q² R_g²/3. 0 < S_k <= 1; S_1 = 1. d_f in [1, 3].
[[nodiscard]] double cluster_structure_factor(int k, double qa, double fractal_dimension);

// I_k / I_1, the intensity scattered by a k-cluster relative to a single sphere:
// k² for Optics::rayleigh, k² S_k(q) for Optics::rgd (P_sphere cancels). k >= 1.
[[nodiscard]] double cluster_intensity_over_primary(int k, Optics optics, double qa,
                                                    double fractal_dimension);

// R_h,k / a. k = 2, 3 from Kirkwood's formula for rigid bead clusters (Kirkwood 1954,
// J. Polym. Sci. 12, 1; PHYSICS.md "Clusters"): 1/R_h = 1/(N a) + (1/N²) Σ_{i≠j} 1/r_ij,
// which gives 4/3 for the doublet; k = 3 is the mean of the linear chain (18/11) and the
// triangle (3/2), 69/44. k >= 4: k^(1/d_f). Increasing in k for every d_f in [1, 3].
[[nodiscard]] double cluster_hydrodynamic_radius_over_a(int k, double fractal_dimension);

}  // namespace brownfloc::shelf
