// Adjustment advice from as-found errors: least-squares zero + span fit, residual
// non-linearity, hysteresis, the likely cause in plain words, and the multiplier or shunt value
// that would null a span error.
#pragma once

#include "core/model/vocabulary.h"
#include "core/units/quantity.h"

#include <optional>
#include <string>
#include <vector>

namespace mw {

// Errors of indication at one test point (indicated − applied), by direction where known.
struct PointErrors {
    double applied = 0.0;
    std::optional<double> errorUp;
    std::optional<double> errorDown;
};

// indicated = zeroOffset + spanFactor · applied, fitted by least squares to the mean error of
// each point (the mean of up and down, so that hysteresis does not bend the fit).
struct ZeroSpanFit {
    double zeroOffset = 0.0;       // error at zero applied, in the unit of the range
    double spanFactor = 1.0;       // 1 for a correct span; 1.01 reads 1 % high
    std::vector<double> residuals; // mean error − fitted error, per point
    double nonlinearity = 0.0;     // largest |residual|
};

// Throws std::invalid_argument with fewer than two distinct applied values, or naming the point
// (number and applied value in `unit`) that has no reading.
ZeroSpanFit fitZeroSpan(const std::vector<PointErrors>& points, Unit unit = Unit::Volt);

// Largest |down − up| over the points that have both directions (0 when none has).
double maxHysteresis(const std::vector<PointErrors>& points);

enum class LikelyCause {
    None,                  // nothing above a fifth of the permissible error
    Zero,                  // mechanical zero
    Span,                  // multiplier / shunt value or movement sensitivity
    RectifierNonlinearity, // diode forward drop at the low end of a rectifier scale
    ScaleNonlinearity,     // scale or movement not uniform
    Friction,              // hysteresis: pivots, jewels, pointer fouling
};

std::string_view toText(LikelyCause cause); // stable word: "none", "zero", "span", ...

// Effects at or above this fraction of the permissible error may be called significant.
inline constexpr double kSignificantFractionOfLimit = 0.25;
// Adjustment is advised when the largest error exceeds this fraction of the limit (our own
// default, after the 80 % that ILAC-G24 uses as an example fraction of the tolerance in its
// staircase method, from memory); below it a meter that passes is left alone.
inline constexpr double kAdjustAboveFractionOfLimit = 0.8;

struct AdviceInput {
    InstrumentKind kind = InstrumentKind::DcVoltmeter;
    Unit unit = Unit::Volt;        // of the applied values and errors, for messages
    double upperLimit = 0.0;       // of the range, to size the span effect at full scale
    double permissibleError = 0.0; // ± limit at every point, for judging what is significant
    // Expanded uncertainty of the readings: an effect no larger than this cannot be told from
    // the scatter and reading resolution of the measurement, so it is never called significant.
    double expandedUncertainty = 0.0;
    double adjustAboveFractionOfLimit = kAdjustAboveFractionOfLimit;
    std::vector<PointErrors> points;
    // Error the circuit model predicts for this meter at each point (same order), e.g. the
    // diode-drop curve of a rectifier instrument; used to recognise that shape.
    std::optional<std::vector<double>> predictedErrors;
};

// One effect and how much of an error of indication it accounts for at most.
struct AdviceEffect {
    LikelyCause cause = LikelyCause::None;
    double size = 0.0;            // in the unit of the range
    double fractionOfLimit = 0.0; // size / permissible error
    // At least kSignificantFractionOfLimit of the limit and larger than the expanded
    // uncertainty of the readings.
    bool significant = false;
};

struct Advice {
    ZeroSpanFit fit;
    double hysteresis = 0.0; // largest |down − up|
    double zeroEffect = 0.0; // |zero offset|
    double spanEffect = 0.0; // |span factor − 1| · upper limit
    // Zero, span, non-linearity and hysteresis, largest first (a significant non-linearity
    // first of all: zero and span cannot remove it, and a curve always leaks into the fitted
    // zero and span). Hysteresis counts with half its width: the worse direction lies that far
    // beyond the mean the fit follows.
    std::vector<AdviceEffect> effects;
    double worstErrorFractionOfLimit = 0.0;   // largest |error| / permissible error
    bool adjustmentNeeded = false;            // worst error above adjustAboveFractionOfLimit
    LikelyCause cause = LikelyCause::None;    // the largest significant effect
    std::vector<LikelyCause> alsoSignificant; // the other significant effects, in rank order
    std::string explanation;                  // plain words for the technician
};

Advice adviseAdjustment(const AdviceInput& input);

// Short name of an effect: "zero offset", "span error", ...
std::string_view effectName(LikelyCause cause);

// Plain-words explanation of one cause.
std::string describeCause(LikelyCause cause, InstrumentKind kind);

} // namespace mw
