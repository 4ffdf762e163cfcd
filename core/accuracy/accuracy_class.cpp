// Class index series and fiducial values of IEC 60051 analog instruments.
#include "core/accuracy/accuracy_class.h"
#include "core/units/quantity.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

// IEC 60051-2 class indices for ammeters and voltmeters (from memory; see the reference notes).
constexpr std::array<double, 11> kClassIndices{0.05, 0.1, 0.2, 0.3, 0.5, 1.0,
                                               1.5,  2.0, 2.5, 3.0, 5.0};

} // namespace

std::span<const double> classIndexSeries() {
    return kClassIndices;
}

bool isStandardClassIndex(double classIndex) {
    for (double index : kClassIndices) {
        if (std::fabs(index - classIndex) <= 1e-9 * index) {
            return true;
        }
    }
    return false;
}

double fiducialValue(const ScaleRange& range) {
    return exactFiducialValue(range).toDouble();
}

ExactDecimal exactFiducialValue(const ScaleRange& range) {
    if (!std::isfinite(range.lower) || !std::isfinite(range.upper) ||
        !(range.upper > range.lower)) {
        throw std::invalid_argument("scale range: the upper limit must be greater than the lower");
    }
    if (range.fiducialOverride) {
        if (!(*range.fiducialOverride > 0.0) || !std::isfinite(*range.fiducialOverride)) {
            throw std::invalid_argument("scale range: the fiducial value must be > 0");
        }
        return ExactDecimal::fromDouble(*range.fiducialOverride);
    }
    const ExactDecimal lower = ExactDecimal::fromDouble(range.lower).abs();
    const ExactDecimal upper = ExactDecimal::fromDouble(range.upper).abs();
    switch (range.type) {
    case ScaleType::ZeroAtEnd:
        // The zero may sit at either end (e.g. -10 … 0 V): the limit farther from it.
        return std::max(lower, upper);
    case ScaleType::ZeroInside:
        if (!(range.lower < 0.0 && range.upper > 0.0)) {
            throw std::invalid_argument("scale range: a zero-inside scale needs a negative "
                                        "lower and a positive upper limit");
        }
        return lower + upper;
    case ScaleType::NoZero:
        return std::max(lower, upper);
    case ScaleType::NonLinear:
        throw std::invalid_argument("scale range: a non-linear scale needs its fiducial value "
                                    "(the scale length) given explicitly");
    }
    throw std::invalid_argument("scale range: unknown scale type");
}

namespace {

ExactDecimal percentOf(double classIndex, const ExactDecimal& fiducial) {
    if (!(classIndex > 0.0) || !std::isfinite(classIndex)) {
        throw std::invalid_argument("accuracy class: the class index must be > 0, got " +
                                    formatPlain(classIndex));
    }
    return (ExactDecimal::fromDouble(classIndex) * fiducial).timesPowerOfTen(-2);
}

} // namespace

double permissibleError(double classIndex, double fiducial) {
    if (!std::isfinite(fiducial)) {
        throw std::invalid_argument("accuracy class: the fiducial value must be finite");
    }
    return percentOf(classIndex, ExactDecimal::fromDouble(fiducial)).toDouble();
}

ExactDecimal exactPermissibleError(double classIndex, const ScaleRange& range) {
    return percentOf(classIndex, exactFiducialValue(range));
}

} // namespace mw
