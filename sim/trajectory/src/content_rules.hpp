#pragma once
// The rules every stored value must meet, in one place: TrajectoryWriter applies them to what
// it is given (std::invalid_argument), TrajectoryReader to what it decodes
// (TrajectoryFormatError, or a skipped frame). So the writer can never produce a file the
// reader refuses. Each returns the first problem found, naming the field and its value, or
// nothing.
#include <optional>
#include <string>

#include "frame_shape.hpp"
#include "trajectory/trajectory_data.hpp"

namespace brownfloc::trajectory::detail {

[[nodiscard]] std::optional<std::string> header_problem(const TrajectoryHeader& header);
// Sizes against the shape, finite values, ids below N; not the ordering against other frames.
[[nodiscard]] std::optional<std::string> frame_problem(const TrajectoryFrame& frame, const FrameShape& shape);

}  // namespace brownfloc::trajectory::detail
