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
    // IEC 60051-1:2016 (ed. 6) with the class series of IEC 60051-2 (check-values.md 2).
    CHECK_THAT(text, Catch::Contains("accuracy class 1.5 (IEC 60051-1:2016 and IEC 60051-2; "
                                     "limit of error \u00B1150 mV"));
    CHECK_THAT(text, Catch::Contains("conforms"));
    // ILAC G8:09/2019 4.2.1 names the rule "binary statement for simple acceptance rule".
    CHECK_THAT(text, Catch::Contains("binary statement for simple acceptance (ILAC G8:09/2019 "
                                     "4.2.1)"));
    CHECK_THAT(text, Catch::Contains("No reference standard is recorded"));
}

TEST_CASE("the statement lists the points that did not pass, with errors rounded like U") {
    StatementFacts f = facts(Outcome::Fail, {DecisionRule::SimpleAcceptance, 0.0});
    f.findings = {{10.0, 0.16, 0.024, Outcome::Fail}, {8.0, -0.1523, 0.0031, Outcome::Fail}};
    f.referenceIdentity = "calibrator CAL-7";
    f.omittedComponents = {"readability of the scale"};
    const std::string text = conformityStatement(f);
    // JCGM 100:2008 7.2.6: an error shown to the last digit of its U (24 mV -> 1 mV; 3.1 mV
    // -> 0.1 mV).
    CHECK_THAT(text, Catch::Contains("Points that did not pass: 10.00 V (error +160 mV, fail); "
                                     "8.000 V (error -152.3 mV, fail)."));
    CHECK_THAT(text, Catch::Contains("Reference standard: calibrator CAL-7."));
    CHECK_THAT(text, Catch::Contains("leaves out the readability of the scale"));
}

TEST_CASE("an error is never rounded onto the other side of a limit") {
    // JCGM 100:2008 7.2.6 rounding to U's last digit, except where the rounded error would
    // seem to lie on or across the limit (0.15 V) or the acceptance limit T ± w: one more
    // digit then.
    CHECK(formatErrorLikeU(0.1603, 0.024, 0.15, 0.0, Unit::Volt) == "+160 mV");
    CHECK(formatErrorLikeU(-0.0004, 0.024, 0.15, 0.0, Unit::Volt) == "0 mV");
    CHECK(formatErrorLikeU(0.1504, 0.024, 0.15, 0.0, Unit::Volt) == "+150.4 mV");
    CHECK(formatErrorLikeU(0.1496, 0.024, 0.15, 0.0, Unit::Volt) == "+149.6 mV");
    CHECK(formatErrorLikeU(0.15, 0.024, 0.15, 0.0, Unit::Volt) == "+150 mV");
    // With w = 24 mV the acceptance limit is 126 mV: 126.3 mV must not print as 126 mV.
    CHECK(formatErrorLikeU(0.1263, 0.024, 0.15, 0.024, Unit::Volt) == "+126.3 mV");
    CHECK(formatErrorLikeU(-2.5e-6, 1.2e-6, 50e-6, 0.0, Unit::Ampere) == "-2.5 \u00B5A");
}

TEST_CASE("an error can be written in the prefix of its column") {
    // JCGM 100:2008 7.2.6: to the last digit of U (2.4 mA), here in milliamperes throughout.
    CHECK(formatErrorLikeU(-0.0009, 0.0024, 0.015, 0.0, Unit::Ampere) == "-900 \u00B5A");
    CHECK(formatErrorLikeU(-0.0009, 0.0024, 0.015, 0.0, Unit::Ampere, -3) == "-0.9 mA");
    CHECK(formatErrorLikeU(0.0009, 0.0024, 0.015, 0.0, Unit::Ampere, -3) == "+0.9 mA");
    CHECK(formatErrorLikeU(0.0, 0.0024, 0.015, 0.0, Unit::Ampere, -3) == "0.0 mA");
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
    CHECK_THAT(describeRule(guarded), Catch::Contains("non-binary statement with guard band") &&
                                          Catch::Contains("ILAC G8:09/2019 4.2.3"));
    // ILAC G8:09/2019 4.2.2 "binary statement with guard band".
    const DecisionSettings binary{DecisionRule::GuardedBinary, 0.83};
    CHECK_THAT(describeRule(binary), Catch::Contains("binary statement with guard band w = 0.83") &&
                                         Catch::Contains("ILAC G8:09/2019 4.2.2"));
    CHECK_THAT(conformityStatement(facts(Outcome::Fail, binary)),
               Catch::Contains("ILAC G8:09/2019 4.2.2"));
}
