#pragma once
// The per-band passes of the sphere renderer. Each touches only rows in `rows` and columns of
// the viewport, so bands run in parallel without sharing a pixel.
//
// During the depth and shading passes the owner buffer holds input indices (ProjectedSphere::
// index), not particle ids; resolve_owner_ids() turns them into ids at the end. The spheres of
// a band are passed as a contiguous array, ideally in row order, so both passes stream them.
#include <cstdint>
#include <span>

#include "parallel_bands.hpp"
#include "projected_sphere.hpp"
#include "scene/sphere_image.hpp"

namespace brownfloc::viewer::detail {

// Depth pass: for every covered pixel of the spheres keeps the nearest surface; ties go to the
// lower id (ids[index]), then to the lower index.
void rasterise_band(std::span<const ProjectedSphere> spheres, std::span<const std::uint32_t> ids, RowRange rows,
                    SphereImage& image);

// Shading pass, sphere by sphere (each record read once, not once per pixel): colours the
// pixels each sphere won.
void shade_band(std::span<const ProjectedSphere> spheres, RowRange rows, SphereImage& image);

// Replaces the owner indices of the band by the particle ids.
void resolve_owner_ids(std::span<const std::uint32_t> ids, const Viewport& viewport, RowRange rows,
                       SphereImage& image);

}  // namespace brownfloc::viewer::detail
