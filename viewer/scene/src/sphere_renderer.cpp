#include "scene/sphere_renderer.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <memory>
#include <stdexcept>
#include <string>
#include <thread>
#include <vector>

#include "box_outline.hpp"
#include "parallel_bands.hpp"
#include "projected_sphere.hpp"
#include "sphere_raster.hpp"

namespace brownfloc::viewer {

namespace {

using detail::ProjectedSphere;
using detail::RowRange;

[[noreturn]] void reject_sphere(std::size_t index, const Sphere& sphere, const std::string& problem) {
    std::string message = "render_spheres: sphere ";
    message += std::to_string(index);
    message += " (id ";
    message += std::to_string(sphere.id);
    message += "): ";
    message += problem;
    throw std::invalid_argument(message);
}

void validate_spheres(std::span<const Sphere> spheres) {
    if (spheres.size() >= std::size_t(no_particle)) {
        std::string message = "render_spheres: ";
        message += std::to_string(spheres.size());
        message += " spheres: at most 4294967294 can be drawn";
        throw std::invalid_argument(message);
    }
    for (std::size_t k = 0; k < spheres.size(); ++k) {
        const Sphere& s = spheres[k];
        if (!std::isfinite(s.centre_nm.x) || !std::isfinite(s.centre_nm.y) || !std::isfinite(s.centre_nm.z)) {
            std::string problem = "centre_nm = (";
            problem += std::to_string(s.centre_nm.x);
            problem += ", ";
            problem += std::to_string(s.centre_nm.y);
            problem += ", ";
            problem += std::to_string(s.centre_nm.z);
            problem += "): must be finite";
            reject_sphere(k, s, problem);
        }
        if (!std::isfinite(s.radius_nm) || s.radius_nm <= 0) {
            std::string problem = "radius_nm = ";
            problem += std::to_string(s.radius_nm);
            problem += ": must be finite and > 0";
            reject_sphere(k, s, problem);
        }
        if (s.id == no_particle) reject_sphere(k, s, "id 4294967295 is reserved for 'no particle'");
    }
}

void validate_image(const Viewport& v, const SphereImage& image) {
    const std::size_t count = std::size_t(std::max(image.width_px, 0)) * std::size_t(std::max(image.height_px, 0));
    if (image.width_px < 0 || image.height_px < 0 || image.rgba.size() != 4 * count || image.owner.size() != count ||
        image.depth_nm.size() != count)
        throw std::invalid_argument("render_spheres: the image buffers do not match its width and height (call resize)");
    if (v.x0_px < 0 || v.y0_px < 0 || (long long)v.x0_px + v.width_px > image.width_px ||
        (long long)v.y0_px + v.height_px > image.height_px) {
        std::string message = "render_spheres: viewport at (";
        message += std::to_string(v.x0_px);
        message += ", ";
        message += std::to_string(v.y0_px);
        message += ") of ";
        message += std::to_string(v.width_px);
        message += " x ";
        message += std::to_string(v.height_px);
        message += " px does not fit in the ";
        message += std::to_string(image.width_px);
        message += " x ";
        message += std::to_string(image.height_px);
        message += " image";
        throw std::invalid_argument(message);
    }
}

void clear_band(const Viewport& v, RowRange rows, Rgb background, SphereImage& image) {
    const std::size_t width = std::size_t(image.width_px);
    for (int j = rows.begin; j < rows.end; ++j) {
        const std::size_t first = std::size_t(j) * width + std::size_t(v.x0_px);
        std::fill_n(image.owner.begin() + std::ptrdiff_t(first), v.width_px, no_particle);
        std::fill_n(image.depth_nm.begin() + std::ptrdiff_t(first), v.width_px, std::numeric_limits<float>::infinity());
        std::uint8_t* out = &image.rgba[4 * first];
        for (int i = 0; i < v.width_px; ++i, out += 4) {
            out[0] = background.r;
            out[1] = background.g;
            out[2] = background.b;
            out[3] = 255;
        }
    }
}

// What pass 1 leaves for pass 2: each chunk's drawable spheres, and per band the positions (in
// that list) of those whose candidate rows touch the band.
struct ChunkProjection {
    std::vector<ProjectedSphere> visible;
    std::vector<std::vector<std::uint32_t>> band_lists;
};

// Copies of the spheres touching `band`, gathered from every chunk and ordered by their first
// row inside the band (a counting sort). Both per-band passes then read records in sequence and
// write depth and owner rows that stay in cache; in input order, every sphere was a cache miss
// on its record and on the buffers, which cost about twice the time.
std::vector<ProjectedSphere> band_spheres_in_row_order(const std::vector<ChunkProjection>& chunks, int band,
                                                       RowRange rows) {
    std::vector<std::uint32_t> starts(std::size_t(rows.end - rows.begin) + 1, 0);
    const auto key = [&](const ProjectedSphere& p) { return std::size_t(std::max(p.y_begin, rows.begin) - rows.begin); };
    for (const ChunkProjection& chunk : chunks)
        for (const std::uint32_t at : chunk.band_lists[std::size_t(band)]) ++starts[key(chunk.visible[at]) + 1];
    for (std::size_t k = 1; k < starts.size(); ++k) starts[k] += starts[k - 1];
    std::vector<ProjectedSphere> ordered(starts.back());
    for (const ChunkProjection& chunk : chunks)
        for (const std::uint32_t at : chunk.band_lists[std::size_t(band)]) {
            const ProjectedSphere& p = chunk.visible[at];
            ordered[starts[key(p)]++] = p;
        }
    return ordered;
}

}  // namespace

int render_thread_count(const RenderSettings& settings, int viewport_height_px) {
    if (settings.threads < 0) {
        std::string message = "render_spheres: threads = ";
        message += std::to_string(settings.threads);
        message += ": must be >= 0 (0 = one per hardware thread, at most 8)";
        throw std::invalid_argument(message);
    }
    int threads = settings.threads;
    if (threads == 0)
        threads = std::clamp(int(std::thread::hardware_concurrency()), 1, max_default_render_threads);
    return std::clamp(threads, 1, std::clamp(viewport_height_px, 1, max_render_threads));
}

void render_spheres(std::span<const Sphere> spheres, const Camera& camera, const RenderSettings& settings,
                    SphereImage& image) {
    const Viewport& v = camera.viewport();
    validate_image(v, image);
    validate_spheres(spheres);
    const int bands = render_thread_count(settings, v.height_px);

    // Pass 1, in parallel over contiguous chunks of spheres: project each sphere once and list
    // it in every band its candidate rows touch.
    const std::size_t count = spheres.size();
    const std::unique_ptr<std::uint32_t[]> ids(new std::uint32_t[count]);
    std::vector<ChunkProjection> chunks(static_cast<std::size_t>(bands));
    detail::run_in_parallel(bands, [&](int chunk_number) {
        const std::size_t begin = count * std::size_t(chunk_number) / std::size_t(bands);
        const std::size_t end = count * std::size_t(chunk_number + 1) / std::size_t(bands);
        ChunkProjection& chunk = chunks[std::size_t(chunk_number)];
        chunk.visible.reserve(end - begin);
        chunk.band_lists.resize(std::size_t(bands));
        for (auto& list : chunk.band_lists) list.reserve((end - begin) / std::size_t(bands) + 16);
        for (std::size_t k = begin; k < end; ++k) {
            ids[k] = spheres[k].id;
            const std::optional<ProjectedSphere> p = detail::project_sphere(spheres[k], std::uint32_t(k), camera);
            if (!p) continue;
            const std::uint32_t at = std::uint32_t(chunk.visible.size());
            chunk.visible.push_back(*p);
            const int first = detail::band_of_row(v.y0_px, v.height_px, bands, p->y_begin);
            const int last = detail::band_of_row(v.y0_px, v.height_px, bands, p->y_end - 1);
            for (int band = first; band <= last; ++band) chunk.band_lists[std::size_t(band)].push_back(at);
        }
    });

    // Pass 2, in parallel over bands of rows: clear, box outline, depth pass, shading, ids. The
    // result is the same for any banding: each pixel's winner is decided by (depth, id, index).
    const std::vector<detail::ImageSegment> outline =
        settings.box_outline ? detail::box_outline_segments(camera) : std::vector<detail::ImageSegment>{};
    const std::span<const std::uint32_t> all_ids(ids.get(), count);
    detail::run_in_parallel(bands, [&](int band) {
        const RowRange rows = detail::row_band(v.y0_px, v.height_px, band, bands);
        clear_band(v, rows, settings.background, image);
        detail::draw_segments(outline, v, rows, settings.box_colour, image);
        const std::vector<ProjectedSphere> ordered = band_spheres_in_row_order(chunks, band, rows);
        detail::rasterise_band(ordered, all_ids, rows, image);
        detail::shade_band(ordered, rows, image);
        detail::resolve_owner_ids(all_ids, v, rows, image);
    });
}

}  // namespace brownfloc::viewer
