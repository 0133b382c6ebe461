#include "potentials/radius_free_interaction.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>

#include "potentials/effective_potential.hpp"

namespace brownfloc::potentials {
namespace {

// Kernels of the double layer as functions of h alone (see the header).
std::array<double, 4> double_layer_kernels(DoubleLayerModel model, double kappa, double h) {
    if (model == DoubleLayerModel::linear_superposition) return {std::exp(-kappa * h), 0.0, 0.0, 0.0};
    const HhfKernels k = hhf_kernels(kappa, h);
    return {k.dk1_dh, k.dk2_dh, k.k1, k.k2};
}

// Gregory (1981) with the radius factor taken out: {d(f/h)/dh, f/h}.
std::array<double, 2> gregory_kernels(double h) {
    const EnergySlope k = gregory_kernel(h);
    return {k.slope_J_per_m, k.energy_J};
}

}  // namespace

RadiusFreeInteraction::RadiusFreeInteraction(VdwForm vdw, DoubleLayerModel double_layer, const Medium& medium,
                                             const Electrolyte& electrolyte, double start_gap_m, double end_gap_m)
    : vdw_(vdw), model_(double_layer), medium_(medium), electrolyte_(electrolyte),
      kappa_per_m_(electrolyte.inverse_debye_length_per_m(medium)),
      permittivity_F_per_m_(medium.permittivity_F_per_m()),
      double_layer_([&](double h) { return double_layer_kernels(double_layer, kappa_per_m_, h); }, start_gap_m,
                    end_gap_m) {
    assert(kappa_per_m_ > 0);
    if (vdw == VdwForm::gregory_retarded) retarded_.emplace(gregory_kernels, start_gap_m, end_gap_m);
}

double RadiusFreeInteraction::double_layer_potential_V(double surface_potential_V) const {
    return model_ == DoubleLayerModel::linear_superposition
               ? effective_surface_potential_V(surface_potential_V, electrolyte_, medium_)
               : surface_potential_V;
}

EnergySlope RadiusFreeInteraction::double_layer_term(double h, const PairSurfaces& p) const {
    const std::array<double, 4> k = double_layer_.values(h);
    if (model_ == DoubleLayerModel::linear_superposition)
        return superposition_from_exponential(permittivity_F_per_m_, kappa_per_m_, p.potential1_V, p.potential2_V,
                                              p.radius1_m, p.radius2_m, h, k[0], SuperpositionGeometry::sphere);
    return hhf_from_kernels(permittivity_F_per_m_, p.potential1_V, p.potential2_V, p.radius1_m, p.radius2_m,
                            {k[2], k[3], k[0], k[1]}, model_);
}

EnergySlope RadiusFreeInteraction::total(double h_m, const PairSurfaces& p) const {
    if (h_m >= end_gap_m()) return {};
    const double h = std::max(h_m, start_gap_m());  // held at start_gap below it, like the tables
    EnergySlope out;
    switch (vdw_) {
        case VdwForm::hamaker_full: out = vdw_hamaker_full(p.hamaker_J, p.radius1_m, p.radius2_m, h); break;
        case VdwForm::derjaguin: out = vdw_derjaguin(p.hamaker_J, p.radius1_m, p.radius2_m, h); break;
        case VdwForm::gregory_retarded: {
            const std::array<double, 2> g = retarded_->values(h);
            out = vdw_gregory_from_kernel(p.hamaker_J, p.radius1_m, p.radius2_m, {g[1], g[0]});
            break;
        }
    }
    out += double_layer_term(h, p);
    return out;
}

double RadiusFreeInteraction::force_N(double h_m, const PairSurfaces& p) const {
    // The full Hamaker slope needs no logarithm; the other forms are cheap through total().
    if (vdw_ != VdwForm::hamaker_full) return -total(h_m, p).slope_J_per_m;
    if (h_m >= end_gap_m()) return 0.0;
    const double h = std::max(h_m, start_gap_m());
    return -(vdw_hamaker_full_slope(p.hamaker_J, p.radius1_m, p.radius2_m, h) + double_layer_term(h, p).slope_J_per_m);
}

}  // namespace brownfloc::potentials
