// Copper coil resistance (IEC 60028), span error with temperature, and swamping design.
#include "core/circuits/coil_temperature.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;
using mwtest::absolute;
using mwtest::relative;

TEST_CASE("copper resistance follows IEC 60028") {
    // IEC 60028: α20 = 0.00393 /K for standard annealed copper; ratios computed from
    // R(t) = R20·(1 + α20·(t − 20)).
    CHECK(kCopperAlpha20_per_K == 0.00393);
    CHECK(copperResistance_ohm(1.0, 23.0) == relative(1.01179, 1e-6));
    CHECK(copperResistance_ohm(1.0, 25.0) == relative(1.01965, 1e-6));
    CHECK(copperResistance_ohm(1.0, 30.0) == relative(1.03930, 1e-6));
    CHECK(copperResistance_ohm(1.0, 0.0) == relative(0.92140, 1e-6));
    // "Inferred zero" of copper at about -234.45 °C (IEC 60028 α; 234.5 common practice).
    CHECK(copperResistance_ohm(100.0, -234.4) == absolute(0.0, 0.03));
    CHECK_THROWS_AS(copperResistance_ohm(100.0, -240.0), std::domain_error);
    // Measured at 23 °C, referred back to 20 °C.
    CHECK(copperResistanceAt20_ohm(101.179, 23.0) == relative(100.0, 1e-6));
}

TEST_CASE("swamping lowers the effective tempco in proportion to the copper share") {
    // Swamping rule (derived from IEC 60028's α20), computed: 5 Ω copper + 15 Ω manganin ->
    // 0.000983 /K.
    CHECK(effectiveTempco_per_K(5.0, 15.0) == relative(0.00098250, 1e-6));
    CHECK(effectiveTempco_per_K(5.0, 0.0) == relative(0.00393, 1e-12));
    // Manganin's own coefficient adds in proportion (order 1e-5 /K, handbook tables of resistance
    // alloys).
    CHECK(effectiveTempco_per_K(5.0, 15.0, 15e-6) == relative(0.00098250 + 0.75 * 15e-6, 1e-6));
}

TEST_CASE("span error of a voltmeter follows the swamping rule") {
    // Helfrick & Cooper Example 4-3 10 V range: 100 Ω copper coil + 9.9 kΩ multiplier.
    // First-order swamping rule (common practice): error ≈ -α_eff·ΔT, α_eff = α·R_m/R_total.
    CoilCircuit voltmeter;
    voltmeter.ohms_coil_20C = 100.0;
    voltmeter.series = {9900.0, 0.0};
    const double alpha_eff = effectiveTempco_per_K(100.0, 9900.0);
    CHECK(spanError(voltmeter, 30.0, 20.0) == relative(-alpha_eff * 10.0, 1e-3));
    CHECK(spanError(voltmeter, 20.0, 20.0) == 0.0);
    // A bare copper coil used as a millivoltmeter: about -0.39 %/K (common practice).
    CoilCircuit bare;
    bare.ohms_coil_20C = 100.0;
    CHECK(spanError(bare, 21.0, 20.0) == relative(-0.00393, 5e-3));
}

TEST_CASE("span error of a shunted ammeter") {
    // Helfrick & Cooper Example 4-1 ammeter (1 mA, 100 Ω, 100 mA range, shunt 1.0101 Ω,
    // manganin α ≈ 0): the movement current falls as the coil warms, about -α per kelvin
    // because the shunt is a hundredth of the coil (swamping rule, common practice).
    CoilCircuit ammeter;
    ammeter.ohms_coil_20C = 100.0;
    ammeter.shunt = TempcoResistor{1.0101, 0.0};
    const double error = spanError(ammeter, 21.0, 20.0);
    CHECK(error == relative(-0.00393 * 100.0 / 101.0101, 2e-2));
}

TEST_CASE("an unswamped copper coil on a manganin shunt is cautioned") {
    // The same ammeter: about -0.39 %/K, -3.8 % over 10 K (IEC 60028 copper), more than the
    // class index per 10 K that IEC 60051-1 allows for temperature (from memory) for any
    // class up to 3.
    CoilCircuit ammeter;
    ammeter.ohms_coil_20C = 100.0;
    ammeter.shunt = TempcoResistor{1.0101, 0.0};
    CHECK(spanDriftPer10K(ammeter) == relative(-0.038, 0.05));
    const auto caution = unswampedShuntCaution(ammeter, 1.5);
    REQUIRE(caution);
    CHECK_THAT(*caution, Catch::StartsWith("The copper coil is not swamped") &&
                             Catch::Contains("per 10 K") && Catch::Contains("swamping resistor"));
    // Swamped 1:20 with manganin (α ≈ 0) the drift falls to about 0.19 % per 10 K (swamping
    // rule, check-values.md 8): within class 0.5, and no caution.
    CoilCircuit swamped = ammeter;
    swamped.series = TempcoResistor{1900.0, 0.0};
    CHECK(std::fabs(spanDriftPer10K(swamped)) < 0.005);
    CHECK_FALSE(unswampedShuntCaution(swamped, 0.5).has_value());
    // A voltmeter has no shunt to be swamped against.
    CoilCircuit voltmeter;
    voltmeter.ohms_coil_20C = 100.0;
    CHECK_FALSE(unswampedShuntCaution(voltmeter, 0.5).has_value());
}

TEST_CASE("swamping design for a voltage-driven coil meets the target exactly") {
    // Closed form for a zero-tempco swamp (derived from the swamping rule, common practice):
    // |R_m(ref) - R_m(t)| / (R_sw + R_m(t)) = limit at the worse end.
    SwampRequest request;
    request.ohms_coil_20C = 5.0;
    request.celsius_ref = 20.0;
    request.celsius_min = 20.0;
    request.celsius_max = 30.0;
    request.error_limit_fraction = 0.01;
    const SwampDesign design = designSwamp(request);
    const double hot = 5.0 * 1.0393;
    CHECK(design.ohms_swamp_20C == relative((hot - 5.0) / 0.01 - hot, 1e-9));
    CHECK(design.celsius_worst == 30.0);
    CHECK(design.worst_error_fraction == relative(-0.01, 1e-9));
    CHECK_FALSE(design.ohms_shunt_20C.has_value());
    // Computed vector: with 15 Ω the effective tempco is a quarter of copper's.
    request.error_limit_fraction = 5.0 * 0.0393 / (15.0 + 5.0 * 1.0393);
    CHECK(designSwamp(request).ohms_swamp_20C == relative(15.0, 1e-9));
}

TEST_CASE("swamping design for an ammeter resizes the shunt and is minimal") {
    // Helfrick & Cooper Example 4-2 movement on its 1 A range, kept within 0.5 % from 10 to
    // 40 °C about the IEC 60051-1 reference temperature of 23 °C.
    SwampRequest request;
    request.ohms_coil_20C = 50.0;
    request.celsius_ref = 23.0;
    request.celsius_min = 10.0;
    request.celsius_max = 40.0;
    request.error_limit_fraction = 0.005;
    request.amps_fs = 1e-3;
    request.amps_range = 1.0;
    request.swamp_tempco_per_K = 15e-6; // manganin, order 1e-5 /K (handbook tables)
    const SwampDesign design = designSwamp(request);
    REQUIRE(design.ohms_shunt_20C.has_value());
    CHECK(std::fabs(design.worst_error_fraction) <= 0.005 * (1.0 + 1e-9));
    CHECK(design.celsius_worst == 40.0);
    // Shunt carries the rest at the reference temperature: R_sh = I_fs·(R_m + R_sw) / (I - I_fs).
    const double branch =
        copperResistance_ohm(50.0, 23.0) + design.ohms_swamp_20C * (1.0 + 15e-6 * 3.0);
    CHECK(*design.ohms_shunt_20C == relative(1e-3 * branch / 0.999, 1e-9));
    // One percent less swamping resistance misses the limit.
    CoilCircuit smaller;
    smaller.ohms_coil_20C = 50.0;
    smaller.series = {0.99 * design.ohms_swamp_20C, 15e-6};
    const double smaller_branch = copperResistance_ohm(50.0, 23.0) + smaller.series.at(23.0);
    smaller.shunt = TempcoResistor{1e-3 * smaller_branch / 0.999, 0.0};
    CHECK(std::fabs(spanError(smaller, 40.0, 23.0)) > 0.005);
}

TEST_CASE("an impossible swamping target is refused with the reason") {
    SwampRequest request;
    request.ohms_coil_20C = 50.0;
    request.celsius_ref = 20.0;
    request.celsius_min = -10.0;
    request.celsius_max = 50.0;
    request.error_limit_fraction = 0.001; // 0.1 %
    request.swamp_tempco_per_K = 100e-6;  // 30 K x 100 ppm/K = 0.3 % from the swamp alone
    CHECK_THROWS_WITH(designSwamp(request), Catch::Contains("own tempco"));
    request.swamp_tempco_per_K = 0.0;
    request.error_limit_fraction = 0.0;
    CHECK_THROWS_AS(designSwamp(request), std::domain_error);
    request.error_limit_fraction = 0.01;
    request.amps_fs = 1e-3; // without a range
    CHECK_THROWS_WITH(designSwamp(request), Catch::Contains("both"));
}
