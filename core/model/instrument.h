// An analog instrument on the register: movement, ranges, scale, accuracy class and status.
#pragma once

#include "core/circuits/diode.h"
#include "core/circuits/movement.h"
#include "core/model/vocabulary.h"
#include "core/units/quantity.h"

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

// One measuring range of the instrument. Values are in `unit` (Unit::Volt or Unit::Ampere).
struct RangeSpec {
    std::int64_t id = 0; // assigned by the workbook; 0 until saved
    std::string label;   // as engraved on the switch, e.g. "10 V"
    Unit unit = Unit::Volt;
    double lower_limit = 0.0; // lower end of the scale (negative for centre zero)
    double full_scale = 0.0;  // upper end of the scale
    // Multiplier resistor (voltmeter) or shunt (ammeter) of this range; nullopt when the range
    // uses the bare movement.
    std::optional<double> nominal_ohms;
    // Set when the fiducial value is fixed explicitly rather than derived from the scale type
    // (IEC 60051-1 5.2.3 lets the relevant part say so, e.g. for suppressed-zero scales).
    std::optional<double> fiducial_value;
    // DC, or AC through a half-wave or bridge rectifier. nullopt only in a range registered
    // before the workbook recorded it (and not yet set since): it is then "not recorded", and
    // the range cannot be calibrated until someone who knows the meter sets it.
    std::optional<SignalType> signal = SignalType::Dc;
    // The model of the rectifier's diodes (rectifier ranges only); nullopt when not recorded.
    std::optional<DiodePreset> diode;

    bool operator==(const RangeSpec&) const = default;
};

struct Instrument {
    std::int64_t id = 0;   // assigned by the workbook; 0 until saved
    std::string asset_tag; // unique within the workbook
    std::string description;
    std::string manufacturer;
    std::string model;
    std::string serial;
    InstrumentKind kind = InstrumentKind::DcVoltmeter;
    Movement movement; // I_fs and R_m of the moving-coil movement inside
    std::vector<RangeSpec> ranges;
    ScaleType scale_type = ScaleType::ZeroAtEnd;
    int scale_divisions = 0;
    double accuracy_class = 0.0; // class index: limit of error in % of the fiducial value
    int interval_days = 365;
    std::string location;
    std::string owner;
    InstrumentStatus status = InstrumentStatus::InService;

    bool operator==(const Instrument&) const = default;
};

} // namespace mw
