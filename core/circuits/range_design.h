// The resistor that sets one range of an instrument, as the engine designs it from the
// movement: a DC voltmeter's multiplier, an ammeter's shunt, a rectifier voltmeter's multiplier
// with its diodes' model — the "computed" value a measured resistor is checked against.
#pragma once

#include "core/model/instrument.h"

#include <optional>
#include <string>

namespace mw {

struct DesignedResistor {
    double ohms = 0.0;
    bool isShunt = false;
    std::string basis; // how it was designed, in words for the record
};

// nullopt for a range that uses the bare movement (a current range equal to I_fs). A
// rectifier range with a diode model is solved with real diodes at `celsius`; without one,
// with ideal diodes (and the basis says so). Throws std::invalid_argument / std::domain_error
// naming what makes the range impossible (e.g. a voltage range below the movement's own drop).
std::optional<DesignedResistor> designedResistor(const Instrument& instrument,
                                                 const RangeSpec& range, double celsius = 23.0);

} // namespace mw
