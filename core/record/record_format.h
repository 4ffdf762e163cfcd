// How numbers stand in the tables of records and reports: values of a range in its own prefix,
// errors and percentages with their sign, coverage probabilities in words.
#pragma once

#include "core/model/instrument.h"
#include "core/units/quantity.h"

#include <string>

namespace mw::record {

// A value on a range's scale (applied, indicated) in the prefix of the range's largest limit,
// to five significant digits of that limit, so that a zero reads "0.000 V" beside "10.000 V".
std::string scaleValue(double value, const RangeSpec& range);

// A percentage of the fiducial value with its sign, to a hundredth of the class index
// ("+0.85 %" for class 1.5, "+0.085 %" for class 0.5; a zero unsigned).
std::string signedPercent(double percent, double classIndex);

// A quantity to three significant digits: "150 mV".
std::string quantity(double value, Unit unit);

// A coverage probability in words: "about 95.45 %" for the two-sigma probability of the
// GUM's Table G.2, else the percentage to four digits.
std::string coverageWords(double probability);

// A number of days: "365 days", "1 day".
std::string days(long count);

// Characters that file names and identifiers of records should not carry replaced by '_'.
std::string safeFileStem(const std::string& text);

} // namespace mw::record
