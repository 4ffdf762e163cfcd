// Conformity decisions for one measured value against a tolerance interval by the rules of
// ILAC G8:09/2019 4.2 (simple acceptance, binary and non-binary statements with a guard band),
// decided in exact decimal arithmetic on the numbers as typed; and the conformance probability
// and specific risk of JCGM 106:2012 for a normal or scaled-and-shifted t model.
#pragma once

#include "core/model/vocabulary.h"
#include "core/units/decimal.h"

#include <limits>

namespace mw {

// Tolerance interval of the measured quantity (here: the error of indication), T_L < T_U.
struct ToleranceInterval {
    double lower = 0.0;
    double upper = 0.0;
};

// The same interval as exact decimals (the limit computed as class index × fiducial / 100).
struct ExactTolerance {
    ExactDecimal lower;
    ExactDecimal upper;

    static ExactTolerance of(const ToleranceInterval& tolerance);
};

struct DecisionSettings {
    DecisionRule rule = DecisionRule::SimpleAcceptance;
    double guardFactor = 1.0; // r in w = r · U (rules with a guard band only)
};

// True for the rules that take a guard band (ILAC G8:09/2019 4.2.2 and 4.2.3).
bool hasGuardBand(DecisionRule rule);

// Guard band w for the rule: 0 for simple acceptance, r · U otherwise (exact product, as the
// nearest double). Throws std::invalid_argument for r < 0 or not finite.
double guardBand(const DecisionSettings& settings, double expandedU);
ExactDecimal exactGuardBand(const DecisionSettings& settings, const ExactDecimal& expandedU);

// Decides one result y with expanded uncertainty U (as reported) against T_L … T_U:
//  - Simple acceptance (ILAC G8:09/2019 4.2.1): pass when T_L ≤ y ≤ T_U, else fail.
//  - Binary statement with guard band (4.2.2), w = r · U: pass when T_L + w ≤ y ≤ T_U − w
//    (the acceptance limits AL = T ∓ w count as inside), else fail.
//  - Non-binary statement with guard band (4.2.3), w = r · U: pass when y lies more than w
//    inside both limits; conditional pass when inside the tolerance but within w of a limit;
//    conditional fail when outside the tolerance by no more than w; fail beyond that.
// Every comparison is exact on the decimals (y a mean of decimal readings kept as sum and
// count), so an error equal to the limit in the numbers typed is on the limit, never beyond it
// by binary rounding. Throws std::invalid_argument for an empty tolerance, a negative U or r.
Outcome decide(const ExactMean& measured, const ExactDecimal& expandedU,
               const ExactTolerance& tolerance, const DecisionSettings& settings);
// The same with each double taken as its shortest decimal.
Outcome decide(double measured, double expandedU, const ToleranceInterval& tolerance,
               const DecisionSettings& settings);

// The more severe of two outcomes (pass < conditional pass < conditional fail < fail).
Outcome worseOf(Outcome a, Outcome b);

// Pass and conditional pass accept the item; conditional fail and fail reject it.
bool isAccepted(Outcome outcome);

// Conformance probability p_c: the probability that the true value lies in T_L … T_U given
// the measured y with standard uncertainty u (JCGM 106:2012 clause 7). With finite `dof` the
// PDF of the measurand is the t-distribution scaled by u and shifted to y (JCGM 101:2008 6.4.9,
// from memory), p_c = F_ν((T_U − y)/u) − F_ν((T_L − y)/u); infinite dof gives the normal PDF.
// u = 0 gives 1 or 0.
double conformanceProbability(double measured, double standardU, const ToleranceInterval& tolerance,
                              double dof = std::numeric_limits<double>::infinity());

// Specific risk (JCGM 106:2012 clause 9, specific consumer's risk; clause number from memory):
// the probability that the true value lies OUTSIDE the tolerance given the measured value,
// 1 − p_c, summed from the two tails so that small risks keep their precision. It is the risk
// of accepting this item; for a rejected item the figure to show is p_c itself.
double specificRisk(double measured, double standardU, const ToleranceInterval& tolerance,
                    double dof = std::numeric_limits<double>::infinity());

// Measurement capability index C_m = (T_U − T_L) / (4 u) (JCGM 106:2012 clause 7.6).
double measurementCapabilityIndex(double standardU, const ToleranceInterval& tolerance);

} // namespace mw
