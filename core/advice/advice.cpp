// Zero + span fit of as-found errors and the classification of the likely cause.
#include "core/advice/advice.h"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <stdexcept>

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

std::string describeCause(LikelyCause cause, InstrumentKind kind) {
    const bool ammeter = kind == InstrumentKind::DcAmmeter;
    switch (cause) {
    case LikelyCause::None:
        return "no adjustment indicated: zero, span, non-linearity and hysteresis are each below "
               "a fifth of the permissible error";
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

Advice adviseAdjustment(const AdviceInput& input) {
    if (!(input.permissibleError > 0.0)) {
        throw std::invalid_argument("advice: the permissible error must be > 0");
    }
    Advice advice;
    advice.fit = fitZeroSpan(input.points, input.unit);
    advice.hysteresis = maxHysteresis(input.points);
    advice.zeroEffect = std::fabs(advice.fit.zeroOffset);
    advice.spanEffect = std::fabs(advice.fit.spanFactor - 1.0) * std::fabs(input.upperLimit);
    const LikelyCause nonlinear = looksLikeRectifier(input, advice.fit)
                                      ? LikelyCause::RectifierNonlinearity
                                      : LikelyCause::ScaleNonlinearity;
    std::vector<std::pair<double, LikelyCause>> effects{
        {advice.zeroEffect, LikelyCause::Zero},
        {advice.spanEffect, LikelyCause::Span},
        {advice.fit.nonlinearity, nonlinear},
        {advice.hysteresis, LikelyCause::Friction},
    };
    const double threshold = kSignificantFractionOfLimit * input.permissibleError;
    // A significant non-linearity comes first: zero and span cannot remove it, and part of a
    // curved error always shows up in the fitted zero and span as well.
    std::stable_sort(effects.begin(), effects.end(), [threshold](const auto& a, const auto& b) {
        const bool curvedA = a.second == LikelyCause::RectifierNonlinearity ||
                             a.second == LikelyCause::ScaleNonlinearity;
        const bool curvedB = b.second == LikelyCause::RectifierNonlinearity ||
                             b.second == LikelyCause::ScaleNonlinearity;
        if (curvedA != curvedB && (curvedA ? a.first : b.first) >= threshold) {
            return curvedA;
        }
        return a.first > b.first;
    });
    for (const auto& [size, cause] : effects) {
        if (size < threshold) {
            continue;
        }
        if (advice.cause == LikelyCause::None) {
            advice.cause = cause;
        } else {
            advice.alsoSignificant.push_back(cause);
        }
    }
    advice.explanation = describeCause(advice.cause, input.kind);
    for (LikelyCause other : advice.alsoSignificant) {
        advice.explanation += "; also " + describeCause(other, input.kind);
    }
    return advice;
}

} // namespace mw
