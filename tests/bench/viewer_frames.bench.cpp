// Frame times of the viewer's window (issue: the viewer, "Speed"): a box at volume fraction
// 0.05 seen whole at 1280x800, plots on, a scripted orbit of 100 frames (3.6 degrees each),
// at 1e4 and 1e5 particles; and, in the same run, a bare vertex-array baseline that draws the
// same spheres at the same projected sizes as textured quads of one pre-shaded sphere
// texture tinted per vertex (the fastest SFML way measured on this machine, TOOLCHAIN.md),
// without depth sorting, plots or text. Each frame ends with display() on a real window, and
// the median and 95th percentile of the frame times are printed, with their ratio to the
// baseline. Needs an X display: xvfb-run -a -s "-screen 0 1280x800x24" build/bin/viewer_bench
// Options: --particles N (only that count), --frames K.
#include <SFML/Graphics.hpp>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <random>
#include <string>
#include <vector>

#include "data/count_series.hpp"
#include "data/frame_analysis.hpp"
#include "font_lookup.hpp"
#include "frame_view.hpp"
#include "scene/camera.hpp"
#include "scene/palettes.hpp"

using namespace brownfloc;
using namespace brownfloc::viewer;
using Clock = std::chrono::steady_clock;

namespace {

struct Case {
    trajectory::TrajectoryHeader header;
    trajectory::TrajectoryFrame frame;
};

// n spheres of 100 nm at random in a box sized for phi = 0.05, in clusters of 1-8 neighbours
// (so that the cluster colouring has work to do); overlaps do not matter for drawing.
Case make_case(std::size_t n) {
    Case c;
    const double a = 100.0, pi = 3.14159265358979;
    const double box = std::cbrt(double(n) * 4.0 / 3.0 * pi * a * a * a / 0.05);
    c.header.box_length_nm = box;
    c.header.temperature_K = 298.15;
    c.header.fast_half_life_s = 1e-3;
    c.header.debye_length_nm = 3;
    c.header.species_names = {"latex"};
    c.header.radius_nm.assign(n, a);
    c.header.species.assign(n, 0);
    trajectory::PairRecord pair;
    for (int k = 0; k < 512; ++k) {
        pair.gap_nm.push_back(0.2 + 0.1 * k);
        pair.energy_kT.push_back(-1.0 / (0.2 + 0.1 * k));
    }
    c.header.pairs.push_back(pair);
    std::mt19937_64 random(7);
    std::uniform_real_distribution<double> uniform(0.0, box);
    std::size_t i = 0;
    while (i < n) {
        const std::size_t size = std::min<std::size_t>(n - i, 1 + random() % 8);
        const double x = uniform(random), y = uniform(random), z = uniform(random);
        for (std::size_t k = 0; k < size; ++k, ++i) {
            c.frame.positions_nm.insert(c.frame.positions_nm.end(), {x + 2 * a * double(k), y, z});
            c.frame.cluster.push_back(static_cast<std::uint32_t>(i - k));
        }
        ++c.frame.cluster_count;
        c.frame.largest_cluster = std::max<std::uint32_t>(c.frame.largest_cluster, std::uint32_t(size));
    }
    return c;
}

struct Timing {
    double median_ms, p95_ms;
};

Timing summarise(std::vector<double> ms) {
    std::sort(ms.begin(), ms.end());
    const auto at = [&](double q) { return ms[std::min(ms.size() - 1, std::size_t(q * double(ms.size() - 1) + 0.5))]; };
    return {at(0.5), at(0.95)};
}

sf::Texture sphere_texture() {
    // One pre-shaded white sphere (64 px), the baseline's sprite.
    const unsigned s = 64;
    sf::Image image;
    image.create(s, s, sf::Color::Transparent);
    for (unsigned j = 0; j < s; ++j)
        for (unsigned i = 0; i < s; ++i) {
            const double qx = (i + 0.5) / s * 2 - 1, qy = (j + 0.5) / s * 2 - 1, q2 = qx * qx + qy * qy;
            if (q2 > 1) continue;
            const double nz = std::sqrt(1 - q2), shade = 0.35 + 0.65 * std::max(0.0, -0.3 * qx - 0.4 * qy + 0.866 * nz);
            const auto v = static_cast<std::uint8_t>(std::min(255.0, 255 * shade));
            image.setPixel(i, j, sf::Color(v, v, v));
        }
    sf::Texture texture;
    texture.loadFromImage(image);
    texture.setSmooth(true);
    return texture;
}

Timing run_viewer(sf::RenderWindow& window, const Case& c, const sf::Font& font, int frames) {
    FrameView view(font);
    LoadedFrame shown;
    shown.frame = std::make_shared<const trajectory::TrajectoryFrame>(c.frame);
    shown.analysis = std::make_shared<const FrameAnalysis>(analyse_frame(c.header, c.frame, 1));
    CountSeries counts;
    for (int k = 0; k <= 100; ++k) {
        counts.t_half_lives.push_back(0.05 * k);
        counts.clusters_over_n0.push_back(1 / (1 + 0.04 * k));
        counts.smoluchowski_over_n0.push_back(1 / (1 + 0.05 * k));
    }
    ViewSettings settings;
    settings.plots = true;
    std::vector<double> ms;
    for (int f = 0; f < frames; ++f) {
        const Clock::time_point start = Clock::now();
        settings.camera.azimuth_deg = std::fmod(30.0 + 3.6 * f, 360.0);
        const SceneText text = describe_frame(c.header, shown, 1, settings);
        view.draw(window, c.header, shown, counts, settings, text);
        window.display();
        sf::Event event;
        while (window.pollEvent(event)) {
        }
        ms.push_back(std::chrono::duration<double, std::milli>(Clock::now() - start).count());
    }
    return summarise(ms);
}

Timing run_baseline(sf::RenderWindow& window, const Case& c, const sf::Texture& texture, int frames) {
    const ViewerLayout layout = layout_viewer(int(window.getSize().x), int(window.getSize().y), true);
    const std::size_t n = c.header.radius_nm.size();
    sf::VertexArray quads(sf::Quads, 4 * n);
    const float ts = float(texture.getSize().x);
    std::vector<double> ms;
    for (int f = 0; f < frames; ++f) {
        const Clock::time_point start = Clock::now();
        CameraPose pose;
        pose.azimuth_deg = std::fmod(30.0 + 3.6 * f, 360.0);
        const Camera camera(pose, c.header.box_length_nm,
                            Viewport{0, 0, layout.scene.width_px, layout.scene.height_px});
        std::size_t used = 0;
        for (std::size_t i = 0; i < n; ++i) {
            const auto p = camera.project({c.frame.positions_nm[3 * i], c.frame.positions_nm[3 * i + 1],
                                           c.frame.positions_nm[3 * i + 2]});
            if (!p) continue;
            const float r = float(camera.sphere_radius_px(c.header.radius_nm[i], p->depth_nm));
            const Rgb rgb = cluster_colour(c.frame.cluster[i], 2);
            const sf::Color tint(rgb.r, rgb.g, rgb.b);
            const float x = float(p->x_px), y = float(p->y_px);
            sf::Vertex* q = &quads[4 * used++];
            q[0] = sf::Vertex({x - r, y - r}, tint, {0, 0});
            q[1] = sf::Vertex({x + r, y - r}, tint, {ts, 0});
            q[2] = sf::Vertex({x + r, y + r}, tint, {ts, ts});
            q[3] = sf::Vertex({x - r, y + r}, tint, {0, ts});
        }
        window.clear(sf::Color(22, 24, 30));
        window.draw(&quads[0], 4 * used, sf::Quads, sf::RenderStates(&texture));
        window.display();
        sf::Event event;
        while (window.pollEvent(event)) {
        }
        ms.push_back(std::chrono::duration<double, std::milli>(Clock::now() - start).count());
    }
    return summarise(ms);
}

}  // namespace

int main(int argc, char** argv) {
    std::vector<std::size_t> counts{10000, 100000};
    int frames = 100;
    for (int k = 1; k + 1 < argc; k += 2) {
        if (std::strcmp(argv[k], "--particles") == 0) counts = {std::size_t(std::atoll(argv[k + 1]))};
        if (std::strcmp(argv[k], "--frames") == 0) frames = std::max(1, std::atoi(argv[k + 1]));
    }
    if (std::getenv("DISPLAY") == nullptr) {
        std::fprintf(stderr, "viewer_bench needs an X display; run under xvfb-run -a -s \"-screen 0 1280x800x24\"\n");
        return 3;
    }
    sf::Font font;
    load_viewer_font(font, std::nullopt);
    sf::RenderWindow window(sf::VideoMode(1280, 800), "viewer_bench");
    const sf::Texture texture = sphere_texture();
    std::printf("viewer frame times, 1280x800, plots on, %d-frame orbit (ms; fps = 1000 / median)\n", frames);
    std::printf("%10s %12s %10s %10s %12s %10s %10s %8s\n", "particles", "viewer_med", "p95", "fps", "baseline_med",
                "p95", "fps", "ratio");
    for (std::size_t n : counts) {
        const Case c = make_case(n);
        // Alternate halves so that a noisy neighbour hits both alike.
        const Timing v1 = run_viewer(window, c, font, frames / 2);
        const Timing b1 = run_baseline(window, c, texture, frames / 2);
        const Timing v2 = run_viewer(window, c, font, frames - frames / 2);
        const Timing b2 = run_baseline(window, c, texture, frames - frames / 2);
        const Timing v{(v1.median_ms + v2.median_ms) / 2, std::max(v1.p95_ms, v2.p95_ms)};
        const Timing b{(b1.median_ms + b2.median_ms) / 2, std::max(b1.p95_ms, b2.p95_ms)};
        std::printf("%10zu %12.2f %10.2f %10.1f %12.2f %10.2f %10.1f %8.2f\n", n, v.median_ms, v.p95_ms,
                    1000 / v.median_ms, b.median_ms, b.p95_ms, 1000 / b.median_ms, b.median_ms / v.median_ms);
    }
    std::printf("ratio = baseline median / viewer median (>= 0.85 is the target where the baseline misses its fps)\n");
    return 0;
}
