// The shelf-life SVG: layout, axes and the drawing of each element. The layout is fixed in
// pixels (an 820-wide canvas that grows downwards with the legend and captions) so that a
// reader can compare figures from different runs side by side.
#include "sim/shelf_life_plot.hpp"

#include <algorithm>
#include <cassert>
#include <charconv>
#include <cmath>
#include <cstddef>
#include <initializer_list>
#include <stdexcept>
#include <string_view>

#include "shelf_life_format.hpp"
#include "sim/shelf_life_report.hpp"

namespace brownfloc::sim {

namespace {

using detail::seconds_per_day;
constexpr double canvas_width_px = 820;
constexpr double plot_left_px = 90, plot_right_px = 790, plot_top_px = 60, plot_bottom_px = 460;
constexpr double legend_top_px = plot_bottom_px + 70, legend_row_px = 18, caption_row_px = 16;
constexpr std::size_t caption_wrap_chars = 120;
constexpr int max_labelled_decades = 12;
constexpr double beyond_arrow_gap_px = 24;

// Orange from the colour-blind-safe palette of Okabe & Ito (2008), "Color Universal Design"
// (from memory); dark blue on light blue, grey and black: common practice.
constexpr std::string_view median_colour = "#1f4e9c", band_colour = "#a6cbe8", ccc_colour = "#e69f00",
                           target_colour = "#6b6b6b", present_colour = "#000000", grid_colour = "#e3e3e3";

const char* const band_legend = "p5-p95 pointwise Monte Carlo band (input uncertainty only, not model error)";

// Pieces joined with +=: g++ 12 at -O3 gives a false -Wrestrict error on "literal" + std::string.
std::string cat(std::initializer_list<std::string_view> pieces) {
    std::string s;
    for (std::string_view p : pieces) s += p;
    return s;
}

// A coordinate with two decimals; callers clamp first, so a non-finite value is our bug.
std::string px(double v) {
    assert(std::isfinite(v));
    if (!std::isfinite(v)) v = 0;
    char buf[64];
    const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::fixed, 2);
    return std::string(buf, r.ptr);
}

std::string trim_zeros(std::string s) {
    if (s.find('.') == std::string::npos) return s;
    while (s.back() == '0') s.pop_back();
    if (s.back() == '.') s.pop_back();
    return s;
}

// A value in a label: whole numbers from 100 to 1e6 ("730"), 3 significant digits below
// ("5", "0.0123"), and "1.16e7" outside 1e-3 to 1e6.
std::string value_text(double v) {
    if (!std::isfinite(v)) return "beyond range";
    char buf[64];
    const double a = std::fabs(v);
    if (a >= 100 && a < 1e6) {
        const auto r = std::to_chars(buf, buf + sizeof buf, std::round(v), std::chars_format::fixed, 0);
        return std::string(buf, r.ptr);
    }
    if (a >= 1e-3 && a < 100) {
        const int decimals = 2 - static_cast<int>(std::floor(std::log10(a)));
        const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::fixed, decimals);
        return trim_zeros(std::string(buf, r.ptr));
    }
    if (a == 0) return "0";
    const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::scientific, 2);
    const std::string s(buf, r.ptr);
    const std::size_t e = s.find('e');
    const int exponent = std::stoi(s.substr(e + 1));
    std::string out = trim_zeros(s.substr(0, e));
    out += 'e';
    out += std::to_string(exponent);
    return out;
}

// The label of times at or beyond the limit: "beyond 1e12 s".
std::string beyond_text() { return cat({"beyond ", value_text(shelf_life_time_limit_s), " s"}); }

// A decade tick label: "0.01" ... "10000" in full, "1e5" or "1e-3" beyond.
std::string decade_text(int n) {
    if (n >= 0 && n <= 4) return cat({"1", std::string(static_cast<std::size_t>(n), '0')});
    if (n < 0 && n >= -2) {
        std::string s = "0.";
        s += std::string(static_cast<std::size_t>(-n - 1), '0');
        s += '1';
        return s;
    }
    return cat({"1e", std::to_string(n)});
}

// A line of caption text cut at spaces into pieces of at most width characters (bytes; a long
// word stays whole). Cutting only at ASCII spaces never splits a UTF-8 sequence.
std::vector<std::string> wrapped(const std::string& text, std::size_t width) {
    std::vector<std::string> lines;
    std::string line;
    std::size_t start = 0;
    while (start <= text.size()) {
        std::size_t end = text.find(' ', start);
        if (end == std::string::npos) end = text.size();
        const std::string word = text.substr(start, end - start);
        if (!line.empty() && line.size() + 1 + word.size() > width) {
            lines.push_back(line);
            line.clear();
        }
        if (!line.empty()) line += ' ';
        line += word;
        start = end + 1;
    }
    lines.push_back(line);
    return lines;
}

// The points that can go on a log salt axis, checked.
struct Prepared {
    std::vector<std::size_t> usable;  // indices into the data vectors
    bool show_present = false, show_ccc = false, show_target = false;
    bool median_beyond_range = false;  // some median point at or beyond the limit
    ShelfLifePlotFrame frame;
    [[nodiscard]] std::size_t legend_rows() const {
        return 2 + std::size_t{show_present} + std::size_t{show_ccc} + std::size_t{show_target} +
               std::size_t{median_beyond_range};
    }
};

void check_shape(const ShelfLifePlotData& d) {
    const std::size_t n = d.salt_mM.size();
    if (d.p50_s.size() != n || d.p5_s.size() != n || d.p95_s.size() != n)
        throw std::invalid_argument(cat({"shelf-life plot: salt_mM, p50_s, p5_s and p95_s must have the same length, got ",
                                         std::to_string(n), ", ", std::to_string(d.p50_s.size()), ", ",
                                         std::to_string(d.p5_s.size()), ", ", std::to_string(d.p95_s.size())}));
    for (std::size_t k = 0; k < n; ++k)
        if (std::isnan(d.p50_s[k]) || std::isnan(d.p5_s[k]) || std::isnan(d.p95_s[k]))
            throw std::invalid_argument(cat({"shelf-life plot: point ", std::to_string(k), " has a NaN time"}));
    if (!std::isfinite(d.target_s))
        throw std::invalid_argument("shelf-life plot: target_s must be finite");
}

bool positive(double v) { return std::isfinite(v) && v > 0; }
bool beyond_range(double time_s) { return !(time_s < shelf_life_time_limit_s); }

// Whole decades around the values; one decade wide at least.
std::pair<int, int> decade_range(const std::vector<double>& values) {
    const auto [lo, hi] = std::minmax_element(values.begin(), values.end());
    const int low = static_cast<int>(std::floor(std::log10(*lo)));
    int high = static_cast<int>(std::ceil(std::log10(*hi)));
    if (high <= low) high = low + 1;
    return {low, high};
}

std::vector<std::size_t> usable_points(const ShelfLifePlotData& d) {
    std::vector<std::size_t> usable;
    for (std::size_t k = 0; k < d.salt_mM.size(); ++k) {
        if (!positive(d.salt_mM[k])) continue;  // no place on a log axis
        if (!usable.empty() && !(d.salt_mM[k] > d.salt_mM[usable.back()]))
            throw std::invalid_argument(cat({"shelf-life plot: salt_mM must ascend, but point ", std::to_string(k), " (",
                                             value_text(d.salt_mM[k]), " mM) does not exceed the one before"}));
        usable.push_back(k);
    }
    if (usable.size() < 2)
        throw std::invalid_argument(cat({"shelf-life plot: needs at least 2 points with salt_mM > 0, got ",
                                         std::to_string(usable.size())}));
    return usable;
}

std::vector<double> time_range_values_days(const ShelfLifePlotData& d, const std::vector<std::size_t>& usable) {
    std::vector<double> days;
    for (std::size_t k : usable)
        for (double t : {d.p5_s[k], d.p50_s[k], d.p95_s[k]})
            if (positive(t) && !beyond_range(t)) days.push_back(t / seconds_per_day);
    if (d.target_s > 0) days.push_back(d.target_s / seconds_per_day);
    if (days.empty()) {  // every time beyond range and no target: show up to the limit
        days.push_back(1.0);
        days.push_back(shelf_life_time_limit_s / seconds_per_day);
    }
    return days;
}

Prepared prepare(const ShelfLifePlotData& d) {
    check_shape(d);
    Prepared p;
    p.usable = usable_points(d);
    p.show_present = d.present_salt_mM && positive(*d.present_salt_mM);
    p.show_ccc = d.ccc_mM && positive(*d.ccc_mM);
    p.show_target = d.target_s > 0;
    for (std::size_t k : p.usable) p.median_beyond_range = p.median_beyond_range || beyond_range(d.p50_s[k]);
    std::vector<double> salts;
    for (std::size_t k : p.usable) salts.push_back(d.salt_mM[k]);
    for (const auto& marker : {d.present_salt_mM, d.ccc_mM})
        if (marker && positive(*marker)) salts.push_back(*marker);
    const auto [x_low, x_high] = decade_range(salts);
    const auto [y_low, y_high] = decade_range(time_range_values_days(d, p.usable));
    p.frame.salt_axis = {x_low, x_high, plot_left_px, plot_right_px};
    p.frame.time_axis = {y_low, y_high, plot_bottom_px, plot_top_px};
    p.frame.width_px = canvas_width_px;
    std::size_t caption_rows = 0;
    for (const std::string& c : d.caption_lines) caption_rows += wrapped(c, caption_wrap_chars).size();
    p.frame.height_px = legend_top_px + legend_row_px * static_cast<double>(p.legend_rows()) +
                        caption_row_px * static_cast<double>(caption_rows) + 10;
    return p;
}

// --- drawing -------------------------------------------------------------------------------

struct Svg {
    std::string out;
    void text(std::string_view cls, double x, double y, const std::string& content, std::string_view extra = "") {
        out += "<text class=\"";
        out += cls;
        out += cat({"\" x=\"", px(x), "\" y=\"", px(y), "\""});
        if (!extra.empty()) {
            out += ' ';
            out += extra;
        }
        out += '>';
        out += xml_escaped(content);
        out += "</text>\n";
    }
    void line(std::string_view cls, double x1, double y1, double x2, double y2, std::string_view style) {
        out += "<line class=\"";
        out += cls;
        out += cat({"\" x1=\"", px(x1), "\" y1=\"", px(y1), "\" x2=\"", px(x2), "\" y2=\"", px(y2), "\" "});
        out += style;
        out += "/>\n";
    }
};

std::string stroke(std::string_view colour, double width, std::string_view dash = "") {
    std::string s = "stroke=\"";
    s += colour;
    s += cat({"\" stroke-width=\"", px(width), "\""});
    if (!dash.empty()) {
        s += " stroke-dasharray=\"";
        s += dash;
        s += '"';
    }
    return s;
}

// y of a time, held inside the plot: beyond range at the top edge, <= 0 at the bottom.
double time_y(const LogAxis& axis, double time_s) {
    if (beyond_range(time_s)) return plot_top_px;
    if (!(time_s > 0)) return plot_bottom_px;
    return std::clamp(axis.to_px(time_s / seconds_per_day), plot_top_px, plot_bottom_px);
}

std::string point_list(const std::vector<std::pair<double, double>>& points) {
    std::string s;
    for (const auto& [x, y] : points) {
        if (!s.empty()) s += ' ';
        s += cat({px(x), ",", px(y)});
    }
    return s;
}

void draw_axes(Svg& svg, const ShelfLifePlotData& d, const ShelfLifePlotFrame& f) {
    const auto stride = [](const LogAxis& a) { return std::max(1, (a.high_decade - a.low_decade + max_labelled_decades - 1) / max_labelled_decades); };
    const int sx = stride(f.salt_axis), sy = stride(f.time_axis);
    for (int n = f.salt_axis.low_decade; n <= f.salt_axis.high_decade; n += sx) {
        const double x = f.salt_axis.to_px(std::pow(10.0, n));
        svg.line("x-grid", x, plot_top_px, x, plot_bottom_px, stroke(grid_colour, 1));
        svg.line("x-tick", x, plot_bottom_px, x, plot_bottom_px + 6, stroke("#000000", 1));
        svg.text("x-tick-label", x, plot_bottom_px + 20, decade_text(n), "text-anchor=\"middle\"");
    }
    for (int n = f.time_axis.low_decade; n <= f.time_axis.high_decade; n += sy) {
        const double y = f.time_axis.to_px(std::pow(10.0, n));
        svg.line("y-grid", plot_left_px, y, plot_right_px, y, stroke(grid_colour, 1));
        svg.line("y-tick", plot_left_px - 6, y, plot_left_px, y, stroke("#000000", 1));
        svg.text("y-tick-label", plot_left_px - 9, y + 4, decade_text(n), "text-anchor=\"end\"");
    }
    svg.out += cat({"<rect class=\"frame\" x=\"", px(plot_left_px), "\" y=\"", px(plot_top_px), "\" width=\"",
                    px(plot_right_px - plot_left_px), "\" height=\"", px(plot_bottom_px - plot_top_px),
                    "\" fill=\"none\" ", stroke("#000000", 1), "/>\n"});
    svg.text("x-title", (plot_left_px + plot_right_px) / 2, plot_bottom_px + 42, cat({d.salt_name, " concentration (mM)"}),
             "text-anchor=\"middle\" font-size=\"13\"");
    const double y_mid = (plot_top_px + plot_bottom_px) / 2;
    svg.text("y-title", 26, y_mid, cat({"time to ", d.criterion_label, " (days)"}),
             cat({"text-anchor=\"middle\" font-size=\"13\" transform=\"rotate(-90 26 ", px(y_mid), ")\""}));
}

void draw_band_and_median(Svg& svg, const ShelfLifePlotData& d, const Prepared& p) {
    const LogAxis& xa = p.frame.salt_axis;
    const LogAxis& ya = p.frame.time_axis;
    std::vector<std::pair<double, double>> band, median;
    for (std::size_t k : p.usable) band.emplace_back(xa.to_px(d.salt_mM[k]), time_y(ya, d.p95_s[k]));
    for (auto it = p.usable.rbegin(); it != p.usable.rend(); ++it)
        band.emplace_back(xa.to_px(d.salt_mM[*it]), time_y(ya, d.p5_s[*it]));
    for (std::size_t k : p.usable) median.emplace_back(xa.to_px(d.salt_mM[k]), time_y(ya, d.p50_s[k]));
    svg.out += cat({"<polygon class=\"band\" points=\"", point_list(band), "\" fill=\"", band_colour,
                    "\" fill-opacity=\"0.7\" stroke=\"none\"/>\n"});
    svg.out += cat({"<polyline class=\"median\" points=\"", point_list(median), "\" fill=\"none\" ",
                    stroke(median_colour, 2.2), " stroke-linejoin=\"round\"/>\n"});
}

// Upward arrows above the top edge along each run of median points beyond range (at least
// beyond_arrow_gap_px apart, so dense points do not merge them into a bar), and one label
// beside the first run, so a line running along the top edge is not read as a value there.
bool draw_beyond_range(Svg& svg, const ShelfLifePlotData& d, const Prepared& p) {
    std::vector<double> first_run_x;
    bool in_first_run = true;
    double last_arrow_x = -1e9;
    for (std::size_t k : p.usable) {
        if (!beyond_range(d.p50_s[k])) {
            in_first_run = first_run_x.empty();
            last_arrow_x = -1e9;  // a new run starts with an arrow
            continue;
        }
        const double x = p.frame.salt_axis.to_px(d.salt_mM[k]);
        if (in_first_run) first_run_x.push_back(x);
        if (x - last_arrow_x < beyond_arrow_gap_px) continue;
        last_arrow_x = x;
        svg.out += cat({"<polygon class=\"beyond-range\" points=\"",
                        point_list({{x - 5, plot_top_px - 3}, {x + 5, plot_top_px - 3}, {x, plot_top_px - 13}}),
                        "\" fill=\"", median_colour, "\"/>\n"});
    }
    if (first_run_x.empty()) return false;
    const bool room_after = first_run_x.back() < plot_right_px - 120;
    svg.text("beyond-range-label", room_after ? first_run_x.back() + 10 : first_run_x.front() - 10, plot_top_px - 5,
             beyond_text(), room_after ? "text-anchor=\"start\"" : "text-anchor=\"end\"");
    return true;
}

void draw_salt_marker(Svg& svg, std::string_view cls, const LogAxis& xa, double salt_mM, double label_y,
                      std::string_view colour, const std::string& label) {
    const double x = xa.to_px(salt_mM);
    svg.line(cls, x, plot_top_px, x, plot_bottom_px, stroke(colour, 1.6, "5 3"));
    const bool right_half = x > (plot_left_px + plot_right_px) / 2;
    std::string cls_label(cls);
    cls_label += "-label";
    svg.text(cls_label, right_half ? x - 4 : x + 4, label_y, label,
             right_half ? "text-anchor=\"end\"" : "text-anchor=\"start\"");
}

struct LegendEntry {
    std::string kind;  // "line", "band", "arrow"
    std::string style;
    std::string label;
};

void draw_legend(Svg& svg, const std::vector<LegendEntry>& entries, double top) {
    for (std::size_t i = 0; i < entries.size(); ++i) {
        const LegendEntry& e = entries[i];
        const double y = top + legend_row_px * static_cast<double>(i);
        const double x0 = plot_left_px, x1 = plot_left_px + 30;
        if (e.kind == "band")
            svg.out += cat({"<rect class=\"legend-band\" x=\"", px(x0), "\" y=\"", px(y - 10),
                            "\" width=\"30\" height=\"12\" ", e.style, "/>\n"});
        else if (e.kind == "arrow")
            svg.out += cat({"<polygon class=\"legend-arrow\" points=\"",
                            point_list({{x0 + 10, y}, {x0 + 20, y}, {x0 + 15, y - 10}}), "\" ", e.style, "/>\n"});
        else
            svg.line("legend-line", x0, y - 4, x1, y - 4, e.style);
        svg.text("legend-label", x1 + 10, y, e.label);
    }
}

}  // namespace

double LogAxis::to_px(double v) const {
    return low_px + (std::log10(v) - low_decade) / (high_decade - low_decade) * (high_px - low_px);
}

ShelfLifePlotFrame shelf_life_plot_frame(const ShelfLifePlotData& data) { return prepare(data).frame; }

std::string shelf_life_svg(const ShelfLifePlotData& d) {
    const Prepared p = prepare(d);
    const std::string w = px(p.frame.width_px), h = px(p.frame.height_px);
    Svg svg;
    svg.out = "<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"no\"?>\n";
    svg.out += cat({"<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"", w, "\" height=\"", h,
                    "\" viewBox=\"0 0 ", w, " ", h, "\" font-family=\"sans-serif\" font-size=\"12\">\n"});
    svg.out += cat({"<title>", xml_escaped(d.title), "</title>\n"});
    svg.out += cat({"<rect class=\"background\" x=\"0\" y=\"0\" width=\"", w, "\" height=\"", h,
                    "\" fill=\"#ffffff\"/>\n"});
    svg.text("title", p.frame.width_px / 2, 28, d.title, "text-anchor=\"middle\" font-size=\"16\" font-weight=\"bold\"");
    draw_axes(svg, d, p.frame);
    draw_band_and_median(svg, d, p);
    std::vector<LegendEntry> legend{{"line", stroke(median_colour, 2.2), "median (p50)"},
                                    {"band", cat({"fill=\"", band_colour, "\" fill-opacity=\"0.7\""}), band_legend}};
    if (p.show_present) {
        const std::string label = cat({"present ", d.salt_name, ": ", value_text(*d.present_salt_mM), " mM"});
        draw_salt_marker(svg, "present-salt", p.frame.salt_axis, *d.present_salt_mM, plot_top_px + 16, present_colour, label);
        legend.push_back({"line", stroke(present_colour, 1.6, "5 3"), label});
    }
    if (p.show_ccc) {
        const std::string label = cat({"CCC: ", value_text(*d.ccc_mM), " mM"});
        draw_salt_marker(svg, "ccc", p.frame.salt_axis, *d.ccc_mM, plot_top_px + 32, ccc_colour, label);
        legend.push_back({"line", stroke(ccc_colour, 1.6, "5 3"), label});
    }
    if (p.show_target) {
        const double y = time_y(p.frame.time_axis, d.target_s);
        const std::string label = cat({"target: ", value_text(d.target_s / seconds_per_day), " days"});
        svg.line("target", plot_left_px, y, plot_right_px, y, stroke(target_colour, 1.6, "9 4"));
        svg.text("target-label", plot_right_px - 4, y - 5, label, "text-anchor=\"end\"");
        legend.push_back({"line", stroke(target_colour, 1.6, "9 4"), label});
    }
    if (draw_beyond_range(svg, d, p))
        legend.push_back({"arrow", cat({"fill=\"", median_colour, "\""}),
                          cat({"median ", beyond_text(), " (drawn at the top edge)"})});
    assert(legend.size() == p.legend_rows());
    draw_legend(svg, legend, legend_top_px);
    double y = legend_top_px + legend_row_px * static_cast<double>(legend.size()) + 4;
    for (const std::string& caption : d.caption_lines)
        for (const std::string& line : wrapped(caption, caption_wrap_chars)) {
            svg.text("caption", plot_left_px - 60, y, line, "font-size=\"11\" fill=\"#333333\"");
            y += caption_row_px;
        }
    svg.out += "</svg>\n";
    return svg.out;
}

}  // namespace brownfloc::sim
