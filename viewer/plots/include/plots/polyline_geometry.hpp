#pragma once
// Pixel-space geometry for drawing plot lines: clipping a segment to the data rectangle and
// cutting a line into dashes. Plain C++ (no SFML), so it is tested without a display.
#include <optional>
#include <vector>

namespace brownfloc::viewer {

struct PixelPoint {
    double x_px, y_px;
};

struct PixelSegment {
    PixelPoint from, to;
};

// The part of segment a-b inside the closed rectangle [left, right] x [top, bottom], or
// nothing when no part is inside or a coordinate (or the segment's extent) is not finite.
// Liang & Barsky (1984), "A new concept and method for line clipping", ACM Trans. Graph. 3, 1.
[[nodiscard]] std::optional<PixelSegment> clip_segment(PixelPoint a, PixelPoint b, double left_px, double top_px,
                                                       double right_px, double bottom_px);

// A dash pattern measured along the line: on_px drawn, then off_px left out, repeating.
struct DashPattern {
    double on_px = 6.0, off_px = 4.0;
};

// Cuts segment a-b into its drawn pieces. phase_px is how far into the pattern the segment
// starts (in [0, on_px + off_px)); it is advanced by the segment's length, so consecutive
// segments of one line continue the pattern. A pattern whose on_px or off_px is not finite
// and > 0, or a non-finite segment, gives the whole segment (a solid line).
[[nodiscard]] std::vector<PixelSegment> dash_segment(PixelPoint a, PixelPoint b, const DashPattern& pattern,
                                                     double& phase_px);

}  // namespace brownfloc::viewer
