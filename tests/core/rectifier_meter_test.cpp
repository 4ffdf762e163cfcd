// Rectifier voltmeter models: ideal closed forms against the textbook factors, the Shockley
// solution against the circuit laws, its limit towards the ideal model, and its quadrature.
#include "core/circuits/rectifier_meter.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <stdexcept>

using namespace mw;

namespace {

constexpr double kNone = std::numeric_limits<double>::infinity();

RectifierCircuit circuit(Rectifier rectifier, double multiplier_ohms, double shunt_ohms = kNone) {
    return {rectifier, 1e-3, 1000.0, multiplier_ohms, shunt_ohms};
}

} // namespace

TEST_CASE("ideal bridge: movement current is 0.9003 × Vrms over the total resistance") {
    // Helfrick & Cooper Example 4-9: I_fs = 1 mA, R_m = 50 Ω, 10 V rms, book multiplier
    // 8 950 Ω from E_dc = 0.9 × 10 V. With the exact factor 2√2/π = 0.900316 (computed from
    // the exact formula) the same circuit passes 0.900316 × 10 / 9 000 = 1.000351 mA.
    const RectifierMeter meter({Rectifier::Bridge, 1e-3, 50.0, 8950.0}, IdealDiodes{});
    const PeriodAverage average = meter.average(Waveform::withRms(WaveShape::Sine, 10.0));
    CHECK(average.movement_amps == mwtest::relative(1.000351e-3, 1e-6));
    CHECK(average.samples == 0); // closed form
    // Square and triangle through the same meter follow their rectified averages.
    CHECK(meter.average(Waveform::square(10.0)).movement_amps ==
          mwtest::relative(10.0 / 9000.0, 1e-12));
}

TEST_CASE("ideal half-wave with shunt and diode resistance: Helfrick & Cooper Example 4-10") {
    // Helfrick & Cooper Example 4-10: I_fs = 1 mA, R_m = 100 Ω shunted by 100 Ω, diode
    // forward resistance 400 Ω, multiplier 1 800 Ω, 10 V rms: the book's 0.45 × 10 V over
    // 2 250 Ω gives 2 mA total, 1 mA in the movement. Exact factor √2/π = 0.450158:
    // 4.50158 V / 2 250 Ω / 2 = 1.000351 mA.
    const RectifierMeter meter({Rectifier::HalfWave, 1e-3, 100.0, 1800.0, 100.0},
                               IdealDiodes{400.0});
    CHECK(meter.average(Waveform::withRms(WaveShape::Sine, 10.0)).movement_amps ==
          mwtest::relative(1.000351e-3, 1e-6));
    CHECK(loadOhms(meter.circuit()) == 50.0);
    CHECK(fullScaleLoadAmps(meter.circuit()) == mwtest::relative(2e-3, 1e-15));
    // Instantaneous: nothing flows on the negative half-cycle.
    CHECK(meter.solveAt(-5.0).movement_amps == 0.0);
    CHECK(meter.solveAt(4.5).movement_amps == mwtest::relative(4.5 / 2250.0 / 2.0, 1e-15));
}

TEST_CASE("Shockley solution satisfies the circuit laws at every instant") {
    const DiodeParameters silicon = diodePreset(DiodePreset::SmallSignalSilicon);
    const Diode d(silicon, 23.0);
    const double multiplier_ohms = 5000.0;
    const double shunt_ohms = 2000.0;
    const RectifierMeter half(circuit(Rectifier::HalfWave, multiplier_ohms, shunt_ohms), silicon,
                              23.0);
    const RectifierMeter bridge(circuit(Rectifier::Bridge, multiplier_ohms, shunt_ohms), silicon,
                                23.0);
    const double load_ohms = 1000.0 * shunt_ohms / (1000.0 + shunt_ohms);
    for (double v : {0.05, 0.4, 0.8, 3.0, 14.0}) {
        INFO("source " << v << " V");
        // Half-wave, positive: KVL source = multiplier drop + node A; node A = series diode +
        // load; KCL at A: source current = series diode current − reverse-path diode current.
        const InstantSolution s = half.solveAt(v);
        const double node_a = v - multiplier_ohms * s.source_amps;
        const double load_volts = s.movement_amps * 1000.0;
        const double series_amps = load_volts / load_ohms;
        CHECK(d.voltageAt(series_amps) + load_volts == mwtest::absolute(node_a, 1e-10));
        CHECK(series_amps - d.currentAt(-node_a) == mwtest::relative(s.source_amps, 1e-9));
        // Half-wave, negative: the reverse-path diode carries the source current less the
        // series diode's leakage, and the movement sees only that leakage.
        const InstantSolution n = half.solveAt(-v);
        const double node_a_neg = -v - multiplier_ohms * n.source_amps;
        CHECK(n.movement_amps * 1000.0 / load_ohms ==
              mwtest::relative(d.currentAt(node_a_neg, load_ohms), 1e-9));
        CHECK(n.movement_amps <= 0.0);
        CHECK(std::abs(n.movement_amps) <= d.saturationCurrent_A());
        // Bridge: KVL around source, multiplier, two forward diodes and the load.
        const InstantSolution b = bridge.solveAt(v);
        const double bridge_load_volts = b.movement_amps * 1000.0;
        const double bridge_in = v - multiplier_ohms * b.source_amps;
        const double forward_volts = 0.5 * (bridge_in - bridge_load_volts);
        const double reverse_amps = d.currentAt(-(forward_volts + bridge_load_volts));
        // KCL at the positive output node: forward diode + reverse diode = load current.
        CHECK(d.currentAt(forward_volts) + reverse_amps ==
              mwtest::relative(bridge_load_volts / load_ohms, 1e-7));
        // The bridge answers −v as it answers +v.
        CHECK(bridge.solveAt(-v).movement_amps == mwtest::relative(b.movement_amps, 1e-12));
    }
    CHECK(half.solveAt(0.0).movement_amps == 0.0);
}

TEST_CASE("the Shockley model tends to the ideal one as the diode drop becomes negligible") {
    // Property: relative to the signal the drop shrinks as the range grows, so the numeric
    // model's shortfall against the ideal closed form shrinks about in proportion.
    for (Rectifier rectifier : {Rectifier::HalfWave, Rectifier::Bridge}) {
        double previous_shortfall = 1.0;
        for (double volts_rms : {10.0, 100.0, 1000.0, 10000.0}) {
            const double multiplier_ohms = volts_rms / 1e-3;
            const RectifierMeter numeric(circuit(rectifier, multiplier_ohms),
                                         diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
            const RectifierMeter ideal(circuit(rectifier, multiplier_ohms), IdealDiodes{});
            const Waveform input = Waveform::withRms(WaveShape::Sine, volts_rms);
            const double shortfall =
                1.0 - numeric.average(input).movement_amps / ideal.average(input).movement_amps;
            INFO(rectifierName(rectifier) << " at " << volts_rms << " V: " << shortfall);
            CHECK(shortfall > 0.0);
            CHECK(shortfall < 0.5 * previous_shortfall);
            previous_shortfall = shortfall;
        }
        CHECK(previous_shortfall < 2e-4);
    }
}

TEST_CASE("period average: quadrature error far below the requested tolerance") {
    for (Rectifier rectifier : {Rectifier::HalfWave, Rectifier::Bridge}) {
        for (WaveShape shape : {WaveShape::Sine, WaveShape::Triangle}) {
            const RectifierMeter meter(circuit(rectifier, 3000.0),
                                       diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
            const Waveform input = Waveform::withRms(shape, 2.0);
            const PeriodAverage adaptive = meter.average(input);
            const PeriodAverage reference = meter.averageWithSamples(input, 1 << 17);
            INFO(rectifierName(rectifier)
                 << ", " << shapeName(shape) << ", " << adaptive.samples << " samples");
            CHECK(adaptive.movement_amps == mwtest::relative(reference.movement_amps, 1e-7));
            CHECK(adaptive.multiplier_rms_amps ==
                  mwtest::relative(reference.multiplier_rms_amps, 1e-6));
        }
    }
    // The whole-period grid (offset sine) and the mirrored quarter grid (sine) agree.
    for (Rectifier rectifier : {Rectifier::HalfWave, Rectifier::Bridge}) {
        const RectifierMeter meter(circuit(rectifier, 3000.0), diodePreset(DiodePreset::Schottky),
                                   23.0);
        CHECK(meter.average(Waveform::sineWithOffset(2.0, 0.0)).movement_amps ==
              mwtest::relative(meter.average(Waveform::sine(2.0)).movement_amps, 1e-8));
        // A positive offset raises a half-wave meter's current (it conducts longer).
        if (rectifier == Rectifier::HalfWave) {
            CHECK(meter.average(Waveform::sineWithOffset(2.0, 0.3)).movement_amps >
                  meter.average(Waveform::sine(2.0)).movement_amps);
        }
    }
    // A sampled record is averaged exactly at its samples.
    const RectifierMeter meter(circuit(Rectifier::Bridge, 3000.0),
                               diodePreset(DiodePreset::Germanium), 23.0);
    const PeriodAverage record = meter.average(Waveform::sampled({2.0, -1.0, 0.0, 3.0}));
    const double expected = (meter.solveAt(2.0).movement_amps + meter.solveAt(-1.0).movement_amps +
                             meter.solveAt(3.0).movement_amps) /
                            4.0;
    CHECK(record.movement_amps == mwtest::relative(expected, 1e-12));
    AveragingOptions hopeless;
    hopeless.relative_tolerance = 1e-300;
    hopeless.max_samples = 256;
    CHECK_THROWS_WITH(meter.average(Waveform::sine(3.0), hopeless),
                      Catch::Contains("did not settle"));
}

TEST_CASE("a DC voltmeter (no rectifier) divides the mean by the total resistance") {
    // Common practice / Helfrick & Cooper Example 4-3: 1 mA, 100 Ω movement with 9.9 kΩ
    // reads full scale at 10 V DC.
    const RectifierMeter meter({Rectifier::None, 1e-3, 100.0, 9900.0}, IdealDiodes{});
    CHECK(meter.average(Waveform::sineWithOffset(0.0, 10.0)).movement_amps ==
          mwtest::relative(1e-3, 1e-12));
    CHECK(meter.solveAt(-5.0).movement_amps == mwtest::relative(-0.5e-3, 1e-12));
}

TEST_CASE("bad circuits are refused with the part named") {
    CHECK_THROWS_WITH(RectifierMeter(circuit(Rectifier::Bridge, -1.0), IdealDiodes{}),
                      Catch::Contains("multiplier"));
    CHECK_THROWS_WITH(RectifierMeter({Rectifier::Bridge, 0.0, 100.0, 0.0}, IdealDiodes{}),
                      Catch::Contains("full-scale current"));
    CHECK_THROWS_WITH(RectifierMeter(circuit(Rectifier::Bridge, 10.0, 0.0), IdealDiodes{}),
                      Catch::Contains("across the movement"));
    CHECK_THROWS_WITH(RectifierMeter(circuit(Rectifier::Bridge, 10.0), IdealDiodes{-5.0}),
                      Catch::Contains("forward resistance"));
    const RectifierMeter meter(circuit(Rectifier::Bridge, 10.0), IdealDiodes{});
    CHECK_THROWS_AS(meter.solveAt(std::nan("")), std::invalid_argument);
}

TEST_CASE("operating temperatures outside the diode model's range are refused") {
    // −55 °C … +150 °C: the junction range of silicon small-signal diode data sheets (common
    // practice, figures from memory); the SPICE level-1 scaling is not meant beyond it.
    const DiodeParameters silicon = diodePreset(DiodePreset::SmallSignalSilicon);
    CHECK_NOTHROW(RectifierMeter(circuit(Rectifier::Bridge, 9000.0), silicon, -55.0));
    CHECK_NOTHROW(RectifierMeter(circuit(Rectifier::Bridge, 9000.0), silicon, 150.0));
    CHECK_THROWS_AS(RectifierMeter(circuit(Rectifier::Bridge, 9000.0), silicon, 150.5),
                    std::invalid_argument);
    CHECK_THROWS_WITH(RectifierMeter(circuit(Rectifier::HalfWave, 9000.0), silicon, 200.0),
                      Catch::Contains("200.0 °C") && Catch::Contains("150 °C") &&
                          Catch::Contains("temperature scaling"));
    CHECK_THROWS_WITH(RectifierMeter(circuit(Rectifier::Bridge, 9000.0), silicon, -60.0),
                      Catch::Contains("-60.00 °C") && Catch::Contains("-55.0 °C"));
    CHECK_THROWS_AS(RectifierMeter(circuit(Rectifier::Bridge, 9000.0), silicon, std::nan("")),
                    std::invalid_argument);
}
