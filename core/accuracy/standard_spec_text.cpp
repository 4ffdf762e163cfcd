// Range specifications of reference standards as text.
#include "core/accuracy/standard_spec_text.h"

#include "core/accuracy/reference_spec.h"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace mw {
namespace {

// The spec of `text` without a trailing floor; `floor` gets the floor when there is one.
ReferenceSpec parseWithFloor(std::string_view text, Unit unit, const ParseOptions& options,
                             double& floor) {
    floor = 0.0;
    try {
        return parseReferenceSpec(text, unit, options);
    } catch (const std::invalid_argument& whole) {
        const auto plus = text.rfind('+');
        if (plus == std::string_view::npos || plus == 0) {
            throw;
        }
        double value = 0.0;
        try {
            value = parseValue(text.substr(plus + 1), unit, options);
        } catch (const std::exception&) {
            throw whole; // the last term is not a floor either: the first reason stands
        }
        const ReferenceSpec limits = parseReferenceSpec(text.substr(0, plus), unit, options);
        if (limits.form == ReferenceSpecForm::Certificate ||
            limits.form == ReferenceSpecForm::Fixed) {
            throw std::invalid_argument("\"" + std::string(text) +
                                        "\": a floor is added only to limits in % or ppm");
        }
        if (!(value >= 0.0)) {
            throw std::invalid_argument("\"" + std::string(text) +
                                        "\": the floor cannot be negative");
        }
        floor = value;
        return limits;
    }
}

} // namespace

void setSpecFromText(StandardRangeSpec& spec, std::string_view text, const ParseOptions& options) {
    double floor = 0.0;
    const ReferenceSpec parsed = parseWithFloor(text, spec.unit, options, floor);
    StandardRangeSpec updated = spec;
    updated.percent_of_reading = 0.0;
    updated.percent_of_range = 0.0;
    updated.floor = floor;
    updated.certificate_expanded_uncertainty.reset();
    updated.coverage_factor = 2.0;
    updated.degrees_of_freedom.reset();
    switch (parsed.form) {
    case ReferenceSpecForm::PercentReadingRange:
    case ReferenceSpecForm::PpmReadingRange:
        updated.percent_of_reading = parsed.fractionOfReading * 100.0;
        updated.percent_of_range = parsed.fractionOfRange * 100.0;
        break;
    case ReferenceSpecForm::Fixed:
        updated.floor = parsed.fixedValue;
        break;
    case ReferenceSpecForm::Certificate:
        updated.certificate_expanded_uncertainty = parsed.fixedValue;
        updated.coverage_factor = parsed.coverageK;
        break;
    }
    if (std::isfinite(parsed.dof)) {
        updated.degrees_of_freedom = parsed.dof;
    }
    spec = updated;
}

std::string specText(const StandardRangeSpec& spec) {
    ReferenceSpec form;
    if (spec.certificate_expanded_uncertainty) {
        form.form = ReferenceSpecForm::Certificate;
        form.fixedValue = *spec.certificate_expanded_uncertainty;
        form.coverageK = spec.coverage_factor;
    } else if (spec.percent_of_reading == 0.0 && spec.percent_of_range == 0.0) {
        form.form = ReferenceSpecForm::Fixed;
        form.fixedValue = spec.floor;
    } else {
        form.fractionOfReading = spec.percent_of_reading / 100.0;
        form.fractionOfRange = spec.percent_of_range / 100.0;
    }
    if (spec.degrees_of_freedom) {
        form.dof = *spec.degrees_of_freedom;
    }
    std::string text = formatReferenceSpec(form);
    if (form.form == ReferenceSpecForm::PercentReadingRange && spec.floor > 0.0) {
        // The floor goes after the percentages, before any ",dof=…".
        const auto comma = std::min(text.find(','), text.size());
        const std::string floor = formatEngineering(spec.floor, 6, spec.unit);
        std::string joined = text.substr(0, comma);
        joined += '+';
        joined += floor;
        joined += text.substr(comma);
        text = joined;
    }
    return text;
}

} // namespace mw
