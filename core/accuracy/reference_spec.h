// Accuracy specifications of reference standards: ±(% of reading + % of range),
// ±(ppm of reading + ppm of range), a fixed ± value, or a certificate's expanded uncertainty
// with its coverage factor; and the compact text form a technician types.
#pragma once

#include "core/uncertainty/budget.h"
#include "core/units/quantity.h"

#include <string>
#include <string_view>

namespace mw {

enum class ReferenceSpecForm {
    PercentReadingRange, // "0.02%rdg+0.01%rng": limits, taken as rectangular
    PpmReadingRange,     // "20ppm+5ppm" (reading + range): limits, taken as rectangular
    Fixed,               // "0.5mV": limits, taken as rectangular
    Certificate,         // "U=1mV,k=2": expanded uncertainty from a calibration certificate
};

// One spec of one range of a reference standard. Fractions are stored as plain ratios
// (0.0002 for 0.02 %), values in the unit of the range.
struct ReferenceSpec {
    ReferenceSpecForm form = ReferenceSpecForm::PercentReadingRange;
    double fractionOfReading = 0.0;
    double fractionOfRange = 0.0;
    double fixedValue = 0.0; // Fixed: the ± limit; Certificate: the expanded uncertainty U
    double coverageK = 2.0;  // Certificate only
};

// The half-width (limits) or the expanded uncertainty U (certificate) at `reading` on a range
// whose full scale is `rangeValue`.
double specValue(const ReferenceSpec& spec, double reading, double rangeValue);

// The spec as a budget component: rectangular for limits (JCGM 100:2008 4.3.7), normal with the
// certificate's k (JCGM 100:2008 4.3.3).
UncertaintyComponent referenceComponent(const ReferenceSpec& spec, double reading,
                                        double rangeValue);

// Parses the compact text form; a fixed value or U may carry the unit `unit` (a bare number is
// taken in that unit). Throws std::invalid_argument naming the text, the place and the reason.
ReferenceSpec parseReferenceSpec(std::string_view text, Unit unit);

// The compact text form of a spec (parses back to the same spec).
std::string formatReferenceSpec(const ReferenceSpec& spec);

} // namespace mw
