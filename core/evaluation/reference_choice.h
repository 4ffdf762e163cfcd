// Which reference standard's range gives the applied values of an instrument's range, and the
// uncertainty components it contributes at each applied value.
#pragma once

#include "core/model/calibration.h"
#include "core/uncertainty/budget.h"
#include "core/units/quantity.h"

#include <optional>
#include <vector>

namespace mw {

struct ReferenceChoice {
    SpecRef reference;            // the range delivering or measuring the applied value
    std::optional<SpecRef> shunt; // set when a current is read as the voltage across a shunt
};

// The copy `ref` names, or nullptr when the session holds no such copy.
const StandardSpecCopy* findSpec(const std::vector<StandardSpecCopy>& specs, const SpecRef& ref);

// True when the copy states an uncertainty: limits (% of reading, % of range, floor) or a
// certificate's expanded uncertainty.
bool statesUncertainty(const StandardRangeSpec& spec);

// The standard uncertainty a standard's range contributes at `reading` (in its own unit):
// limits are taken as rectangular (JCGM 100:2008 4.3.7), a certificate's U as normal with its k
// (JCGM 100:2008 4.3.3). Where a copy states both, the limits are used: a standard used without
// applying its certificate's corrections is only known to its specification (common practice).
UncertaintyComponent standardComponent(const StandardRangeSpec& spec, double reading);

// Our own rule, so that a verdict never depends on which standard happens to be listed first:
//  1. a range of the same unit and kind of signal whose full scale covers `largestMagnitude`
//     and that states an uncertainty; of those the one with the smallest standard uncertainty
//     at `largestMagnitude` (ties: the smaller full scale, then the lower standard id and
//     position);
//  2. for a DC current no range covers: a resistance used as a shunt with a DC voltage range
//     that covers largestMagnitude × R, the pair with the smallest combined standard
//     uncertainty at largestMagnitude (same ties, shunt first);
//  3. otherwise none: the evaluation then says that the reference component was left out.
std::optional<ReferenceChoice> chooseReference(Unit unit, SignalType signal,
                                               double largestMagnitude,
                                               const std::vector<StandardSpecCopy>& specs);

// The components of the chosen reference at `applied` (in the range's unit). Throws
// std::invalid_argument when the choice names a copy the session does not hold.
std::vector<UncertaintyComponent> referenceComponents(const ReferenceChoice& choice,
                                                      const std::vector<StandardSpecCopy>& specs,
                                                      double applied);

// "20 V AC 45 Hz-1 kHz" or "100 mV DC across 0.01 ohm at 10 A": the ranges in words.
std::string describeChoice(const ReferenceChoice& choice,
                           const std::vector<StandardSpecCopy>& specs);

} // namespace mw
