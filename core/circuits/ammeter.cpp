// Shunt and Ayrton-shunt design for DC ammeters.
#include "core/circuits/ammeter.h"

#include "core/units/quantity.h"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace mw {
namespace {

void checkAmmeterRange(const Movement& movement, double amps_range) {
    if (!std::isfinite(amps_range) || amps_range <= movement.amps_fs) {
        throw std::domain_error("ammeter range " + formatEngineering(amps_range, 4, Unit::Ampere) +
                                " is not above the movement's full-scale current I_fs = " +
                                formatEngineering(movement.amps_fs, 4, Unit::Ampere) +
                                "; a shunt can only extend a range");
    }
}

} // namespace

double shunt_ohm(const Movement& movement, double amps_range) {
    checkMovement(movement);
    checkAmmeterRange(movement, amps_range);
    return movement.amps_fs * movement.ohms_coil / (amps_range - movement.amps_fs);
}

AyrtonShunt ayrtonShunt(const Movement& movement, std::span<const double> amps_ranges) {
    checkMovement(movement);
    if (amps_ranges.empty()) {
        throw std::domain_error("Ayrton shunt: at least one range is needed");
    }
    AyrtonShunt shunt;
    shunt.amps_ranges.assign(amps_ranges.begin(), amps_ranges.end());
    std::sort(shunt.amps_ranges.begin(), shunt.amps_ranges.end());
    for (std::size_t k = 0; k < shunt.amps_ranges.size(); ++k) {
        checkAmmeterRange(movement, shunt.amps_ranges[k]);
        if (k > 0 && shunt.amps_ranges[k] == shunt.amps_ranges[k - 1]) {
            throw std::domain_error("Ayrton shunt: range " +
                                    formatEngineering(shunt.amps_ranges[k], 4, Unit::Ampere) +
                                    " is given twice");
        }
    }
    shunt.total_ohm = shunt_ohm(movement, shunt.amps_ranges.front());
    const double loop_V = movement.amps_fs * (movement.ohms_coil + shunt.total_ohm);
    for (std::size_t k = 0; k < shunt.amps_ranges.size(); ++k) {
        shunt.taps_ohm.push_back(k == 0 ? shunt.total_ohm : loop_V / shunt.amps_ranges[k]);
        shunt.burden_V.push_back(movement.amps_fs *
                                 (movement.ohms_coil + shunt.total_ohm - shunt.taps_ohm.back()));
    }
    // Sections from the common terminal outwards: highest range's tap first.
    double previous_ohm = 0.0;
    for (auto tap = shunt.taps_ohm.rbegin(); tap != shunt.taps_ohm.rend(); ++tap) {
        shunt.sections_ohm.push_back(*tap - previous_ohm);
        previous_ohm = *tap;
    }
    return shunt;
}

} // namespace mw
