// Copper coil resistance against temperature, span error, and swamping-resistor design.
#include "core/circuits/coil_temperature.h"

#include "core/units/quantity.h"

#include <cmath>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

double linearFactor(double tempco_per_K, double celsius, const char* what) {
    if (!std::isfinite(celsius)) {
        throw std::domain_error(std::string(what) + ": temperature is not a finite number");
    }
    const double factor = 1.0 + tempco_per_K * (celsius - kCopperReference_C);
    if (!(factor > 0.0)) {
        throw std::domain_error(std::string(what) + ": " +
                                formatEngineering(celsius, 4, Unit::DegreeCelsius) +
                                " is outside the range of the linear resistance law");
    }
    return factor;
}

// Worst span error over the two ends of the range: with linear resistances the error is a
// ratio of linear functions of t, hence monotonic, so the ends bound it.
struct Worst {
    double error = 0.0;
    double celsius = 0.0;
};

CoilCircuit circuitFor(const SwampRequest& request, double ohms_swamp_20C) {
    CoilCircuit circuit;
    circuit.ohms_coil_20C = request.ohms_coil_20C;
    circuit.series = {ohms_swamp_20C, request.swamp_tempco_per_K};
    if (request.amps_fs) {
        const double t = request.celsius_ref;
        const double branch_ohm =
            copperResistance_ohm(request.ohms_coil_20C, t) + circuit.series.at(t);
        const double shunt_at_ref =
            *request.amps_fs * branch_ohm / (*request.amps_range - *request.amps_fs);
        circuit.shunt =
            TempcoResistor{shunt_at_ref / linearFactor(request.shunt_tempco_per_K, t, "shunt"),
                           request.shunt_tempco_per_K};
    }
    return circuit;
}

Worst worstError(const SwampRequest& request, double ohms_swamp_20C) {
    const CoilCircuit circuit = circuitFor(request, ohms_swamp_20C);
    Worst worst;
    for (const double t : {request.celsius_min, request.celsius_max}) {
        const double error = spanError(circuit, t, request.celsius_ref);
        if (std::fabs(error) >= std::fabs(worst.error)) {
            worst = {error, t};
        }
    }
    return worst;
}

void checkRequest(const SwampRequest& r) {
    if (!(r.ohms_coil_20C > 0.0) || !std::isfinite(r.ohms_coil_20C)) {
        throw std::domain_error("swamping design: coil resistance must be above 0 Ω");
    }
    if (!(r.celsius_min <= r.celsius_max)) {
        throw std::domain_error("swamping design: the temperature range runs from a lower to a "
                                "higher temperature");
    }
    if (!(r.error_limit_fraction > 0.0) || !std::isfinite(r.error_limit_fraction)) {
        throw std::domain_error("swamping design: the error limit must be above 0 %");
    }
    if (r.amps_fs.has_value() != r.amps_range.has_value()) {
        throw std::domain_error("swamping design: an ammeter needs both I_fs and the range");
    }
    if (r.amps_fs && !(*r.amps_fs > 0.0 && *r.amps_range > *r.amps_fs)) {
        throw std::domain_error("swamping design: the ammeter range must be above I_fs > 0");
    }
}

} // namespace

double copperResistance_ohm(double ohms_at_20C, double celsius) {
    return ohms_at_20C * linearFactor(kCopperAlpha20_per_K, celsius, "copper resistance");
}

double copperResistanceAt20_ohm(double ohms_measured, double celsius_measured) {
    return ohms_measured /
           linearFactor(kCopperAlpha20_per_K, celsius_measured, "copper resistance");
}

double TempcoResistor::at(double celsius) const {
    return ohms_20C * linearFactor(tempco_per_K, celsius, "resistor");
}

double spanError(const CoilCircuit& circuit, double celsius, double celsius_ref) {
    const auto movementCurrent = [&circuit](double t) {
        const double branch_ohm =
            copperResistance_ohm(circuit.ohms_coil_20C, t) + circuit.series.at(t);
        if (!(branch_ohm > 0.0)) {
            throw std::domain_error("span error: coil plus series resistance must be above 0 Ω");
        }
        if (!circuit.shunt) {
            return 1.0 / branch_ohm; // per volt applied
        }
        const double shunt_ohm = circuit.shunt->at(t);
        return shunt_ohm / (shunt_ohm + branch_ohm); // per ampere applied
    };
    return movementCurrent(celsius) / movementCurrent(celsius_ref) - 1.0;
}

double effectiveTempco_per_K(double ohms_coil_20C, double ohms_swamp_20C,
                             double swamp_tempco_per_K) {
    const double total_ohm = ohms_coil_20C + ohms_swamp_20C;
    if (!(total_ohm > 0.0)) {
        throw std::domain_error("effective tempco: coil plus swamping resistance must be above 0");
    }
    return (kCopperAlpha20_per_K * ohms_coil_20C + swamp_tempco_per_K * ohms_swamp_20C) / total_ohm;
}

SwampDesign designSwamp(const SwampRequest& request) {
    checkRequest(request);
    const double limit = request.error_limit_fraction;
    SwampDesign design;
    double ok_ohm = 0.0;
    if (std::fabs(worstError(request, 0.0).error) > limit) {
        // Geometric scan for the first resistance that meets the limit, then bisection: the
        // error need not be monotonic in R_sw when the swamp's tempco is negative.
        double failing_ohm = 0.0;
        ok_ohm = -1.0;
        for (int step = -60; step <= 240 && ok_ohm < 0.0; ++step) {
            const double trial_ohm = request.ohms_coil_20C * std::pow(10.0, step / 20.0);
            if (std::fabs(worstError(request, trial_ohm).error) <= limit) {
                ok_ohm = trial_ohm;
            } else {
                failing_ohm = trial_ohm;
            }
        }
        if (ok_ohm < 0.0) {
            throw std::domain_error(
                "swamping design: no series resistance keeps the span error within " +
                formatEngineering(100.0 * limit, 3, Unit::Percent) +
                "; the swamping resistor's own tempco over the temperature range exceeds it");
        }
        for (int i = 0; i < 100 && ok_ohm - failing_ohm > 1e-12 * ok_ohm; ++i) {
            const double mid_ohm = 0.5 * (ok_ohm + failing_ohm);
            (std::fabs(worstError(request, mid_ohm).error) <= limit ? ok_ohm : failing_ohm) =
                mid_ohm;
        }
    }
    design.ohms_swamp_20C = ok_ohm;
    const Worst worst = worstError(request, ok_ohm);
    design.worst_error_fraction = worst.error;
    design.celsius_worst = worst.celsius;
    if (const CoilCircuit circuit = circuitFor(request, ok_ohm); circuit.shunt) {
        design.ohms_shunt_20C = circuit.shunt->ohms_20C;
    }
    return design;
}

double spanDriftPer10K(const CoilCircuit& circuit, double celsius_ref) {
    return spanError(circuit, celsius_ref + 10.0, celsius_ref);
}

std::optional<std::string> unswampedShuntCaution(const CoilCircuit& circuit, double classIndex,
                                                 double celsius_ref) {
    if (!circuit.shunt) {
        return std::nullopt;
    }
    if (!(classIndex > 0.0) || !std::isfinite(classIndex)) {
        throw std::domain_error("swamping check: the class index must be above 0");
    }
    const double drift = spanDriftPer10K(circuit, celsius_ref);
    if (std::fabs(drift) * 100.0 <= classIndex) {
        return std::nullopt;
    }
    return "The copper coil is not swamped: on a low-tempco shunt the span drifts by " +
           formatEngineering(100.0 * drift, 3, Unit::Percent) +
           " per 10 K (copper: +0.393 %/K, IEC 60028), more than the " +
           formatEngineering(classIndex, 2, Unit::Percent) +
           " per 10 K that class allows for temperature (IEC 60051-1, from memory). Add a "
           "low-tempco swamping resistor in series with the coil and resize the shunt (calc "
           "temperature --target).";
}

} // namespace mw
