#pragma once
// Watches an Engine run and turns it into results: the timeseries rows and size
// distributions at each output, the cluster-number history and the species-pair exposures
// for the early-time rate fits, and at the end the cluster table and the fractal fit.
// Reads the engine between steps only; everything recorded is a pure function of the
// engine's state, so of (scenario, seed).
#include <cstdint>
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "analysis/fractal_fit.hpp"
#include "analysis/size_statistics.hpp"
#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/rate_fit.hpp"

namespace brownfloc::sim {

struct ClusterRow {
    std::uint32_t cluster_id = 0;
    std::int64_t size = 0;
    std::optional<double> radius_of_gyration_nm;  // empty when the cluster spans the box
    std::optional<double> hydrodynamic_radius_nm;
    bool spans_box = false;
    std::vector<std::int64_t> per_species;
};

struct PairRate {
    std::size_t species_i = 0, species_j = 0;
    std::int64_t monomer_events = 0;
    double exposure_s_per_m3 = 0;
    RateEstimate rate;
    double log_stability_ratio_at_capture = 0;
    double fast_rate_m3_per_s = 0;
};

// What a RunRecorder has accumulated (for checkpoints): with the engine's state, enough to
// continue recording bit for bit.
struct RecorderState {
    std::vector<CountSample> counts;
    bool in_window = true;
    std::uint64_t captures_seen = 0;
    std::vector<std::int64_t> monomers, pair_events;
    std::vector<double> pair_exposure;
    double last_time_s = 0;
    analysis::SizeStatistics last{};
    std::optional<std::int64_t> last_geometric;
};

class RunRecorder {
public:
    RunRecorder(const RunPlan& plan, const Engine& engine);

    [[nodiscard]] RecorderState state() const;
    // Continues from a saved state (same plan); std::invalid_argument if it does not fit.
    void restore(const RecorderState& state);

    // Call after every step (cheap unless clusters formed).
    void after_step(const Engine& engine);
    // Writes one timeseries row and the size distribution at the engine's time.
    void write_output(const Engine& engine, std::ostream& timeseries, std::ostream& size_distribution);
    static void write_timeseries_header(std::ostream& out, bool reversible);
    static void write_size_distribution_header(std::ostream& out);

    // End of run.
    [[nodiscard]] std::vector<ClusterRow> cluster_rows(const Engine& engine) const;
    [[nodiscard]] RateFit total_rate() const;
    [[nodiscard]] std::vector<PairRate> pair_rates() const;
    [[nodiscard]] analysis::FractalFit fractal(const std::vector<ClusterRow>& rows) const;
    [[nodiscard]] analysis::SizeStatistics last_statistics() const { return last_; }
    [[nodiscard]] std::optional<std::int64_t> last_geometric_clusters() const { return last_geometric_; }
    [[nodiscard]] double contact_distance_m() const { return contact_distance_m_; }
    [[nodiscard]] double relative_diffusion_m2_per_s() const { return relative_diffusion_m2_per_s_; }
    [[nodiscard]] double reference_rate_m3_per_s() const { return reference_rate_m3_per_s_; }

private:
    [[nodiscard]] std::int64_t geometric_clusters(const Engine& engine) const;

    const RunPlan& plan_;
    double volume_m3_ = 0;
    std::int64_t n0_ = 0;
    double contact_distance_m_ = 0, relative_diffusion_m2_per_s_ = 0;
    double reference_rate_m3_per_s_ = 0;  // Smoluchowski with the Fuchs W at capture
    std::vector<CountSample> counts_;
    bool in_window_ = true;
    std::size_t captures_seen_ = 0;
    std::vector<std::int64_t> monomers_;  // per species
    std::vector<std::int64_t> pair_events_;
    std::vector<double> pair_exposure_;
    std::vector<double> pair_contact_m_, pair_diffusion_m2_per_s_;
    double last_time_s_ = 0;
    analysis::SizeStatistics last_{};
    std::optional<std::int64_t> last_geometric_;
};

}  // namespace brownfloc::sim
