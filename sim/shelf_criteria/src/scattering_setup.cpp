#include "shelf_criteria/scattering_setup.hpp"

#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

#include "number_text.hpp"

namespace brownfloc::shelf {
namespace {

[[noreturn]] void refuse(std::string_view key, double value, std::string_view allowed) {
    std::string message = "z-average-growth: ";
    message += key;
    message += " = ";
    message += detail::number_text(value);
    message += ": must be ";
    message += allowed;
    throw std::invalid_argument(message);
}

}  // namespace

Optics optics_from_name(std::string_view name) {
    if (name == "rayleigh") return Optics::rayleigh;
    if (name == "rgd") return Optics::rgd;
    std::string message = "unknown optics \"";
    message += name;
    message += "\": allowed are rayleigh, rgd";
    throw std::invalid_argument(message);
}

std::string_view optics_name(Optics optics) {
    switch (optics) {
        case Optics::rayleigh: return "rayleigh";
        case Optics::rgd: return "rgd";
    }
    throw std::invalid_argument("optics_name: not an Optics enumerator");
}

void validate_scattering(const ScatteringSetup& setup, double fractal_dimension) {
    // d_f = 1 (a rod) to 3 (compact); with these R_h,k rises with k, which makes D_z(t)
    // increase (cluster_optics.hpp). NaN fails every test below.
    if (!(fractal_dimension >= 1.0 && fractal_dimension <= 3.0))
        refuse("fractal_dimension", fractal_dimension, "in [1, 3] (2.1 for slow, reaction-limited aggregation)");
    if (setup.optics == Optics::rayleigh) return;
    if (setup.optics != Optics::rgd) throw std::invalid_argument("validate_scattering: not an Optics enumerator");
    if (!(setup.scattering_angle_deg > 0.0 && setup.scattering_angle_deg <= 180.0))
        refuse("scattering_angle_deg", setup.scattering_angle_deg, "in (0, 180]");
    if (!(setup.wavelength_nm > 0.0 && std::isfinite(setup.wavelength_nm)))
        refuse("wavelength_nm", setup.wavelength_nm, "finite and > 0 (the vacuum wavelength)");
    if (!(setup.medium_refractive_index >= 1.0 && std::isfinite(setup.medium_refractive_index)))
        refuse("medium_refractive_index", setup.medium_refractive_index, "finite and >= 1");
}

double scattering_vector_per_m(const ScatteringSetup& setup) {
    const double half_angle_rad = 0.5 * setup.scattering_angle_deg * std::numbers::pi / 180.0;
    return 4.0 * std::numbers::pi * setup.medium_refractive_index * std::sin(half_angle_rad) /
           (setup.wavelength_nm * 1e-9);
}

}  // namespace brownfloc::shelf
