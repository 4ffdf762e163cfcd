// Wording of the statement of conformity.
#include "core/evaluation/statement.h"

#include <cstdio>

namespace mw {
namespace {

std::string number(double value) {
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.4g", value);
    return buffer;
}

std::string quantity(double value, Unit unit) {
    return formatEngineering(value, 3, unit);
}

std::string verdict(const StatementFacts& facts) {
    const std::string spec =
        "accuracy class " + number(facts.classIndex) + " of IEC 60051 (limit of error ±" +
        quantity(facts.permissibleError, facts.unit) + ", that is " + number(facts.classIndex) +
        " % of the fiducial value " + quantity(facts.fiducialValue, facts.unit) + ")";
    switch (facts.overall) {
    case Outcome::Pass:
        return "the instrument conforms to " + spec + " at every point.";
    case Outcome::ConditionalPass:
        return "every measured error lies within " + spec +
               ", but at least one lies within the guard band of a limit, so conformity is "
               "likely but not assured (conditional pass).";
    case Outcome::ConditionalFail:
        return "at least one measured error lies outside " + spec +
               " by no more than the guard band, so non-conformity is likely but not proven "
               "(conditional fail).";
    case Outcome::Fail:
        return "the instrument does not conform to " + spec + ".";
    }
    return {};
}

} // namespace

std::string describeRule(const DecisionSettings& settings) {
    if (settings.rule == DecisionRule::SimpleAcceptance) {
        return "simple acceptance (ILAC G8:09/2019 4.2.1): each measured error is compared with "
               "the limit as it stands, and the measurement uncertainty is reported beside it "
               "without being subtracted";
    }
    return "guarded acceptance with guard band w = " + number(settings.guardFactor) +
           " × U (ILAC G8:09/2019 4.2.3): an error more than w inside both limits passes, one "
           "within w of a limit on either side is a conditional pass or conditional fail, and "
           "one more than w outside fails";
}

std::string conformityStatement(const StatementFacts& facts) {
    const std::string phase = facts.phase == Phase::AsFound ? "As-found" : "As-left";
    const std::string points =
        std::to_string(facts.pointCount) + (facts.pointCount == 1 ? " test point" : " test points");
    return phase + " results at " + points + " of the " + quantity(facts.lower, facts.unit) +
           " to " + quantity(facts.upper, facts.unit) + " range: " + verdict(facts) +
           " Decision rule: " + describeRule(facts.decision) +
           ". Uncertainties are expanded uncertainties U for a coverage probability of about "
           "95 % (JCGM 100:2008).";
}

} // namespace mw
