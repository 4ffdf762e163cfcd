// A reference standard (calibrator, reference meter, standard resistor) and what its
// certificate or specification says about each of its ranges.
#pragma once

#include "core/model/vocabulary.h"
#include "core/units/quantity.h"

#include <chrono>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

// Accuracy of one range of a standard: either a specification (percent of reading plus percent
// of range plus a floor, as makers state it) or a certificate's expanded uncertainty, or both.
struct StandardRangeSpec {
    std::string label; // e.g. "20 V DC"
    Unit unit = Unit::Volt;
    double full_scale = 0.0;
    double percent_of_reading = 0.0;
    double percent_of_range = 0.0;
    double floor = 0.0;                                     // in `unit`
    std::optional<double> certificate_expanded_uncertainty; // in `unit`, at coverage_factor
    double coverage_factor = 2.0;
    // Effective degrees of freedom the certificate states for U; nullopt: none stated, taken
    // as infinite (JCGM 100:2008 G.4.2: a Type B estimate taken as exactly known).
    std::optional<double> degrees_of_freedom;
    SignalKind signal = SignalKind::Dc; // what the range delivers or measures (ohms: DC)

    bool operator==(const StandardRangeSpec&) const = default;
};

struct ReferenceStandard {
    std::int64_t id = 0; // assigned by the workbook; 0 until saved
    std::string asset_tag;
    std::string description;
    std::string certificate_number;
    // The day the certificate's calibration was made; nullopt where it was not recorded.
    std::optional<std::chrono::sys_days> calibrated_on;
    std::chrono::sys_days due_date{};
    std::vector<StandardRangeSpec> specs;

    bool operator==(const ReferenceStandard&) const = default;
};

} // namespace mw
