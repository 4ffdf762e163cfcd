// Temperature of the copper coil: its resistance (IEC 60028 copper), the span error it causes,
// and the design of a series low-tempco swamping resistor that keeps that error within a target.
#pragma once

#include <optional>
#include <string>

namespace mw {

// IEC 60028 standard annealed copper: α = 0.00393 /K at 20 °C.
inline constexpr double kCopperAlpha20_per_K = 0.00393;
inline constexpr double kCopperReference_C = 20.0;

// R(t) = R20·(1 + α20·(t - 20)). Throws std::domain_error below copper's inferred zero
// (about -234.45 °C), where the linear law gives no resistance.
double copperResistance_ohm(double ohms_at_20C, double celsius);

// R20 from a coil resistance measured at another temperature.
double copperResistanceAt20_ohm(double ohms_measured, double celsius_measured);

// A resistor with a linear temperature coefficient referred to 20 °C (manganin: order 1e-5 /K).
struct TempcoResistor {
    double ohms_20C = 0.0;
    double tempco_per_K = 0.0;
    double at(double celsius) const;
};

// The circuit whose span drifts: copper coil in series with a low-tempco resistance (a
// multiplier or a swamping resistor); for an ammeter that branch is shunted.
struct CoilCircuit {
    double ohms_coil_20C = 0.0;
    TempcoResistor series;               // multiplier or swamping resistor (may be 0 Ω)
    std::optional<TempcoResistor> shunt; // across coil + series: an ammeter
};

// Relative change of the indication at `celsius` against `celsius_ref` for the same applied
// voltage (no shunt) or current (with a shunt): I_m(t) / I_m(ref) - 1. Negative: reads low.
double spanError(const CoilCircuit& circuit, double celsius, double celsius_ref);

// Span drift over 10 K above `celsius_ref`, as a fraction: spanError(circuit, ref + 10, ref).
double spanDriftPer10K(const CoilCircuit& circuit, double celsius_ref = 23.0);

// For an ammeter (a circuit with a shunt): the caution that its copper coil sits on a
// low-tempco (manganin) shunt without enough swamping, so the span drifts with almost the
// whole 0.393 %/K of copper. Given when the drift over 10 K exceeds `classIndex` percent, the
// limit of the variation due to temperature of IEC 60051-1 (100 % of the class index per
// 10 K, from memory). None for a voltmeter or a swamped ammeter.
std::optional<std::string> unswampedShuntCaution(const CoilCircuit& circuit, double classIndex,
                                                 double celsius_ref = 23.0);

// Temperature coefficient of coil + swamping resistor in series:
// (α_Cu·R_coil + α_sw·R_sw) / (R_coil + R_sw), both resistances at 20 °C.
double effectiveTempco_per_K(double ohms_coil_20C, double ohms_swamp_20C,
                             double swamp_tempco_per_K = 0.0);

struct SwampRequest {
    double ohms_coil_20C = 0.0;
    double celsius_ref = 23.0; // where the meter is adjusted (IEC 60051-1 reference: 23 °C)
    double celsius_min = 0.0;
    double celsius_max = 0.0;
    double error_limit_fraction = 0.0; // largest |span error| allowed over [min, max]
    double swamp_tempco_per_K = 0.0;
    // For an ammeter give both: the shunt is then sized at celsius_ref for coil + swamp.
    std::optional<double> amps_fs;
    std::optional<double> amps_range;
    double shunt_tempco_per_K = 0.0;
};

struct SwampDesign {
    double ohms_swamp_20C = 0.0;          // smallest swamping resistance meeting the limit
    std::optional<double> ohms_shunt_20C; // ammeter only
    double worst_error_fraction = 0.0;    // signed, at celsius_worst
    double celsius_worst = 0.0;
};

// Throws std::domain_error (with the reason) when the request is malformed or when no swamping
// resistance can meet the limit (its own tempco over the range already exceeds it).
SwampDesign designSwamp(const SwampRequest& request);

} // namespace mw
