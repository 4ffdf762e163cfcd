// The session evaluator: sealing the inputs and evaluating every range and phase.
#include "core/evaluation/session_evaluation.h"

#include "core/advice/rectifier_curve.h"
#include "core/circuits/coil_temperature.h"
#include "core/circuits/hazard.h"
#include "core/circuits/rectifier_design.h"
#include "core/circuits/rectifier_meter.h"
#include "core/plan/session_plan.h"

#include <algorithm>
#include <cmath>
#include <set>
#include <stdexcept>

namespace mw {
namespace {

double largestMagnitude(const RangeSpec& range) {
    return std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
}

const RangeAsUsed* findRange(const SealedInputs& inputs, std::int64_t rangeId) {
    for (const RangeAsUsed& used : inputs.ranges) {
        if (used.range_id == rangeId) {
            return &used;
        }
    }
    return nullptr;
}

std::set<std::int64_t> rangesWithWork(const CalibrationSession& session) {
    std::set<std::int64_t> ids;
    for (const Reading& r : session.readings) {
        ids.insert(r.range_id);
    }
    for (const ResistorCheck& c : session.resistor_checks) {
        ids.insert(c.range_id);
    }
    for (const TestPoint& p : session.plan) {
        ids.insert(p.range_id);
    }
    return ids;
}

// The copper coil with its multiplier (voltmeter) or behind its shunt (ammeter), the resistors
// taken as manganin with a negligible coefficient (common practice). A bare movement read as a
// current does not depend on its coil's resistance, so it has no temperature effect here.
std::optional<CoilCircuit> coilOf(const Instrument& instrument, const RangeSpec& range,
                                  const RangeAsUsed& used, double referenceCelsius) {
    if (!(instrument.movement.ohms_coil > 0.0)) {
        return std::nullopt;
    }
    CoilCircuit coil;
    coil.ohms_coil_20C = copperResistanceAt20_ohm(instrument.movement.ohms_coil, referenceCelsius);
    if (range.unit == Unit::Ampere) {
        if (!used.resistor_ohms) {
            return std::nullopt;
        }
        coil.shunt = TempcoResistor{*used.resistor_ohms, 0.0};
    } else {
        coil.series = TempcoResistor{used.resistor_ohms.value_or(0.0), 0.0};
    }
    return coil;
}

// The diode curve a rectifier range's circuit predicts once its span is set at full scale (the
// multiplier solved with the diodes' model, as an adjusted meter has it), so the curve shows the
// low-scale loss the diodes cause; none when the model is not recorded or has no answer at
// every applied value (the advice then goes without it).
std::function<double(double)> predictedCurve(const Instrument& instrument, const RangeSpec& range,
                                             const RangeAsUsed& used, double celsius,
                                             const std::vector<EvaluationReading>& readings) {
    if (used.signal == SignalType::Dc || !used.diode) {
        return {};
    }
    try {
        RectifierCircuit circuit;
        circuit.rectifier =
            used.signal == SignalType::HalfWave ? Rectifier::HalfWave : Rectifier::Bridge;
        circuit.movement_amps_fs = instrument.movement.amps_fs;
        circuit.movement_ohms = instrument.movement.ohms_coil;
        const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
        const RectifierMeter model(circuit, *used.diode, celsius);
        const MultiplierSolution solution = solveMultiplier(model, top, WaveShape::Sine);
        auto curve = predictedRectifierError(model.withMultiplier(solution.multiplier_ohms), top);
        for (const EvaluationReading& reading : readings) {
            curve(reading.applied); // throws where the model has no answer
        }
        return curve;
    } catch (const std::exception&) {
        return {};
    }
}

std::string phaseWords(Phase phase) {
    return phase == Phase::AsFound ? "as-found" : "as-left";
}

// The caution for the largest voltage the session put on the terminals (AC ranges are judged
// by their rms and peak, DC ones by the DC limit).
std::optional<std::string> hazardOf(const Instrument& instrument, const CalibrationSession& s,
                                    const SealedInputs& inputs) {
    double largestAc = 0.0;
    double largestDc = 0.0;
    for (const Reading& reading : s.readings) {
        if (reading.unit != Unit::Volt) {
            continue;
        }
        const RangeAsUsed* used = findRange(inputs, reading.range_id);
        const bool ac = used ? used->signal != SignalType::Dc
                             : std::any_of(instrument.ranges.begin(), instrument.ranges.end(),
                                           [&reading](const RangeSpec& r) {
                                               return r.id == reading.range_id && r.signal &&
                                                      *r.signal != SignalType::Dc;
                                           });
        const double value =
            std::max(std::fabs(reading.applied), std::fabs(reading.indicated.value_or(0.0)));
        (ac ? largestAc : largestDc) = std::max(ac ? largestAc : largestDc, value);
    }
    if (auto caution = hazardCaution(largestAc, VoltageKind::AcRms)) {
        return caution;
    }
    return hazardCaution(largestDc, VoltageKind::Dc);
}

} // namespace

SealedInputs sealInputs(const Instrument& instrument, const CalibrationSession& session,
                        const std::vector<ReferenceStandard>& registerStandards,
                        const std::optional<SealedInputs>& inherited) {
    SealedInputs inputs;
    for (const StandardUse& use : session.standards) {
        const bool kept = inherited && std::any_of(inherited->specs.begin(), inherited->specs.end(),
                                                   [&use](const StandardSpecCopy& c) {
                                                       return c.standard_id == use.standard_id;
                                                   });
        if (kept) {
            for (const StandardSpecCopy& copy : inherited->specs) {
                if (copy.standard_id == use.standard_id) {
                    inputs.specs.push_back(copy);
                }
            }
            continue;
        }
        for (const ReferenceStandard& standard : registerStandards) {
            if (standard.id != use.standard_id) {
                continue;
            }
            for (std::size_t i = 0; i < standard.specs.size(); ++i) {
                inputs.specs.push_back({standard.id, static_cast<int>(i), standard.specs[i]});
            }
        }
    }
    const std::set<std::int64_t> used = rangesWithWork(session);
    for (const RangeSpec& range : instrument.ranges) {
        if (!used.count(range.id)) {
            continue;
        }
        if (inherited) {
            if (const RangeAsUsed* copy = findRange(*inherited, range.id)) {
                inputs.ranges.push_back(*copy);
                continue;
            }
        }
        if (!range.signal) {
            continue; // not recorded: evaluateSession() names it
        }
        RangeAsUsed entry;
        entry.range_id = range.id;
        entry.signal = *range.signal;
        if (entry.signal != SignalType::Dc && range.diode) {
            entry.diode = diodePreset(*range.diode);
        }
        entry.resistor_ohms = range.nominal_ohms;
        entry.divisions = instrument.scale_divisions;
        if (auto choice =
                chooseReference(range.unit, entry.signal, largestMagnitude(range), inputs.specs)) {
            entry.reference = choice->reference;
            entry.reference_shunt = choice->shunt;
        }
        inputs.ranges.push_back(entry);
    }
    return inputs;
}

EvaluationInput evaluationInputFor(const Instrument& instrument, const RangeSpec& range,
                                   const CalibrationSession& session, const SealedInputs& inputs,
                                   Phase phase, RectifierCurve curve) {
    const RangeAsUsed* used = findRange(inputs, range.id);
    if (used == nullptr) {
        throw std::invalid_argument("range \"" + range.label +
                                    "\": its signal type (DC, half-wave or bridge rectifier) is "
                                    "not recorded; set it in the register before evaluating");
    }
    const EvaluationSettings settings = session.settings.value_or(EvaluationSettings{});
    EvaluationInput input;
    input.kind = rangeKind(used->signal, range.unit);
    input.phase = phase;
    input.unit = range.unit;
    input.range = ScaleRange{range.lower_limit, range.full_scale, instrument.scale_type,
                             range.fiducial_value};
    input.classIndex = instrument.accuracy_class;
    input.divisions = used->divisions;
    input.readabilityFraction = settings.readability_fraction;
    input.probability = settings.coverage_probability;
    input.decision.rule = session.decision_rule;
    input.decision.guardFactor = session.guard_factor;
    if (used->reference) {
        const ReferenceChoice choice{*used->reference, used->reference_shunt};
        const std::vector<StandardSpecCopy> specs = inputs.specs;
        // Named on the record by its range and certificate (refuses a choice naming a copy the
        // session does not hold).
        input.referenceIdentity = describeChoice(choice, specs);
        for (const StandardUse& use : session.standards) {
            if (use.standard_id == choice.reference.standard_id &&
                !use.certificate_number.empty()) {
                input.referenceIdentity += " (certificate " + use.certificate_number + ")";
            }
        }
        input.referenceComponents = [choice, specs](double applied) {
            return referenceComponents(choice, specs, applied);
        };
    }
    const double ambient = session.environment.ambient_celsius;
    if (ambient != settings.reference_celsius) {
        if (auto coil = coilOf(instrument, range, *used, settings.reference_celsius)) {
            TemperatureInfluence influence;
            influence.roomCelsius = ambient;
            influence.referenceCelsius = settings.reference_celsius;
            influence.coil = coil;
            input.temperature = influence;
        }
    }
    for (const Reading& r : session.readings) {
        if (r.range_id == range.id && r.phase == phase && r.indicated) {
            input.readings.push_back(
                {r.applied, *r.indicated, r.direction, r.repeat, r.point_index});
        }
    }
    if (curve == RectifierCurve::Predicted) {
        input.predictedError = predictedCurve(instrument, range, *used, ambient, input.readings);
    }
    if (used->resistor_ohms && *used->resistor_ohms > 0.0) {
        RangeResistor resistor;
        resistor.presentOhms = *used->resistor_ohms;
        resistor.movementOhms = instrument.movement.ohms_coil;
        resistor.isShunt = range.unit == Unit::Ampere;
        input.resistor = resistor;
    }
    return input;
}

SessionEvaluation evaluateSession(const Instrument& instrument, const CalibrationSession& session,
                                  const SealedInputs& inputs, RectifierCurve curve) {
    SessionEvaluation evaluation;
    evaluation.settingsRecorded = session.settings.has_value();
    evaluation.hazardCaution = hazardOf(instrument, session, inputs);
    bool complete = true;
    bool anyReadings = false;
    for (const RangeSpec& range : instrument.ranges) {
        std::optional<Outcome> last;
        for (Phase phase : {Phase::AsFound, Phase::AsLeft}) {
            const bool measured = std::any_of(
                session.readings.begin(), session.readings.end(), [&](const Reading& r) {
                    return r.range_id == range.id && r.phase == phase && r.indicated;
                });
            if (!measured) {
                continue;
            }
            anyReadings = true;
            RangeEvaluation part;
            part.rangeId = range.id;
            part.rangeLabel = range.label;
            part.phase = phase;
            try {
                const EvaluationInput input =
                    evaluationInputFor(instrument, range, session, inputs, phase, curve);
                if (const RangeAsUsed* used = findRange(inputs, range.id); used->reference) {
                    part.reference =
                        describeChoice({*used->reference, used->reference_shunt}, inputs.specs);
                }
                part.result = evaluateRange(input);
                const Outcome outcome = part.result->overall;
                std::optional<Outcome>& phaseWorst =
                    phase == Phase::AsFound ? evaluation.asFound : evaluation.asLeft;
                phaseWorst = phaseWorst ? worseOf(*phaseWorst, outcome) : outcome;
                last = outcome;
            } catch (const std::exception& error) {
                part.problem =
                    "range \"" + range.label + "\", " + phaseWords(phase) + ": " + error.what();
                evaluation.problems.push_back(part.problem);
                complete = false;
            }
            evaluation.ranges.push_back(std::move(part));
        }
        if (last) {
            evaluation.overall = evaluation.overall ? worseOf(*evaluation.overall, *last) : *last;
        }
    }
    if (!complete || !anyReadings) {
        evaluation.overall.reset();
        evaluation.asFound = complete ? evaluation.asFound : std::nullopt;
        evaluation.asLeft = complete ? evaluation.asLeft : std::nullopt;
    }
    return evaluation;
}

} // namespace mw
