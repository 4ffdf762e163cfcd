// The caution text for test values above the IEC 61010-1 hazardous-live limits.
#include "core/circuits/hazard.h"

#include "core/units/quantity.h"

#include <cmath>
#include <stdexcept>

namespace mw {
namespace {

constexpr double kPeakRounding = 1.001;

std::string caution(const std::string& what) {
    return "Caution: " + what +
           " exceeds the hazardous-live limits of IEC 61010-1 (30 V rms, 42.4 V peak, 60 V DC). "
           "Use rated test leads and a guarded source, and de-energise before changing "
           "connections.";
}

} // namespace

std::optional<std::string> hazardCaution(double volts, VoltageKind kind, double crestFactor) {
    if (!std::isfinite(volts)) {
        throw std::invalid_argument("hazard check: the voltage is not a finite number");
    }
    const double magnitude_V = std::fabs(volts);
    switch (kind) {
    case VoltageKind::Dc:
        if (magnitude_V > kHazardLimitDc_V) {
            return caution(formatEngineering(volts, 3, Unit::Volt) + " DC");
        }
        return std::nullopt;
    case VoltageKind::Peak:
        if (magnitude_V > kHazardLimitPeak_V) {
            return caution(formatEngineering(volts, 3, Unit::Volt) + " peak");
        }
        return std::nullopt;
    case VoltageKind::AcRms:
        if (!std::isfinite(crestFactor) || crestFactor < 1.0) {
            throw std::invalid_argument("hazard check: crest factor must be at least 1");
        }
        // 42.4 V is 30 V x √2 rounded: a 30 V rms sine (42.43 V peak) is at, not above, the limit.
        if (magnitude_V > kHazardLimitRms_V ||
            magnitude_V * crestFactor > kHazardLimitPeak_V * kPeakRounding) {
            return caution(formatEngineering(volts, 3, Unit::Volt) + " rms (" +
                           formatEngineering(magnitude_V * crestFactor, 3, Unit::Volt) + " peak)");
        }
        return std::nullopt;
    }
    return std::nullopt;
}

} // namespace mw
