// The evaluation of one range of one instrument from its readings: errors, uncertainty budget,
// decision and probability of false accept per point, the overall outcome, the statement of
// conformity and the adjustment advice. One pure function over value types, shared by the bench
// screen, the stored records and the headless `calc evaluate` command.
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

#include <functional>
#include <optional>
#include <string>
#include <vector>

namespace mw {

struct EvaluationReading {
    double applied = 0.0;   // delivered by the reference standard, in the unit of the range
    double indicated = 0.0; // shown by the instrument under test
    Direction direction = Direction::Up;
    int repeat = 1;
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
    int divisions = 0;                // 0 leaves out the readability component
    double readabilityFraction = 0.2; // of a division
    std::optional<ReferenceSpec> reference;
    std::optional<double> referenceRangeValue; // full scale of the standard's range; default
                                               // the larger modulus of the range limits
    double referenceResolution = 0.0;          // 0 leaves out the resolution component
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
    double applied = 0.0;
    double indicated = 0.0; // mean indication in the direction with the larger error
    double error = 0.0;     // indicated − applied in that direction
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
    // TUR, guard band and decision use the expanded uncertainty as reported, rounded UP to two
    // significant digits (budget.expandedRounded). That value is never below the unrounded U,
    // so the guard band is never narrowed and the TUR never flattered by rounding, and a reader
    // can redo every decision from the printed numbers.
    double tur = 0.0;
    bool turBelowMinimum = false; // TUR < 4:1
    Outcome decision = Outcome::Pass;
    double probabilityOfFalseAccept = 0.0; // if the point were accepted: 1 − p_c
};

struct EvaluationResult {
    double fiducialValue = 0.0;
    double permissibleError = 0.0;
    std::vector<PointResult> points; // ascending applied value
    std::size_t worstPoint = 0;      // largest |error| / permissible error
    Outcome overall = Outcome::Pass;
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

// Throws std::invalid_argument naming the input (and the reading number, 1-based) at fault.
EvaluationResult evaluateRange(const EvaluationInput& input);

} // namespace mw
