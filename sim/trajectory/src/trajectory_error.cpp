#include "trajectory/trajectory_error.hpp"

#include "message_text.hpp"

namespace brownfloc::trajectory {

TrajectoryFormatError::TrajectoryFormatError(const std::string& source, std::uint64_t offset_bytes,
                                             const std::string& problem)
    : std::runtime_error(detail::located(source, offset_bytes, problem)), offset_bytes_{offset_bytes}, problem_{problem} {}

}  // namespace brownfloc::trajectory
