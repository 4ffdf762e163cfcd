// Accuracy specifications of reference standards: ±(% of reading + % of range),
// ±(ppm of reading + ppm of range), a fixed ± value, or a certificate's expanded uncertainty
// with its coverage factor, each optionally with the degrees of freedom its certificate states;
// and the compact text form a technician types.
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
    // Degrees of freedom of the stated uncertainty (a certificate's ν_eff), used in
    // Welch–Satterthwaite (JCGM 100:2008 G.4.1); infinity when none is stated, as for a Type B
    // estimate taken as exactly known (G.4.3).
    double dof = kInfiniteDof;
};

// The half-width (limits) or the expanded uncertainty U (certificate) at `reading` on a range
// whose full scale is `rangeValue`.
double specValue(const ReferenceSpec& spec, double reading, double rangeValue);

// The spec as a budget component: rectangular for limits (JCGM 100:2008 4.3.7), normal with the
// certificate's k (JCGM 100:2008 4.3.3), with the spec's degrees of freedom.
UncertaintyComponent referenceComponent(const ReferenceSpec& spec, double reading,
                                        double rangeValue);

// Parses the compact text form; a fixed value or U may carry the unit `unit` (a bare number is
// taken in that unit, scaled by options.bareNumberPowerOfTen). Any form may end with
// ",dof=N" (N > 0, or inf): "U=1mV,k=2,dof=8". Throws std::invalid_argument naming the text,
// the place and the reason.
ReferenceSpec parseReferenceSpec(std::string_view text, Unit unit,
                                 const ParseOptions& options = {});

// The compact text form of a spec (parses back to the same spec).
std::string formatReferenceSpec(const ReferenceSpec& spec);

// The spec in words for a record: "±(0.02 % of reading + 0.01 % of range)",
// "U = 1.00 mV (k = 2, ν = 8)".
std::string describeReferenceSpec(const ReferenceSpec& spec, Unit unit);

} // namespace mw
