#pragma once
// The DLVO interaction of one pair of spheres: van der Waals + electric double layer.
//
//   PairModel model{.radius1_m = 100e-9, .radius2_m = 100e-9, .hamaker_J = 1e-20,
//                   .surface_potential1_V = -0.03, .surface_potential2_V = -0.03};
//   PairInteraction pair(model, water_at(298.15), Electrolyte::from_salt("NaCl", 50));
//   double u_kT = pair.energy_kT(2e-9);
//
// Built once (it computes kappa and the effective potentials), then a pure, thread-safe
// function of the surface gap h [m].
#include "potentials/double_layer.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/energy_slope.hpp"
#include "potentials/medium.hpp"
#include "potentials/van_der_waals.hpp"

namespace brownfloc::potentials {

struct PairModel {
    double radius1_m = 0.0;
    double radius2_m = 0.0;
    double hamaker_J = 0.0;             // combined Hamaker constant across the medium
    double surface_potential1_V = 0.0;  // psi_0 (zeta is the usual, low, stand-in)
    double surface_potential2_V = 0.0;
    VdwForm vdw = VdwForm::hamaker_full;
    DoubleLayerModel double_layer = DoubleLayerModel::linear_superposition;
    SuperpositionGeometry superposition_geometry = SuperpositionGeometry::sphere;
    bool include_double_layer = true;  // false: van der Waals alone (the "fast" reference)
};

class PairInteraction {
public:
    // Requires radii > 0 and, when the double layer is on, ionic strength > 0 (asserted;
    // validate inputs before building).
    PairInteraction(const PairModel& model, const Medium& medium, const Electrolyte& electrolyte);

    [[nodiscard]] EnergySlope van_der_waals(double h_m) const;
    [[nodiscard]] EnergySlope double_layer(double h_m) const;
    [[nodiscard]] EnergySlope total(double h_m) const;
    [[nodiscard]] double energy_J(double h_m) const { return total(h_m).energy_J; }
    [[nodiscard]] double energy_kT(double h_m) const { return total(h_m).energy_J / kT_J_; }
    // Force along the centre line, -dU/dh [N]; positive when repulsive.
    [[nodiscard]] double force_N(double h_m) const { return -total(h_m).slope_J_per_m; }

    // The same pair without the double layer (van der Waals only).
    [[nodiscard]] PairInteraction van_der_waals_only() const;

    [[nodiscard]] const PairModel& model() const { return model_; }
    [[nodiscard]] const Medium& medium() const { return medium_; }
    [[nodiscard]] double kT_J() const { return kT_J_; }
    [[nodiscard]] double kappa_per_m() const { return kappa_per_m_; }
    [[nodiscard]] double effective_potential1_V() const { return psi1_eff_V_; }
    [[nodiscard]] double effective_potential2_V() const { return psi2_eff_V_; }
    [[nodiscard]] double radius1_m() const { return model_.radius1_m; }
    [[nodiscard]] double radius2_m() const { return model_.radius2_m; }
    // Whether U is identically zero (no Hamaker constant and no double layer).
    [[nodiscard]] bool is_zero() const;

private:
    PairModel model_;
    Medium medium_;
    double kT_J_ = 0.0;
    double kappa_per_m_ = 0.0;
    double permittivity_F_per_m_ = 0.0;
    double psi1_eff_V_ = 0.0, psi2_eff_V_ = 0.0;
};

}  // namespace brownfloc::potentials
