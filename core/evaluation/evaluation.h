// The evaluation of one range of one instrument from its readings: errors, uncertainty budget,
// decision, conformance probability and specific risk per point, the overall outcome, the
// statement of conformity, cautions and the adjustment advice. One pure function over value
// types, shared by the bench screen, the stored records and the headless `calc evaluate`.
#pragma once

#include "core/accuracy/accuracy_class.h"
#include "core/accuracy/reference_spec.h"
#include "core/advice/advice.h"
#include "core/advice/resistor_correction.h"
#include "core/circuits/coil_temperature.h"
#include "core/circuits/eseries.h"
#include "core/decision/decision.h"
#include "core/model/vocabulary.h"
#include "core/uncertainty/budget.h"
#include "core/units/quantity.h"

#include <cstddef>
#include <functional>
#include <optional>
#include <stdexcept>
#include <string>
#include <vector>

namespace mw {

struct EvaluationReading {
    double applied = 0.0;   // delivered by the reference standard, in the unit of the range
    double indicated = 0.0; // shown by the instrument under test
    Direction direction = Direction::Up;
    int repeat = 0; // 1-based repeat number at its point and direction; 0: not numbered
    int point = -1; // test-point index; -1 groups readings by equal applied value instead
};

// The room is off the reference temperature. With a coil circuit the shift of the indication
// comes from the coil model (copper coil with its multiplier, swamp and shunt); without one,
// from a plain coefficient: coefficientPerKelvin × (room − reference).
struct TemperatureInfluence {
    double roomCelsius = 23.0;
    double referenceCelsius = 23.0; // IEC 60051-1 default reference temperature
    std::optional<CoilCircuit> coil;
    double coefficientPerKelvin = 0.0;
};

// The resistor that sets the range: a multiplier (voltmeter) or a shunt (ammeter).
struct RangeResistor {
    double presentOhms = 0.0;  // value in the instrument now (measured, or nominal)
    double movementOhms = 0.0; // coil resistance of the movement
    bool isShunt = false;
    std::optional<double> computedOhms; // designed value, for the deviation check
    double tolerancePercent = 1.0;      // of the fitted resistor
    ESeries series = ESeries::E96;      // where the replacement is chosen from
};

struct EvaluationInput {
    InstrumentKind kind = InstrumentKind::DcVoltmeter;
    Phase phase = Phase::AsFound;
    Unit unit = Unit::Volt;
    ScaleRange range;
    double classIndex = 1.0;
    int divisions = 0;                      // 0 leaves out the readability component (and says so)
    double readabilityFraction = 0.2;       // of a division
    std::optional<ReferenceSpec> reference; // absent: left out of the budget, and said so
    // Full scale of the standard's range, on which a spec's "% of range" term is taken. Absent:
    // the larger modulus of the meter range's limits, stated in the result as an assumption.
    std::optional<double> referenceRangeValue;
    double referenceResolution = 0.0; // 0 leaves out the resolution component
    std::string referenceIdentity;    // the standard used (asset, certificate), for the statement
    // The reference standard's components at an applied value, when they are more than one
    // spec can say (a current read across a shunt); used instead of `reference` when set.
    std::function<std::vector<UncertaintyComponent>(double applied)> referenceComponents;
    std::optional<TemperatureInfluence> temperature;
    std::vector<UncertaintyComponent> extraComponents; // user-added, at every point
    DecisionSettings decision;
    double probability = kProbabilityTwoSigma;
    std::vector<EvaluationReading> readings;
    // Error the circuit model predicts at an applied value (rectifier diode curve), if known.
    std::function<double(double applied)> predictedError;
    std::optional<RangeResistor> resistor;
};

struct PointResult {
    int pointIndex = -1; // the test-point index of its readings; -1 when grouped by value
    double applied = 0.0;
    double indicated = 0.0; // mean indication in the direction with the larger error
    Direction decidingDirection = Direction::Up; // that direction (the one judged)
    double error = 0.0; // indicated − applied in that direction (nearest double)
    std::optional<double> errorPercentOfReading; // absent at zero applied
    double errorPercentOfFiducial = 0.0;
    std::optional<double> errorUp;
    std::optional<double> errorDown;
    std::optional<double> hysteresis;    // errorDown − errorUp
    std::optional<double> repeatability; // pooled standard deviation of repeated readings
    int readingCount = 0;
    double permissibleError = 0.0; // ± limit
    std::vector<UncertaintyComponent> components;
    BudgetResult budget;
    // The decision, the guard band and the TUR use the expanded uncertainty as reported,
    // rounded UP to two significant digits (budget.expandedRounded), and every comparison is
    // exact on the decimals typed (mean of n readings compared as n·Σ). The rounded-up U is
    // never below the unrounded one, so the guard band is never narrowed and the TUR never
    // flattered, and a reader can redo every decision from the printed numbers.
    Outcome decision = Outcome::Pass;
    // TUR = 2·limit / (2U) (ANSI/NCSL Z540.3 Handbook); absent without a reference-standard
    // uncertainty, where U lacks the main part of the calibration process.
    std::optional<double> tur;
    std::string turText;          // rounded DOWN to two significant digits: "6.2:1"; "" without
    bool turBelowMinimum = false; // TUR < 4:1, decided exactly; false without a TUR
    // JCGM 106:2012 with the scaled-and-shifted t-distribution at the point's ν_eff (truncated
    // as for the coverage factor; normal when infinite) and scale u_c.
    double conformanceProbability = 1.0; // p_c: the true error lies within the limits
    // Specific risk of the accepted point (pass, conditional pass): the probability that its
    // true error lies outside the limits, 1 − p_c. Absent for a rejected point, whose figure is
    // p_c (the chance that it conforms after all).
    std::optional<double> specificRisk;
    double riskDof = kInfiniteDof; // ν of the t-distribution used for the two figures above
};

// A component that a complete budget would hold but this evaluation could not, and why.
struct OmittedComponent {
    std::string name;   // e.g. "reference standard"
    std::string reason; // e.g. "no uncertainty of the reference standard was given"
};

struct EvaluationResult {
    double fiducialValue = 0.0;
    double permissibleError = 0.0;
    std::vector<PointResult> points; // ascending applied value
    std::size_t worstPoint = 0;      // largest |error| (all points share the limit)
    Outcome overall = Outcome::Pass;
    std::vector<OmittedComponent> omittedComponents;
    // The full scale on which the reference's "% of range" term was taken, and whether it was
    // assumed (the meter range's limit) rather than given as the standard's range.
    std::optional<double> referenceRangeValue;
    bool referenceRangeAssumed = false;
    // IEC 61010-1 hazardous-live caution when a voltage of the range or a reading reaches it.
    std::optional<std::string> hazardCaution;
    // Every caution in words, in the order to show them: hazard, left-out budget components,
    // simple acceptance with a TUR below 4:1, an assumed reference range.
    std::vector<std::string> cautions;
    std::string statement;
    std::optional<Advice> advice;                  // needs two or more distinct applied values
    std::optional<double> correctedResistorOhms;   // the value that nulls the fitted span error
    std::optional<ResistorChoice> correctedChoice; // nearest standard value and series trim
    std::optional<ResistorDeviation> resistorDeviation;
};

// Readings must lie on the range's scale: an applied value beyond lower … upper by more than
// kScaleEndAllowance of the span is refused (a 20 V reading on a 10 V range is a wrong range or a
// typing slip, never a point to pass). The allowance is wide enough for the common practice of
// setting the pointer on the end mark and reading what the standard applies: a meter reading
// several per cent low needs that much more than full scale, and a failing meter must still be
// recorded (our own choice: a fifth of the span, the usual 120 % overrange of a test).
inline constexpr double kScaleEndAllowance = 0.2;

// What evaluateRange() throws for input it cannot evaluate: the field at fault ("readings",
// "applied", "indicated", "repeat", "range", "class index", "divisions", "readability",
// "reference", "probability", "decision", "component") and, when one reading is at fault, its
// 1-based number in input.readings (and that of an earlier reading it conflicts with), so callers
// map it to a line of their own without reading the message.
class EvaluationError : public std::invalid_argument {
public:
    EvaluationError(std::string field, std::optional<std::size_t> readingNumber,
                    const std::string& detail,
                    std::optional<std::size_t> conflictingReadingNumber = std::nullopt);

    const std::string& field() const noexcept { return field_; }
    std::optional<std::size_t> readingNumber() const noexcept { return readingNumber_; }
    std::optional<std::size_t> conflictingReadingNumber() const noexcept {
        return conflictingReadingNumber_;
    }
    // The message without "evaluation: " and the reading number: "has an applied value of …".
    const std::string& detail() const noexcept { return detail_; }

private:
    std::string field_;
    std::optional<std::size_t> readingNumber_;
    std::optional<std::size_t> conflictingReadingNumber_;
    std::string detail_;
};

// Throws EvaluationError naming the input (and the reading, 1-based) at fault.
EvaluationResult evaluateRange(const EvaluationInput& input);

} // namespace mw
