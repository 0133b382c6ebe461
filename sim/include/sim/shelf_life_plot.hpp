#pragma once
// The SVG figure of `brownfloc shelf-life --plot FILE.svg`: the time for a dispersion to reach
// its aggregation criterion against the concentration of one salt, log-log, at one storage
// temperature. It shows the median (p50) as a line, the p5-p95 pointwise Monte Carlo band
// (input uncertainty only, not model error), the present salt and the CCC as vertical
// markers, the target time as a horizontal line, and the caller's caution lines under it.
//
//     ShelfLifePlotData d;
//     d.title = "Time to count-drop 0.1 at 25 degC";
//     d.salt_name = "NaCl";  d.criterion_label = "count-drop 0.1";
//     d.salt_mM = {1, 10, 100};  d.p50_s = {...};  d.p5_s = {...};  d.p95_s = {...};
//     d.present_salt_mM = 5;  d.ccc_mM = 120;  d.target_s = 730 * 86400.0;
//     std::ofstream("plot.svg") << shelf_life_svg(d);
//
// Axes: both log10. Salt is in mM, time is shown in days (1 day = 86400 s). Each range runs
// over whole decades: from floor(log10(smallest)) to ceil(log10(largest)) of the values it
// must show, one decade wider when they all lie within one power of ten. The salt range
// covers every usable salt, the present salt and the CCC; the time range covers every finite
// p5, p50 and p95 below shelf_life_time_limit_s (1e12 s) and the target. Ticks sit at every
// decade (every k-th when there are more than 12) and are labelled "0.01" ... "10000", "1e5".
//
// Mapping (LogAxis::to_px): px = low_px + (log10(v) - low_decade) / (high_decade - low_decade)
// * (high_px - low_px). The salt axis runs left to right; the time axis has low_px at the
// bottom of the plot and high_px at its top (SVG y grows downwards).
//
// What cannot be drawn: a point with salt <= 0 (or not finite) is skipped; a time that is +inf
// or >= 1e12 s is drawn at the top edge, such median points get upward arrows above it (at
// least 24 px apart) and the first one the label "beyond 1e12 s"; a time <= 0 is drawn at the
// bottom edge. No NaN or inf
// is ever written. All text is XML-escaped, control characters become spaces and invalid
// UTF-8 becomes U+FFFD, so the output is a well-formed standalone SVG 1.1 document in UTF-8.
// Numbers are written with std::to_chars, independent of the C locale.
//
// Elements carry a class for tests and style sheets: "band", "median", "beyond-range",
// "present-salt", "ccc", "target" (lines) with "...-label" texts, "x-tick"/"y-tick" lines
// with "x-tick-label"/"y-tick-label" texts, "caption".
// Pure functions of their argument; safe to call from any thread.
#include <optional>
#include <string>
#include <vector>

namespace brownfloc::sim {

struct ShelfLifePlotData {
    std::string title;                       // e.g. "Time to count-drop 0.1 at 25 degC"
    std::string salt_name;                   // e.g. "NaCl": x axis title "NaCl concentration (mM)"
    std::string criterion_label;             // e.g. "count-drop 0.1": y axis title "time to count-drop 0.1 (days)"
    std::vector<double> salt_mM;             // ascending over the usable points (salt > 0)
    std::vector<double> p50_s, p5_s, p95_s;  // times in s, same length as salt_mM; +inf allowed
    std::optional<double> present_salt_mM;   // marker, drawn when > 0
    std::optional<double> ccc_mM;            // marker, drawn when > 0
    double target_s = 0;                     // horizontal line, drawn when > 0
    std::vector<std::string> caption_lines;  // each drawn under the plot (wrapped when long)
};

// One log10 axis in pixels; see the mapping above.
struct LogAxis {
    int low_decade = 0;   // log10 of the value at low_px
    int high_decade = 1;  // log10 of the value at high_px; > low_decade
    double low_px = 0;
    double high_px = 1;
    // Pixel coordinate of v (v > 0, in the axis unit); outside [low, high] it extrapolates.
    [[nodiscard]] double to_px(double v) const;
};

struct ShelfLifePlotFrame {
    LogAxis salt_axis;  // mM, x pixels
    LogAxis time_axis;  // days, y pixels
    double width_px = 0;
    double height_px = 0;
};

// The axes and canvas size the SVG of data uses. Throws std::invalid_argument as shelf_life_svg.
[[nodiscard]] ShelfLifePlotFrame shelf_life_plot_frame(const ShelfLifePlotData& data);

// The whole SVG document. Throws std::invalid_argument when the vectors differ in length, a
// time is NaN, the usable salts are not strictly ascending, fewer than 2 points are usable,
// or target_s is NaN or infinite: the caller built the data wrongly.
[[nodiscard]] std::string shelf_life_svg(const ShelfLifePlotData& data);

// text with & < > " ' escaped for XML, control characters as spaces, invalid UTF-8 (and
// U+FFFE, U+FFFF) as U+FFFD.
[[nodiscard]] std::string xml_escaped(const std::string& text);

}  // namespace brownfloc::sim
