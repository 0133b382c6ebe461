#include "frame_view.hpp"

#include <SFML/Graphics/RectangleShape.hpp>
#include <SFML/Graphics/Sprite.hpp>
#include <SFML/Graphics/Text.hpp>
#include <SFML/Graphics/VertexArray.hpp>

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "analysis/fractal_fit.hpp"
#include "plots/plot_builders.hpp"
#include "scene/palettes.hpp"

namespace brownfloc::viewer {

namespace {

std::string short_number(double value, const char* format = "%.3g") {
    char buffer[48];
    std::snprintf(buffer, sizeof buffer, format, value);
    return buffer;
}

double wrapped(double x, double box) { return x - box * std::floor(x / box); }

sf::Color to_sf(Rgb c) { return sf::Color(c.r, c.g, c.b); }

// Words of text in lines of at most `width` characters (a longer word stands alone).
std::vector<std::string> wrapped_lines(const std::string& text, std::size_t width) {
    std::vector<std::string> lines;
    std::string line;
    std::size_t at = 0;
    while (at < text.size()) {
        const std::size_t space = text.find(' ', at);
        const std::string word = text.substr(at, space == std::string::npos ? std::string::npos : space - at);
        at = space == std::string::npos ? text.size() : space + 1;
        if (word.empty()) continue;
        if (!line.empty() && line.size() + 1 + word.size() > width) {
            lines.push_back(line);
            line.clear();
        }
        if (!line.empty()) line += ' ';
        line += word;
    }
    if (!line.empty()) lines.push_back(line);
    return lines;
}

// viewer/README.md "Plots": a curve is drawn up to the first sample after which |U| stays
// below 1 % of its largest magnitude, and at least to twice the barrier and capture gaps, so
// that the barrier region is not squeezed against the axis by a long flat tail.
std::size_t interesting_samples(const trajectory::PairRecord& pair) {
    const std::size_t n = pair.gap_nm.size();
    double largest = 0;
    for (double u : pair.energy_kT) largest = std::max(largest, std::fabs(u));
    std::size_t kept = n;
    while (kept > 2 && std::fabs(pair.energy_kT[kept - 1]) < 0.01 * largest) --kept;
    kept = std::min(n, kept + 1);
    const double at_least_nm = 2 * std::max(pair.capture_gap_nm, pair.has_barrier ? pair.barrier_gap_nm : 0.0);
    while (kept < n && pair.gap_nm[kept - 1] < at_least_nm) ++kept;
    return kept;
}

}  // namespace

std::vector<Sphere> build_spheres(const trajectory::TrajectoryHeader& header, const trajectory::TrajectoryFrame& frame,
                                  const FrameAnalysis& analysis, const ViewSettings& settings) {
    const std::size_t n = header.radius_nm.size();
    const double box = header.box_length_nm;
    std::vector<Sphere> spheres;
    spheres.reserve(n);
    const RenderSettings defaults;
    for (std::size_t i = 0; i < n; ++i) {
        const std::uint32_t cluster = frame.cluster[i];
        if (settings.only_largest && cluster != analysis.largest_cluster_id) continue;
        const ClusterSummary* summary = analysis.find(cluster);
        const std::int64_t size = summary ? summary->size : 1;
        Rgb colour;
        switch (settings.colour) {
            case ColourMode::cluster: colour = cluster_colour(cluster, size); break;
            case ColourMode::size: colour = size_colour(size, analysis.largest_size); break;
            case ColourMode::species: colour = species_colour(header.species[i]); break;
        }
        if (settings.selected_cluster && cluster != *settings.selected_cluster)
            colour = dimmed(colour, defaults.background);
        Vec3 centre{frame.positions_nm[3 * i], frame.positions_nm[3 * i + 1], frame.positions_nm[3 * i + 2]};
        if (settings.wrap) centre = {wrapped(centre.x, box), wrapped(centre.y, box), wrapped(centre.z, box)};
        spheres.push_back({centre, header.radius_nm[i], colour, static_cast<std::uint32_t>(i)});
    }
    return spheres;
}

std::array<PlotSpec, 4> build_plot_specs(const trajectory::TrajectoryHeader& header, const FrameAnalysis& analysis,
                                         const CountSeries& counts, double frame_time_s) {
    const double t_half = header.fast_half_life_s;
    const double now = t_half > 0 ? frame_time_s / t_half : 0.0;
    PlotSpec clusters;
    if (counts.from_timeseries_csv || counts.t_half_lives.empty()) {
        clusters = clusters_plot(counts.t_half_lives, counts.clusters_over_n0, counts.t_half_lives,
                                 counts.smoluchowski_over_n0, counts.smoluchowski_transient_over_n0, now);
    } else {
        // Without timeseries.csv the reference is the plain curve N/N0 = 1/(1 + t/t1/2), the
        // definition of the fast half-life, drawn smoothly rather than only at the frames.
        std::vector<double> t_ref, plain;
        const double t_end = counts.t_half_lives.back();
        for (int k = 0; k <= 200; ++k) {
            t_ref.push_back(t_end * k / 200.0);
            plain.push_back(1.0 / (1.0 + t_ref.back()));
        }
        clusters = clusters_plot(counts.t_half_lives, counts.clusters_over_n0, t_ref, plain, {}, now);
    }

    PlotSpec sizes = size_distribution_plot(analysis.size_count);

    std::vector<std::int64_t> cluster_sizes;
    std::vector<double> rg_over_a;
    std::int64_t smallest_fitted = 0, largest_fitted = 0;
    for (const ClusterSummary& c : analysis.clusters) {
        if (c.size < 2 || c.spans_box || !c.radius_of_gyration_nm || analysis.mean_radius_nm <= 0) continue;
        cluster_sizes.push_back(c.size);
        rg_over_a.push_back(*c.radius_of_gyration_nm / analysis.mean_radius_nm);
        if (c.size >= analysis::fractal_min_cluster_size) {
            smallest_fitted = smallest_fitted == 0 ? c.size : std::min(smallest_fitted, c.size);
            largest_fitted = std::max(largest_fitted, c.size);
        }
    }
    std::optional<FractalLine> line;
    if (analysis.fractal.dimension && analysis.fractal.prefactor)
        line = FractalLine{*analysis.fractal.dimension, analysis.fractal.dimension_error.value_or(0.0),
                           *analysis.fractal.prefactor, smallest_fitted, largest_fitted};
    // The fit's note can be long: the first line goes to the plot, the rest under it.
    std::vector<std::string> note_lines = wrapped_lines(line ? std::string() : analysis.fractal.note, 48);
    PlotSpec gyration = gyration_plot(cluster_sizes, rg_over_a, line, note_lines.empty() ? std::string() : note_lines[0]);
    for (std::size_t k = 1; k < note_lines.size(); ++k) gyration.notes.push_back(note_lines[k]);

    std::vector<PairCurve> curves;
    std::vector<std::pair<double, double>> barriers_marked;  // (gap, height): one marker for equal barriers
    for (const trajectory::PairRecord& pair : header.pairs) {
        PairCurve curve;
        if (header.pairs.size() > 1) {
            curve.label = header.species_names.at(pair.species_i);
            curve.label += '-';
            curve.label += header.species_names.at(pair.species_j);
        }
        const std::size_t kept = interesting_samples(pair);
        curve.gap_nm.assign(pair.gap_nm.begin(), pair.gap_nm.begin() + std::ptrdiff_t(kept));
        curve.energy_kT.assign(pair.energy_kT.begin(), pair.energy_kT.begin() + std::ptrdiff_t(kept));
        const std::pair<double, double> barrier{pair.barrier_gap_nm, pair.barrier_kT};
        if (pair.has_barrier &&
            std::find(barriers_marked.begin(), barriers_marked.end(), barrier) == barriers_marked.end()) {
            curve.barrier_gap_nm = pair.barrier_gap_nm;
            curve.barrier_kT = pair.barrier_kT;
            barriers_marked.push_back(barrier);
        }
        curve.capture_gap_nm = pair.capture_gap_nm;
        curves.push_back(std::move(curve));
    }
    PlotSpec interaction = interaction_plot(curves);
    return {std::move(clusters), std::move(sizes), std::move(gyration), std::move(interaction)};
}

SceneText describe_frame(const trajectory::TrajectoryHeader& header, const LoadedFrame& shown, std::size_t frame_count,
                         const ViewSettings& settings) {
    SceneText text;
    const trajectory::TrajectoryFrame& frame = *shown.frame;
    const FrameAnalysis& analysis = *shown.analysis;
    std::string line = "frame ";
    line += std::to_string(shown.index);
    line += ", last ";
    line += std::to_string(frame_count == 0 ? 0 : frame_count - 1);
    line += "   step ";
    line += std::to_string(frame.step);
    text.top_left.push_back(line);
    line = "t = ";
    line += short_number(frame.time_s);
    line += " s";
    if (header.fast_half_life_s > 0) {
        line += " = ";
        line += short_number(frame.time_s / header.fast_half_life_s, "%.3f");
        line += " fast half-lives";
    }
    text.top_left.push_back(line);
    line = std::to_string(frame.cluster_count);
    line += " clusters of ";
    line += std::to_string(header.radius_nm.size());
    line += " particles, largest ";
    line += std::to_string(frame.largest_cluster);
    text.top_left.push_back(line);
    line = "colour: ";
    line += colour_mode_name(settings.colour);
    line += settings.wrap ? ", wrapped into the box" : ", clusters whole";
    if (settings.only_largest) line += ", largest cluster only";
    text.top_left.push_back(line);
    if (!frame.spanning_clusters.empty()) {
        line = std::to_string(frame.spanning_clusters.size());
        line += frame.spanning_clusters.size() == 1 ? " cluster spans" : " clusters span";
        line += " the periodic box (a gel network: no R_g)";
        text.top_left.push_back(line);
    }
    if (settings.selected_cluster) {
        if (const ClusterSummary* c = analysis.find(*settings.selected_cluster)) {
            line = "selected cluster ";
            line += std::to_string(c->id);
            line += ": ";
            line += std::to_string(c->size);
            line += c->size == 1 ? " particle" : " particles";
            if (c->radius_of_gyration_nm) {
                line += ", R_g ";
                line += short_number(*c->radius_of_gyration_nm);
                line += " nm";
            }
            if (c->spans_box) line += ", spans the periodic box";
            text.bottom_left.push_back(line);
        }
    }
    return text;
}

FrameView::FrameView(const sf::Font& font) : font_(font) {}

void FrameView::draw(sf::RenderTarget& target, const trajectory::TrajectoryHeader& header, const LoadedFrame& shown,
                     const CountSeries& counts, const ViewSettings& settings, const SceneText& text) {
    const sf::Vector2u size = target.getSize();
    layout_ = layout_viewer(int(size.x), int(size.y), settings.plots);
    const PixelRect& scene = layout_.scene;
    const Camera camera(settings.camera, header.box_length_nm, Viewport{0, 0, scene.width_px, scene.height_px});
    if (image_.width_px != scene.width_px || image_.height_px != scene.height_px)
        image_.resize(scene.width_px, scene.height_px);
    RenderSettings render;
    render.threads = settings.render_threads;
    const std::vector<Sphere> spheres = build_spheres(header, *shown.frame, *shown.analysis, settings);
    render_spheres(spheres, camera, render, image_);

    if (texture_.getSize() != sf::Vector2u(unsigned(scene.width_px), unsigned(scene.height_px)))
        texture_.create(unsigned(scene.width_px), unsigned(scene.height_px));
    texture_.update(image_.rgba.data());
    target.clear(to_sf(render.background));
    sf::Sprite sprite(texture_);
    sprite.setPosition(float(scene.x_px), float(scene.y_px));
    target.draw(sprite);
    if (settings.colour == ColourMode::size) draw_size_legend(target, shown.analysis->largest_size);
    if (settings.plots) {
        const std::array<PlotSpec, 4> specs = build_plot_specs(header, *shown.analysis, counts, shown.frame->time_s);
        plots_.draw(target, layout_, specs, font_);
    }
    draw_scene_text(target, text);
}

std::optional<std::uint32_t> FrameView::particle_at(int x_px, int y_px) const {
    const PixelRect& scene = layout_.scene;
    const int x = x_px - scene.x_px, y = y_px - scene.y_px;
    if (x < 0 || y < 0 || x >= image_.width_px || y >= image_.height_px) return std::nullopt;
    const std::uint32_t id = image_.owner_at(x, y);
    if (id == no_particle) return std::nullopt;
    return id;
}

void FrameView::draw_scene_text(sf::RenderTarget& target, const SceneText& text) const {
    const PixelRect& scene = layout_.scene;
    const unsigned character_px = 13;
    const float line_px = 17.0f;
    sf::Text line("", font_, character_px);
    line.setFillColor(sf::Color(225, 228, 235));
    float y = float(scene.y_px) + 8.0f;
    for (const std::string& s : text.top_left) {
        line.setString(sf::String::fromUtf8(s.begin(), s.end()));
        line.setPosition(float(scene.x_px) + 10.0f, y);
        target.draw(line);
        y += line_px;
    }
    y = float(scene.y_px + scene.height_px - text.bottom_reserved_px) - 10.0f - line_px * float(text.bottom_left.size());
    for (const std::string& s : text.bottom_left) {
        line.setString(sf::String::fromUtf8(s.begin(), s.end()));
        line.setPosition(float(scene.x_px) + 10.0f, y);
        target.draw(line);
        y += line_px;
    }
    line.setFillColor(sf::Color(245, 190, 90));
    y = float(scene.y_px) + 8.0f;
    for (const std::string& s : text.warnings) {
        line.setString(sf::String::fromUtf8(s.begin(), s.end()));
        const float width = line.getLocalBounds().width;
        line.setPosition(float(scene.x_px + scene.width_px) - 10.0f - width, y);
        target.draw(line);
        y += line_px;
    }
}

void FrameView::draw_size_legend(sf::RenderTarget& target, std::int64_t largest_size) const {
    const PixelRect& scene = layout_.scene;
    const float bar_w = 14.0f, bar_h = std::min(220.0f, float(scene.height_px) * 0.4f);
    const float x = float(scene.x_px + scene.width_px) - 60.0f, y_top = float(scene.y_px + scene.height_px) - bar_h - 50.0f;
    sf::VertexArray bar(sf::TriangleStrip);
    const int steps = 64;
    for (int k = 0; k <= steps; ++k) {
        const double fraction = double(k) / steps;
        const sf::Color c = to_sf(size_map_at(fraction));
        const float y = y_top + bar_h * float(1.0 - fraction);
        bar.append(sf::Vertex({x, y}, c));
        bar.append(sf::Vertex({x + bar_w, y}, c));
    }
    target.draw(bar);
    sf::Text label("", font_, 12);
    label.setFillColor(sf::Color(225, 228, 235));
    label.setString("size");
    label.setPosition(x - 4.0f, y_top - 20.0f);
    target.draw(label);
    label.setString(std::to_string(std::max<std::int64_t>(largest_size, 1)));
    label.setPosition(x + bar_w + 4.0f, y_top - 7.0f);
    target.draw(label);
    label.setString("1");
    label.setPosition(x + bar_w + 4.0f, y_top + bar_h - 7.0f);
    target.draw(label);
}

}  // namespace brownfloc::viewer
