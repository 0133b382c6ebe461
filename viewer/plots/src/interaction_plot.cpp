// Plot 4: U/kT against gap h (nm). Range rule in plot_layout.hpp.
#include "plots/plot_builders.hpp"

#include "builder_support.hpp"

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer {

std::string barrier_label(double barrier_kT) {
    std::string label = "barrier ";
    label += builder_support::fixed_text(barrier_kT, 1);
    label += " kT";
    return label;
}

PlotSpec interaction_plot(const std::vector<PairCurve>& curves) {
    PlotSpec spec;
    spec.title = "Interaction energy U/kT against gap h (nm)";
    spec.x_label = "h (nm)";
    spec.y_label = "U / kT";

    bool any_gap = false;
    double first_gap_nm = 0.0, last_gap_nm = 0.0;
    double y_top = 5.0;
    std::vector<double> capture_gaps_nm;
    for (std::size_t c = 0; c < curves.size(); ++c) {
        const PairCurve& curve = curves[c];
        builder_support::require_equal_lengths("interaction plot", curve.gap_nm.size(), "gaps", curve.energy_kT.size(),
                                               "energies");
        for (const double gap : curve.gap_nm) {
            if (!std::isfinite(gap)) continue;
            first_gap_nm = any_gap ? std::min(first_gap_nm, gap) : gap;
            last_gap_nm = any_gap ? std::max(last_gap_nm, gap) : gap;
            any_gap = true;
        }
        for (const double energy : curve.energy_kT)
            if (std::isfinite(energy)) y_top = std::max(y_top, builder_support::scaled_finite(energy, 1.25));
        spec.series.push_back(Series{curve.label, curve.gap_nm, curve.energy_kT, Series::Style::line,
                                     plot_colours::pair_curves[c % 4]});

        if (curve.barrier_gap_nm && curve.barrier_kT && std::isfinite(*curve.barrier_gap_nm) &&
            std::isfinite(*curve.barrier_kT)) {
            y_top = std::max(y_top, builder_support::scaled_finite(*curve.barrier_kT, 1.25));
            spec.markers.push_back(
                VerticalMarker{*curve.barrier_gap_nm, barrier_label(*curve.barrier_kT), plot_colours::barrier_marker});
        }
        if (std::isfinite(curve.capture_gap_nm) &&
            std::find(capture_gaps_nm.begin(), capture_gaps_nm.end(), curve.capture_gap_nm) == capture_gaps_nm.end())
            capture_gaps_nm.push_back(curve.capture_gap_nm);
    }
    for (const double gap : capture_gaps_nm)
        spec.markers.push_back(VerticalMarker{gap, "capture", plot_colours::capture_marker});

    if (!any_gap)
        spec.x = AxisRange{0.0, 1.0, false};
    else if (first_gap_nm == last_gap_nm)
        spec.x = AxisRange{first_gap_nm - 0.5, last_gap_nm + 0.5, false};
    else
        spec.x = AxisRange{first_gap_nm, last_gap_nm, false};
    spec.y = AxisRange{-y_top, y_top, false};
    return spec;
}

}  // namespace brownfloc::viewer
