#include "sim/association_constant.hpp"

#include <algorithm>
#include <array>
#include <cassert>
#include <cmath>
#include <sstream>
#include <vector>

#include "potentials/constants.hpp"
#include "potentials/extrema.hpp"

namespace brownfloc::sim {
namespace {

constexpr double pi = potentials::constants::pi;

// Gauss-Kronrod 7/15 nodes and weights on [-1, 1] (Kronrod 1965; as tabulated in QUADPACK,
// Piessens et al. 1983). Odd entries of kronrod_nodes are the Gauss nodes; the last is 0.
constexpr double kronrod_nodes[8] = {
    0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
    0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
    0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
    0.207784955007898467600689403773245, 0.0};
constexpr double kronrod_weights[8] = {
    0.022935322010529224963732008058970, 0.063092092629978553290700663189204,
    0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
    0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
    0.204432940075298892414161999234649, 0.209482141084727828012999174891714};
constexpr double gauss_weights[4] = {
    0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
    0.381830050505118944950369775488975, 0.417959183673469387755102040816327};

struct Segment {
    double a = 0.0, b = 0.0, value = 0.0, error = 0.0, abs_value = 0.0;
};

template <class F>
Segment gauss_kronrod(const F& f, double a, double b) {
    const double centre = 0.5 * (a + b), half = 0.5 * (b - a);
    const double fc = f(centre);
    double kronrod = kronrod_weights[7] * fc, gauss = gauss_weights[3] * fc, abs_sum = std::fabs(kronrod);
    for (int i = 0; i < 7; ++i) {
        const double dx = half * kronrod_nodes[i];
        const double f1 = f(centre - dx), f2 = f(centre + dx);
        kronrod += kronrod_weights[i] * (f1 + f2);
        abs_sum += kronrod_weights[i] * (std::fabs(f1) + std::fabs(f2));
        if (i % 2 == 1) gauss += gauss_weights[i / 2] * (f1 + f2);
    }
    // |K15 - G7| is a plain, pessimistic error estimate for smooth integrands (QUADPACK rescales
    // it); being pessimistic only costs a few more panels here.
    return {a, b, kronrod * half, std::fabs((kronrod - gauss) * half), abs_sum * std::fabs(half)};
}

struct Integral {
    double value = 0.0, error = 0.0;
    bool converged = true;
};

// Globally adaptive quadrature over the panels given by `breaks` (sorted): the panel with the
// largest error estimate is bisected until the summed estimate is below rel_tol |I| or 1e-15
// of integral |f| (the floor for integrands that cancel). Piessens et al. (1983), QUADPACK QAGP,
// without the epsilon-algorithm extrapolation (the integrands here are bounded and smooth
// except where u jumps). Deterministic: same panels, same order, same bits.
template <class F>
Integral adaptive_integral(const F& f, const std::vector<double>& breaks, double rel_tol) {
    constexpr std::size_t max_segments = 20000;
    auto by_error = [](const Segment& x, const Segment& y) { return x.error < y.error; };
    std::vector<Segment> heap;
    for (std::size_t i = 0; i + 1 < breaks.size(); ++i)
        if (breaks[i + 1] > breaks[i]) heap.push_back(gauss_kronrod(f, breaks[i], breaks[i + 1]));
    std::make_heap(heap.begin(), heap.end(), by_error);
    std::vector<Segment> done;  // panels too narrow to bisect further
    Integral out;
    auto totals = [&] {
        double value = 0.0, error = 0.0, abs_value = 0.0;
        for (const auto* list : {&heap, &done})
            for (const Segment& s : *list) value += s.value, error += s.error, abs_value += s.abs_value;
        return std::array<double, 3>{value, error, abs_value};
    };
    std::array<double, 3> t = totals();
    for (std::size_t step = 1; !heap.empty() && t[1] > std::max(rel_tol * std::fabs(t[0]), 1e-15 * t[2]); ++step) {
        if (heap.size() + done.size() >= max_segments) break;
        std::pop_heap(heap.begin(), heap.end(), by_error);
        const Segment worst = heap.back();
        heap.pop_back();
        const double mid = 0.5 * (worst.a + worst.b);
        if (!(mid > worst.a && mid < worst.b) || worst.b - worst.a < 1e-14 * std::fabs(mid)) {
            done.push_back(worst);  // the sums keep it
            continue;
        }
        for (const Segment& c : {gauss_kronrod(f, worst.a, mid), gauss_kronrod(f, mid, worst.b)}) {
            heap.push_back(c);
            std::push_heap(heap.begin(), heap.end(), by_error);
            t[0] += c.value, t[1] += c.error, t[2] += c.abs_value;
        }
        t[0] -= worst.value, t[1] -= worst.error, t[2] -= worst.abs_value;
        if (step % 64 == 0) t = totals();  // running sums drift; recompute from the panels
    }
    t = totals();
    out.value = t[0];
    out.error = t[1];
    out.converged = t[1] <= std::max(rel_tol * std::fabs(t[0]), 1e-15 * t[2]);
    return out;
}

std::string nm(double gap_m) {
    std::ostringstream s;
    s.precision(4);
    s << gap_m * 1e9 << " nm";
    return s.str();
}

}  // namespace

double integrate_well(const std::function<double(double)>& u_kT_of_r, double r1_m, double r2_m) {
    assert(0 < r1_m && r1_m < r2_m);
    // 64 equal starting panels, so that a narrow feature cannot hide between the 15 nodes.
    std::vector<double> breaks(65);
    for (std::size_t i = 0; i < breaks.size(); ++i)
        breaks[i] = i == 64 ? r2_m : r1_m + (r2_m - r1_m) * static_cast<double>(i) / 64.0;
    auto integrand = [&](double r) { return std::expm1(-u_kT_of_r(r)) * r * r; };
    return 4.0 * pi * adaptive_integral(integrand, breaks, 1e-11).value;
}

SecondaryMinimumAssociation secondary_minimum_association(const potentials::PairInteraction& pair,
                                                          double min_gap_m) {
    SecondaryMinimumAssociation out;
    if (pair.model().vdw != potentials::VdwForm::hamaker_full) {
        out.note = "the association constant needs the full Hamaker van der Waals form: the Derjaguin and "
                   "Gregory forms decay as 1/h or 1/h^2 at large gaps and the integral diverges";
        return out;
    }
    const potentials::Extrema e = potentials::find_extrema(pair, min_gap_m, potentials::default_max_gap_m(pair));
    if (!e.has_maximum) {
        out.note = "U has no maximum: attraction all the way to contact, so there is no reversible well";
        return out;
    }
    out.well_start_gap_m = e.maximum_gap_m;
    if (!e.has_secondary_minimum) {
        out.note = "no secondary minimum beyond the maximum at " + nm(e.maximum_gap_m);
        return out;
    }
    out.minimum_gap_m = e.secondary_minimum_gap_m;
    out.minimum_kT = e.secondary_minimum_J / pair.kT_J();

    // Outer limit: beyond the minimum U rises towards 0; step out until |U| < 1e-12 kT
    // (about 130 radii for the examples in the tests).
    double outer = e.secondary_minimum_gap_m;
    for (int i = 0; i < 400 && std::fabs(pair.energy_kT(outer)) >= 1e-12; ++i) outer *= 1.5;
    out.well_end_gap_m = outer;

    // Starting panels: 16 per decade of gap from the maximum, plus the minimum, so that the
    // barrier flank (a few Debye lengths) and the far tail (radii) are both resolved.
    const double s = pair.radius1_m() + pair.radius2_m();
    const double decades = std::log10(outer / e.maximum_gap_m);
    const int panels = std::max(8, static_cast<int>(std::ceil(16.0 * decades)));
    std::vector<double> breaks;
    for (int i = 0; i <= panels; ++i)
        breaks.push_back(i == panels ? outer : e.maximum_gap_m * std::pow(outer / e.maximum_gap_m, double(i) / panels));
    breaks.push_back(e.secondary_minimum_gap_m);
    std::sort(breaks.begin(), breaks.end());
    breaks.erase(std::unique(breaks.begin(), breaks.end()), breaks.end());

    auto integrand = [&](double h) {
        const double r = s + h;
        return std::expm1(-pair.energy_kT(h)) * r * r;
    };
    const Integral well = adaptive_integral(integrand, breaks, 1e-11);
    // Beyond the outer limit the full Hamaker form is -(16/9) A a1^3 a2^3 / r^6 to within
    // (a/r)^2 (Hamaker 1937) and the double layer is negligible, so with |U| < 1e-12 kT,
    // exp(-U) - 1 = -U and the rest of the integral is -U(r_out) r_out^3 / 3.
    const double r_out = s + outer;
    const double tail = -pair.energy_kT(outer) * r_out * r_out * r_out / 3.0;
    out.constant_m3 = 4.0 * pi * (well.value + tail);
    if (!well.converged)
        out.note = "quadrature stopped at its panel limit; estimated relative error " +
                   std::to_string(well.error / std::fabs(well.value));
    return out;
}

// Derivation. Dilute limit, g(r) = exp(-U/kT) (PHYSICS.md). A given monomer has, in excess of
// an ideal gas, n_M K partners inside the well (K from the ordered-pair integral above). The
// doublet density counts each unordered pair once: n_D = 1/2 n_M (n_M K) = 1/2 K n_M^2. This is
// the law of mass action for M + M <-> D with K_c = [D]/[M]^2 = K/2, the 1/2 being the symmetry
// number of two identical particles. Conservation n_M + 2 n_D = n0 gives
//   K n_M^2 + n_M - n0 = 0,  n_M = 2 n0 / (1 + sqrt(1 + 4 K n0)),
// and the fraction of particles in doublets is 2 n_D / n0 = 1 - n_M / n0 = 4x / (1 + sqrt(1+4x))^2
// with x = K n0 (the last form avoids cancellation at small x, where it tends to x).
double doublet_fraction_expected(double association_m3, double n_per_m3) {
    assert(n_per_m3 >= 0);
    const double x = association_m3 * n_per_m3;
    if (!(x > 0)) return 0.0;
    const double root = 1.0 + std::sqrt(1.0 + 4.0 * x);
    return 4.0 * x / (root * root);
}

}  // namespace brownfloc::sim
