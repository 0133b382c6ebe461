#include "trajectory/trajectory_error.hpp"

#include "io_pieces.hpp"

namespace brownfloc::trajectory {

TrajectoryFormatError::TrajectoryFormatError(const std::string& source, std::uint64_t offset_bytes,
                                             const std::string& problem)
    : std::runtime_error(detail::located(source, offset_bytes, problem)), offset_bytes_{offset_bytes}, problem_{problem} {}

}  // namespace brownfloc::trajectory

namespace brownfloc::trajectory::detail {

void throw_format_error(const std::string& source, std::uint64_t offset_bytes, const std::string& problem) {
    throw TrajectoryFormatError(source, offset_bytes, problem);
}

}  // namespace brownfloc::trajectory::detail
