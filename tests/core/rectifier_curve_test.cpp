// The predicted rectifier curve: shape of the diode drop and its use by the advice.
#include "core/advice/rectifier_curve.h"

#include "core/advice/advice.h"
#include "core/circuits/diode.h"
#include "core/circuits/rectifier_design.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>

using namespace mw;

namespace {

// A bridge rectifier voltmeter, 1 mA / 50 Ω movement, 10 V rms range (Helfrick & Cooper
// Example 4-9 movement), with small-signal silicon diodes at 23 °C and the multiplier solved
// so that 10 V reads full scale.
RectifierMeter siliconBridge() {
    RectifierCircuit circuit;
    circuit.rectifier = Rectifier::Bridge;
    circuit.movement_amps_fs = 1e-3;
    circuit.movement_ohms = 50.0;
    circuit.multiplier_ohms = 8950.0;
    const RectifierMeter first(circuit, diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
    return first.withMultiplier(solveMultiplier(first, 10.0).multiplier_ohms);
}

} // namespace

TEST_CASE("ideal diodes predict no error; real diodes read low at the bottom of the scale") {
    RectifierCircuit ideal;
    ideal.rectifier = Rectifier::Bridge;
    ideal.movement_amps_fs = 1e-3;
    ideal.movement_ohms = 50.0;
    ideal.multiplier_ohms = 1.0;
    const RectifierMeter idealMeter(ideal, IdealDiodes{});
    const RectifierMeter tuned =
        idealMeter.withMultiplier(solveMultiplier(idealMeter, 10.0).multiplier_ohms);
    const auto idealCurve = predictedRectifierError(tuned, 10.0);
    // Average-responding meter with ideal diodes is linear (common practice: a sine-scaled
    // average-responding meter reads a sine's rms exactly).
    CHECK(idealCurve(2.0) == mwtest::absolute(0.0, 1e-9));
    CHECK(idealCurve(10.0) == mwtest::absolute(0.0, 1e-9));

    const auto curve = predictedRectifierError(siliconBridge(), 10.0);
    CHECK(curve(10.0) == mwtest::absolute(0.0, 1e-6)); // full scale set by the multiplier
    // Common practice: the forward drop makes a rectifier meter read low at small signals.
    CHECK(curve(1.0) < 0.0);
    CHECK(curve(1.0) < curve(5.0));
}

TEST_CASE("advice recognises measured errors that follow the predicted diode curve") {
    const RectifierMeter meter = siliconBridge();
    const auto curve = predictedRectifierError(meter, 10.0);
    AdviceInput input;
    input.kind = InstrumentKind::BridgeAcVoltmeter;
    input.upperLimit = 10.0;
    input.permissibleError = 0.05; // class 0.5, chosen so that the curve is significant
    std::vector<double> predicted;
    for (const double applied : {1.0, 2.0, 4.0, 6.0, 8.0, 10.0}) {
        predicted.push_back(curve(applied));
        // Measured: the predicted curve scaled by 1.3 (a tired diode) — invented demo data.
        input.points.push_back({applied, 1.3 * predicted.back(), std::nullopt});
    }
    input.predictedErrors = predicted;
    const Advice advice = adviseAdjustment(input);
    INFO("nonlinearity " << advice.fit.nonlinearity);
    CHECK(advice.cause == LikelyCause::RectifierNonlinearity);
}
