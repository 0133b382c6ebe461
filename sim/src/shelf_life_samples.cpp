#include "sim/shelf_life_samples.hpp"

#include <cmath>
#include <exception>
#include <string>

#include "potentials/input_error.hpp"
#include "uncertainty/sample_draw.hpp"
#include "uncertainty/standard_normal.hpp"

namespace brownfloc::sim {

namespace {

// Lower Cholesky factor of a symmetric positive semi-definite matrix (Golub & Van Loan (2013),
// algorithm 4.2.1); a zero pivot (a parameter with zero variance) gives a zero column.
std::vector<std::vector<double>> cholesky_lower(const std::vector<std::vector<double>>& a) {
    const std::size_t n = a.size();
    std::vector<std::vector<double>> l(n, std::vector<double>(n, 0.0));
    for (std::size_t j = 0; j < n; ++j) {
        if (a[j].size() != n) throw InputError("calibration covariance: not a square matrix");
        double d = a[j][j];
        for (std::size_t k = 0; k < j; ++k) d -= l[j][k] * l[j][k];
        const double scale = std::abs(a[j][j]) + 1e-300;
        if (d < -1e-9 * scale || !std::isfinite(d))
            throw InputError("calibration covariance: not positive semi-definite; the fit cannot be sampled");
        if (d <= 1e-14 * scale) continue;  // no variance left in this direction
        l[j][j] = std::sqrt(d);
        for (std::size_t i = j + 1; i < n; ++i) {
            double s = a[i][j];
            for (std::size_t k = 0; k < j; ++k) s -= l[i][k] * l[j][k];
            l[i][j] = s / l[j][j];
        }
    }
    return l;
}

}  // namespace

ShelfLifeSampler::ShelfLifeSampler(const Scenario& scenario, const JointDraw* joint)
    : base_(scenario), joint_(joint) {
    for (const UncertainInput& u : base_.uncertain_inputs) {
        names_.push_back(u.key);
        varies_ = varies_ || !u.distribution.is_point();
    }
    if (joint_) {
        cholesky_ = cholesky_lower(joint_->covariance);
        for (std::size_t k = 0; k < joint_->names.size(); ++k) {
            names_.push_back(joint_->names[k]);
            varies_ = varies_ || joint_->covariance[k][k] > 0;
        }
    }
}

Scenario ShelfLifeSampler::sample(std::uint64_t i, std::vector<double>* drawn) const {
    Scenario s = base_;
    if (drawn) drawn->clear();
    const std::uint64_t seed = base_.run.seed;
    for (const UncertainInput& u : base_.uncertain_inputs) {
        const double v = uncertainty::draw(u.distribution, seed, i, u.input_index);
        set_input(s, u.slot, u.species, v);
        if (drawn) drawn->push_back(v);
    }
    if (joint_) {
        const std::size_t n = joint_->mean.size();
        std::vector<double> z(n), x = joint_->mean;
        for (std::size_t k = 0; k < n; ++k)
            z[k] = uncertainty::standard_normal_quantile(
                uncertainty::uniform_draw(seed, i, joint_draw_first_index + static_cast<std::uint32_t>(k)));
        for (std::size_t r = 0; r < n; ++r)
            for (std::size_t k = 0; k <= r; ++k) x[r] += cholesky_[r][k] * z[k];
        s = joint_->apply(s, x);
        if (drawn) drawn->insert(drawn->end(), x.begin(), x.end());
    }
    return s;
}

SampledConditions sample_conditions(const ShelfLifeSampler& sampler, std::uint64_t samples,
                                    const std::vector<double>& temperatures_K, SurfaceHold hold,
                                    bool hydrodynamic_correction, const std::function<double(double)>& time_for) {
    const std::size_t n = static_cast<std::size_t>(samples), conditions = temperatures_K.size();
    SampledConditions out;
    out.inputs.assign(sampler.input_names().size(), std::vector<double>(n));
    for (auto* table : {&out.log10_w, &out.log10_tau_s, &out.half_life_fast_s, &out.time_s})
        table->assign(conditions, std::vector<double>(n));
    // The first error (by sample number) is rethrown after the loop: exceptions must not
    // leave an OpenMP region.
    std::vector<std::exception_ptr> errors(n);
#pragma omp parallel for schedule(dynamic, 16)
    for (std::size_t i = 0; i < n; ++i) {
        try {
            std::vector<double> drawn;
            const Scenario s = sampler.sample(i, &drawn);
            for (std::size_t j = 0; j < drawn.size(); ++j) out.inputs[j][i] = drawn[j];
            const std::vector<StorageCondition> c =
                storage_conditions(s, temperatures_K, hold, hydrodynamic_correction, s, WQuadrature::fast);
            for (std::size_t k = 0; k < conditions; ++k) {
                out.log10_w[k][i] = c[k].log10_stability_ratio;
                out.log10_tau_s[k][i] = c[k].log10_tau_s;
                out.half_life_fast_s[k][i] = c[k].half_life_fast_s;
                out.time_s[k][i] = time_for(c[k].log10_tau_s);
            }
        } catch (...) {
            errors[i] = std::current_exception();
        }
    }
    for (const std::exception_ptr& e : errors)
        if (e) std::rethrow_exception(e);
    return out;
}

}  // namespace brownfloc::sim
