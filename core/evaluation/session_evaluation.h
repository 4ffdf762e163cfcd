// The one session evaluator: a stored calibration (instrument with its ranges, session with its
// readings, the standards' specifications as used, environment, decision rule and settings)
// turned into per-range, per-phase results and the overall outcome. The bench, the review, the
// records, the history and the commands all call it; nothing else decides a verdict.
#pragma once

#include "core/evaluation/evaluation.h"
#include "core/evaluation/reference_choice.h"
#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

// The inputs a session would be sealed with now: a copy of every range of every standard it
// uses (from `registerStandards`, the standards as the register holds them today) and, for each
// range of the instrument that has readings or resistor checks, its signal type, diode model,
// fitted resistor, divisions and chosen reference. Copies in `inherited` (an amendment starts
// with those of the record it amends) are kept for the standards and ranges they cover. A range
// whose signal type is not recorded gets no entry; evaluateSession() then says so.
SealedInputs sealInputs(const Instrument& instrument, const CalibrationSession& session,
                        const std::vector<ReferenceStandard>& registerStandards,
                        const std::optional<SealedInputs>& inherited = std::nullopt);

// One range in one phase.
struct RangeEvaluation {
    std::int64_t rangeId = 0;
    std::string rangeLabel;
    Phase phase = Phase::AsFound;
    std::optional<EvaluationResult> result; // nullopt when it could not be evaluated
    std::string problem;                    // why not, in words naming the range and phase
    std::string reference;                  // the standard's range used, in words ("" if none)
};

struct SessionEvaluation {
    // Ranges in the instrument's order, each as-found then as-left where it has readings.
    std::vector<RangeEvaluation> ranges;
    std::optional<Outcome> asFound; // worst as-found outcome over the ranges, when all evaluated
    std::optional<Outcome> asLeft;  // worst as-left outcome, when any range has as-left readings
    // The condition the meter leaves in: per range its last phase measured (as-left where it
    // was adjusted, as-found otherwise), the worst over the ranges. nullopt when a range could
    // not be evaluated or there are no readings.
    std::optional<Outcome> overall;
    std::vector<std::string> problems; // every range/phase that could not be evaluated
    // The IEC 61010-1 caution when a test value reaches the hazardous-live limits.
    std::optional<std::string> hazardCaution;
    // False for records sealed before their settings were recorded: defaults were assumed.
    bool settingsRecorded = true;
};

// Whether a rectifier range's input carries the error curve its diodes predict. The curve only
// informs the advice and the chart, never a result or an outcome, and costs a solve of the
// circuit per reading: what shows no advice (the history of an instrument) leaves it out.
enum class RectifierCurve { Predicted, Omitted };

// Evaluates every range and phase of `session` with `inputs` (its sealed copies, or
// sealInputs() of the register for a draft). Never throws for bad readings: each range that
// cannot be evaluated is named in `problems`.
SessionEvaluation evaluateSession(const Instrument& instrument, const CalibrationSession& session,
                                  const SealedInputs& inputs,
                                  RectifierCurve curve = RectifierCurve::Predicted);

// The evaluation input of one range and phase (exposed for the bench's live updates and for
// tests); throws std::invalid_argument when the range has no entry in `inputs`.
EvaluationInput evaluationInputFor(const Instrument& instrument, const RangeSpec& range,
                                   const CalibrationSession& session, const SealedInputs& inputs,
                                   Phase phase, RectifierCurve curve = RectifierCurve::Predicted);

} // namespace mw
