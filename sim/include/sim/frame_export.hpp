#pragma once
// `brownfloc export`: one trajectory frame as CSV, one row per particle:
//   id, species, radius_nm, x_nm, y_nm, z_nm, cluster, spans_box
// (the project's INTERFACES). Positions as stored: each cluster whole, so a member may lie
// outside [0, box). Numbers in shortest round-trip form of the stored precision (9
// significant digits for float32 files, 17 for float64). Species names are quoted as CSV
// requires, control characters written as \xNN.
#include <string>

#include "trajectory/trajectory_data.hpp"

namespace brownfloc::sim {

[[nodiscard]] std::string frame_csv(const trajectory::TrajectoryHeader& header, const trajectory::TrajectoryFrame& frame,
                                    bool positions_float64);

}  // namespace brownfloc::sim
