#pragma once
// Everything the Brownian-dynamics engine needs that does not change during a run: the
// medium, the species-pair interactions (tabulated), capture and cutoff gaps, the time
// step and the seed. Built once from a Scenario (engine_setup.hpp); immutable and shared
// (read-only) by every thread and by several engines in tests.
#include <cstdint>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "potentials/radius_free_interaction.hpp"
#include "potentials/tabulated_interaction.hpp"
#include "sim/pair_kind.hpp"
#include "sim/time_step_rule.hpp"

namespace brownfloc::sim {

enum class ClusterMobility { hydrodynamic_radius, free_draining };

struct EngineModel {
    double temperature_K = 0, viscosity_Pa_s = 0, kT_J = 0;
    double min_gap_m = 0;
    std::size_t species_count = 1;
    std::vector<std::string> species_names;
    std::vector<double> species_median_radius_m;

    // One PairKind per unordered species pair, index pair_index(i, j).
    std::vector<PairKind> pair_kinds;
    // Monodisperse species: one table per interacting pair kind (empty optional otherwise).
    std::vector<std::optional<potentials::TabulatedInteraction>> pair_tables;
    // Polydisperse (any radius_spread > 0): radius-free tables, per-species Hamaker constant
    // and double-layer potential; the pair kind still gives capture and cutoff gaps.
    std::shared_ptr<const potentials::RadiusFreeInteraction> radius_free;
    std::vector<double> species_hamaker_J, species_double_layer_potential_V;
    bool any_interaction = false;

    ClusterMobility cluster_mobility = ClusterMobility::hydrodynamic_radius;
    bool reversible = false;  // also count geometric (secondary-minimum) clusters

    TimeStep time_step;
    double skin_m = 0;  // Verlet-list skin
    std::uint64_t seed = 1;
    // Loops over fewer particles (or bodies) than this run on one thread: the fork and
    // barrier would cost more than the work, and far more when the cores are shared.
    // Results do not depend on it (tests lower it to exercise threads on small systems).
    std::int64_t parallel_min_items = 8192;

    [[nodiscard]] std::size_t pair_index(std::size_t i, std::size_t j) const {
        if (i > j) std::swap(i, j);
        return i * species_count - i * (i + 1) / 2 + j;
    }
    [[nodiscard]] const PairKind& pair_kind(std::size_t i, std::size_t j) const { return pair_kinds[pair_index(i, j)]; }
    [[nodiscard]] double max_cutoff_gap_m() const;
    [[nodiscard]] double max_capture_gap_m() const;
};

}  // namespace brownfloc::sim
