#include "whole_file.hpp"

#include "io/file_reading.hpp"
#include "io/io_error.hpp"
#include "io/message_text.hpp"

namespace brownfloc::run_files::detail {

std::vector<std::byte> read_whole_file(const std::filesystem::path& path, std::uint64_t limit_bytes) {
    io::ReadableFile file = io::open_for_reading(path);
    if (file.size_bytes > limit_bytes)
        throw io::IoError("read", path, 0,
                          io::message("the file holds ", file.size_bytes, " bytes; run files are read up to ",
                                      limit_bytes, " bytes"));
    std::vector<std::byte> bytes(static_cast<std::size_t>(file.size_bytes));
    io::pread_exact(file.fd.get(), 0, bytes, path);
    return bytes;
}

}  // namespace brownfloc::run_files::detail
