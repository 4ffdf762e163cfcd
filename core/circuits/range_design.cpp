// Designing the resistor of one range from the movement.
#include "core/circuits/range_design.h"

#include "core/circuits/ammeter.h"
#include "core/circuits/dc_voltmeter.h"
#include "core/circuits/rectifier_design.h"

#include <algorithm>
#include <cmath>

namespace mw {

std::optional<DesignedResistor> designedResistor(const Instrument& instrument,
                                                 const RangeSpec& range, double celsius) {
    const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    const Movement& movement = instrument.movement;
    if (range.unit == Unit::Ampere) {
        if (std::fabs(top - movement.amps_fs) <= 1e-12 * top) {
            return std::nullopt;
        }
        return DesignedResistor{shunt_ohm(movement, top), true, "shunt R = I_fs·R_m/(I − I_fs)"};
    }
    const SignalType signal = range.signal.value_or(SignalType::Dc);
    if (signal == SignalType::Dc) {
        return DesignedResistor{multiplier_ohm(movement, top), false,
                                "multiplier R = V/I_fs − R_m"};
    }
    RectifierCircuit circuit;
    circuit.rectifier = signal == SignalType::HalfWave ? Rectifier::HalfWave : Rectifier::Bridge;
    circuit.movement_amps_fs = movement.amps_fs;
    circuit.movement_ohms = movement.ohms_coil;
    const std::string rectifier =
        signal == SignalType::HalfWave ? "half-wave rectifier" : "bridge rectifier";
    if (!range.diode) {
        const double ohms =
            idealMultiplierOhms(circuit, top, averagePerRms(circuit.rectifier, WaveShape::Sine));
        return DesignedResistor{ohms, false,
                                rectifier + ", ideal diodes (diode model not "
                                            "recorded)"};
    }
    const RectifierMeter meter(circuit, diodePreset(*range.diode), celsius);
    const MultiplierSolution solution = solveMultiplier(meter, top, WaveShape::Sine);
    return DesignedResistor{solution.multiplier_ohms, false,
                            rectifier + ", " + std::string(presetName(*range.diode)) +
                                " diodes solved over each cycle"};
}

} // namespace mw
