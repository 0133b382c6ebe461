#pragma once
// "What the viewer was given cannot be shown": a path that is neither a run directory nor a
// trajectory file, a frame whose arrays do not fit its header, a timeseries.csv without the
// columns the plots need. The message names the path or value and what is expected:
//
//   runs/a: not a run directory: it has no trajectory.bftraj (give a run directory written by
//   `brownfloc run`, or a .bftraj file)
//
// A damaged trajectory file is trajectory::TrajectoryFormatError and a failed read io::IoError,
// as the trajectory library throws them; a damaged CSV or JSON file is run_files::RunFileError.
#include <stdexcept>
#include <string>

namespace brownfloc::viewer {

class ViewerInputError : public std::runtime_error {
public:
    explicit ViewerInputError(const std::string& what);
};

}  // namespace brownfloc::viewer
