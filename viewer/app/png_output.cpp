#include "png_output.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <atomic>
#include <cerrno>
#include <cstring>
#include <string>

#include "io/file_writing.hpp"
#include "io/io_error.hpp"
#include "io/message_text.hpp"
#include "viewer_errors.hpp"

namespace brownfloc::viewer {

namespace {

std::atomic<unsigned> temporary_counter{0};

[[noreturn]] void cannot_write(const std::filesystem::path& path, std::string_view reason) {
    throw ViewerEnvironmentError(io::message("cannot write ", io::quoted(path.string()), ": ", reason));
}

// Removes the temporary file on every path out of save_png.
struct TemporaryFile {
    std::filesystem::path path;
    ~TemporaryFile() {
        if (!path.empty()) ::unlink(path.c_str());
    }
};

}  // namespace

void save_png(const sf::Image& image, const std::filesystem::path& path, ExistingFile existing) {
    if (path.extension() != ".png") cannot_write(path, "the file name must end in .png");
    struct stat info {};
    if (::lstat(path.c_str(), &info) == 0) {
        if (existing == ExistingFile::refuse) cannot_write(path, "it exists already (never overwritten)");
        if (S_ISLNK(info.st_mode)) cannot_write(path, "it is a symbolic link (refused)");
        if (!S_ISREG(info.st_mode)) cannot_write(path, "it exists and is not a regular file");
    }
    const std::filesystem::path directory = path.has_parent_path() ? path.parent_path() : std::filesystem::path(".");
    std::string name = ".";
    name += path.filename().string();
    name += ".tmp-";
    name += std::to_string(::getpid());
    name += '-';
    name += std::to_string(temporary_counter.fetch_add(1));
    name += ".png";
    TemporaryFile temporary{directory / name};
    try {
        io::UniqueFd created = io::create_new_file(temporary.path);  // exclusive: nobody else's file
    } catch (const io::IoError& error) {
        temporary.path.clear();
        cannot_write(path, error.what());
    }
    if (!image.saveToFile(temporary.path.string())) cannot_write(path, "the PNG encoder failed (disk full?)");
    try {
        io::UniqueFd fd{::open(temporary.path.c_str(), O_RDONLY | O_NOFOLLOW | O_CLOEXEC)};
        if (fd.get() < 0) throw io::IoError("open", temporary.path, errno);
        io::sync_file(fd.get(), temporary.path);
    } catch (const io::IoError& error) {
        cannot_write(path, error.what());
    }
    if (existing == ExistingFile::refuse) {
        if (::link(temporary.path.c_str(), path.c_str()) != 0) {
            const int error = errno;
            cannot_write(path, error == EEXIST ? "it exists already (never overwritten)" : std::strerror(error));
        }
    } else if (::rename(temporary.path.c_str(), path.c_str()) != 0) {
        cannot_write(path, std::strerror(errno));
    } else {
        temporary.path.clear();
    }
    try {
        io::sync_directory(directory);
    } catch (const io::IoError& error) {
        cannot_write(path, error.what());
    }
}

}  // namespace brownfloc::viewer
