// Hazardous-live check of a test value against the limits of IEC 61010-1 (6.3.1).
#pragma once

#include <optional>
#include <string>

namespace mw {

// The limits above which a voltage is hazardous live in normal condition (IEC 61010-1:2010
// 6.3.1 a): 30 V rms, 42.4 V peak, 60 V DC.
inline constexpr double kHazardLimitRms_V = 30.0;
inline constexpr double kHazardLimitPeak_V = 42.4;
inline constexpr double kHazardLimitDc_V = 60.0;

enum class VoltageKind {
    Dc,    // steady DC level
    AcRms, // AC given by its rms value; its peak is checked too (sine unless stated)
    Peak,  // a peak value of any waveform
};

// The caution text to show and record when |volts| exceeds the limit for its kind, or none.
// For AC rms values the peak (volts_rms * crest factor, √2 for a sine) is checked as well, so a
// 25 V rms square wave passes but a 25 V rms wave with crest factor 2 does not.
std::optional<std::string> hazardCaution(double volts, VoltageKind kind,
                                         double crestFactor = 1.4142135623730951);

} // namespace mw
