#pragma once
// Initial placement: t = 0 is the moment salt is added, so particles sit at random with
// every gap at least the capture gap of their pair (random sequential addition on a cell
// grid). Ids are then given along a Morton curve so that neighbours sit close in memory;
// species and radii stay random in space. A pure function of (radii, species, box, seed).
#include <cstdint>
#include <string>
#include <vector>

#include "sim/engine.hpp"
#include "sim/engine_model.hpp"
#include "sim/engine_setup.hpp"

namespace brownfloc::sim {

// Random sequential addition jams near a volume fraction of 0.38 for equal spheres; above
// this effective volume fraction (radii grown by half the capture gap) placement is refused.
inline constexpr double max_placement_volume_fraction = 0.30;

// Throws InputError naming source when the concentration is too high to place the
// particles (checked before trying, and again if a particle finds no room). Asks
// stop_requested (if given) every 4096 particles and throws SetupStopped when it says true.
[[nodiscard]] InitialParticles place_particles(const std::vector<double>& radii_m,
                                               const std::vector<std::uint32_t>& species, double box_length_m,
                                               const EngineModel& model, std::uint64_t seed, const std::string& source,
                                               StopRequested stop_requested = nullptr);

}  // namespace brownfloc::sim
