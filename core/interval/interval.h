// Recalibration interval from an instrument's history of as-found results by a staircase: the
// rule of ILAC-G24:2007 / OIML D 10:2007 method 1, the step form of NCSL RP-1 method A1, and two
// refinements of our own (the shortening step b and a "keep" zone), each labelled below.
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

// Where each part comes from:
//  - ILAC-G24:2007 / OIML D 10:2007 method 1 ("staircase"): after each calibration the interval
//    is lengthened when the instrument was found in tolerance and shortened when it was found
//    out of tolerance. The documents give the rule, not the step sizes.
//  - NCSL RP-1 method A1 ("simple response"): the steps are multiplicative, I ← I (1 + a) when
//    in tolerance and I ← I (1 − b) when out, with a and b chosen by the laboratory.
//  - Our own derivation: b from a and the reliability target R (shortenFraction below).
//  - Our own refinement: a result in tolerance but above marginFraction of the limit keeps the
//    interval unchanged (neither step). The 80 % default is from memory: we recall it as the
//    example share of the tolerance in the method 1 text, unconfirmed; the keep zone itself is
//    ours. marginFraction = 1 turns the zone off and gives the plain method 1 staircase.
struct StaircaseSettings {
    double lengthenFraction = 0.10;  // a: I ← I (1 + a) after a comfortable in-tolerance result
    double reliabilityTarget = 0.90; // R: end-of-period in-tolerance probability aimed at
    double marginFraction = 0.80;    // our keep zone: in tolerance above this share of the limit
    int minimumDays = 30;
    int maximumDays = 1095;
};

// b in I ← I (1 − b) after an out-of-tolerance result: our own derivation, not taken from
// RP-1 or ILAC-G24. It is the b for which the interval is stationary on average when a fraction
// R of results are in tolerance: R ln(1 + a) + (1 − R) ln(1 − b) = 0, so
// b = 1 − (1 + a)^(−R/(1−R)).
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
