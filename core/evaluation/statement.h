// The statement of conformity for a record, in our own words, carrying what ISO/IEC 17025:2017
// 7.8.6.2 asks for: which results it covers, which specification (standard with part and
// edition), which decision rule; and what a reviewer needs beside it: the points that did not
// pass, the reference standard, and what the uncertainty budget left out.
#pragma once

#include "core/decision/decision.h"
#include "core/model/vocabulary.h"
#include "core/uncertainty/distributions.h"
#include "core/units/quantity.h"

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace mw {

// A point that did not pass outright, with the U its error is shown against.
struct PointFinding {
    double applied = 0.0;
    double error = 0.0;
    double expandedU = 0.0; // as reported; the error is printed to U's last digit
    Outcome outcome = Outcome::Fail;
};

struct StatementFacts {
    Phase phase = Phase::AsFound;
    std::size_t pointCount = 0;
    double lower = 0.0; // range limits
    double upper = 0.0;
    Unit unit = Unit::Volt;
    double classIndex = 0.0;
    double fiducialValue = 0.0;
    double permissibleError = 0.0;
    DecisionSettings decision;
    Outcome overall = Outcome::Pass;
    double probability = kProbabilityTwoSigma;  // coverage probability of U
    std::vector<PointFinding> findings;         // every point whose outcome is not a pass
    std::string referenceIdentity;              // the standard used, if known
    std::string referenceSpec;                  // its spec in words, if given
    std::vector<std::string> omittedComponents; // names of budget parts left out
};

// The specification the class index refers to (IEC 60051-1:2016 and IEC 60051-2).
inline constexpr const char* kClassStandard = "IEC 60051-1:2016 and IEC 60051-2";

std::string conformityStatement(const StatementFacts& facts);

// The decision rule in one clause, named as ILAC G8:09/2019 4.2 names it, e.g. "binary
// statement for simple acceptance (ILAC G8:09/2019 4.2.1): ...".
std::string describeRule(const DecisionSettings& settings);

// An error written to the last digit of its expanded uncertainty (JCGM 100:2008 7.2.6), with
// one more digit where that rounding would put it on the other side of the limit or of the
// acceptance limit than it is, and a sign: "+160 mV". With `prefixPower`, in that prefix (a
// column of a table in one prefix: "+0.9 mA", not "+900 µA" among milliamperes).
std::string formatErrorLikeU(double error, double expandedU, double permissibleError,
                             double guardBand, Unit unit,
                             std::optional<int> prefixPower = std::nullopt);

} // namespace mw
