// The session evaluator: sealing a session's inputs from the register and turning a stored
// calibration into per-range, per-phase results and the overall outcome. Readings, meters and
// standards are invented demo data; limits and budgets are checked by the cited rules.
#include "core/evaluation/session_evaluation.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

using namespace mw;

namespace {

// A two-range meter: 10 V DC and 250 V through a bridge rectifier; class 1.5, 50 divisions.
Instrument meter() {
    Instrument i;
    i.id = 1;
    i.asset_tag = "DEMO-1";
    i.kind = InstrumentKind::MultiRange;
    i.movement = Movement{1e-3, 100.0};
    i.scale_type = ScaleType::ZeroAtEnd;
    i.scale_divisions = 50;
    i.accuracy_class = 1.5;
    RangeSpec volts;
    volts.id = 11;
    volts.label = "10 V";
    volts.full_scale = 10.0;
    volts.nominal_ohms = 9900.0;
    RangeSpec ac;
    ac.id = 12;
    ac.label = "250 V~";
    ac.full_scale = 250.0;
    ac.nominal_ohms = 224900.0;
    ac.signal = SignalType::Bridge;
    ac.diode = DiodePreset::SmallSignalSilicon;
    i.ranges = {volts, ac};
    return i;
}

std::vector<ReferenceStandard> register_() {
    ReferenceStandard calibrator;
    calibrator.id = 5;
    calibrator.asset_tag = "STD-5";
    StandardRangeSpec dc;
    dc.label = "20 V DC";
    dc.full_scale = 20.0;
    dc.percent_of_reading = 0.004;
    dc.percent_of_range = 0.0008;
    StandardRangeSpec ac = dc;
    ac.label = "1000 V AC";
    ac.full_scale = 1000.0;
    ac.percent_of_reading = 0.07;
    ac.percent_of_range = 0.01;
    ac.signal = SignalKind::Ac;
    calibrator.specs = {dc, ac};
    ReferenceStandard unused;
    unused.id = 6;
    unused.specs = {dc};
    return {calibrator, unused};
}

void read(CalibrationSession& s, std::int64_t range, Phase phase, double applied, double error) {
    const int point =
        static_cast<int>(std::count_if(s.readings.begin(), s.readings.end(), [&](const Reading& r) {
            return r.range_id == range && r.phase == phase && r.direction == Direction::Up;
        }));
    const Unit unit = Unit::Volt;
    s.readings.push_back({range, point, Direction::Up, phase, 1, unit, applied, applied + error});
    s.readings.push_back(
        {range, point, Direction::Down, phase, 1, unit, applied, applied + error * 0.5});
}

// As found the 10 V range reads 0.2 V high at full scale (limit 0.15 V: fails); adjusted, it
// reads 0.02 V high (passes).
CalibrationSession adjustedSession() {
    CalibrationSession s;
    s.id = 40;
    s.instrument_id = 1;
    s.environment = {23.0, 45.0};
    s.standards = {{5, "C-1", {}, ""}};
    for (double v : {2.0, 4.0, 6.0, 8.0, 10.0}) {
        read(s, 11, Phase::AsFound, v, 0.02 * v);
    }
    for (double v : {2.0, 4.0, 6.0, 8.0, 10.0}) {
        read(s, 11, Phase::AsLeft, v, 0.002 * v);
    }
    return s;
}

} // namespace

TEST_CASE("sealing copies every range of the standards used and each range measured") {
    const CalibrationSession s = adjustedSession();
    const SealedInputs inputs = sealInputs(meter(), s, register_());
    REQUIRE(inputs.specs.size() == 2); // both ranges of STD-5, nothing of the unused STD-6
    CHECK(inputs.specs[0].standard_id == 5);
    CHECK(inputs.specs[1].sort_order == 1);
    REQUIRE(inputs.ranges.size() == 1); // only the 10 V range has readings
    const RangeAsUsed& used = inputs.ranges[0];
    CHECK(used.range_id == 11);
    CHECK(used.signal == SignalType::Dc);
    CHECK(used.resistor_ohms == 9900.0);
    CHECK(used.divisions == 50);
    CHECK(used.reference == SpecRef{5, 0});
    CHECK_FALSE(used.diode);
}

TEST_CASE("the overall outcome is the condition the meter leaves in") {
    const CalibrationSession s = adjustedSession();
    const SessionEvaluation evaluation =
        evaluateSession(meter(), s, sealInputs(meter(), s, register_()));
    REQUIRE(evaluation.ranges.size() == 2);
    CHECK(evaluation.ranges[0].phase == Phase::AsFound);
    CHECK(evaluation.ranges[1].phase == Phase::AsLeft);
    CHECK(evaluation.ranges[0].reference == "20 V DC");
    // IEC 60051-1: class 1.5 of a 10 V zero-at-end scale is ±0.15 V everywhere.
    CHECK(evaluation.ranges[0].result->permissibleError == mwtest::relative(0.15, 1e-12));
    CHECK(evaluation.asFound == Outcome::Fail); // 0.2 V > 0.15 V at full scale
    CHECK(evaluation.asLeft == Outcome::Pass);  // 0.02 V
    CHECK(evaluation.overall == Outcome::Pass); // as left after the adjustment
    CHECK(evaluation.problems.empty());
    CHECK_FALSE(evaluation.hazardCaution); // 10 V DC is below 60 V (IEC 61010-1 6.3.1)

    // Without an adjustment the as-found result is what the meter leaves in.
    CalibrationSession unadjusted = s;
    std::erase_if(unadjusted.readings, [](const Reading& r) { return r.phase == Phase::AsLeft; });
    const SessionEvaluation asFoundOnly =
        evaluateSession(meter(), unadjusted, sealInputs(meter(), unadjusted, register_()));
    CHECK(asFoundOnly.overall == Outcome::Fail);
    CHECK_FALSE(asFoundOnly.asLeft);
}

TEST_CASE("the budget uses the sealed reference and the session's settings") {
    CalibrationSession s = adjustedSession();
    s.settings->readability_fraction = 0.1;
    const SessionEvaluation evaluation =
        evaluateSession(meter(), s, sealInputs(meter(), s, register_()));
    const PointResult& top = evaluation.ranges[1].result->points.back();
    // Reference at 10 V on its 20 V range: a = 0.004 % · 10 V + 0.0008 % · 20 V = 0.56 mV;
    // readability: a tenth of a 0.2 V division, half-width 0.01 V; both rectangular
    // (JCGM 100:2008 4.3.7), k = 2 for infinite degrees of freedom (Table G.2).
    REQUIRE(top.components.size() == 2);
    CHECK(top.components[0].value == mwtest::relative(5.6e-4, 1e-12));
    CHECK(top.components[1].value == mwtest::relative(0.01, 1e-12));
    const double uc = std::sqrt(5.6e-4 * 5.6e-4 + 0.01 * 0.01) / std::sqrt(3.0);
    CHECK(top.budget.combined == mwtest::relative(uc, 1e-12));
    CHECK(top.budget.expanded == mwtest::relative(2.0 * uc, 1e-9));
}

TEST_CASE("guarded acceptance states a result near the limit as conditional") {
    // ILAC G8:09/2019 4.2.3 with w = U: 0.14 V high at full scale is inside ±0.15 V but within
    // w of the limit (U is about 0.024 V here), so a conditional pass.
    CalibrationSession s = adjustedSession();
    std::erase_if(s.readings, [](const Reading& r) { return r.phase == Phase::AsFound; });
    s.readings.back().indicated = s.readings.back().applied + 0.14;
    s.decision_rule = DecisionRule::GuardedAcceptance;
    s.guard_factor = 1.0;
    CHECK(evaluateSession(meter(), s, sealInputs(meter(), s, register_())).overall ==
          Outcome::ConditionalPass);
    s.decision_rule = DecisionRule::SimpleAcceptance;
    s.guard_factor = 0.0;
    CHECK(evaluateSession(meter(), s, sealInputs(meter(), s, register_())).overall ==
          Outcome::Pass);
}

TEST_CASE("a range that cannot be evaluated is named and leaves no overall outcome") {
    CalibrationSession s = adjustedSession();
    Instrument unknown = meter();
    unknown.ranges[0].signal.reset(); // registered before signal types were recorded
    SessionEvaluation evaluation = evaluateSession(unknown, s, sealInputs(unknown, s, register_()));
    CHECK_FALSE(evaluation.overall);
    REQUIRE_FALSE(evaluation.problems.empty());
    CHECK(evaluation.problems.front().find("range \"10 V\", as-found") != std::string::npos);
    CHECK(evaluation.problems.front().find("signal type") != std::string::npos);

    // A reading far off the scale: the engine refuses it and the range says why.
    s.readings.front().applied = 40.0;
    evaluation = evaluateSession(meter(), s, sealInputs(meter(), s, register_()));
    CHECK_FALSE(evaluation.overall);
    CHECK(evaluation.problems.front().find("outside the range's scale") != std::string::npos);

    // No readings at all: nothing to decide.
    s.readings.clear();
    evaluation = evaluateSession(meter(), s, sealInputs(meter(), s, register_()));
    CHECK_FALSE(evaluation.overall);
    CHECK(evaluation.ranges.empty());
}

TEST_CASE("no standard covers a range: the evaluation goes on and says what is missing") {
    CalibrationSession s;
    s.instrument_id = 1;
    s.standards = {{5, "C-1", {}, ""}};
    for (double v : {50.0, 150.0, 250.0}) {
        read(s, 12, Phase::AsFound, v, 0.5);
    }
    std::vector<ReferenceStandard> dcOnly = register_();
    dcOnly[0].specs.pop_back();
    const SealedInputs inputs = sealInputs(meter(), s, dcOnly);
    CHECK_FALSE(inputs.ranges[0].reference);
    const SessionEvaluation evaluation = evaluateSession(meter(), s, inputs);
    REQUIRE(evaluation.overall);
    CHECK(evaluation.ranges[0].reference.empty());
    // 250 V AC reaches the hazardous-live limits (IEC 61010-1:2010 6.3.1: 30 V rms).
    REQUIRE(evaluation.hazardCaution);
}

TEST_CASE("an amendment keeps the copies of the record it amends") {
    const CalibrationSession original = adjustedSession();
    const SealedInputs sealed = sealInputs(meter(), original, register_());
    // Since then the calibrator was recalibrated with a better specification.
    std::vector<ReferenceStandard> later = register_();
    later[0].specs[0].percent_of_reading = 0.001;
    CalibrationSession amendment = original;
    amendment.supersedes_id = original.id;
    CHECK(sealInputs(meter(), amendment, later, sealed) == sealed);
    // A standard added by the amendment is copied as the register holds it now.
    amendment.standards.push_back({6, "C-6", {}, ""});
    const SealedInputs widened = sealInputs(meter(), amendment, later, sealed);
    CHECK(widened.specs.size() == 3);
    CHECK(widened.specs[0] == sealed.specs[0]);
}

TEST_CASE("leaving out the rectifier curve changes no result, only what the advice rests on") {
    CalibrationSession s = adjustedSession();
    for (double v : {50.0, 100.0, 150.0, 200.0, 250.0}) {
        read(s, 12, Phase::AsFound, v, -0.004 * v);
    }
    const SealedInputs inputs = sealInputs(meter(), s, register_());
    const SessionEvaluation full = evaluateSession(meter(), s, inputs);
    const SessionEvaluation lean = evaluateSession(meter(), s, inputs, RectifierCurve::Omitted);
    CHECK(lean.overall == full.overall);
    CHECK(lean.asFound == full.asFound);
    CHECK(lean.asLeft == full.asLeft);
    REQUIRE(lean.ranges.size() == full.ranges.size());
    for (std::size_t i = 0; i < full.ranges.size(); ++i) {
        REQUIRE(full.ranges[i].result);
        REQUIRE(lean.ranges[i].result);
        const auto& a = full.ranges[i].result->points;
        const auto& b = lean.ranges[i].result->points;
        REQUIRE(a.size() == b.size());
        for (std::size_t k = 0; k < a.size(); ++k) {
            CHECK(a[k].error == b[k].error);
            CHECK(a[k].decision == b[k].decision);
        }
    }
    const auto instrument = meter(); // kept: the range below refers into it
    const RangeSpec& ac = instrument.ranges[1];
    CHECK(evaluationInputFor(instrument, ac, s, inputs, Phase::AsFound).predictedError);
    CHECK_FALSE(
        evaluationInputFor(instrument, ac, s, inputs, Phase::AsFound, RectifierCurve::Omitted)
            .predictedError);
}
