// Shockley diode: thermal voltage from the exact SI constants, SPICE level-1 temperature
// scaling, presets, and the explicit and Lambert-W solutions of diode plus series resistance.
#include "core/circuits/diode.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;

namespace {

DiodeParameters plainDiode() {
    DiodeParameters p;
    p.saturation_current_a = 1e-14;
    p.emission_coefficient = 1.0;
    p.series_ohms = 0.0;
    return p;
}

} // namespace

TEST_CASE("slope n·kT/q comes from the exact 2019 SI constants") {
    // 2019 SI k and e (SI Brochure 9th ed.): kT/q = 25.852000 mV at 300 K, 25.520232 mV at
    // 23 °C (computed from the exact constants).
    CHECK(Diode(plainDiode(), 300.0 - 273.15).slope_V() == mwtest::relative(25.852000e-3, 1e-7));
    CHECK(Diode(plainDiode(), 23.0).slope_V() == mwtest::relative(25.520232e-3, 1e-7));
    DiodeParameters n2 = plainDiode();
    n2.emission_coefficient = 2.0;
    CHECK(Diode(n2, 23.0).slope_V() == mwtest::relative(2.0 * 25.520232e-3, 1e-7));
}

TEST_CASE("saturation current scales with temperature as SPICE level 1 does") {
    const DiodeParameters p = diodePreset(DiodePreset::SmallSignalSilicon);
    // At TNOM the model card's IS holds unchanged (SPICE level-1 convention).
    CHECK(saturationCurrentAt(p, 27.0) == mwtest::relative(p.saturation_current_a, 1e-15));
    // Berkeley SPICE 3 / ngspice diode temperature equation, restated here term by term:
    // IS(T) = IS·exp((T/TNOM − 1)·EG/(N·V_T(T)) + XTI/N·ln(T/TNOM)), V_T from k/q.
    const double t = 273.15 + 50.0;
    const double tnom = 273.15 + 27.0;
    const double vt = 1.380649e-23 * t / 1.602176634e-19;
    const double expected = 2.52e-9 * std::exp((t / tnom - 1.0) * 1.11 / (1.752 * vt) +
                                               3.0 / 1.752 * std::log(t / tnom));
    CHECK(saturationCurrentAt(p, 50.0) == mwtest::relative(expected, 1e-12));
    CHECK(saturationCurrentAt(p, 0.0) < p.saturation_current_a);
}

TEST_CASE("forward voltage of silicon falls about 2 mV per kelvin") {
    // Common practice: a silicon junction's forward voltage at constant current falls by about
    // 2 mV/K near room temperature (from memory). Also (V − EG − XTI·V_T)/T for this model.
    const Diode cool(diodePreset(DiodePreset::SmallSignalSilicon), 20.0);
    const Diode warm(diodePreset(DiodePreset::SmallSignalSilicon), 30.0);
    const double coefficient_v_per_k = (warm.voltageAt(1e-3) - cool.voltageAt(1e-3)) / 10.0;
    CHECK(coefficient_v_per_k == mwtest::absolute(-2.0e-3, 0.4e-3));
}

TEST_CASE("presets give the forward drops the trade expects at 1 mA") {
    // Common practice: about 0.6 V for small-signal silicon, 0.2–0.3 V for germanium and
    // small-signal Schottky diodes at 1 mA and room temperature.
    CHECK(Diode(diodePreset(DiodePreset::SmallSignalSilicon), 27.0).voltageAt(1e-3) ==
          mwtest::absolute(0.6, 0.08));
    CHECK(Diode(diodePreset(DiodePreset::Schottky), 27.0).voltageAt(1e-3) ==
          mwtest::absolute(0.25, 0.08));
    CHECK(Diode(diodePreset(DiodePreset::Germanium), 27.0).voltageAt(1e-3) ==
          mwtest::absolute(0.25, 0.08));
    CHECK(presetName(DiodePreset::Schottky) == "schottky");
    for (DiodePreset preset :
         {DiodePreset::SmallSignalSilicon, DiodePreset::Schottky, DiodePreset::Germanium}) {
        CHECK_NOTHROW(validate(diodePreset(preset)));
    }
}

TEST_CASE("Wright omega solves w + ln w = x over the whole range") {
    // W(e^0) = W(1) is the omega constant 0.567143290409784 (from memory); W(e^1) = 1 exactly.
    CHECK(wrightOmega(0.0) == mwtest::relative(0.567143290409784, 1e-14));
    CHECK(wrightOmega(1.0) == mwtest::relative(1.0, 1e-15));
    for (double x : {-700.0, -40.0, -18.5, -17.5, -3.0, -0.5, 2.0, 10.0, 300.0, 1e6}) {
        const double w = wrightOmega(x);
        INFO("x = " << x);
        CHECK(w + std::log(w) == mwtest::absolute(x, 1e-13 * (1.0 + std::abs(x))));
    }
    CHECK_THROWS_AS(wrightOmega(std::nan("")), std::invalid_argument);
}

TEST_CASE("current and voltage of a diode with series resistance are inverse functions") {
    const Diode d(diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
    for (double extra_ohms : {0.0, 1.0, 1000.0, 1e6}) {
        for (double amps : {-0.999 * d.saturationCurrent_A(), -1e-12, 0.0, 1e-9, 1e-6, 1e-3, 0.1}) {
            INFO("I = " << amps << " A, extra R = " << extra_ohms << " Ω");
            // KVL of the series string: the junction-plus-RS voltage and the extra drop.
            const double volts = d.voltageAt(amps) + amps * extra_ohms;
            CHECK(d.currentAt(volts, extra_ohms) ==
                  mwtest::absolute(amps, 1e-10 * std::abs(amps) + 1e-22));
        }
    }
    // Deep reverse bias: the current saturates at −I_s (Shockley equation).
    CHECK(d.currentAt(-5.0, 1000.0) == mwtest::relative(-d.saturationCurrent_A(), 1e-9));
    // Far forward the series resistance dominates: I → (V − drop)/R.
    CHECK(d.currentAt(100.0, 1000.0) == mwtest::relative(0.1, 0.01));
    // Incremental conductance matches a central difference.
    const double i0 = d.currentAt(0.7, 10.0);
    const double numeric = (d.currentAt(0.7 + 1e-6, 10.0) - d.currentAt(0.7 - 1e-6, 10.0)) / 2e-6;
    CHECK(d.conductanceAt(i0, 10.0) == mwtest::relative(numeric, 1e-5));
    CHECK_THROWS_AS(d.voltageAt(-2.0 * d.saturationCurrent_A()), std::domain_error);
}

TEST_CASE("bad diode parameters are refused with the parameter named") {
    DiodeParameters p = diodePreset(DiodePreset::SmallSignalSilicon);
    p.saturation_current_a = 0.0;
    CHECK_THROWS_WITH(validate(p), Catch::Contains("IS"));
    p = diodePreset(DiodePreset::SmallSignalSilicon);
    p.emission_coefficient = 0.1;
    CHECK_THROWS_WITH(validate(p), Catch::Contains("emission coefficient N"));
    p = diodePreset(DiodePreset::SmallSignalSilicon);
    p.series_ohms = -1.0;
    CHECK_THROWS_WITH(validate(p), Catch::Contains("RS"));
    CHECK_THROWS_WITH(Diode(diodePreset(DiodePreset::Germanium), -300.0),
                      Catch::Contains("absolute zero"));
}
