#pragma once
// "The data handed to a plot is not usable": arrays of different lengths, a window size that
// is not positive, an off-screen image that could not be created. The message names the plot,
// the values found and what is allowed:
//
//   clusters plot: 12 measured times but 11 cluster fractions; the two arrays must have equal length
//
// Non-finite or (on a log axis) non-positive values are not errors: they are skipped when
// drawn. The viewer links no physics, so this is the plots' own type rather than
// brownfloc::InputError (potentials/).
#include <stdexcept>
#include <string>

namespace brownfloc::viewer {

class PlotError : public std::runtime_error {
public:
    explicit PlotError(const std::string& what) : std::runtime_error(what) {}
};

}  // namespace brownfloc::viewer
