#include "byte_source.hpp"

#include <algorithm>
#include <cassert>

#include "io/file_reading.hpp"

namespace brownfloc::trajectory::detail {

ByteSource ByteSource::open_file(const std::filesystem::path& path) {
    io::ReadableFile file = io::open_for_reading(path);
    return ByteSource{std::move(file.fd), {}, path.string()};
}

ByteSource ByteSource::hold_bytes(std::span<const std::byte> bytes, std::string name) {
    return ByteSource{io::UniqueFd{}, std::vector<std::byte>(bytes.begin(), bytes.end()), std::move(name)};
}

std::uint64_t ByteSource::measure_size() const {
    return fd_ ? io::regular_file_size(fd_.get(), name_) : bytes_.size();
}

void ByteSource::read(std::uint64_t offset, std::span<std::byte> into) const {
    if (fd_) {
        io::pread_exact(fd_.get(), offset, into, name_);
        return;
    }
    // Callers stay within measure_size(); memory never changes size.
    assert(offset <= bytes_.size() && into.size() <= bytes_.size() - offset);
    std::copy_n(bytes_.begin() + static_cast<std::ptrdiff_t>(offset), into.size(), into.begin());
}

}  // namespace brownfloc::trajectory::detail
