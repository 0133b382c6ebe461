#pragma once
// The DLVO interaction of any pair of radii from tables of radius-free kernels, for
// dispersions whose radii vary continuously (polydisperse species, mixtures).
//
// Only functions of the gap h alone are tabulated (GapTable): exp(-kappa h) for linear
// superposition, the Hogg-Healy-Fuerstenau kernels ln((1+e)/(1-e)), ln(1-e^2) and their
// h-derivatives for constant potential/charge, and Gregory's f(h)/h and its derivative. The
// radius-dependent factors (a1 a2/(a1+a2+h), a1 a2/(a1+a2)) and the full Hamaker form, which
// is cheap and needs no logarithm for the force, stay analytic. So no radius is binned and
// the look-up error is that of the tables: |F - F_exact| <= 1e-6 max(|F|, kappa kT) for any
// radii (tested on log-normal radius pairs).
//
//   RadiusFreeInteraction table(VdwForm::hamaker_full, DoubleLayerModel::linear_superposition,
//                               medium, electrolyte, 0.3e-9, 60e-9);
//   const double psi = table.double_layer_potential_V(-0.03);   // once per particle
//   double f = table.force_N(h, {a1, a2, hamaker, psi, psi});
//
// Immutable after construction; thread-safe and reproducible look-ups.
#include <optional>

#include "potentials/double_layer.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/energy_slope.hpp"
#include "potentials/gap_table.hpp"
#include "potentials/medium.hpp"
#include "potentials/van_der_waals.hpp"

namespace brownfloc::potentials {

struct PairSurfaces {
    double radius1_m = 0, radius2_m = 0;
    double hamaker_J = 0;      // of this pair across the medium
    double potential1_V = 0;   // as returned by double_layer_potential_V
    double potential2_V = 0;
};

class RadiusFreeInteraction {
public:
    RadiusFreeInteraction(VdwForm vdw, DoubleLayerModel double_layer, const Medium& medium,
                          const Electrolyte& electrolyte, double start_gap_m, double end_gap_m);

    // The potential [V] that enters the double-layer form for a surface at surface_potential_V:
    // the far-field potential for linear superposition, the surface potential otherwise.
    [[nodiscard]] double double_layer_potential_V(double surface_potential_V) const;

    // U and dU/dh at gap h_m. Beyond end_gap: zero; below start_gap: the start_gap values.
    [[nodiscard]] EnergySlope total(double h_m, const PairSurfaces& pair) const;
    // -dU/dh [N], positive when repulsive; the same as -total().slope_J_per_m without the
    // energy's logarithms.
    [[nodiscard]] double force_N(double h_m, const PairSurfaces& pair) const;

    [[nodiscard]] double kappa_per_m() const { return kappa_per_m_; }
    [[nodiscard]] double start_gap_m() const { return double_layer_.start_gap_m(); }
    [[nodiscard]] double end_gap_m() const { return double_layer_.end_gap_m(); }

private:
    [[nodiscard]] EnergySlope double_layer_term(double h_m, const PairSurfaces& pair) const;

    VdwForm vdw_;
    DoubleLayerModel model_;
    Medium medium_;
    Electrolyte electrolyte_;
    double kappa_per_m_, permittivity_F_per_m_;
    // Linear superposition: {exp(-kappa h), 0, 0, 0}. Constant potential/charge:
    // {dK1/dh, dK2/dh, K1, K2} with K1 = ln((1+e)/(1-e)), K2 = ln(1-e^2), e = exp(-kappa h).
    GapTable<4> double_layer_;
    // Gregory (1981): {d(f/h)/dh, f/h}; only with the retarded form.
    std::optional<GapTable<2>> retarded_;
};

}  // namespace brownfloc::potentials
