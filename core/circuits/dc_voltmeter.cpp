// DC voltmeter multipliers and loading.
#include "core/circuits/dc_voltmeter.h"

#include "core/units/quantity.h"

#include <cmath>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

void checkRange(double volts_range) {
    if (!std::isfinite(volts_range) || volts_range <= 0.0) {
        throw std::domain_error("voltmeter range must be above 0 V, got " +
                                formatEngineering(volts_range, 4, Unit::Volt));
    }
}

} // namespace

double multiplier_ohm(const Movement& movement, double volts_range) {
    checkMovement(movement);
    checkRange(volts_range);
    const double drop_V = movement.fullScaleDrop_V();
    if (volts_range <= drop_V) {
        throw std::domain_error("voltmeter range " + formatEngineering(volts_range, 4, Unit::Volt) +
                                " is not above the movement's own full-scale drop I_fs·R_m = " +
                                formatEngineering(drop_V, 4, Unit::Volt) +
                                "; no multiplier can give it");
    }
    return volts_range / movement.amps_fs - movement.ohms_coil;
}

std::vector<double> multipliers_ohm(const Movement& movement,
                                    std::span<const double> volts_ranges) {
    std::vector<double> out;
    out.reserve(volts_ranges.size());
    for (const double volts : volts_ranges) {
        out.push_back(multiplier_ohm(movement, volts));
    }
    return out;
}

std::vector<double> seriesChain_ohm(const Movement& movement,
                                    std::span<const double> volts_ranges) {
    std::vector<double> sections;
    sections.reserve(volts_ranges.size());
    for (std::size_t i = 0; i < volts_ranges.size(); ++i) {
        if (i == 0) {
            sections.push_back(multiplier_ohm(movement, volts_ranges[0]));
            continue;
        }
        checkRange(volts_ranges[i]);
        if (volts_ranges[i] <= volts_ranges[i - 1]) {
            throw std::domain_error("series-chain ranges must be in ascending order: range " +
                                    std::to_string(i + 1) + " (" +
                                    formatEngineering(volts_ranges[i], 4, Unit::Volt) +
                                    ") is not above range " + std::to_string(i) + " (" +
                                    formatEngineering(volts_ranges[i - 1], 4, Unit::Volt) + ")");
        }
        sections.push_back((volts_ranges[i] - volts_ranges[i - 1]) / movement.amps_fs);
    }
    return sections;
}

double voltmeterResistance_ohm(const Movement& movement, double volts_range) {
    checkMovement(movement);
    checkRange(volts_range);
    return volts_range / movement.amps_fs;
}

LoadedReading loadedReading(double volts_true, double ohms_meter, double ohms_thevenin) {
    if (!std::isfinite(volts_true)) {
        throw std::domain_error("loading: the source voltage is not a finite number");
    }
    if (!std::isfinite(ohms_meter) || ohms_meter <= 0.0) {
        throw std::domain_error("loading: voltmeter resistance must be above 0 Ω");
    }
    if (!std::isfinite(ohms_thevenin) || ohms_thevenin < 0.0) {
        throw std::domain_error("loading: source (Thevenin) resistance must not be negative");
    }
    const double ratio = ohms_meter / (ohms_meter + ohms_thevenin);
    return {volts_true * ratio, ratio - 1.0};
}

} // namespace mw
