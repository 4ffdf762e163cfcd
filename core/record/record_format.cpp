// Number formats of records and reports.
#include "core/record/record_format.h"

#include "core/uncertainty/distributions.h"
#include "core/units/decimal.h"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace mw::record {

std::string scaleValue(double value, const RangeSpec& range) {
    const double largest = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    if (!(largest > 0.0)) {
        return formatEngineering(value, 5, range.unit);
    }
    const int leading = ExactDecimal::fromDouble(largest).leadingExponent();
    // The prefix of the limit: a multiple of three at or below its leading digit.
    const int prefix = static_cast<int>(std::floor(leading / 3.0)) * 3;
    return formatAtExponent(value, leading - 4, range.unit, std::clamp(prefix, -12, 9));
}

std::string signedPercent(double percent, double classIndex) {
    const int classLeading =
        classIndex > 0.0 ? ExactDecimal::fromDouble(classIndex).leadingExponent() : 0;
    const std::string text = formatAtExponent(percent, classLeading - 2, Unit::Percent);
    const bool zero = text.find_first_not_of("0.") == text.find(' ');
    std::string signed_(text.front() == '-' || zero ? "" : "+");
    return signed_.append(text);
}

std::string quantity(double value, Unit unit) {
    return formatEngineering(value, 3, unit);
}

std::string coverageWords(double probability) {
    if (std::fabs(probability - kProbabilityTwoSigma) < 1e-12) {
        return "about 95.45 %";
    }
    char text[32];
    std::snprintf(text, sizeof text, "%.4g %%", probability * 100.0);
    return text;
}

std::string days(long count) {
    return std::to_string(count) + (count == 1 ? " day" : " days");
}

std::string safeFileStem(const std::string& text) {
    std::string stem = text;
    for (char& c : stem) {
        const bool plain = (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') ||
                           (c >= '0' && c <= '9') || c == '-' || c == '.' || c == '_';
        if (!plain) {
            c = '_';
        }
    }
    return stem;
}

} // namespace mw::record
