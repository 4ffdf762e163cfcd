// Default test-point plans and their edits.
#include "core/plan/test_plan.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>
#include <vector>

using namespace mw;

namespace {

std::vector<double> nominalsInOrder(const TestPlan& plan) {
    std::vector<double> values;
    for (const PlannedPoint& point : plan.points) {
        values.push_back(point.nominal);
    }
    return values;
}

} // namespace

TEST_CASE("default DC plan: cardinal points up-scale then down-scale") {
    // Common practice: numbered scale marks every 20 % of span, up-scale then down-scale.
    const TestPlan plan = defaultPlan(InstrumentKind::DcVoltmeter, {0.0, 10.0, {}, {}});
    CHECK(nominalsInOrder(plan) == std::vector<double>{0, 2, 4, 6, 8, 10, 10, 8, 6, 4, 2, 0});
    CHECK(plan.points.front().direction == Direction::Up);
    CHECK(plan.points.back().direction == Direction::Down);
}

TEST_CASE("rectifier plans start at 10 % and centre-zero plans include zero") {
    // Common practice: a rectifier scale is unusable at its very bottom.
    const TestPlan ac = defaultPlan(InstrumentKind::BridgeAcVoltmeter, {0.0, 10.0, {}, {}});
    CHECK(nominalValues(ac) == std::vector<double>{1, 2, 4, 6, 8, 10});
    const TestPlan centre =
        defaultPlan(InstrumentKind::DcAmmeter, {-50.0, 50.0, ScaleType::ZeroInside, {}});
    const std::vector<double> values = nominalValues(centre);
    REQUIRE(values.size() == 7);
    CHECK(values[0] == -50.0);
    CHECK(values[3] == mwtest::absolute(0.0, 1e-12));
    CHECK(values[6] == 50.0);
}

TEST_CASE("snapping to scale marks") {
    // A 10 V scale of 50 divisions has a mark every 0.2 V.
    const ScaleRange range{0.0, 10.0, {}, {}};
    CHECK(divisionValue(range, 50) == mwtest::relative(0.2, 1e-12));
    CHECK(snapToMark(3.33, range, 50) == mwtest::relative(3.4, 1e-12));
    CHECK(snapToMark(3.29, range, 50) == mwtest::relative(3.2, 1e-12));
    CHECK(snapToMark(11.0, range, 50) == 10.0);
    TestPlan plan;
    plan.points = {{3.31, Direction::Up, 1}, {3.39, Direction::Up, 1}, {7.0, Direction::Up, 1}};
    const TestPlan snapped = snapPlan(plan, range, 50);
    REQUIRE(snapped.points.size() == 2); // 3.31 and 3.39 fall on the same mark
    CHECK(snapped.points[0].nominal == mwtest::relative(3.4, 1e-12));
    CHECK_THROWS_AS(divisionValue(range, 0), std::invalid_argument);
}

TEST_CASE("repeats, added and removed points") {
    const TestPlan base = defaultPlan(InstrumentKind::DcVoltmeter, {0.0, 10.0, {}, {}});
    const TestPlan repeated = withRepeats(base, 3);
    CHECK(repeated.points.size() == 36);
    CHECK(repeated.points[2].repeat == 3);
    CHECK(repeated.points[2].nominal == 0.0);
    const TestPlan added = addPoint(base, 5.0);
    CHECK(nominalsInOrder(added) ==
          std::vector<double>{0, 2, 4, 5, 6, 8, 10, 10, 8, 6, 5, 4, 2, 0});
    CHECK(addPoint(repeated, 5.0).points.size() == 42);
    const TestPlan removed = removePoint(base, 4.0);
    CHECK(nominalValues(removed) == std::vector<double>{0, 2, 6, 8, 10});
    CHECK_THROWS_AS(withRepeats(base, 0), std::invalid_argument);
}
