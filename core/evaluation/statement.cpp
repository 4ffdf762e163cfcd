// Wording of the statement of conformity.
#include "core/evaluation/statement.h"

#include "core/units/decimal.h"

#include <cmath>
#include <compare>
#include <cstdio>
#include <vector>

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

int sign(std::strong_ordering order) {
    return order < 0 ? -1 : (order > 0 ? 1 : 0);
}

std::string specification(const StatementFacts& facts) {
    return "accuracy class " + number(facts.classIndex) + " (" + kClassStandard +
           "; limit of error \u00B1" + quantity(facts.permissibleError, facts.unit) + ", that is " +
           number(facts.classIndex) + " % of the fiducial value " +
           quantity(facts.fiducialValue, facts.unit) + ")";
}

std::string verdict(const StatementFacts& facts) {
    const std::string spec = specification(facts);
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

std::string findings(const StatementFacts& facts) {
    if (facts.findings.empty()) {
        return {};
    }
    std::string text = " Points that did not pass:";
    for (std::size_t i = 0; i < facts.findings.size(); ++i) {
        const PointFinding& f = facts.findings[i];
        const double band = guardBand(facts.decision, f.expandedU);
        text += (i == 0 ? " " : "; ") + formatEngineering(f.applied, 4, facts.unit) + " (error " +
                formatErrorLikeU(f.error, f.expandedU, facts.permissibleError, band, facts.unit) +
                ", " + std::string(toText(f.outcome)) + ")";
    }
    return text + ".";
}

std::string reference(const StatementFacts& facts) {
    if (facts.referenceIdentity.empty() && facts.referenceSpec.empty()) {
        return " No reference standard is recorded for these results.";
    }
    std::string text = " Reference standard: ";
    text +=
        facts.referenceIdentity.empty() ? std::string("not identified") : facts.referenceIdentity;
    if (!facts.referenceSpec.empty()) {
        text += ", taken as " + facts.referenceSpec;
    }
    return text + ".";
}

std::string omissions(const StatementFacts& facts) {
    if (facts.omittedComponents.empty()) {
        return {};
    }
    std::string names;
    for (std::size_t i = 0; i < facts.omittedComponents.size(); ++i) {
        names += (i == 0 ? "" : (i + 1 == facts.omittedComponents.size() ? " and " : ", ")) +
                 facts.omittedComponents[i];
    }
    return " The uncertainty budget is incomplete: it leaves out the " + names +
           ", so U is understated and the decisions made with it are less safe than they look.";
}

std::string coverage(double probability) {
    const bool twoSigma = std::fabs(probability - kProbabilityTwoSigma) < 1e-12;
    return twoSigma ? std::string("95.45 %") : number(100.0 * probability) + " %";
}

} // namespace

std::string formatErrorLikeU(double error, double expandedU, double permissibleError,
                             double guardBand, Unit unit, std::optional<int> prefixPower) {
    const ExactDecimal exact = ExactDecimal::fromDouble(error);
    const ExactDecimal u = ExactDecimal::fromDouble(expandedU);
    int last = u.isZero() ? exact.lastDigitExponent() : u.leadingExponent() - 1;
    std::vector<ExactDecimal> bounds{ExactDecimal::fromDouble(permissibleError)};
    if (guardBand > 0.0) {
        const ExactDecimal w = ExactDecimal::fromDouble(guardBand);
        bounds.push_back(bounds.front() - w);
        bounds.push_back(bounds.front() + w);
    }
    // A rounding that would move the error onto or across a bound gets one more digit.
    for (int extra = 0; extra < 6 && last > exact.lastDigitExponent(); ++extra) {
        const ExactDecimal rounded = exact.roundedToExponent(last).abs();
        bool honest = true;
        for (const ExactDecimal& bound : bounds) {
            honest = honest && sign(exact.abs() <=> bound) == sign(rounded <=> bound);
        }
        if (honest) {
            break;
        }
        --last;
    }
    const std::string text = formatAtExponent(error, last, unit, prefixPower);
    // A zero takes no sign; "0.9 mA" (a prefix given) is no zero.
    const std::string number = text.substr(0, text.find_first_of(" e"));
    const bool zero = number.find_first_of("123456789") == std::string::npos;
    return error > 0.0 && !zero ? "+" + text : text;
}

std::string describeRule(const DecisionSettings& settings) {
    switch (settings.rule) {
    case DecisionRule::SimpleAcceptance:
        return "binary statement for simple acceptance (ILAC G8:09/2019 4.2.1): each measured "
               "error is compared with the limit as it stands, and the measurement uncertainty "
               "is reported beside it without being subtracted";
    case DecisionRule::GuardedBinary:
        return "binary statement with guard band w = " + number(settings.guardFactor) +
               " \u00D7 U (ILAC G8:09/2019 4.2.2): an error within the acceptance limits, w "
               "inside both limits, passes; any other fails";
    case DecisionRule::GuardedAcceptance:
        break;
    }
    return "non-binary statement with guard band w = " + number(settings.guardFactor) +
           " \u00D7 U (ILAC G8:09/2019 4.2.3): an error more than w inside both limits passes, "
           "one within w of a limit on either side is a conditional pass or conditional fail, "
           "and one more than w outside fails";
}

std::string conformityStatement(const StatementFacts& facts) {
    const std::string phase(displayName(facts.phase));
    const std::string points =
        std::to_string(facts.pointCount) + (facts.pointCount == 1 ? " test point" : " test points");
    return phase + " results at " + points + " of the " + quantity(facts.lower, facts.unit) +
           " to " + quantity(facts.upper, facts.unit) + " range: " + verdict(facts) +
           findings(facts) + " Decision rule: " + describeRule(facts.decision) + "." +
           reference(facts) + omissions(facts) +
           " Uncertainties are expanded uncertainties U for a coverage probability of about " +
           coverage(facts.probability) +
           ", with k from Student's t at the effective degrees of freedom (JCGM 100:2008 G.4).";
}

} // namespace mw
