#pragma once
// The Monte Carlo of `brownfloc shelf-life`: each sample is the scenario with every uncertain
// value drawn (and, after a calibration, the fitted parameters drawn jointly from the fit),
// evaluated at every storage temperature. Sample i draws input j as
// uncertainty::draw(distribution, seed, i, j), with j fixed by the slot (input_index_of), so the
// samples are the same at any thread count and the same draws serve every temperature.
//
// Jointly drawn fitted parameters (calibration): x = mean + L z, L the lower Cholesky factor of
// their covariance and z_k standard normal, drawn as inputs 128 + k (Gentle (2003), "Random
// Number Generation and Monte Carlo Methods", section 5.3.1: the usual way to draw a
// multivariate normal).
//
// W comes from the fast quadrature (WQuadrature::fast): within 1e-3 of the careful one in ln W.
#include <cstdint>
#include <functional>
#include <string>
#include <vector>

#include "sim/scenario.hpp"
#include "sim/storage_conditions.hpp"

namespace brownfloc::sim {

// Fitted parameters drawn together (from a calibration).
struct JointDraw {
    std::vector<std::string> names;               // shown in the sensitivity ranking
    std::vector<double> mean;                     // the fit's estimates (its own coordinates)
    std::vector<std::vector<double>> covariance;  // of those coordinates
    // The scenario with the drawn values put in place.
    std::function<Scenario(const Scenario&, const std::vector<double>&)> apply;
};

// First Monte Carlo input index of the jointly drawn parameters (after every scenario slot).
inline constexpr std::uint32_t joint_draw_first_index = 128;

class ShelfLifeSampler {
public:
    // joint may be null. Throws InputError if the covariance is not positive semi-definite.
    ShelfLifeSampler(const Scenario& scenario, const JointDraw* joint);

    // Whether any input varies between samples (some distribution of non-zero width, or a
    // joint draw with a non-zero variance).
    [[nodiscard]] bool varies() const { return varies_; }
    // Names of the drawn inputs: the uncertain keys, then the joint draw's names.
    [[nodiscard]] const std::vector<std::string>& input_names() const { return names_; }

    // The scenario of sample i; the drawn values (in input_names order) go to `drawn` if given.
    [[nodiscard]] Scenario sample(std::uint64_t i, std::vector<double>* drawn = nullptr) const;

private:
    Scenario base_;
    const JointDraw* joint_;
    std::vector<std::vector<double>> cholesky_;
    std::vector<std::string> names_;
    bool varies_ = false;
};

struct SampledConditions {
    std::vector<std::vector<double>> inputs;        // [input][sample]
    std::vector<std::vector<double>> log10_w;       // [condition][sample]
    std::vector<std::vector<double>> log10_tau_s;   // [condition][sample]
    std::vector<std::vector<double>> half_life_fast_s;  // [condition][sample]
    std::vector<std::vector<double>> time_s;        // [condition][sample], +inf when it overflows
};

// time_for(log10 tau) maps tau to the time to the criterion (+inf when out of reach).
// Parallel over samples (OpenMP), each in its own slot: same bits at any thread count.
[[nodiscard]] SampledConditions sample_conditions(const ShelfLifeSampler& sampler, std::uint64_t samples,
                                                  const std::vector<double>& temperatures_K, SurfaceHold hold,
                                                  bool hydrodynamic_correction,
                                                  const std::function<double(double)>& time_for);

}  // namespace brownfloc::sim
