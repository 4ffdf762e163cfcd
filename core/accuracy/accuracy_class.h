// Accuracy classes of direct-acting analog indicating instruments (IEC 60051-1/-2): the class
// index series and the fiducial value that the class index is a percentage of.
#pragma once

#include "core/model/vocabulary.h"
#include "core/units/decimal.h"

#include <optional>
#include <span>

namespace mw {

// Class indices for ammeters and voltmeters, IEC 60051-2 (0.05 … 5).
std::span<const double> classIndexSeries();
bool isStandardClassIndex(double classIndex);

// The measuring range of one range of an instrument, in the unit of that range. For a
// strongly non-linear scale IEC 60051-1 takes the scale length as the fiducial value and states
// errors in length of scale; this engine states every error in the range's unit, so the user
// gives the fiducial value in that unit in `fiducialOverride` (no electrical limit defines it).
struct ScaleRange {
    double lower = 0.0; // lower limit of the measuring range (negative for centre zero)
    double upper = 0.0; // upper limit of the measuring range
    ScaleType type = ScaleType::ZeroAtEnd;
    std::optional<double> fiducialOverride; // stored per instrument range when the rule differs
};

// Fiducial value by scale type (IEC 60051-1 5.2.3; rule recalled from the standard, common
// practice): zero at an end -> upper limit; zero inside -> sum of the moduli of the two limits;
// no zero on the scale -> upper limit; non-linear -> scale length (must be given).
// Throws std::invalid_argument naming what is missing or inconsistent.
double fiducialValue(const ScaleRange& range);

// Limit of intrinsic error (± this value, same unit as the range): class index % of fiducial,
// computed exactly on the decimals and returned as the nearest double (1.5 % of 10 V is the
// double nearest 0.15, not 0.15000000000000002).
double permissibleError(double classIndex, double fiducial);

// The same two values in exact decimal arithmetic on the limits and the class index as typed,
// for decisions that must agree with the numbers on the record (IEC 60051-1: errors shall not
// exceed the limits). Throw like their double counterparts.
ExactDecimal exactFiducialValue(const ScaleRange& range);
ExactDecimal exactPermissibleError(double classIndex, const ScaleRange& range);

} // namespace mw
