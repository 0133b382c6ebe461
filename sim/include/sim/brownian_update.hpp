#pragma once
// The Ermak & McCammon (1978), J. Chem. Phys. 69, 1352, position update without
// hydrodynamic interactions, for one body and one step:
//   dr = (D/kT) F dt + sqrt(2 D dt) xi,  xi ~ N(0, I).
// Shared by the engine and its two-body validation so that both move particles alike.
#include <array>

namespace brownfloc::sim {

// mobility_dt = D dt / kT [m/N], amplitude = sqrt(2 D dt) [m], force [N], normals: at least
// three standard normal numbers (the first three are used).
[[nodiscard]] inline std::array<double, 3> monomer_displacement(double mobility_dt, double amplitude,
                                                                const std::array<double, 3>& force_N,
                                                                const std::array<double, 4>& normals) {
    return {mobility_dt * force_N[0] + amplitude * normals[0], mobility_dt * force_N[1] + amplitude * normals[1],
            mobility_dt * force_N[2] + amplitude * normals[2]};
}

}  // namespace brownfloc::sim
