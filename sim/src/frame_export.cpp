#include "sim/frame_export.hpp"

#include <algorithm>
#include <cstdio>

namespace brownfloc::sim {

namespace {

// A field of text from a file: quoted when it holds a comma, quote or line break (quotes
// doubled), control characters as \xNN so that no byte of it can break the table.
std::string csv_text(const std::string& text) {
    std::string out;
    bool quote = false;
    for (const char c : text) {
        const auto u = static_cast<unsigned char>(c);
        if (u < 0x20 || u == 0x7f) {
            char buf[8];
            std::snprintf(buf, sizeof buf, "\\x%02X", u);
            out += buf;
        } else if (c == '"') {
            out += "\"\"";
            quote = true;
        } else {
            quote = quote || c == ',';
            out += c;
        }
    }
    if (!quote) return out;
    std::string quoted = "\"";
    quoted += out;
    quoted += '"';
    return quoted;
}

}  // namespace

std::string frame_csv(const trajectory::TrajectoryHeader& header, const trajectory::TrajectoryFrame& frame,
                      bool positions_float64) {
    const std::size_t n = header.radius_nm.size();
    std::vector<std::string> names;
    names.reserve(header.species_names.size());
    for (const std::string& name : header.species_names) names.push_back(csv_text(name));
    std::vector<std::uint32_t> spanning = frame.spanning_clusters;
    std::sort(spanning.begin(), spanning.end());
    const char* position_format = positions_float64 ? "%.17g" : "%.9g";
    std::string out = "id,species,radius_nm,x_nm,y_nm,z_nm,cluster,spans_box\n";
    out.reserve(out.size() + n * 96);
    char buf[48];
    for (std::size_t i = 0; i < n; ++i) {
        out += std::to_string(i);
        out += ',';
        out += names.at(header.species.at(i));
        out += ',';
        std::snprintf(buf, sizeof buf, "%.17g", header.radius_nm[i]);
        out += buf;
        for (int c = 0; c < 3; ++c) {
            out += ',';
            std::snprintf(buf, sizeof buf, position_format, frame.positions_nm.at(3 * i + std::size_t(c)));
            out += buf;
        }
        out += ',';
        const std::uint32_t cluster = frame.cluster.at(i);
        out += std::to_string(cluster);
        out += std::binary_search(spanning.begin(), spanning.end(), cluster) ? ",true\n" : ",false\n";
    }
    return out;
}

}  // namespace brownfloc::sim
