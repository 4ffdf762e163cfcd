// Recalibration interval from an instrument's history of as-found results, by the staircase
// ("automatic adjustment") method of ILAC-G24:2007 / OIML D 10:2007 Method 1 with the step
// sizes of the "simple response" method A1 of NCSLI RP-1.
#pragma once

#include <chrono>
#include <string>
#include <vector>

namespace mw {

struct AsFoundRecord {
    std::chrono::sys_days date{};
    bool inTolerance = true;
    double worstFractionOfLimit = 0.0; // largest |error| / permissible error of that calibration
};

struct StaircaseSettings {
    double lengthenFraction = 0.10;  // a: I ← I (1 + a) after a comfortable in-tolerance result
    double reliabilityTarget = 0.90; // R: end-of-period in-tolerance probability aimed at
    double marginFraction = 0.80;    // in tolerance but above this share of the limit: keep I
    int minimumDays = 30;
    int maximumDays = 1095;
};

// b in I ← I (1 − b) after an out-of-tolerance result. RP-1 A1 makes b a function of a and R;
// we take the value for which the interval is stationary on average at reliability R:
// R ln(1 + a) + (1 − R) ln(1 − b) = 0, i.e. b = 1 − (1 + a)^(−R/(1−R)).
double shortenFraction(double lengthenFraction, double reliabilityTarget);

enum class IntervalStepKind { Lengthen, Keep, Shorten };

struct IntervalStep {
    std::chrono::sys_days date{};
    IntervalStepKind kind = IntervalStepKind::Keep;
    double intervalDays = 0.0; // interval set after this calibration
};

struct IntervalRecommendation {
    int recommendedDays = 0;
    std::vector<IntervalStep> steps;
    std::size_t inToleranceCount = 0;
    std::size_t total = 0;
    double observedReliability = 0.0; // inToleranceCount / total
    std::string method;               // what was applied, for the record
};

// Records must be in date order; throws std::invalid_argument naming the bad record or
// setting.
IntervalRecommendation recommendInterval(int currentDays, const std::vector<AsFoundRecord>& history,
                                         const StaircaseSettings& settings = {});

} // namespace mw
