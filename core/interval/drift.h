// Drift of the error at one test point over an instrument's history: least-squares line over
// time, a t-test of its slope, and the date at which the line reaches the permissible error.
#pragma once

#include <chrono>
#include <optional>
#include <string>
#include <vector>

namespace mw {

struct DriftObservation {
    std::chrono::sys_days date{};
    double error = 0.0; // as-found error at the point, in the unit of the range
};

struct DriftResult {
    double slopePerYear = 0.0;       // error change per 365.25 days
    double errorAtLast = 0.0;        // fitted error at the last observation
    double slopeStandardError = 0.0; // per year
    double tStatistic = 0.0;
    double dof = 0.0;    // n − 2
    double pValue = 1.0; // two-sided, for slope = 0
    bool significant = false;
    std::optional<std::chrono::sys_days> projectedLimitDate; // only for a significant drift
    std::string summary;
};

// The slope is significant when the two-sided p-value of t = b / s(b) with n − 2 degrees of
// freedom is below `significanceLevel` (ordinary least-squares slope test, e.g. NIST/SEMATECH
// e-Handbook of Statistical Methods 4.4.5). Needs three or more observations on two or more
// dates; throws std::invalid_argument otherwise, and for a limit that is not > 0.
DriftResult analyseDrift(const std::vector<DriftObservation>& observations, double limit,
                         double significanceLevel = 0.05);

} // namespace mw
