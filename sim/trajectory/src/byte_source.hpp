#pragma once
// Where a reader's bytes come from: an open regular file, read with pread (never mmap: a file
// truncated under a mapping raises SIGBUS), or a copy of bytes in memory (fuzzer, tests).
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <span>
#include <string>
#include <vector>

#include "io/unique_fd.hpp"

namespace brownfloc::trajectory::detail {

class ByteSource {
public:
    // Opens path with io::open_for_reading (refuses FIFOs, devices, directories; never blocks).
    static ByteSource open_file(const std::filesystem::path& path);
    static ByteSource hold_bytes(std::span<const std::byte> bytes, std::string name);

    // The size now: fstat for a file (it may grow while a run writes it), fixed for memory.
    [[nodiscard]] std::uint64_t measure_size() const;
    // Exactly into.size() bytes from offset; throws io::IoError if a file ends first.
    void read(std::uint64_t offset, std::span<std::byte> into) const;
    [[nodiscard]] const std::string& name() const { return name_; }
    [[nodiscard]] bool is_file() const { return static_cast<bool>(fd_); }

private:
    ByteSource(io::UniqueFd fd, std::vector<std::byte> bytes, std::string name)
        : fd_{std::move(fd)}, bytes_{std::move(bytes)}, name_{std::move(name)} {}

    io::UniqueFd fd_;
    std::vector<std::byte> bytes_;
    std::string name_;
};

}  // namespace brownfloc::trajectory::detail
