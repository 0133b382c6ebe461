#include "potentials/pair_interaction.hpp"

#include <cassert>

#include "potentials/effective_potential.hpp"

namespace brownfloc::potentials {

PairInteraction::PairInteraction(const PairModel& model, const Medium& medium,
                                 const Electrolyte& electrolyte)
    : model_(model), medium_(medium), kT_J_(medium.thermal_energy_J()),
      permittivity_F_per_m_(medium.permittivity_F_per_m()) {
    assert(model.radius1_m > 0 && model.radius2_m > 0);
    if (!model_.include_double_layer) return;
    kappa_per_m_ = electrolyte.inverse_debye_length_per_m(medium);
    assert(kappa_per_m_ > 0);
    if (model_.double_layer == DoubleLayerModel::linear_superposition) {
        psi1_eff_V_ = effective_surface_potential_V(model_.surface_potential1_V, electrolyte, medium);
        psi2_eff_V_ = effective_surface_potential_V(model_.surface_potential2_V, electrolyte, medium);
    } else {
        // Constant potential and constant charge stay Debye-Hueckel: the surface values enter.
        psi1_eff_V_ = model_.surface_potential1_V;
        psi2_eff_V_ = model_.surface_potential2_V;
    }
}

EnergySlope PairInteraction::van_der_waals(double h_m) const {
    return potentials::van_der_waals(model_.vdw, model_.hamaker_J, model_.radius1_m, model_.radius2_m, h_m);
}

EnergySlope PairInteraction::double_layer(double h_m) const {
    if (!model_.include_double_layer) return {};
    switch (model_.double_layer) {
        case DoubleLayerModel::linear_superposition:
            return double_layer_superposition(permittivity_F_per_m_, kappa_per_m_, psi1_eff_V_, psi2_eff_V_,
                                              model_.radius1_m, model_.radius2_m, h_m,
                                              model_.superposition_geometry);
        case DoubleLayerModel::constant_potential:
            return double_layer_constant_potential(permittivity_F_per_m_, kappa_per_m_, psi1_eff_V_,
                                                   psi2_eff_V_, model_.radius1_m, model_.radius2_m, h_m);
        case DoubleLayerModel::constant_charge:
            return double_layer_constant_charge(permittivity_F_per_m_, kappa_per_m_, psi1_eff_V_,
                                                psi2_eff_V_, model_.radius1_m, model_.radius2_m, h_m);
    }
    return {};
}

EnergySlope PairInteraction::total(double h_m) const {
    EnergySlope sum = van_der_waals(h_m);
    sum += double_layer(h_m);
    return sum;
}

PairInteraction PairInteraction::van_der_waals_only() const {
    PairInteraction copy = *this;
    copy.model_.include_double_layer = false;
    copy.kappa_per_m_ = 0.0;
    copy.psi1_eff_V_ = copy.psi2_eff_V_ = 0.0;
    return copy;
}

bool PairInteraction::is_zero() const {
    const bool superposition = model_.double_layer == DoubleLayerModel::linear_superposition;
    const bool no_double_layer = !model_.include_double_layer ||
                                 (psi1_eff_V_ == 0.0 && psi2_eff_V_ == 0.0) ||
                                 (superposition && psi1_eff_V_ * psi2_eff_V_ == 0.0);
    return model_.hamaker_J == 0.0 && no_double_layer;
}

}  // namespace brownfloc::potentials
