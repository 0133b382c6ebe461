#pragma once
// An invented latex paint for the shelf-life tests (demo-style inputs, not a measured
// system): 80 nm radius, Hamaker 1e-20 J, volume fraction 0.2, with the surface potential and
// the [electrolyte] section given by the test.
#include <string>

namespace brownfloc::test {

inline std::string latex_paint_toml(const std::string& surface_potential_mV, const std::string& electrolyte) {
    std::string text = "[particle]\nradius_nm = 80\nhamaker_J = 1.0e-20\nsurface_potential_mV = ";
    text += surface_potential_mV;
    text += "\n\n[suspension]\nvolume_fraction = 0.2\n\n[electrolyte]\n";
    text += electrolyte;
    return text;
}

}  // namespace brownfloc::test
