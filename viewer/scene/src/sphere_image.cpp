#include "scene/sphere_image.hpp"

#include <limits>
#include <stdexcept>
#include <string>

namespace brownfloc::viewer {

namespace {

std::string size_text(int width_px, int height_px) {
    std::string text = std::to_string(width_px);
    text += " x ";
    text += std::to_string(height_px);
    return text;
}

}  // namespace

void SphereImage::resize(int new_width_px, int new_height_px) {
    if (new_width_px < 0 || new_height_px < 0 ||
        static_cast<long long>(new_width_px) * static_cast<long long>(new_height_px) > max_pixels) {
        std::string message = "sphere image: size ";
        message += size_text(new_width_px, new_height_px);
        message += " px: width and height must be >= 0 with at most ";
        message += std::to_string(max_pixels);
        message += " pixels";
        throw std::invalid_argument(message);
    }
    width_px = new_width_px;
    height_px = new_height_px;
    const std::size_t count = std::size_t(width_px) * std::size_t(height_px);
    rgba.assign(4 * count, 0);
    for (std::size_t k = 0; k < count; ++k) rgba[4 * k + 3] = 255;
    owner.assign(count, no_particle);
    depth_nm.assign(count, std::numeric_limits<float>::infinity());
}

namespace {

std::size_t checked_index(const SphereImage& image, int x, int y, std::size_t buffer_size, std::size_t per_pixel) {
    if (x < 0 || y < 0 || x >= image.width_px || y >= image.height_px) {
        std::string message = "sphere image: pixel (";
        message += std::to_string(x);
        message += ", ";
        message += std::to_string(y);
        message += ") is outside the ";
        message += size_text(image.width_px, image.height_px);
        message += " image";
        throw std::out_of_range(message);
    }
    const std::size_t index = std::size_t(y) * std::size_t(image.width_px) + std::size_t(x);
    if (per_pixel * (index + 1) > buffer_size)
        throw std::out_of_range("sphere image: buffers are smaller than width x height (call resize)");
    return index;
}

}  // namespace

Rgb SphereImage::pixel(int x, int y) const {
    const std::size_t k = 4 * checked_index(*this, x, y, rgba.size(), 4);
    return {rgba[k], rgba[k + 1], rgba[k + 2]};
}

std::uint32_t SphereImage::owner_at(int x, int y) const { return owner[checked_index(*this, x, y, owner.size(), 1)]; }

float SphereImage::depth_at(int x, int y) const { return depth_nm[checked_index(*this, x, y, depth_nm.size(), 1)]; }

}  // namespace brownfloc::viewer
