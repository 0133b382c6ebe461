#include "font_lookup.hpp"

#include <array>
#include <string>

#include "io/message_text.hpp"
#include "viewer_errors.hpp"

namespace brownfloc::viewer {

namespace {

constexpr std::array<const char*, 3> debian_font_paths = {
    "/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf",
    "/usr/share/fonts/truetype/dejavu/DejaVuSansCondensed.ttf",
    "/usr/share/fonts/truetype/dejavu/DejaVuSansMono.ttf",
};

}  // namespace

void load_viewer_font(sf::Font& font, const std::optional<std::filesystem::path>& requested) {
    if (requested) {
        std::error_code error;
        if (!std::filesystem::is_regular_file(*requested, error) || !font.loadFromFile(requested->string()))
            throw ViewerEnvironmentError(io::message("--font ", io::quoted(requested->string()),
                                                     ": not a font file SFML can load (TrueType or OpenType)"));
        return;
    }
    std::string tried;
    for (const char* path : debian_font_paths) {
        std::error_code error;
        if (std::filesystem::is_regular_file(path, error) && font.loadFromFile(path)) return;
        if (!tried.empty()) tried += ", ";
        tried += path;
    }
    throw ViewerEnvironmentError(io::message("no font found (tried ", tried,
                                             "); install fonts-dejavu-core or give --font FILE"));
}

}  // namespace brownfloc::viewer
