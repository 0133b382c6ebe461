#pragma once
namespace brownfloc::potentials {

// A pair energy and its derivative with respect to the surface gap h.
// The force along the centre line is -slope_J_per_m (positive = repulsive).
struct EnergySlope {
    double energy_J = 0.0;
    double slope_J_per_m = 0.0;  // dU/dh

    EnergySlope& operator+=(const EnergySlope& o) {
        energy_J += o.energy_J;
        slope_J_per_m += o.slope_J_per_m;
        return *this;
    }
};

}  // namespace brownfloc::potentials
