// Conformity decisions for one measured value against a tolerance interval: simple and guarded
// acceptance with the ILAC G8:09/2019 4.2.3 outcomes, and the JCGM 106:2012 conformance
// probability for a normal model.
#pragma once

#include "core/model/vocabulary.h"

namespace mw {

// Tolerance interval of the measured quantity (here: the error of indication), T_L < T_U.
struct ToleranceInterval {
    double lower = 0.0;
    double upper = 0.0;
};

struct DecisionSettings {
    DecisionRule rule = DecisionRule::SimpleAcceptance;
    double guardFactor = 1.0; // r in w = r · U (guarded acceptance only)
};

// Guard band w for the rule: 0 for simple acceptance, r · U for guarded acceptance.
double guardBand(const DecisionSettings& settings, double expandedU);

// Decides one result y with expanded uncertainty U.
//  - Simple acceptance (ILAC G8:09/2019 4.2.1): pass when T_L ≤ y ≤ T_U, else fail.
//  - Guarded acceptance, non-binary (ILAC G8:09/2019 4.2.3) with w = r · U: pass when y lies
//    more than w inside both limits; conditional pass when inside the tolerance but within w of
//    a limit; conditional fail when outside the tolerance by no more than w; fail beyond that.
// Throws std::invalid_argument for an empty tolerance, a negative U or r.
Outcome decide(double measured, double expandedU, const ToleranceInterval& tolerance,
               const DecisionSettings& settings);

// The more severe of two outcomes (pass < conditional pass < conditional fail < fail).
Outcome worseOf(Outcome a, Outcome b);

// Conformance probability p_c = Φ((T_U − y)/u) − Φ((T_L − y)/u) (JCGM 106:2012 clause 7, normal
// PDF for the measurand given y with standard uncertainty u). u = 0 gives 1 or 0.
double conformanceProbability(double measured, double standardU,
                              const ToleranceInterval& tolerance);

// Specific risk of false accept for an accepted item: the probability that the true value lies
// outside the tolerance, 1 − p_c (JCGM 106:2012 9.5.2). The caller shows it when accepting.
double probabilityOfFalseAccept(double measured, double standardU,
                                const ToleranceInterval& tolerance);

// Measurement capability index C_m = (T_U − T_L) / (4 u) (JCGM 106:2012 clause 7.6).
double measurementCapabilityIndex(double standardU, const ToleranceInterval& tolerance);

} // namespace mw
