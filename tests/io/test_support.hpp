#pragma once
// A private temporary directory per test, removed afterwards, and small file helpers.
#include <cstddef>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <span>
#include <stdexcept>
#include <string>
#include <string_view>

#include "../support/temp_dir.hpp"

#include "io/write_faults.hpp"

namespace brownfloc::test {


inline std::string read_text(const std::filesystem::path& path) {
    std::ifstream in{path, std::ios::binary};
    return {std::istreambuf_iterator<char>{in}, std::istreambuf_iterator<char>{}};
}

inline void write_text(const std::filesystem::path& path, std::string_view text) {
    std::ofstream out{path, std::ios::binary};
    out.write(text.data(), static_cast<std::streamsize>(text.size()));
}

inline std::span<const std::byte> as_bytes(std::string_view text) {
    return std::as_bytes(std::span<const char>{text.data(), text.size()});
}

// Disarms the write fault seam when a test ends, however it ends.
struct WriteFaultGuard {
    WriteFaultGuard() = default;
    WriteFaultGuard(const WriteFaultGuard&) = delete;
    WriteFaultGuard& operator=(const WriteFaultGuard&) = delete;
    ~WriteFaultGuard() { io::testing::clear_write_faults(); }
};

}  // namespace brownfloc::test
