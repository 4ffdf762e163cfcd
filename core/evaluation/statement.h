// The statement of conformity for a record, in our own words, carrying what ISO/IEC 17025:2017
// 7.8.6.2 asks for: which results it covers, which specification, and which decision rule.
#pragma once

#include "core/decision/decision.h"
#include "core/model/vocabulary.h"
#include "core/units/quantity.h"

#include <cstddef>
#include <string>

namespace mw {

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
};

std::string conformityStatement(const StatementFacts& facts);

// The decision rule in one clause, e.g. "simple acceptance (ILAC G8:09/2019 4.2.1) ...".
std::string describeRule(const DecisionSettings& settings);

} // namespace mw
