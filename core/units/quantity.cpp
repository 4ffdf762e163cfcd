// PLACEHOLDER parser: plain numbers only. Replaced by the full quantity parser.
#include "core/units/quantity.h"

#include <cstdlib>
#include <string>

namespace mw {

QuantityError::QuantityError(const std::string& message, std::size_t position)
    : std::runtime_error(message)
    , position_(position) {}

Quantity parseQuantity(std::string_view text, const ParseOptions&) {
    std::string copy(text);
    char* end = nullptr;
    const double value = std::strtod(copy.c_str(), &end);
    if (end == copy.c_str()) {
        throw QuantityError("not a number", 0);
    }
    return {value, Unit::Dimensionless};
}

double parseValue(std::string_view text, Unit, const ParseOptions& options) {
    return parseQuantity(text, options).value;
}

std::string formatEngineering(double value, int, Unit) {
    return std::to_string(value);
}

std::string_view unitSymbol(Unit) {
    return "";
}

} // namespace mw
