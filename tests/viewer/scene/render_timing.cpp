// Times render_spheres on random spheres at volume fraction 0.05 in a box seen whole (default
// camera) into an 800 x 800 viewport, for 1e4 and 1e5 spheres and 1 and 2 threads. Not a test:
// run it by hand (build target render_timing) and quote its output with the machine.
//
//     build/bin/render_timing [repeats]
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <numbers>
#include <random>
#include <vector>

#include "scene/camera.hpp"
#include "scene/palettes.hpp"
#include "scene/sphere_image.hpp"
#include "scene/sphere_renderer.hpp"

using namespace brownfloc::viewer;

namespace {

constexpr double radius_nm = 50.0, volume_fraction = 0.05;

// N spheres of radius 50 nm, uniform in a box sized for phi = N (4/3) pi a^3 / L^3 = 0.05.
// Overlaps are allowed (only the drawing cost matters). Seed 7.
std::vector<Sphere> random_spheres(std::size_t count, double& box_length_nm) {
    box_length_nm = std::cbrt(double(count) * 4.0 / 3.0 * std::numbers::pi * std::pow(radius_nm, 3) / volume_fraction);
    std::mt19937_64 generator(7);
    std::uniform_real_distribution<double> position(0.0, box_length_nm);
    std::vector<Sphere> spheres(count);
    for (std::size_t k = 0; k < count; ++k) {
        spheres[k] = {{position(generator), position(generator), position(generator)}, radius_nm,
                      cluster_colour(std::uint32_t(k / 4), 4), std::uint32_t(k)};
    }
    return spheres;
}

// CPU time of the whole process (all threads), in ms: on a shared machine wall time also counts
// other people's work, CPU time does not (but includes cache contention).
double process_cpu_ms() {
    timespec t{};
    clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &t);
    return double(t.tv_sec) * 1e3 + double(t.tv_nsec) * 1e-6;
}

double median_ms(std::vector<double> samples) {
    std::sort(samples.begin(), samples.end());
    return samples[samples.size() / 2];
}

}  // namespace

int main(int argc, char** argv) {
    const int repeats = argc > 1 ? std::max(1, std::atoi(argv[1])) : 15;
    SphereImage image;
    image.resize(800, 800);
    std::printf("render_spheres, 800 x 800 viewport, default camera, phi = 0.05, median of %d renders\n", repeats);
    std::printf("%10s %8s %12s %10s %14s %10s\n", "spheres", "threads", "ms/render", "fps", "cpu ms/render",
                "px/sphere");
    for (const std::size_t count : {std::size_t(10000), std::size_t(100000)}) {
        double box_length_nm = 0;
        const std::vector<Sphere> spheres = random_spheres(count, box_length_nm);
        const Camera camera(CameraPose{}, box_length_nm, Viewport{0, 0, 800, 800});
        // Mean disc area at the box-centre depth, for scale.
        const double rho = camera.sphere_radius_px(radius_nm, CameraPose{}.distance_box_lengths * box_length_nm);
        for (const int threads : {1, 2}) {
            RenderSettings settings;
            settings.threads = threads;
            render_spheres(spheres, camera, settings, image);  // warm-up
            std::vector<double> wall, cpu;
            for (int r = 0; r < repeats; ++r) {
                const double cpu_start = process_cpu_ms();
                const auto start = std::chrono::steady_clock::now();
                render_spheres(spheres, camera, settings, image);
                const auto stop = std::chrono::steady_clock::now();
                cpu.push_back(process_cpu_ms() - cpu_start);
                wall.push_back(std::chrono::duration<double, std::milli>(stop - start).count());
            }
            const double ms = median_ms(wall);
            std::printf("%10zu %8d %12.2f %10.1f %14.2f %10.1f\n", count, threads, ms, 1000.0 / ms, median_ms(cpu),
                        std::numbers::pi * rho * rho);
        }
    }
    return 0;
}
