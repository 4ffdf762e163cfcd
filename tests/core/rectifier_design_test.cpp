// Range design for rectifier voltmeters: textbook multipliers with the book's and the exact
// factors, AC sensitivity, the solved full-scale multiplier and the low-scale non-linearity.
#include "core/circuits/rectifier_design.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <limits>
#include <stdexcept>
#include <vector>

using namespace mw;

namespace {

constexpr double kNone = std::numeric_limits<double>::infinity();

} // namespace

TEST_CASE("Helfrick & Cooper Example 4-9: bridge multiplier with ideal diodes") {
    const RectifierCircuit bridge{Rectifier::Bridge, 1e-3, 50.0, 0.0};
    // Book: E_dc = 0.9 × 10 V = 9 V, R_T = 9 kΩ, R_s = 9 kΩ − 50 Ω = 8 950 Ω.
    CHECK(idealMultiplierOhms(bridge, 10.0, 0.9) == mwtest::relative(8950.0, 1e-12));
    // Exact factor 2√2/π: R_s = 8 953.2 Ω (computed from the exact formula).
    CHECK(idealMultiplierOhms(bridge, 10.0, averagePerRms(Rectifier::Bridge)) ==
          mwtest::absolute(8953.2, 0.05));
    const MultiplierSolution solved = solveMultiplier(RectifierMeter(bridge, IdealDiodes{}), 10.0);
    CHECK(solved.multiplier_ohms == mwtest::absolute(8953.2, 0.05));
    CHECK(solved.movement_amps_at_range == mwtest::relative(1e-3, 1e-12));
}

TEST_CASE("Helfrick & Cooper Example 4-10: half-wave with shunt and 400 Ω diodes") {
    const RectifierCircuit half{Rectifier::HalfWave, 1e-3, 100.0, 0.0, 100.0};
    // Book: I_dc = 2 mA, E_dc = 0.45 × 10 V = 4.5 V, R_T = 2.25 kΩ, R_s = 2 250 − 400 − 50
    // = 1 800 Ω; S_ac = 225 Ω/V against S_dc = 1 000 Ω/V.
    CHECK(idealMultiplierOhms(half, 10.0, 0.45, IdealDiodes{400.0}) ==
          mwtest::relative(1800.0, 1e-12));
    CHECK(acSensitivityOhmPerVolt(half, 0.45) == mwtest::relative(225.0, 1e-12));
    // Exact factor √2/π: R_s = 1 800.8 Ω (computed from the exact formula).
    const MultiplierSolution solved =
        solveMultiplier(RectifierMeter(half, IdealDiodes{400.0}), 10.0);
    CHECK(solved.multiplier_ohms == mwtest::absolute(1800.8, 0.05));
    CHECK(solved.ideal_multiplier_ohms == mwtest::absolute(2200.8, 0.05)); // no diode resistance
}

TEST_CASE("AC sensitivity is 0.9 and 0.45 of the DC ohms per volt for ideal diodes") {
    // S_ac = 2√2/π·S_dc (bridge) and √2/π·S_dc (half-wave) for a sine (exact forms, computed;
    // Helfrick & Cooper use the rounded 0.9 and 0.45 in Examples 4-9 and 4-10).
    const RectifierCircuit movement{Rectifier::Bridge, 1e-3, 100.0, 0.0};
    CHECK(acSensitivityOhmPerVolt(movement, averagePerRms(Rectifier::Bridge)) ==
          mwtest::relative(900.316, 1e-6));
    CHECK(acSensitivityOhmPerVolt(movement, averagePerRms(Rectifier::HalfWave)) ==
          mwtest::relative(450.158, 1e-6));
    CHECK(acSensitivityOhmPerVolt(movement, averagePerRms(Rectifier::None)) ==
          mwtest::relative(1000.0, 1e-15));
    // For a square wave the rectified average equals the rms (form factor 1, exact).
    CHECK(averagePerRms(Rectifier::Bridge, WaveShape::Square) == mwtest::relative(1.0, 1e-15));
}

TEST_CASE("DC voltmeter multiplier: R_s = V/I_fs − R_m") {
    // Helfrick & Cooper Example 4-3: 1 mA, 100 Ω → 9.9 kΩ for 10 V; 99.9 kΩ for 100 V
    // (the 100 V figure is the classic textbook case, from memory; no printed source checked).
    const RectifierMeter dc({Rectifier::None, 1e-3, 100.0, 0.0}, IdealDiodes{});
    CHECK(solveMultiplier(dc, 10.0).multiplier_ohms == mwtest::relative(9900.0, 1e-12));
    CHECK(solveMultiplier(dc, 100.0).multiplier_ohms == mwtest::relative(99900.0, 1e-12));
    CHECK_THROWS_WITH(solveMultiplier(dc, 0.05), Catch::Contains("below what the movement"));
}

TEST_CASE("the solved multiplier reproduces full-scale current with real diodes") {
    for (Rectifier rectifier : {Rectifier::HalfWave, Rectifier::Bridge}) {
        for (DiodePreset preset :
             {DiodePreset::SmallSignalSilicon, DiodePreset::Schottky, DiodePreset::Germanium}) {
            for (WaveShape shape : {WaveShape::Sine, WaveShape::Square, WaveShape::Triangle}) {
                for (double shunt_ohms : {kNone, 1500.0}) {
                    const RectifierCircuit circuit{rectifier, 1e-3, 1000.0, 0.0, shunt_ohms};
                    const RectifierMeter prototype(circuit, diodePreset(preset), 23.0);
                    const MultiplierSolution solved = solveMultiplier(prototype, 10.0, shape);
                    INFO(rectifierName(rectifier)
                         << ", " << presetName(preset) << ", " << shapeName(shape) << ", shunt "
                         << shunt_ohms << ": " << solved.multiplier_ohms << " Ω");
                    // Property: the diode drop costs multiplier resistance.
                    CHECK(solved.multiplier_ohms > 0.0);
                    CHECK(solved.multiplier_ohms < solved.ideal_multiplier_ohms);
                    CHECK(solved.evaluations < 12);
                    // Independent of the solve's own sample count: a fresh adaptive average at
                    // the range gives full scale.
                    const Indication at_range =
                        predictIndication(prototype.withMultiplier(solved.multiplier_ohms), 10.0,
                                          Waveform::withRms(shape, 10.0));
                    CHECK(at_range.indicated == mwtest::relative(10.0, 1e-6));
                    CHECK(solved.movement_amps_at_range == mwtest::relative(1e-3, 1e-9));
                }
            }
        }
    }
}

TEST_CASE("rectifier meters read low at the bottom of the scale") {
    // Common practice: the diodes' knee makes a rectifier instrument's scale cramped at its low
    // end; with the multiplier solved for full scale the error is zero at the top and grows
    // towards the bottom (in % of range it peaks in the lower part of the scale).
    const RectifierCircuit circuit{Rectifier::Bridge, 1e-3, 1000.0, 0.0};
    const RectifierMeter prototype(circuit, diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
    const RectifierMeter meter =
        prototype.withMultiplier(solveMultiplier(prototype, 10.0).multiplier_ohms);
    const std::vector<double> plan{0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0, 8.0, 9.0, 10.0};
    const std::vector<Indication> readings = predictTestPlan(meter, 10.0, plan, WaveShape::Sine);
    REQUIRE(readings.size() == plan.size());
    CHECK(readings.front().indicated == 0.0);
    CHECK(readings.back().error_percent_of_range == mwtest::absolute(0.0, 1e-5));
    for (std::size_t i = 1; i + 1 < readings.size(); ++i) {
        INFO(plan[i] << " V reads " << readings[i].indicated);
        CHECK(readings[i].indicated < plan[i]);
        CHECK(readings[i].indicated > readings[i - 1].indicated);
        if (i >= 3) { // past the worst point the error falls steadily towards full scale
            CHECK(readings[i].error_percent_of_range > readings[i - 1].error_percent_of_range);
        }
    }
    // Ideal diodes have no such error anywhere on the scale.
    const RectifierMeter ideal(
        {Rectifier::Bridge, 1e-3, 1000.0, idealMultiplierOhms(circuit, 10.0, 0.900316)},
        IdealDiodes{});
    CHECK(predictIndication(ideal, 10.0, Waveform::withRms(WaveShape::Sine, 3.0)).indicated ==
          mwtest::relative(3.0, 1e-5));
}

TEST_CASE("a range below what the diodes need is refused with the reason") {
    const RectifierCircuit circuit{Rectifier::Bridge, 1e-3, 1000.0, 0.0};
    const RectifierMeter prototype(circuit, diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
    // Ideal diodes would manage 1.2 V rms (1.08 V average across 1 kΩ); two silicon drops
    // of about 0.6 V do not.
    CHECK_THROWS_WITH(solveMultiplier(prototype, 1.2), Catch::Contains("too low for the diodes"));
    CHECK_THROWS_WITH(solveMultiplier(prototype, 0.5), Catch::Contains("below what the movement"));
    CHECK_THROWS_AS(predictIndication(prototype, 0.0, Waveform::sine(1.0)), std::invalid_argument);
}

TEST_CASE("an input far beyond the range is refused: the movement would be overloaded") {
    // Helfrick & Cooper Example 4-9 circuit (1 mA, 50 Ω, ideal bridge) with the multiplier for
    // 10 V rms from the exact factor 2√2/π. Our limit: 150 % of the range.
    const RectifierCircuit bridge{Rectifier::Bridge, 1e-3, 50.0, 0.0};
    const RectifierMeter meter(
        {Rectifier::Bridge, 1e-3, 50.0,
         idealMultiplierOhms(bridge, 10.0, averagePerRms(Rectifier::Bridge))},
        IdealDiodes{});
    CHECK(predictIndication(meter, 10.0, Waveform::withRms(WaveShape::Sine, 15.0)).indicated ==
          mwtest::relative(15.0, 1e-9));
    CHECK_THROWS_AS(predictIndication(meter, 10.0, Waveform::withRms(WaveShape::Sine, 20.0)),
                    std::invalid_argument);
    CHECK_THROWS_WITH(predictIndication(meter, 10.0, Waveform::withRms(WaveShape::Sine, 20.0)),
                      Catch::Contains("20.00 V") && Catch::Contains("200.0 %") &&
                          Catch::Contains("10.00 V range") && Catch::Contains("overloaded"));
    // A square wave of 14 V rms is under 150 % of the range, but its rectified average is
    // 14 V against 0.9003 × 10 V for the sine the scale is marked for (form factors 1 and
    // π/(2√2), common practice): 155.5 % of full-scale current.
    CHECK_THROWS_WITH(predictIndication(meter, 10.0, Waveform::withRms(WaveShape::Square, 14.0)),
                      Catch::Contains("155.5 %") && Catch::Contains("full-scale current"));
    // A DC voltmeter is judged by the mean, either polarity (Helfrick & Cooper Example 4-3:
    // 1 mA, 100 Ω, 9.9 kΩ for 10 V).
    const RectifierMeter dc({Rectifier::None, 1e-3, 100.0, 9900.0}, IdealDiodes{});
    CHECK_THROWS_WITH(predictIndication(dc, 10.0, Waveform::sineWithOffset(0.0, -20.0)),
                      Catch::Contains("-20.00 V") && Catch::Contains("overloaded"));
    const std::vector<double> plan{5.0, 10.0, 25.0};
    CHECK_THROWS_WITH(predictTestPlan(meter, 10.0, plan, WaveShape::Sine),
                      Catch::Contains("25.00 V"));
}
