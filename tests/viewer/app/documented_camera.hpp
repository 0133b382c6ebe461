#pragma once
// The camera of viewer/README.md, written out again here so that the pixel tests predict
// where things land without calling the viewer's own projection.
#include <cmath>

namespace brownfloc::test {

struct Predicted {
    double x_px, y_px, depth_nm, radius_px;
};

// Where a sphere at (x, y, z) nm of radius a lands in a W x H scene viewport at (0, 0), for
// a camera at azimuth az, elevation el (degrees), distance dist box lengths, aimed at the
// centre of a box of edge L.
inline Predicted predict(double x, double y, double z, double a, double az_deg, double el_deg, double dist, double L,
                         int W, int H) {
    const double pi = 3.14159265358979323846;
    const double az = az_deg * pi / 180, el = el_deg * pi / 180;
    const double wx = std::sin(az) * std::cos(el), wy = -std::cos(az) * std::cos(el), wz = std::sin(el);
    const double rx = std::cos(az), ry = std::sin(az), rz = 0;
    const double ux = -std::sin(az) * std::sin(el), uy = std::cos(az) * std::sin(el), uz = std::cos(el);
    const double D = dist * L;
    const double ex = L / 2 + D * wx, ey = L / 2 + D * wy, ez = L / 2 + D * wz;
    const double dx = x - ex, dy = y - ey, dz = z - ez;
    const double xc = dx * rx + dy * ry + dz * rz, yc = dx * ux + dy * uy + dz * uz, zc = -(dx * wx + dy * wy + dz * wz);
    const double f = (H / 2.0) / std::tan(20.0 * pi / 180);
    return {W / 2.0 + f * xc / zc, H / 2.0 - f * yc / zc, zc, f * a / zc};
}

}  // namespace brownfloc::test
