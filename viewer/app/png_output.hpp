#pragma once
// PNG files written so that a crash or a full disk never leaves a half-written image under the
// final name: SFML encodes into a temporary file beside the target (created exclusively),
// which is fsynced and then renamed into place. A sequence never overwrites: its frames are
// linked into place, which fails if the name exists.
#include <SFML/Graphics/Image.hpp>

#include <filesystem>

namespace brownfloc::viewer {

enum class ExistingFile { replace, refuse };

// Writes image to path (which must end in .png). With ExistingFile::replace an existing
// regular file is replaced atomically; a symbolic link or anything not a regular file is
// refused. With ExistingFile::refuse any existing path is refused. Throws
// ViewerEnvironmentError naming the path and the reason; no temporary file is left behind.
void save_png(const sf::Image& image, const std::filesystem::path& path, ExistingFile existing);

}  // namespace brownfloc::viewer
