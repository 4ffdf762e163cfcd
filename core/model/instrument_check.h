// What makes an instrument's description impossible or inconsistent, found as it is typed, so
// that the editor can show each reason beside its field before anything is saved.
#pragma once

#include "core/model/instrument.h"

#include <string>
#include <vector>

namespace mw {

struct InstrumentProblem {
    std::string field;   // "asset_tag", "movement_amps_fs", "accuracy_class", "ranges", or a
                         // range field ("full_scale", "nominal_ohms", ...) with rangeIndex set
    int rangeIndex = -1; // index into Instrument::ranges; -1 for the instrument's own fields
    std::string message; // in words, naming the value
};

// Every problem found (empty: the instrument can be saved). Checks identity, movement (I_fs
// positive, R_m not negative), the class index against the IEC 60051-2 series, divisions and
// interval, and each range: limits, unit and signal agreeing with the kind, and that the engine
// can design its resistor (a voltage range below the movement's own full-scale drop, a current
// range below I_fs are impossible).
std::vector<InstrumentProblem> checkInstrument(const Instrument& instrument);

} // namespace mw
