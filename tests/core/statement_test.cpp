// The statement of conformity carries the content ISO/IEC 17025:2017 7.8.6.2 asks for.
#include "core/evaluation/statement.h"

#include <catch2/catch.hpp>

using namespace mw;

namespace {

StatementFacts facts(Outcome overall, DecisionSettings decision) {
    StatementFacts f;
    f.phase = Phase::AsLeft;
    f.pointCount = 6;
    f.lower = 0.0;
    f.upper = 10.0;
    f.unit = Unit::Volt;
    f.classIndex = 1.5;
    f.fiducialValue = 10.0;
    f.permissibleError = 0.15;
    f.decision = decision;
    f.overall = overall;
    return f;
}

} // namespace

TEST_CASE("the statement names the results, the specification and the decision rule") {
    // ISO/IEC 17025:2017 7.8.6.2 a) results covered, b) specification, c) decision rule.
    const std::string text =
        conformityStatement(facts(Outcome::Pass, {DecisionRule::SimpleAcceptance, 0.0}));
    CHECK_THAT(text, Catch::Contains("As-left results at 6 test points"));
    CHECK_THAT(text, Catch::Contains("accuracy class 1.5 of IEC 60051"));
    CHECK_THAT(text, Catch::Contains("conforms"));
    CHECK_THAT(text, Catch::Contains("simple acceptance (ILAC G8:09/2019 4.2.1)"));
}

TEST_CASE("each outcome has its own verdict and the guard band is stated") {
    // ILAC G8:09/2019 4.2.3 outcome words.
    const DecisionSettings guarded{DecisionRule::GuardedAcceptance, 1.0};
    CHECK_THAT(conformityStatement(facts(Outcome::ConditionalPass, guarded)),
               Catch::Contains("(conditional pass)") && Catch::Contains("w = 1 × U"));
    CHECK_THAT(conformityStatement(facts(Outcome::ConditionalFail, guarded)),
               Catch::Contains("(conditional fail)"));
    CHECK_THAT(conformityStatement(facts(Outcome::Fail, guarded)),
               Catch::Contains("does not conform"));
    CHECK_THAT(describeRule(guarded), Catch::Contains("ILAC G8:09/2019 4.2.3"));
}
