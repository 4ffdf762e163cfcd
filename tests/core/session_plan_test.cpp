// A session's plan: default points, the readings a plan asks for in bench order, and what is
// still missing before submission. Invented meter; the plan rule is common practice.
#include "core/plan/session_plan.h"

#include <catch2/catch.hpp>

using namespace mw;

namespace {

Instrument meter() {
    Instrument i;
    i.scale_type = ScaleType::ZeroAtEnd;
    i.scale_divisions = 50;
    i.accuracy_class = 1.5;
    RangeSpec volts;
    volts.id = 3;
    volts.label = "10 V";
    volts.full_scale = 10.0;
    RangeSpec ac = volts;
    ac.id = 4;
    ac.label = "10 V~";
    ac.signal = SignalType::Bridge;
    i.ranges = {volts, ac};
    return i;
}

} // namespace

TEST_CASE("default points: every fifth of the scale, a rectifier range from a tenth") {
    // Common practice: the numbered marks of a five-division scale, up then down; a rectifier
    // meter's bottom tenth is not usable (core/plan/test_plan.h).
    const auto dc = defaultPoints(meter(), meter().ranges[0]);
    REQUIRE(dc.size() == 6);
    CHECK(dc.front().nominal == 0.0);
    CHECK(dc.back().nominal == 10.0);
    CHECK(dc[2].point_index == 2);
    const auto ac = defaultPoints(meter(), meter().ranges[1], 2);
    CHECK(ac.front().nominal == 1.0);
    CHECK(ac.front().repeats == 2);
}

TEST_CASE("the plan's readings in bench order, and what is still missing") {
    CalibrationSession s;
    s.plan = {{3, 0, 5.0, 1}, {3, 1, 10.0, 2}};
    s.phases = PhasePlan::AsFoundAndAsLeft;
    const auto keys = plannedReadings(meter(), s);
    // Per phase: up 5, up 10 (two repeats), then down 10 (two repeats), down 5.
    REQUIRE(keys.size() == 12);
    CHECK(keys[0] == ReadingKey{3, 0, Direction::Up, Phase::AsFound, 1});
    CHECK(keys[2] == ReadingKey{3, 1, Direction::Up, Phase::AsFound, 2});
    CHECK(keys[3] == ReadingKey{3, 1, Direction::Down, Phase::AsFound, 1});
    CHECK(keys[5] == ReadingKey{3, 0, Direction::Down, Phase::AsFound, 1});
    CHECK(keys[6].phase == Phase::AsLeft);

    s.readings = {{3, 0, Direction::Up, Phase::AsFound, 1, Unit::Volt, 5.0, 5.02},
                  {3, 1, Direction::Up, Phase::AsFound, 1, Unit::Volt, 10.0, std::nullopt}};
    auto missing = missingReadings(meter(), s);
    CHECK(missing.size() == 11); // a pending reading (no indication yet) is still missing
    CHECK(describeMissing(meter(), s, missing, 2) ==
          "10 V: point 2 (10.00 V) up-scale as-found repeat 1; 10 V: point 2 (10.00 V) up-scale "
          "as-found repeat 2; and 9 more");
    s.phases = PhasePlan::AsFound;
    CHECK(missingReadings(meter(), s).size() == 5);
}

TEST_CASE("a record made before plans were kept: its readings are its plan") {
    CalibrationSession s;
    s.readings = {{3, 0, Direction::Up, Phase::AsFound, 1, Unit::Volt, 4.98, 5.0},
                  {3, 0, Direction::Down, Phase::AsFound, 1, Unit::Volt, 5.02, 5.0},
                  {3, 2, Direction::Up, Phase::AsFound, 2, Unit::Volt, 10.0, 10.0}};
    const auto plan = effectivePlan(s);
    REQUIRE(plan.size() == 2);
    CHECK(plan[0] == TestPoint{3, 0, 5.0, 1});
    CHECK(plan[1] == TestPoint{3, 2, 10.0, 2});
    CHECK(missingReadings(meter(), s).size() == 3); // point 3: repeat 1 up, both down
}
