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
