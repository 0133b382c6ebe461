#include "sim/run_recorder.hpp"

#include <cmath>
#include <cstdio>
#include <stdexcept>

#include "analysis/cluster_geometry.hpp"
#include "analysis/union_find.hpp"
#include "potentials/constants.hpp"
#include "potentials/kinetics.hpp"
#include "sim/coagulation_reference.hpp"

namespace brownfloc::sim {

namespace {

std::string g17(double v) {
    char buf[40];
    std::snprintf(buf, sizeof buf, "%.17g", v);
    return buf;
}

}  // namespace

RunRecorder::RunRecorder(const RunPlan& plan, const Engine& engine) : plan_(plan) {
    const EngineModel& m = *plan.model;
    const double box = engine.box_length_m();
    volume_m3_ = box * box * box;
    n0_ = static_cast<std::int64_t>(engine.particle_count());
    const std::size_t ns = m.species_count;
    std::vector<double> fraction(ns, 0.0);
    monomers_.assign(ns, 0);
    for (std::uint32_t i = 0; i < engine.particle_count(); ++i) {
        fraction[engine.species(i)] += 1.0 / double(n0_);
        if (engine.body_size(engine.body_of(i)) == 1) ++monomers_[engine.species(i)];
    }
    pair_events_.assign(m.pair_kinds.size(), 0);
    pair_exposure_.assign(m.pair_kinds.size(), 0.0);
    pair_contact_m_.resize(m.pair_kinds.size());
    pair_diffusion_m2_per_s_.resize(m.pair_kinds.size());
    for (const PairKind& kind : m.pair_kinds) {
        const std::size_t k = m.pair_index(kind.species_i, kind.species_j);
        const double ai = m.species_median_radius_m[kind.species_i], aj = m.species_median_radius_m[kind.species_j];
        const double r = ai + aj + kind.capture_gap_m;
        const double d = potentials::stokes_einstein_m2_per_s(ai, m.temperature_K, m.viscosity_Pa_s) +
                         potentials::stokes_einstein_m2_per_s(aj, m.temperature_K, m.viscosity_Pa_s);
        pair_contact_m_[k] = r;
        pair_diffusion_m2_per_s_[k] = d;
        // Ordered pairs (i, j) and (j, i) both appear in the double sum.
        const double weight = fraction[kind.species_i] * fraction[kind.species_j] * (kind.species_i == kind.species_j ? 1.0 : 2.0);
        const double k_fast = potentials::fast_rate_m3_per_s(ai, aj, m.temperature_K, m.viscosity_Pa_s);
        contact_distance_m_ += weight * r;
        relative_diffusion_m2_per_s_ += weight * d;
        reference_rate_m3_per_s_ += weight * k_fast * std::exp(-kind.log_stability_ratio_at_capture);
    }
    counts_.push_back({engine.time_s(), static_cast<std::int64_t>(engine.bodies().size())});
    last_time_s_ = engine.time_s();
}

void RunRecorder::after_step(const Engine& engine) {
    const EngineModel& m = *plan_.model;
    const double t1 = engine.time_s();
    if (in_window_) {
        for (const PairKind& kind : m.pair_kinds) {
            const std::size_t k = m.pair_index(kind.species_i, kind.species_j);
            pair_exposure_[k] += pair_exposure_s_per_m3(monomers_[kind.species_i], monomers_[kind.species_j],
                                                        kind.species_i == kind.species_j, volume_m3_, last_time_s_, t1,
                                                        pair_contact_m_[k], pair_diffusion_m2_per_s_[k]);
        }
    }
    last_time_s_ = t1;
    const auto& captures = engine.captures();
    if (captures.size() == captures_seen_) return;
    for (; captures_seen_ < captures.size(); ++captures_seen_) {
        const CaptureEvent& e = captures[captures_seen_];
        const std::uint32_t si = engine.species(e.particle_i), sj = engine.species(e.particle_j);
        if (in_window_ && e.size_i == 1 && e.size_j == 1) ++pair_events_[m.pair_index(si, sj)];
        if (e.size_i == 1) --monomers_[si];
        if (e.size_j == 1) --monomers_[sj];
    }
    if (in_window_) {
        const auto clusters = static_cast<std::int64_t>(engine.bodies().size());
        counts_.push_back({t1, clusters});
        if (double(clusters) < 0.7 * double(n0_)) in_window_ = false;
    }
}

void RunRecorder::write_timeseries_header(std::ostream& out, bool reversible) {
    out << "time_s,time_half_lives,clusters,monomers,doublets,triplets,mean_size,weight_mean_size,largest,"
           "smoluchowski_clusters,smoluchowski_clusters_transient";
    if (reversible) out << ",geometric_clusters,geometric_mean_size";
    out << "\n";
}

void RunRecorder::write_size_distribution_header(std::ostream& out) { out << "time_s,size,count\n"; }

std::int64_t RunRecorder::geometric_clusters(const Engine& engine) const {
    const EngineModel& m = *plan_.model;
    analysis::UnionFind sets(engine.particle_count());
    for (std::uint32_t i = 0; i < engine.particle_count(); ++i)
        if (engine.body_of(i) != i) sets.unite(i, engine.body_of(i));
    engine.for_each_listed_pair([&](std::uint32_t i, std::uint32_t j) {
        if (engine.body_of(i) == engine.body_of(j)) return;
        const auto& gap = m.pair_kind(engine.species(i), engine.species(j)).cluster_gap_m;
        if (!gap) return;
        if (engine.gap_m(i, j) < *gap) sets.unite(i, j);
    });
    return static_cast<std::int64_t>(sets.set_count());
}

void RunRecorder::write_output(const Engine& engine, std::ostream& ts, std::ostream& sd) {
    std::vector<std::int64_t> sizes;
    sizes.reserve(engine.bodies().size());
    for (std::uint32_t b : engine.bodies()) sizes.push_back(engine.body_size(b));
    last_ = analysis::size_statistics(sizes);
    const double t = engine.time_s();
    const double n0_density = double(n0_) / volume_m3_;
    const double tau = potentials::fast_half_life_s(reference_rate_m3_per_s_, n0_density);
    ts << g17(t) << ',' << g17(t / plan_.half_life_fast_s) << ',' << last_.clusters << ',' << last_.monomers << ','
       << last_.doublets << ',' << last_.triplets << ',' << g17(last_.mean_size) << ',' << g17(last_.weight_mean_size)
       << ',' << last_.largest << ',' << g17(double(n0_) * constant_kernel_fraction(t, tau)) << ','
       << g17(double(n0_) * transient_corrected_fraction(t, reference_rate_m3_per_s_, n0_density, contact_distance_m_,
                                                         relative_diffusion_m2_per_s_));
    if (plan_.model->reversible) {
        last_geometric_ = geometric_clusters(engine);
        ts << ',' << *last_geometric_ << ',' << g17(double(n0_) / double(*last_geometric_));
    }
    ts << '\n';
    for (const auto& [size, count] : analysis::size_histogram(sizes)) sd << g17(t) << ',' << size << ',' << count << '\n';
}

std::vector<ClusterRow> RunRecorder::cluster_rows(const Engine& engine) const {
    const EngineModel& m = *plan_.model;
    std::vector<ClusterRow> rows;
    rows.reserve(engine.bodies().size());
    for (std::uint32_t b : engine.bodies()) {
        ClusterRow row;
        row.cluster_id = b;
        row.size = engine.body_size(b);
        row.spans_box = engine.spans_box(b);
        row.per_species.assign(m.species_count, 0);
        const std::vector<std::uint32_t> members = engine.members(b);
        for (std::uint32_t k : members) ++row.per_species[engine.species(k)];
        if (!row.spans_box) {
            const std::vector<Vec3> centres = engine.unwrapped_members_m(b);
            row.radius_of_gyration_nm = analysis::radius_of_gyration_m(centres) * 1e9;
            if (m.cluster_mobility == ClusterMobility::hydrodynamic_radius || row.size == 1) {
                row.hydrodynamic_radius_nm = engine.hydrodynamic_radius_m(b) * 1e9;
            } else {
                std::vector<double> radii;
                for (std::uint32_t k : members) radii.push_back(engine.radius_m(k));
                row.hydrodynamic_radius_nm = analysis::kirkwood_hydrodynamic_radius_m(centres, radii, m.seed + b) * 1e9;
            }
        }
        rows.push_back(std::move(row));
    }
    return rows;
}

RateFit RunRecorder::total_rate() const {
    RateFitInput in;
    in.volume_m3 = volume_m3_;
    in.initial_particles = n0_;
    in.contact_distance_m = contact_distance_m_;
    in.relative_diffusion_m2_per_s = relative_diffusion_m2_per_s_;
    return fit_early_rate(counts_, in);
}

std::vector<PairRate> RunRecorder::pair_rates() const {
    const EngineModel& m = *plan_.model;
    std::vector<PairRate> out;
    for (const PairKind& kind : m.pair_kinds) {
        const std::size_t k = m.pair_index(kind.species_i, kind.species_j);
        PairRate p;
        p.species_i = kind.species_i;
        p.species_j = kind.species_j;
        p.monomer_events = pair_events_[k];
        p.exposure_s_per_m3 = pair_exposure_[k];
        p.rate = monomer_pair_rate(pair_events_[k], pair_exposure_[k]);
        p.log_stability_ratio_at_capture = kind.log_stability_ratio_at_capture;
        p.fast_rate_m3_per_s = potentials::fast_rate_m3_per_s(m.species_median_radius_m[kind.species_i],
                                                              m.species_median_radius_m[kind.species_j],
                                                              m.temperature_K, m.viscosity_Pa_s);
        out.push_back(p);
    }
    return out;
}

analysis::FractalFit RunRecorder::fractal(const std::vector<ClusterRow>& rows) const {
    std::vector<analysis::ClusterShape> shapes;
    for (const ClusterRow& r : rows)
        shapes.push_back({r.size, r.radius_of_gyration_nm.value_or(0.0) * 1e-9, r.spans_box});
    double mean_radius = 0;
    for (double a : plan_.particles.radii_m) mean_radius += a;
    mean_radius /= double(plan_.particles.radii_m.size());
    return analysis::fit_fractal_dimension(shapes, mean_radius, plan_.model->seed);
}

RecorderState RunRecorder::state() const {
    RecorderState s;
    s.counts = counts_;
    s.in_window = in_window_;
    s.captures_seen = captures_seen_;
    s.monomers = monomers_;
    s.pair_events = pair_events_;
    s.pair_exposure = pair_exposure_;
    s.last_time_s = last_time_s_;
    s.last = last_;
    s.last_geometric = last_geometric_;
    return s;
}

void RunRecorder::restore(const RecorderState& s) {
    if (s.monomers.size() != monomers_.size() || s.pair_events.size() != pair_events_.size() ||
        s.pair_exposure.size() != pair_exposure_.size())
        throw std::invalid_argument("recorder state: species or pair counts differ from the run's");
    counts_ = s.counts;
    in_window_ = s.in_window;
    captures_seen_ = static_cast<std::size_t>(s.captures_seen);
    monomers_ = s.monomers;
    pair_events_ = s.pair_events;
    pair_exposure_ = s.pair_exposure;
    last_time_s_ = s.last_time_s;
    last_ = s.last;
    last_geometric_ = s.last_geometric;
}

}  // namespace brownfloc::sim
