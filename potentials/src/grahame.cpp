#include "potentials/grahame.hpp"

#include <cmath>
#include <string>

#include "potentials/constants.hpp"
#include "potentials/input_error.hpp"

namespace brownfloc::potentials {

namespace {

// sum_i n_i (exp(-z_i y) - 1) [1/m^3] at reduced potential y = e psi0 / kT, summed with
// expm1 so that small y keep their digits (the sum is O(y^2) by electroneutrality).
double boltzmann_excess_per_m3(double reduced_potential, const Electrolyte& electrolyte) {
    double sum = 0.0;
    for (const Ion& ion : electrolyte.ions())
        sum += ion.concentration_mol_per_m3 * constants::avogadro_per_mol *
               std::expm1(-double(ion.valence) * reduced_potential);
    return sum;
}

}  // namespace

double grahame_surface_charge_C_per_m2(double surface_potential_V, const Electrolyte& electrolyte,
                                       const Medium& medium) {
    const double y = surface_potential_V / medium.thermal_voltage_V();
    const double excess = std::max(0.0, boltzmann_excess_per_m3(y, electrolyte));
    const double magnitude = std::sqrt(2.0 * medium.permittivity_F_per_m() * medium.thermal_energy_J() * excess);
    return std::copysign(magnitude, surface_potential_V);
}

double grahame_surface_potential_V(double surface_charge_C_per_m2, const Electrolyte& electrolyte,
                                   const Medium& medium) {
    if (!std::isfinite(surface_charge_C_per_m2))
        throw InputError("surface charge density must be a finite number (C/m^2)");
    if (surface_charge_C_per_m2 == 0.0) return 0.0;
    if (!(electrolyte.ionic_strength_mol_per_m3() > 0.0))
        throw InputError("a surface charge cannot be held fixed without ions in solution: the Grahame equation "
                         "gives no potential for it");
    // Bracket in y = e psi0 / kT on the side of sigma's sign, then bisect: sigma(y) is strictly
    // increasing, and |sigma| grows at least like exp(|z| |y| / 2), so the bracket closes fast.
    const double sign = surface_charge_C_per_m2 > 0 ? 1.0 : -1.0;
    const double target = std::fabs(surface_charge_C_per_m2);
    const double vt = medium.thermal_voltage_V();
    auto charge_at = [&](double y) { return std::fabs(grahame_surface_charge_C_per_m2(sign * y * vt, electrolyte, medium)); };
    double lo = 0.0, hi = 1.0;
    while (charge_at(hi) < target) {
        lo = hi;
        hi *= 2.0;
        if (hi > 1e4)
            throw InputError("surface charge density " + std::to_string(surface_charge_C_per_m2) +
                             " C/m^2 needs a surface potential beyond 1e4 kT/e in this electrolyte");
    }
    for (int k = 0; k < 200 && hi - lo > 1e-15 * hi; ++k) {
        const double mid = 0.5 * (lo + hi);
        (charge_at(mid) < target ? lo : hi) = mid;
    }
    return sign * 0.5 * (lo + hi) * vt;
}

}  // namespace brownfloc::potentials
