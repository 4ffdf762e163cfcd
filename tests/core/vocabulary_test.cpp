// The stable text forms of the shared enumerations round-trip and reject unknown words.
#include "core/model/vocabulary.h"

#include <catch2/catch.hpp>

using namespace mw;

TEMPLATE_TEST_CASE("every word round-trips through its stable text", "", InstrumentKind, ScaleType,
                   Direction, Phase, SessionState, Role, InstrumentStatus, DecisionRule, Outcome) {
    for (int i = 0; i < 8; ++i) {
        const auto value = static_cast<TestType>(i);
        const std::string_view text = toText(value);
        if (text == "?") {
            continue; // past the last enumerator
        }
        const auto back = fromText<TestType>(text);
        REQUIRE(back.has_value());
        CHECK(*back == value);
    }
    CHECK_FALSE(fromText<TestType>("no-such-word").has_value());
    CHECK_FALSE(fromText<TestType>("").has_value());
}

TEST_CASE("decision outcomes use the ILAC G8:09/2019 4.2.3 vocabulary") {
    // ILAC G8:09/2019 clause 4.2.3: pass, conditional pass, conditional fail, fail.
    CHECK(toText(Outcome::Pass) == "pass");
    CHECK(toText(Outcome::ConditionalPass) == "conditional-pass");
    CHECK(toText(Outcome::ConditionalFail) == "conditional-fail");
    CHECK(toText(Outcome::Fail) == "fail");
}

TEST_CASE("decision rules keep their stored values and carry the ILAC G8 names") {
    // Stored values never change: the binary guarded rule is appended after the other two.
    CHECK(static_cast<int>(DecisionRule::SimpleAcceptance) == 0);
    CHECK(static_cast<int>(DecisionRule::GuardedAcceptance) == 1);
    CHECK(static_cast<int>(DecisionRule::GuardedBinary) == 2);
    CHECK(toText(DecisionRule::SimpleAcceptance) == "simple");
    CHECK(toText(DecisionRule::GuardedAcceptance) == "guarded");
    CHECK(toText(DecisionRule::GuardedBinary) == "guarded-binary");
    // ILAC G8:09/2019 4.2.1 to 4.2.3 name the rules as binary statement for simple
    // acceptance, binary statement with guard band, non-binary statement with guard band.
    CHECK(displayName(DecisionRule::SimpleAcceptance) ==
          "Binary statement for simple acceptance (ILAC G8:09/2019 4.2.1)");
    CHECK(displayName(DecisionRule::GuardedBinary) ==
          "Binary statement with guard band (ILAC G8:09/2019 4.2.2)");
    CHECK(displayName(DecisionRule::GuardedAcceptance) ==
          "Non-binary statement with guard band (ILAC G8:09/2019 4.2.3)");
}
