// Reference-standard specifications: values at a reading and the compact text form.
#include "core/accuracy/reference_spec.h"

#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <vector>

namespace mw {
namespace {

// The text as typed and, for each byte of its compact form (no spaces, no leading ±), the byte
// it came from, so that errors point into what the technician typed.
struct Source {
    std::string_view original;
    std::string compact;
    std::vector<std::size_t> origin;
};

Source compactForm(std::string_view text) {
    Source source{text, {}, {}};
    for (std::size_t i = 0; i < text.size(); ++i) {
        if (!std::isspace(static_cast<unsigned char>(text[i]))) {
            source.compact += text[i];
            source.origin.push_back(i);
        }
    }
    // A leading "±" (UTF-8) or "+-" only says the spec is symmetric.
    for (std::string_view sign : {"\xC2\xB1", "+-"}) {
        if (source.compact.rfind(sign, 0) == 0) {
            source.compact.erase(0, sign.size());
            source.origin.erase(source.origin.begin(),
                                source.origin.begin() + static_cast<std::ptrdiff_t>(sign.size()));
        }
    }
    return source;
}

[[noreturn]] void fail(const Source& source, std::size_t position, const std::string& reason) {
    const std::size_t byte =
        position < source.origin.size() ? source.origin[position] : source.original.size();
    std::size_t character = 0; // counts UTF-8 lead bytes, so "±" is one character
    for (std::size_t i = 0; i < byte; ++i) {
        character += (static_cast<unsigned char>(source.original[i]) & 0xC0) != 0x80 ? 1 : 0;
    }
    throw std::invalid_argument("reference spec \"" + std::string(source.original) +
                                "\" at character " + std::to_string(character + 1) + ": " + reason);
}

struct Term {
    double number = 0.0;
    std::string suffix; // "%rdg", "%rng", "ppm", "ppmrdg", "ppmrng"
};

Term parseTerm(const Source& whole, std::string_view term, std::size_t offset) {
    Term result;
    const auto [end, error] =
        std::from_chars(term.data(), term.data() + term.size(), result.number);
    if (error != std::errc() || end == term.data()) {
        fail(whole, offset, "expected a number");
    }
    if (!(result.number >= 0.0) || !std::isfinite(result.number)) {
        fail(whole, offset, "the number must be >= 0");
    }
    for (const char* c = end; c != term.data() + term.size(); ++c) {
        result.suffix += static_cast<char>(std::tolower(static_cast<unsigned char>(*c)));
    }
    return result;
}

ReferenceSpec parseLimits(const Source& whole, const std::string& text) {
    ReferenceSpec spec;
    spec.form = text.find("ppm") != std::string::npos ? ReferenceSpecForm::PpmReadingRange
                                                      : ReferenceSpecForm::PercentReadingRange;
    std::size_t start = 0;
    int index = 0;
    while (start <= text.size()) {
        const std::size_t plus = text.find('+', start);
        const std::size_t stop = plus == std::string::npos ? text.size() : plus;
        const Term term =
            parseTerm(whole, std::string_view(text).substr(start, stop - start), start);
        const bool ppm = term.suffix.rfind("ppm", 0) == 0;
        const double scale = ppm ? 1e-6 : 1e-2;
        std::string kind = term.suffix.substr(ppm ? 3 : 1);
        if (!ppm && term.suffix.rfind('%', 0) != 0) {
            fail(whole, start, "expected %rdg, %rng, ppm, ppmrdg or ppmrng after the number");
        }
        if (kind.empty() && ppm) {
            kind = index == 0 ? "rdg" : "rng"; // "20ppm+5ppm": reading first, then range
        }
        if (kind == "rdg" || kind == "reading") {
            spec.fractionOfReading += term.number * scale;
        } else if (kind == "rng" || kind == "range" || kind == "fs") {
            spec.fractionOfRange += term.number * scale;
        } else {
            fail(whole, start, "unknown term \"" + term.suffix + "\" (use rdg or rng)");
        }
        if (plus == std::string::npos) {
            break;
        }
        start = plus + 1;
        ++index;
    }
    return spec;
}

double parseAmount(const Source& whole, std::string_view text, std::size_t offset, Unit unit,
                   const ParseOptions& options) {
    try {
        const double value = parseValue(text, unit, options);
        if (!(value >= 0.0) || !std::isfinite(value)) {
            fail(whole, offset, "the value must be >= 0");
        }
        return value;
    } catch (const QuantityError& error) {
        fail(whole, offset + error.position(), error.what());
    }
}

ReferenceSpec parseCertificate(const Source& whole, const std::string& text, Unit unit,
                               const ParseOptions& options) {
    // "U=1mV,k=2"; the comma is required because "1mVk" would be ambiguous.
    const std::size_t comma = text.find(',');
    const bool hasK = comma != std::string::npos && (text.compare(comma + 1, 2, "k=") == 0 ||
                                                     text.compare(comma + 1, 2, "K=") == 0);
    if (!hasK) {
        fail(whole, text.size(), "a certificate value needs its coverage factor: U=1mV,k=2");
    }
    ReferenceSpec spec;
    spec.form = ReferenceSpecForm::Certificate;
    spec.fixedValue =
        parseAmount(whole, std::string_view(text).substr(2, comma - 2), 2, unit, options);
    const std::string kText = text.substr(comma + 3);
    const auto [end, error] =
        std::from_chars(kText.data(), kText.data() + kText.size(), spec.coverageK);
    if (error != std::errc() || end != kText.data() + kText.size() || !(spec.coverageK > 0.0)) {
        fail(whole, comma + 3, "the coverage factor k must be a number > 0");
    }
    return spec;
}

// Splits a trailing ",dof=N" off `compact` and returns N (infinity without one).
double takeDegreesOfFreedom(const Source& whole, std::string& compact) {
    std::string lower;
    for (const char c : compact) {
        lower += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    }
    const std::size_t at = lower.rfind(",dof=");
    if (at == std::string::npos) {
        return kInfiniteDof;
    }
    const std::string number = lower.substr(at + 5);
    double dof = 0.0;
    if (number == "inf" || number == "infinity") {
        dof = kInfiniteDof;
    } else {
        const auto [end, error] =
            std::from_chars(number.data(), number.data() + number.size(), dof);
        if (error != std::errc() || end != number.data() + number.size() || !(dof > 0.0) ||
            !std::isfinite(dof)) {
            fail(whole, at + 5, "the degrees of freedom must be a number > 0 or inf");
        }
    }
    compact.erase(at);
    return dof;
}

} // namespace

double specValue(const ReferenceSpec& spec, double reading, double rangeValue) {
    switch (spec.form) {
    case ReferenceSpecForm::Fixed:
    case ReferenceSpecForm::Certificate:
        return spec.fixedValue;
    case ReferenceSpecForm::PercentReadingRange:
    case ReferenceSpecForm::PpmReadingRange:
        return spec.fractionOfReading * std::fabs(reading) +
               spec.fractionOfRange * std::fabs(rangeValue);
    }
    return 0.0;
}

UncertaintyComponent referenceComponent(const ReferenceSpec& spec, double reading,
                                        double rangeValue) {
    UncertaintyComponent component;
    component.name = "reference standard";
    component.value = specValue(spec, reading, rangeValue);
    component.dof = spec.dof;
    if (spec.form == ReferenceSpecForm::Certificate) {
        component.distribution = Distribution::Normal;
        component.coverageK = spec.coverageK;
    } else {
        component.distribution = Distribution::Rectangular;
    }
    return component;
}

ReferenceSpec parseReferenceSpec(std::string_view text, Unit unit, const ParseOptions& options) {
    const Source source = compactForm(text);
    std::string compact = source.compact;
    if (compact.empty()) {
        fail(source, 0, "empty; expected e.g. 0.02%rdg+0.01%rng, 20ppm+5ppm, 0.5mV or U=1mV,k=2");
    }
    const double dof = takeDegreesOfFreedom(source, compact);
    ReferenceSpec spec;
    if (compact.rfind("U=", 0) == 0 || compact.rfind("u=", 0) == 0) {
        spec = parseCertificate(source, compact, unit, options);
    } else if (compact.find('%') != std::string::npos || compact.find("ppm") != std::string::npos) {
        spec = parseLimits(source, compact);
    } else {
        spec.form = ReferenceSpecForm::Fixed;
        spec.fixedValue = parseAmount(source, compact, 0, unit, options);
    }
    spec.dof = dof;
    return spec;
}

std::string formatReferenceSpec(const ReferenceSpec& spec) {
    char buffer[128];
    switch (spec.form) {
    case ReferenceSpecForm::PercentReadingRange:
        std::snprintf(buffer, sizeof buffer, "%.12g%%rdg+%.12g%%rng", spec.fractionOfReading * 1e2,
                      spec.fractionOfRange * 1e2);
        break;
    case ReferenceSpecForm::PpmReadingRange:
        std::snprintf(buffer, sizeof buffer, "%.12gppm+%.12gppm", spec.fractionOfReading * 1e6,
                      spec.fractionOfRange * 1e6);
        break;
    case ReferenceSpecForm::Fixed:
        std::snprintf(buffer, sizeof buffer, "%.17g", spec.fixedValue);
        break;
    case ReferenceSpecForm::Certificate:
        std::snprintf(buffer, sizeof buffer, "U=%.17g,k=%.12g", spec.fixedValue, spec.coverageK);
        break;
    }
    std::string text = buffer;
    if (std::isfinite(spec.dof)) {
        std::snprintf(buffer, sizeof buffer, ",dof=%.12g", spec.dof);
        text += buffer;
    }
    return text;
}

std::string describeReferenceSpec(const ReferenceSpec& spec, Unit unit) {
    const auto plain = [](double value) {
        char buffer[32];
        std::snprintf(buffer, sizeof buffer, "%.6g", value);
        return std::string(buffer);
    };
    std::string text;
    switch (spec.form) {
    case ReferenceSpecForm::PercentReadingRange:
        text = "\u00B1(" + plain(spec.fractionOfReading * 1e2) + " % of reading + " +
               plain(spec.fractionOfRange * 1e2) + " % of range)";
        break;
    case ReferenceSpecForm::PpmReadingRange:
        text = "\u00B1(" + plain(spec.fractionOfReading * 1e6) + " ppm of reading + " +
               plain(spec.fractionOfRange * 1e6) + " ppm of range)";
        break;
    case ReferenceSpecForm::Fixed:
        text = "\u00B1" + formatEngineering(spec.fixedValue, 3, unit);
        break;
    case ReferenceSpecForm::Certificate:
        text = "U = " + formatEngineering(spec.fixedValue, 3, unit) +
               " (k = " + plain(spec.coverageK) +
               (std::isfinite(spec.dof) ? ", \u03BD = " + plain(spec.dof) : std::string()) + ")";
        return text;
    }
    if (std::isfinite(spec.dof)) {
        text += " with \u03BD = " + plain(spec.dof);
    }
    return text;
}

} // namespace mw
