// Zero + span fit of as-found errors and the classification of the likely cause.
#include "core/advice/advice.h"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <stdexcept>
#include <string>
#include <vector>

namespace mw {
namespace {

double meanError(const PointErrors& point, std::size_t index, Unit unit) {
    if (point.errorUp && point.errorDown) {
        return 0.5 * (*point.errorUp + *point.errorDown);
    }
    if (point.errorUp) {
        return *point.errorUp;
    }
    if (point.errorDown) {
        return *point.errorDown;
    }
    throw std::invalid_argument("advice: point " + std::to_string(index + 1) + " (applied " +
                                formatEngineering(point.applied, 4, unit) + ") has no reading");
}

double correlation(const std::vector<double>& a, const std::vector<double>& b) {
    const auto n = static_cast<double>(a.size());
    const double meanA = std::accumulate(a.begin(), a.end(), 0.0) / n;
    const double meanB = std::accumulate(b.begin(), b.end(), 0.0) / n;
    double sab = 0.0, saa = 0.0, sbb = 0.0;
    for (std::size_t i = 0; i < a.size(); ++i) {
        sab += (a[i] - meanA) * (b[i] - meanB);
        saa += (a[i] - meanA) * (a[i] - meanA);
        sbb += (b[i] - meanB) * (b[i] - meanB);
    }
    return saa > 0.0 && sbb > 0.0 ? sab / std::sqrt(saa * sbb) : 0.0;
}

// A rectifier's diode drop makes the meter read low at the bottom of the scale: the largest
// residual sits at the lowest point and is negative. With a predicted curve, the residual
// pattern must follow the curve's own non-linear part.
bool looksLikeRectifier(const AdviceInput& input, const ZeroSpanFit& fit) {
    if (input.kind != InstrumentKind::HalfWaveAcVoltmeter &&
        input.kind != InstrumentKind::BridgeAcVoltmeter) {
        return false;
    }
    if (input.predictedErrors && input.predictedErrors->size() == input.points.size()) {
        std::vector<PointErrors> predicted = input.points;
        for (std::size_t i = 0; i < predicted.size(); ++i) {
            predicted[i].errorUp = (*input.predictedErrors)[i];
            predicted[i].errorDown.reset();
        }
        return correlation(fitZeroSpan(predicted, input.unit).residuals, fit.residuals) > 0.7;
    }
    std::size_t lowest = 0;
    std::size_t largest = 0;
    for (std::size_t i = 0; i < input.points.size(); ++i) {
        lowest = input.points[i].applied < input.points[lowest].applied ? i : lowest;
        largest = std::fabs(fit.residuals[i]) > std::fabs(fit.residuals[largest]) ? i : largest;
    }
    return lowest == largest && fit.residuals[lowest] < 0.0;
}

} // namespace

ZeroSpanFit fitZeroSpan(const std::vector<PointErrors>& points, Unit unit) {
    std::vector<double> x, y;
    for (std::size_t i = 0; i < points.size(); ++i) {
        x.push_back(points[i].applied);
        y.push_back(meanError(points[i], i, unit));
    }
    const auto n = static_cast<double>(x.size());
    const double meanX = std::accumulate(x.begin(), x.end(), 0.0) / std::max(n, 1.0);
    const double meanY = std::accumulate(y.begin(), y.end(), 0.0) / std::max(n, 1.0);
    double sxx = 0.0, sxy = 0.0;
    for (std::size_t i = 0; i < x.size(); ++i) {
        sxx += (x[i] - meanX) * (x[i] - meanX);
        sxy += (x[i] - meanX) * (y[i] - meanY);
    }
    if (x.size() < 2 || !(sxx > 0.0)) {
        throw std::invalid_argument("advice: a zero and span fit needs at least two different "
                                    "applied values");
    }
    ZeroSpanFit fit;
    const double slope = sxy / sxx; // error grows by (span − 1) per unit applied
    fit.spanFactor = 1.0 + slope;
    fit.zeroOffset = meanY - slope * meanX;
    for (std::size_t i = 0; i < x.size(); ++i) {
        fit.residuals.push_back(y[i] - (fit.zeroOffset + slope * x[i]));
        fit.nonlinearity = std::max(fit.nonlinearity, std::fabs(fit.residuals.back()));
    }
    return fit;
}

double maxHysteresis(const std::vector<PointErrors>& points) {
    double largest = 0.0;
    for (const PointErrors& point : points) {
        if (point.errorUp && point.errorDown) {
            largest = std::max(largest, std::fabs(*point.errorDown - *point.errorUp));
        }
    }
    return largest;
}

std::string_view toText(LikelyCause cause) {
    switch (cause) {
    case LikelyCause::None:
        return "none";
    case LikelyCause::Zero:
        return "zero";
    case LikelyCause::Span:
        return "span";
    case LikelyCause::RectifierNonlinearity:
        return "rectifier-nonlinearity";
    case LikelyCause::ScaleNonlinearity:
        return "scale-nonlinearity";
    case LikelyCause::Friction:
        return "friction";
    }
    return "?";
}

std::string_view effectName(LikelyCause cause) {
    switch (cause) {
    case LikelyCause::None:
        return "no effect";
    case LikelyCause::Zero:
        return "zero offset";
    case LikelyCause::Span:
        return "span error";
    case LikelyCause::RectifierNonlinearity:
        return "low-end non-linearity of the rectifier";
    case LikelyCause::ScaleNonlinearity:
        return "non-linearity across the scale";
    case LikelyCause::Friction:
        return "hysteresis";
    }
    return "?";
}

std::string describeCause(LikelyCause cause, InstrumentKind kind) {
    const bool ammeter = kind == InstrumentKind::DcAmmeter;
    switch (cause) {
    case LikelyCause::None:
        return "no single effect (zero, span, non-linearity, hysteresis) reaches a quarter of "
               "the permissible error and stands out from the measurement uncertainty";
    case LikelyCause::Zero:
        return "zero offset: every reading is shifted by the same amount; set the mechanical "
               "zero with the zero adjuster (meter in its reference position, no signal)";
    case LikelyCause::Span:
        return std::string("span error: the error grows in proportion to the reading; the ") +
               (ammeter ? "shunt" : "multiplier") +
               " resistance has drifted or the movement's sensitivity (magnet strength, "
               "hairspring) has changed; trim the " +
               (ammeter ? "shunt" : "multiplier") + " to bring full scale back";
    case LikelyCause::RectifierNonlinearity:
        return "non-linearity at the low end of the scale, the pattern of the rectifier diode's "
               "forward drop; check the rectifier (a tired diode reads low on small signals) "
               "rather than trimming the span";
    case LikelyCause::ScaleNonlinearity:
        return "non-linearity across the scale that zero and span cannot remove: the scale "
               "markings or the movement (pole pieces, hairspring, coil rubbing) are not "
               "uniform; the movement needs repair";
    case LikelyCause::Friction:
        return "hysteresis between up-scale and down-scale readings: friction in the pivots "
               "and jewels, or the pointer touching the dial or glass; clean or replace the "
               "pivots and jewels";
    }
    return {};
}

namespace {

std::string percentOfLimit(double fraction) {
    return formatEngineering(100.0 * fraction, 3, Unit::Percent) + " of the limit of error";
}

double worstFraction(const AdviceInput& input) {
    double worst = 0.0;
    for (const PointErrors& point : input.points) {
        for (const auto& error : {point.errorUp, point.errorDown}) {
            if (error) {
                worst = std::max(worst, std::fabs(*error) / input.permissibleError);
            }
        }
    }
    return worst;
}

std::vector<AdviceEffect> rankedEffects(const AdviceInput& input, const Advice& advice) {
    const LikelyCause nonlinear = looksLikeRectifier(input, advice.fit)
                                      ? LikelyCause::RectifierNonlinearity
                                      : LikelyCause::ScaleNonlinearity;
    std::vector<AdviceEffect> effects{
        {LikelyCause::Zero, advice.zeroEffect, 0.0, false},
        {LikelyCause::Span, advice.spanEffect, 0.0, false},
        {nonlinear, advice.fit.nonlinearity, 0.0, false},
        {LikelyCause::Friction, 0.5 * advice.hysteresis, 0.0, false},
    };
    for (AdviceEffect& effect : effects) {
        effect.fractionOfLimit = effect.size / input.permissibleError;
        effect.significant = effect.fractionOfLimit >= kSignificantFractionOfLimit &&
                             effect.size > input.expandedUncertainty;
    }
    const auto curved = [](const AdviceEffect& e) {
        return e.significant && (e.cause == LikelyCause::RectifierNonlinearity ||
                                 e.cause == LikelyCause::ScaleNonlinearity);
    };
    std::stable_sort(effects.begin(), effects.end(), [&curved](const auto& a, const auto& b) {
        if (curved(a) != curved(b)) {
            return curved(a);
        }
        return a.size > b.size;
    });
    return effects;
}

std::string effectInWords(const AdviceEffect& effect, const AdviceInput& input) {
    return describeCause(effect.cause, input.kind) + " (up to " +
           formatEngineering(effect.size, 3, input.unit) + ", " +
           percentOfLimit(effect.fractionOfLimit) + ")";
}

std::string explain(const AdviceInput& input, const Advice& advice) {
    const std::string worst =
        "the largest error is " + percentOfLimit(advice.worstErrorFractionOfLimit);
    std::vector<const AdviceEffect*> significant;
    for (const AdviceEffect& effect : advice.effects) {
        if (effect.significant) {
            significant.push_back(&effect);
        }
    }
    if (!advice.adjustmentNeeded) {
        std::string text = "no adjustment needed: " + worst + " (adjustment is advised above " +
                           formatPlain(100.0 * input.adjustAboveFractionOfLimit) + " %)";
        if (!significant.empty()) {
            text += "; to gain margin, the largest effect is the " +
                    effectInWords(*significant.front(), input);
        }
        return text;
    }
    if (significant.empty()) {
        return "adjustment advised, as " + worst + ", but " +
               describeCause(LikelyCause::None, input.kind) +
               "; repeat the readings or read the scale more finely before adjusting";
    }
    std::string text =
        "adjustment advised, as " + worst + ": " + effectInWords(*significant.front(), input);
    for (std::size_t i = 1; i < significant.size(); ++i) {
        text += "; also " + effectInWords(*significant[i], input);
    }
    return text;
}

} // namespace

Advice adviseAdjustment(const AdviceInput& input) {
    if (!(input.permissibleError > 0.0)) {
        throw std::invalid_argument("advice: the permissible error must be > 0");
    }
    Advice advice;
    advice.fit = fitZeroSpan(input.points, input.unit);
    advice.hysteresis = maxHysteresis(input.points);
    advice.zeroEffect = std::fabs(advice.fit.zeroOffset);
    advice.spanEffect = std::fabs(advice.fit.spanFactor - 1.0) * std::fabs(input.upperLimit);
    advice.effects = rankedEffects(input, advice);
    advice.worstErrorFractionOfLimit = worstFraction(input);
    advice.adjustmentNeeded = advice.worstErrorFractionOfLimit > input.adjustAboveFractionOfLimit;
    for (const AdviceEffect& effect : advice.effects) {
        if (!effect.significant) {
            continue;
        }
        if (advice.cause == LikelyCause::None) {
            advice.cause = effect.cause;
        } else {
            advice.alsoSignificant.push_back(effect.cause);
        }
    }
    advice.explanation = explain(input, advice);
    return advice;
}

} // namespace mw
