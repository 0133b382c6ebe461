#include "appending_file.hpp"

#include <algorithm>
#include <span>

#include "io/file_reading.hpp"
#include "io/file_writing.hpp"
#include "sim/environment_error.hpp"

namespace brownfloc::sim {

namespace {
// Flush once this much is buffered: outputs are rare, rows short.
constexpr std::size_t flush_threshold_bytes = std::size_t{1} << 20;
}

AppendingFile::AppendingFile(io::UniqueFd fd, std::filesystem::path path, std::uint64_t bytes, std::uint64_t rows)
    : fd_(std::move(fd)), path_(std::move(path)), bytes_(bytes), rows_(rows) {}

AppendingFile AppendingFile::create(const std::filesystem::path& path) {
    return AppendingFile(io::create_new_file(path), path, 0, 0);
}

AppendingFile AppendingFile::reopen(const std::filesystem::path& path, std::uint64_t valid_bytes,
                                    std::uint64_t valid_rows) {
    io::UniqueFd fd = io::open_existing_for_append(path);
    const std::uint64_t size = io::regular_file_size(fd.get(), path);
    if (size < valid_bytes) {
        std::string message = path.string();
        message += ": shorter (";
        message += std::to_string(size);
        message += " bytes) than the checkpoint records (";
        message += std::to_string(valid_bytes);
        message += " bytes); the run directory was changed after the checkpoint";
        throw EnvironmentError(message);
    }
    io::truncate_to(fd.get(), valid_bytes, path);
    return AppendingFile(std::move(fd), path, valid_bytes, valid_rows);
}

void AppendingFile::append(std::string_view text) {
    buffer_ += text;
    bytes_ += text.size();
    rows_ += static_cast<std::uint64_t>(std::count(text.begin(), text.end(), '\n'));
    if (buffer_.size() >= flush_threshold_bytes) flush();
}

void AppendingFile::flush() {
    if (buffer_.empty()) return;
    io::write_all(fd_.get(), std::as_bytes(std::span(buffer_.data(), buffer_.size())), path_);
    buffer_.clear();
}

void AppendingFile::sync() {
    flush();
    io::sync_file(fd_.get(), path_);
}

}  // namespace brownfloc::sim
