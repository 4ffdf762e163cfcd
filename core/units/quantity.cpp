// The quantity parser: number, optional IEC 60062 letter code, SI prefix and unit, with errors
// that say what was wrong, at which character, and why.
#include "core/units/quantity.h"

#include "core/units/unit_spelling.h"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <optional>
#include <string>
#include <system_error>

namespace mw {

QuantityError::QuantityError(const std::string& message, std::size_t position)
    : std::runtime_error(message)
    , position_(position) {}

namespace {

bool isDigit(char32_t c) {
    return c >= U'0' && c <= U'9';
}

bool isSpace(char32_t c) {
    return c == U' ' || c == U'\t' || c == U'\u00A0' || c == U'\u2009' || c == U'\u202F';
}

// Built by appending: GCC 12 at -O3 reports a false -Wrestrict on "\"" + s + "\"".
std::string quoted(const std::string& text) {
    std::string out;
    out.reserve(text.size() + 2);
    out.append(1, '"').append(text).append(1, '"');
    return out;
}

std::string toUtf8(std::u32string_view text) {
    std::string out;
    for (char32_t c : text) {
        if (c < 0x80) {
            out += static_cast<char>(c);
        } else if (c < 0x800) {
            out += static_cast<char>(0xC0 | (c >> 6));
            out += static_cast<char>(0x80 | (c & 0x3F));
        } else if (c < 0x10000) {
            out += static_cast<char>(0xE0 | (c >> 12));
            out += static_cast<char>(0x80 | ((c >> 6) & 0x3F));
            out += static_cast<char>(0x80 | (c & 0x3F));
        } else {
            out += static_cast<char>(0xF0 | (c >> 18));
            out += static_cast<char>(0x80 | ((c >> 12) & 0x3F));
            out += static_cast<char>(0x80 | ((c >> 6) & 0x3F));
            out += static_cast<char>(0x80 | (c & 0x3F));
        }
    }
    return out;
}

// Decodes UTF-8 so that error positions count characters the way a person sees them.
std::u32string decodeUtf8(std::string_view text) {
    std::u32string out;
    std::size_t i = 0;
    while (i < text.size()) {
        const auto lead = static_cast<unsigned char>(text[i]);
        const int extra = lead < 0x80           ? 0
                          : (lead >> 5) == 0x06 ? 1
                          : (lead >> 4) == 0x0E ? 2
                          : (lead >> 3) == 0x1E ? 3
                                                : -1;
        if (extra < 0 || i + static_cast<std::size_t>(extra) >= text.size()) {
            throw QuantityError("invalid UTF-8 byte at character " +
                                    std::to_string(out.size() + 1) +
                                    ": the text is not readable as characters",
                                out.size());
        }
        char32_t c = extra == 0 ? lead : (lead & (0x3F >> extra));
        for (int k = 1; k <= extra; ++k) {
            const auto next = static_cast<unsigned char>(text[i + static_cast<std::size_t>(k)]);
            if ((next >> 6) != 2) {
                throw QuantityError("invalid UTF-8 byte at character " +
                                        std::to_string(out.size() + 1) +
                                        ": the text is not readable as characters",
                                    out.size());
            }
            c = (c << 6) | (next & 0x3F);
        }
        out += c;
        i += static_cast<std::size_t>(extra) + 1;
    }
    return out;
}

struct Parsed {
    Quantity quantity;
    std::size_t unitPosition = 0; // where the unit (or the end of the number) starts
    bool hasUnit = false;
};

class Parser {
public:
    Parser(std::string_view original, const ParseOptions& options)
        : original_(original)
        , text_(decodeUtf8(original))
        , decimal_(options.decimalComma ? U',' : U'.')
        , otherSeparator_(options.decimalComma ? U'.' : U',')
        , bareNumberPowerOfTen_(options.bareNumberPowerOfTen) {}

    Parsed run();

private:
    [[noreturn]] void fail(std::size_t at, const std::string& what, const std::string& why) const {
        throw QuantityError(what + " at character " + std::to_string(at + 1) + " of \"" +
                                std::string(original_) + "\": " + why,
                            at);
    }
    char32_t at(std::size_t i) const { return i < text_.size() ? text_[i] : U'\0'; }
    std::string show(std::size_t i) const { return quoted(toUtf8(text_.substr(i, 1))); }
    void skipSpaces() {
        while (pos_ < text_.size() && isSpace(text_[pos_])) {
            ++pos_;
        }
    }
    std::string digitsFrom(std::size_t& i) const {
        std::string digits;
        while (isDigit(at(i))) {
            digits += static_cast<char>(at(i));
            ++i;
        }
        return digits;
    }
    void rejectWords();
    void readMantissa();
    void readExponent();
    void readUnit(Parsed& parsed);
    double convert(std::size_t start) const;

    std::string_view original_;
    std::u32string text_;
    char32_t decimal_;
    char32_t otherSeparator_;
    int bareNumberPowerOfTen_;
    std::size_t pos_ = 0;
    int prefixPower_ = 0; // as typed
    bool negative_ = false;
    std::string integer_;
    std::string fraction_;
    long exponent_ = 0;
    bool letterCode_ = false;
    bool letterCodeIsOhm_ = false;
};

void Parser::rejectWords() {
    std::string word;
    for (std::size_t i = pos_; i < text_.size() && i < pos_ + 8; ++i) {
        const char32_t c = text_[i];
        if ((c >= U'A' && c <= U'Z') || (c >= U'a' && c <= U'z')) {
            word += static_cast<char>(c | 0x20);
        } else {
            break;
        }
    }
    if (word == "nan" || word == "inf" || word == "infinity") {
        fail(pos_, quoted(word), "not-a-number and infinity are not values a meter can have");
    }
}

void Parser::readMantissa() {
    if (at(pos_) == U'+' || at(pos_) == U'-' || at(pos_) == U'\u2212') {
        negative_ = at(pos_) != U'+';
        ++pos_;
    }
    rejectWords();
    const std::size_t start = pos_;
    if (at(pos_) == U'R' && isDigit(at(pos_ + 1))) { // IEC 60062 "R47" = 0.47 Ω
        letterCode_ = letterCodeIsOhm_ = true;
        ++pos_;
        fraction_ = digitsFrom(pos_);
        return;
    }
    integer_ = digitsFrom(pos_);
    if (at(pos_) == decimal_) {
        ++pos_;
        fraction_ = digitsFrom(pos_);
    } else if (!integer_.empty() && isDigit(at(pos_ + 1)) &&
               (at(pos_) == U'R' || units::prefixPower(at(pos_)))) {
        letterCode_ = true; // IEC 60062 "4k7": the letter is the decimal point and the prefix
        letterCodeIsOhm_ = at(pos_) == U'R';
        exponent_ = at(pos_) == U'R' ? 0 : *units::prefixPower(at(pos_));
        prefixPower_ = static_cast<int>(exponent_);
        ++pos_;
        fraction_ = digitsFrom(pos_);
    }
    if (integer_.empty() && fraction_.empty()) {
        if (pos_ >= text_.size()) {
            fail(pos_, "end of text", "expected a number after the sign");
        }
        if (units::prefixPower(at(pos_)) || units::findUnit(text_.substr(pos_, 1))) {
            fail(pos_, "unit or prefix " + show(pos_), "a number must come before it");
        }
        fail(pos_, show(pos_), "expected a number");
    }
    if (at(pos_) == decimal_ || at(pos_) == otherSeparator_) {
        if (letterCode_ || pos_ > start + integer_.size()) {
            fail(pos_, "unexpected " + show(pos_),
                 letterCode_ ? "a letter-code value such as 4k7 has no other decimal point"
                             : "a number has only one decimal separator");
        }
        fail(pos_, "unexpected " + show(pos_),
             decimal_ == U'.' ? "the decimal separator is a point (decimal comma is off)"
                              : "the decimal separator is a comma here");
    }
}

void Parser::readExponent() {
    if (letterCode_ || (at(pos_) != U'e' && at(pos_) != U'E')) {
        return;
    }
    std::size_t i = pos_ + 1;
    bool negative = false;
    if (at(i) == U'+' || at(i) == U'-') {
        negative = at(i) == U'-';
        ++i;
    }
    const std::string digits = digitsFrom(i);
    if (digits.empty()) {
        fail(pos_, show(pos_), "an exponent needs digits, as in 1e3 or 2.5e-6");
    }
    // The exponent's value counts, not its digits ("1e0000001" is 10). A value of seven digits
    // or more overflows or underflows any double either way; capping it keeps the long whole.
    const std::size_t first = std::min(digits.find_first_not_of('0'), digits.size());
    const std::string significant = digits.substr(first);
    const long magnitude =
        significant.size() > 6 ? 9999999 : (significant.empty() ? 0 : std::stol(significant));
    exponent_ += negative ? -magnitude : magnitude;
    pos_ = i;
}

void Parser::readUnit(Parsed& parsed) {
    skipSpaces();
    const std::size_t start = pos_;
    while (pos_ < text_.size() && !isSpace(text_[pos_])) {
        ++pos_;
    }
    const std::u32string_view token(text_.data() + start, pos_ - start);
    parsed.unitPosition = start;
    if (token.empty()) {
        parsed.quantity.unit = letterCodeIsOhm_ ? Unit::Ohm : Unit::Dimensionless;
        if (!letterCode_) {
            exponent_ += bareNumberPowerOfTen_; // neither prefix nor unit: the context's
        }
        return;
    }
    parsed.hasUnit = true;
    const std::string spelled = quoted(toUtf8(token));
    std::optional<units::UnitSpelling> unit = units::findUnit(token);
    if (!unit) {
        const std::optional<int> prefix = units::prefixPower(token.front());
        if (!prefix || (token.size() == 1 && token.front() == U'K')) {
            fail(start, "unknown unit " + spelled,
                 "expected V, A, Ω (ohm), W, Hz, s, K, °C, %, Ω/V or /K, optionally with a "
                 "prefix p n µ m k M G");
        }
        if (letterCode_) {
            fail(start, "prefix " + show(start),
                 "a letter-code value such as 4k7 already carries its prefix");
        }
        if (token.size() == 1) {
            exponent_ += *prefix; // "4.7k": a prefix alone, the unit follows from context
            prefixPower_ = *prefix;
            parsed.quantity.unit = letterCodeIsOhm_ ? Unit::Ohm : Unit::Dimensionless;
            return;
        }
        unit = units::findUnit(token.substr(1));
        if (!unit) {
            fail(start + 1, "unknown unit " + quoted(toUtf8(token.substr(1))),
                 "expected V, A, Ω (ohm), W, Hz, s, K, °C, %, Ω/V or /K after the prefix");
        }
        if (!unit->takesPrefix) {
            fail(start, "prefix " + show(start),
                 "no SI prefix is used with " + toUtf8(token.substr(1)));
        }
        exponent_ += *prefix;
        prefixPower_ = *prefix;
    }
    if (letterCodeIsOhm_ && unit->unit != Unit::Ohm) {
        fail(start, "unit " + spelled, "the R of the resistor code marks a resistance in ohms");
    }
    exponent_ += unit->powerOfTen;
    parsed.quantity.unit = unit->unit;
}

double Parser::convert(std::size_t start) const {
    // One decimal conversion of the whole value, prefix folded into the exponent, so "4.7m"
    // is the double nearest 0.0047 and printed values parse back exactly.
    std::string ascii = (negative_ ? "-" : "") + (integer_.empty() ? "0" : integer_) + "." +
                        (fraction_.empty() ? "0" : fraction_) + "e" + std::to_string(exponent_);
    double value = 0.0;
    const auto result = std::from_chars(ascii.data(), ascii.data() + ascii.size(), value);
    if (result.ec == std::errc::result_out_of_range ||
        (result.ec == std::errc() && std::isinf(value))) {
        fail(start, "number",
             "out of the range of values this program can hold (about 1e-300 to 1e300)");
    }
    if (result.ec != std::errc()) {
        fail(start, "number", "not readable as a number");
    }
    return value;
}

Parsed Parser::run() {
    skipSpaces();
    if (pos_ >= text_.size()) {
        throw QuantityError("empty value: expected a number such as \"4.7k\" or \"10 V\"", 0);
    }
    const std::size_t start = pos_;
    readMantissa();
    readExponent();
    Parsed parsed;
    readUnit(parsed);
    skipSpaces();
    if (pos_ < text_.size()) {
        fail(pos_, "unexpected " + show(pos_),
             parsed.hasUnit ? "nothing may follow the unit" : "nothing may follow the number");
    }
    parsed.quantity.value = convert(start);
    parsed.quantity.prefixPower = prefixPower_;
    return parsed;
}

bool convertible(Unit from, Unit to) {
    return from == to || from == Unit::Dimensionless ||
           (from == Unit::Kelvin && to == Unit::DegreeCelsius) ||
           (from == Unit::DegreeCelsius && to == Unit::Kelvin);
}

} // namespace

Quantity parseQuantity(std::string_view text, const ParseOptions& options) {
    return Parser(text, options).run().quantity;
}

double parseValue(std::string_view text, Unit expected, const ParseOptions& options) {
    const Parsed parsed = Parser(text, options).run();
    const Quantity& q = parsed.quantity;
    if (!convertible(q.unit, expected)) {
        throw QuantityError("unit \"" + std::string(unitSymbol(q.unit)) + "\" at character " +
                                std::to_string(parsed.unitPosition + 1) + " of \"" +
                                std::string(text) +
                                "\": " + std::string(unitDescription(expected)) +
                                " is expected here, not " + std::string(unitDescription(q.unit)),
                            parsed.unitPosition);
    }
    if (q.unit == Unit::Kelvin && expected == Unit::DegreeCelsius) {
        return q.value - 273.15;
    }
    if (q.unit == Unit::DegreeCelsius && expected == Unit::Kelvin) {
        return q.value + 273.15;
    }
    return q.value;
}

} // namespace mw
