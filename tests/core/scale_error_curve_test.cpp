// The rectifier range's error across its scale: ideal diodes give a straight line on zero,
// real diodes lose the bottom of the scale, and every point is the indication the
// `calc indication` command predicts with the designed multiplier.
#include "core/circuits/scale_error_curve.h"

#include "core/circuits/diode.h"
#include "core/circuits/rectifier_design.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <array>
#include <cmath>

using namespace mw;

namespace {

// A 1 mA, 500 Ω movement in a bridge, 10 V rms range (invented test circuit).
RectifierCircuit bridge() {
    RectifierCircuit circuit;
    circuit.rectifier = Rectifier::Bridge;
    circuit.movement_amps_fs = 1e-3;
    circuit.movement_ohms = 500.0;
    return circuit;
}

} // namespace

TEST_CASE("ideal diodes give a straight line on zero across the whole scale") {
    const RectifierMeter meter(bridge(), IdealDiodes{});
    const ScaleErrorCurve curve = rectifierScaleErrorCurve(meter, 10.0);
    REQUIRE(curve.fractions.size() == defaultScaleFractions().size());
    // Common practice: an average-responding meter scaled in rms of a sine reads a sine
    // exactly when its diodes are ideal, so the error is zero everywhere.
    for (std::size_t i = 0; i < curve.fractions.size(); ++i) {
        CHECK(curve.error_percent[i] == mwtest::absolute(0.0, 1e-9));
        CHECK(curve.ideal_error_percent[i] == mwtest::absolute(0.0, 1e-9));
    }
    // Textbook relation for a full-wave meter (Helfrick & Cooper, ch. 4):
    // R_s = 0.9 × V / I_fs − R_m = 0.9 × 10 V / 1 mA − 500 Ω = 8.5 kΩ.
    CHECK(curve.ideal_multiplier_ohms == mwtest::relative(8500.0, 5e-3));
    CHECK(curve.multiplier_ohms == mwtest::relative(curve.ideal_multiplier_ohms, 1e-12));
}

TEST_CASE("silicon diodes read low at the bottom of the scale and exactly at full scale") {
    const RectifierMeter meter(bridge(), diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
    const ScaleErrorCurve curve = rectifierScaleErrorCurve(meter, 10.0);
    const std::size_t last = curve.fractions.size() - 1;
    CHECK(curve.fractions.front() == 0.0);
    CHECK(curve.fractions[last] == 1.0);
    CHECK(curve.error_percent.front() == mwtest::absolute(0.0, 1e-12)); // nothing applied
    CHECK(curve.error_percent[last] == mwtest::absolute(0.0, 1e-6));    // set by the multiplier
    // Common practice: the forward drop makes a rectifier meter read low at small signals,
    // and the real diodes' drop leaves less for the multiplier than the ideal design.
    CHECK(curve.error_percent[6] < 0.0); // 10 % of the range
    CHECK(curve.multiplier_ohms < curve.ideal_multiplier_ohms);
    // Cross-check against the functions `calc multiplier` and `calc indication` run.
    const double solved = solveMultiplier(meter, 10.0).multiplier_ohms;
    CHECK(curve.multiplier_ohms == solved);
    const RectifierMeter designed = meter.withMultiplier(solved);
    for (const std::size_t i : {std::size_t(3), std::size_t(10), last}) {
        const double applied = curve.fractions[i] * 10.0;
        const Indication shown =
            predictIndication(designed, 10.0, Waveform::withRms(WaveShape::Sine, applied));
        CHECK(curve.error_percent[i] ==
              mwtest::absolute((shown.indicated - applied) * 10.0, 1e-12));
    }
}

TEST_CASE("a hotter diode drops less, so the loss at the bottom of the scale shrinks") {
    const auto atTenPercent = [](double celsius) {
        const RectifierMeter meter(bridge(), diodePreset(DiodePreset::SmallSignalSilicon), celsius);
        const std::array<double, 2> points{0.1, 1.0};
        return rectifierScaleErrorCurve(meter, 10.0, points).error_percent[0];
    };
    // Common practice: a silicon junction's forward voltage falls by about 2 mV/K.
    CHECK(atTenPercent(60.0) > atTenPercent(0.0));
}

TEST_CASE("a DC meter and points off the scale are refused with the reason") {
    RectifierCircuit dc = bridge();
    dc.rectifier = Rectifier::None;
    CHECK_THROWS_WITH(rectifierScaleErrorCurve(RectifierMeter(dc, IdealDiodes{}), 10.0),
                      Catch::Contains("no rectifier"));
    const std::array<double, 1> beyond{1.2};
    CHECK_THROWS_WITH(
        rectifierScaleErrorCurve(RectifierMeter(bridge(), IdealDiodes{}), 10.0, beyond),
        Catch::Contains("outside"));
    // Below what the movement needs with no multiplier at all: 1 mA × 500 Ω / 0.9 ≈ 0.56 V.
    CHECK_THROWS_AS(rectifierScaleErrorCurve(RectifierMeter(bridge(), IdealDiodes{}), 0.1),
                    std::domain_error);
}
