// Per-point decisions of evaluateRange() against an independent decision made in exact
// integer arithmetic on the decimal readings as typed: thousands of generated readings over
// every class of IEC 60051-2, many ranges and unit prefixes, the three rules of ILAC
// G8:09/2019 4.2, repeats and both directions. Also: grouping, direction and repeat numbers.
#include "core/evaluation/evaluation.h"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <map>
#include <random>
#include <set>
#include <string>
#include <vector>

using namespace mw;

namespace {

// All comparisons of the reference are on integers scaled by S: a count is one unit of the
// last typed digit (10^-3 of the range's prefix); the class index and the guard factor have
// at most two decimals and U two significant digits, so limit × S and w × S are whole numbers.
constexpr std::int64_t kScale = 1'000'000'000;

std::int64_t powerOfTen(int exponent) {
    std::int64_t value = 1;
    for (int i = 0; i < exponent; ++i) {
        value *= 10;
    }
    return value;
}

// The reported U (a double holding a two-significant-digit decimal) in counts × S, read
// through printf's own decimal conversion: "%.1e" gives exactly two significant digits.
std::int64_t scaledFromTwoDigits(double value, int rangePrefix) {
    char text[32];
    std::snprintf(text, sizeof text, "%.1e", value);
    const std::int64_t mantissa = (text[0] - '0') * 10 + (text[2] - '0');
    const int exponent = std::atoi(text + 4) - 1 - (rangePrefix - 3) + 9; // S = 10^9
    REQUIRE(exponent >= 2); // whole, and still whole after × r/100
    return mantissa * powerOfTen(exponent);
}

// counts × 10^exponent written as a plain decimal, by moving the point in the digit string.
std::string decimalText(std::int64_t counts, int exponent) {
    std::string digits = std::to_string(std::llabs(counts));
    const std::string sign = counts < 0 ? "-" : "";
    if (exponent >= 0) {
        return sign + digits + std::string(static_cast<std::size_t>(exponent), '0');
    }
    const auto fraction = static_cast<std::size_t>(-exponent);
    if (digits.size() <= fraction) {
        digits = std::string(fraction - digits.size() + 1, '0') + digits;
    }
    return sign + digits.substr(0, digits.size() - fraction) + "." +
           digits.substr(digits.size() - fraction);
}

const char* prefixLetter(int power) {
    switch (power) {
    case -12:
        return "p";
    case -9:
        return "n";
    case -6:
        return "u";
    case -3:
        return "m";
    case 3:
        return "k";
    case 6:
        return "M";
    default:
        return "";
    }
}

struct RangeCase {
    std::int64_t upper; // in the range's prefix, e.g. 50 for 50 µA
    int prefix;         // power of ten of that prefix
    Unit unit;
    bool centreZero; // -upper … +upper, fiducial value the span (IEC 60051-1)
};

// Ranges over the prefixes of the trade, µA to kV (values of our own).
const RangeCase kRanges[] = {
    {50, -6, Unit::Ampere, false}, {1, -3, Unit::Ampere, false}, {100, -3, Unit::Ampere, false},
    {5, 0, Unit::Ampere, false},   {100, -3, Unit::Volt, false}, {3, 0, Unit::Volt, false},
    {10, 0, Unit::Volt, false},    {300, 0, Unit::Volt, false},  {1, 3, Unit::Volt, false},
    {30, 3, Unit::Volt, false},    {50, -6, Unit::Ampere, true}, {15, 0, Unit::Volt, true},
};

// One reading as the reference sees it (counts) and as the engine gets it (text, parsed).
struct TypedReading {
    std::int64_t applied;
    std::int64_t error;
    Direction direction;
    int repeat;
    int point;
};

// Writes counts (10^(prefix − 3) each) as a person might type them: bare in the range's
// unit, or with a unit and a neighbouring prefix.
std::string typed(std::int64_t counts, const RangeCase& range, int style) {
    const int power = range.prefix - 3 * (style - 1); // style 0: bare, 1..3: prefixes around
    if (style == 0 || power < -12 || power > 6) {
        return decimalText(counts, -3);
    }
    const char* unit = range.unit == Unit::Volt ? "V" : "A";
    return decimalText(counts, range.prefix - 3 - power) + " " + prefixLetter(power) + unit;
}

enum class Verdict { Pass, ConditionalPass, ConditionalFail, Fail };

Outcome toOutcome(Verdict v) {
    return static_cast<Outcome>(static_cast<int>(v));
}

// The decision of ILAC G8:09/2019 4.2.1 / 4.2.2 / 4.2.3 on |mean| = |sum| / n against the
// limit L and the guard band w, all scaled by kScale, in integers.
Verdict reference(std::int64_t sumScaled, std::int64_t n, std::int64_t limitScaled,
                  std::int64_t guardScaled, DecisionRule rule) {
    const std::int64_t magnitude = std::llabs(sumScaled);
    const bool inside = magnitude <= n * limitScaled;
    switch (rule) {
    case DecisionRule::SimpleAcceptance:
        return inside ? Verdict::Pass : Verdict::Fail;
    case DecisionRule::GuardedBinary:
        return magnitude <= n * (limitScaled - guardScaled) ? Verdict::Pass : Verdict::Fail;
    case DecisionRule::GuardedAcceptance:
        break;
    }
    if (inside) {
        return magnitude < n * (limitScaled - guardScaled) ? Verdict::Pass
                                                           : Verdict::ConditionalPass;
    }
    return magnitude <= n * (limitScaled + guardScaled) ? Verdict::ConditionalFail : Verdict::Fail;
}

// Counts around a bound given scaled by kScale: just below, on (when whole), just above.
std::vector<std::int64_t> around(std::int64_t boundScaled) {
    const std::int64_t below = boundScaled / kScale; // bounds are >= 0 here
    return {below - 1, below, below + 1, below + 2};
}

struct Generated {
    std::vector<TypedReading> readings;
    std::map<int, std::int64_t> appliedOfPoint;
};

Generated generate(std::mt19937_64& random, const RangeCase& range, std::int64_t limitScaled,
                   std::int64_t guardScaled) {
    const std::int64_t upper = range.upper * 1000;
    const std::int64_t lower = range.centreZero ? -upper : 0;
    std::vector<std::int64_t> errors;
    for (const std::int64_t bound :
         {limitScaled, limitScaled - guardScaled, limitScaled + guardScaled}) {
        if (bound > 0) {
            for (const std::int64_t e : around(bound)) {
                errors.push_back(e);
                errors.push_back(-e);
            }
        }
    }
    std::uniform_int_distribution<std::int64_t> anywhere(lower, upper);
    std::set<std::int64_t> usedApplied;
    Generated out;
    int point = 0;
    for (std::size_t i = 0; i < errors.size() + 6; ++i, ++point) {
        std::int64_t applied = anywhere(random);
        if (i % 2 == 0) {
            applied -= applied % 1000; // a cardinal point on a whole mark
        }
        if (!usedApplied.insert(applied).second) {
            --point;
            continue;
        }
        out.appliedOfPoint[point] = applied;
        const std::int64_t target =
            i < errors.size()
                ? errors[i]
                : std::uniform_int_distribution<std::int64_t>(-2 * limitScaled / kScale - 2,
                                                              2 * limitScaled / kScale + 2)(random);
        const int shape = static_cast<int>(i % 4);
        if (shape == 0) { // one reading
            out.readings.push_back({applied, target, Direction::Up, 0, point});
        } else if (shape == 1) { // repeats whose mean is target, or a third off it
            const std::int64_t spread = 1 + static_cast<std::int64_t>(i % 3);
            const std::int64_t nudge = static_cast<std::int64_t>(i % 3) - 1;
            out.readings.push_back({applied, target + spread + nudge, Direction::Up, 1, point});
            out.readings.push_back({applied, target - spread, Direction::Up, 2, point});
            out.readings.push_back({applied, target, Direction::Up, 3, point});
        } else if (shape == 2) { // up and down: the larger mean magnitude decides
            out.readings.push_back({applied, target, Direction::Up, 1, point});
            out.readings.push_back({applied, target / 2, Direction::Down, 1, point});
            out.readings.push_back({applied, -target + 1, Direction::Down, 2, point});
        } else { // two readings with a half-count mean
            out.readings.push_back({applied, target, Direction::Up, 1, point});
            out.readings.push_back({applied, target + 1, Direction::Up, 2, point});
        }
    }
    return out;
}

struct Sums {
    std::int64_t up = 0, nUp = 0, down = 0, nDown = 0;
};

} // namespace

TEST_CASE("decisions agree with exact decimal arithmetic over classes, ranges and prefixes") {
    // IEC 60051-1: errors shall not exceed the limits (class index % of the fiducial value);
    // ILAC G8:09/2019 4.2.1-4.2.3 zones; the mean of n repeats compared as n·Σ. The reference
    // below decides in 64-bit integers on the same decimals, independently of the engine's
    // decimal type. Class indices from the IEC 60051-2 series (classIndexSeries, from memory).
    std::mt19937_64 random(60051);
    const std::int64_t guardFactors[] = {100, 83, 50, 150}; // r × 100 (ISO 14253-1 0.83 too)
    std::size_t readingsChecked = 0;
    std::size_t pointsChecked = 0;
    for (const RangeCase& range : kRanges) {
        for (const double classIndex : classIndexSeries()) {
            const auto classHundredths = static_cast<std::int64_t>(classIndex * 100.0 + 0.5);
            const std::int64_t fiducial = range.upper * 1000 * (range.centreZero ? 2 : 1);
            // L × S = class/100 × fiducial × S, with S = 10^9 and class = hundredths / 100.
            const std::int64_t limitScaled = classHundredths * fiducial * (kScale / 10'000);
            for (const DecisionRule rule :
                 {DecisionRule::SimpleAcceptance, DecisionRule::GuardedBinary,
                  DecisionRule::GuardedAcceptance}) {
                // U as reported: up to half the limit, cut to two significant digits.
                const std::int64_t limitCounts = std::max<std::int64_t>(limitScaled / kScale, 1);
                std::int64_t mantissa = std::uniform_int_distribution<std::int64_t>(
                    1, std::max<std::int64_t>(limitCounts / 2, 1))(random);
                std::int64_t power = 1;
                while (mantissa >= 100) {
                    mantissa /= 10;
                    power *= 10;
                }
                const std::int64_t uCounts = mantissa * power;
                const std::int64_t r = guardFactors[readingsChecked % 4];
                const auto guardOf = [rule, r](std::int64_t uScaled) {
                    return rule == DecisionRule::SimpleAcceptance ? 0 : r * uScaled / 100;
                };
                const Generated generated =
                    generate(random, range, limitScaled, guardOf(uCounts * kScale));

                EvaluationInput input;
                input.unit = range.unit;
                ParseOptions bare;
                bare.bareNumberPowerOfTen = range.prefix;
                const std::int64_t upperCounts = range.upper * 1000;
                input.range.upper = parseValue(decimalText(upperCounts, -3), range.unit, bare);
                input.range.lower = range.centreZero ? -input.range.upper : 0.0;
                input.range.type = range.centreZero ? ScaleType::ZeroInside : ScaleType::ZeroAtEnd;
                input.classIndex = classIndex;
                input.decision = {rule, static_cast<double>(r) / 100.0};
                input.reference =
                    parseReferenceSpec("U=" + decimalText(uCounts, -3) + ",k=2", range.unit, bare);
                std::map<int, Sums> sums;
                int style = 0;
                for (const TypedReading& reading : generated.readings) {
                    const std::int64_t indicated = reading.applied + reading.error;
                    input.readings.push_back(
                        {parseValue(typed(reading.applied, range, style++ % 4), range.unit, bare),
                         parseValue(typed(indicated, range, style++ % 4), range.unit, bare),
                         reading.direction, reading.repeat, reading.point});
                    Sums& s = sums[reading.point];
                    (reading.direction == Direction::Up ? s.up : s.down) += reading.error;
                    ++(reading.direction == Direction::Up ? s.nUp : s.nDown);
                }
                const EvaluationResult result = evaluateRange(input);
                REQUIRE(result.points.size() == sums.size());
                // Points come back in ascending applied value.
                std::vector<std::pair<std::int64_t, int>> order;
                for (const auto& [point, applied] : generated.appliedOfPoint) {
                    order.emplace_back(applied, point);
                }
                std::sort(order.begin(), order.end());
                for (std::size_t i = 0; i < order.size(); ++i) {
                    const Sums& s = sums.at(order[i].second);
                    const bool down = s.nDown > 0 && (s.nUp == 0 || std::llabs(s.down) * s.nUp >
                                                                        std::llabs(s.up) * s.nDown);
                    const std::int64_t sum = down ? s.down : s.up;
                    const std::int64_t n = down ? s.nDown : s.nUp;
                    const PointResult& got = result.points[i];
                    // The point's own U as reported (repeats add their Type A part).
                    const std::int64_t uScaled =
                        scaledFromTwoDigits(got.budget.expandedRounded, range.prefix);
                    const Verdict expected =
                        reference(sum * kScale, n, limitScaled, guardOf(uScaled), rule);
                    INFO("range " << range.upper << "e" << range.prefix
                                  << (range.centreZero ? " centre zero" : "") << ", class "
                                  << classIndex << ", rule " << toText(rule).data() << ", U "
                                  << uScaled << "/1e9 counts, r " << r << "%, error sum " << sum
                                  << " over " << n << " readings, limit " << limitScaled
                                  << "/1e9 counts");
                    CHECK(got.decision == toOutcome(expected));
                    if (got.readingCount == 1) { // no Type A: U is the reference's alone
                        CHECK(uScaled == uCounts * kScale);
                    }
                    // TUR 4:1 threshold (ANSI/NCSL Z540.3 5.3): L/U < 4 exactly.
                    CHECK(got.turBelowMinimum == (limitScaled < 4 * uScaled));
                    ++pointsChecked;
                }
                readingsChecked += generated.readings.size();
            }
        }
    }
    INFO(readingsChecked << " readings, " << pointsChecked << " points");
    CHECK(readingsChecked > 10000);
}

TEST_CASE("errors of exactly the limit never split between outcomes") {
    // The case that started it: a class 1.5, 10 V meter (limit ±150 mV) with errors of exactly
    // ±150 mV at every test point, typed as a technician writes them. IEC 60051-1: an error
    // equal to the limit does not exceed it; ILAC G8:09/2019 4.2.1 passes it, 4.2.3 makes it a
    // conditional pass at every point alike.
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.5;
    input.divisions = 50;
    input.reference = parseReferenceSpec("0.02%rdg+0.01%rng", Unit::Volt);
    const char* const appliedText[] = {"0", "1", "2", "3", "4", "5", "6", "7", "8", "9", "10"};
    const char* const highText[] = {"0.15", "1.15", "2.15", "3.15", "4.15", "5.15",
                                    "6.15", "7.15", "8.15", "9.15", "10.15"};
    const char* const lowText[] = {"-0.15", "0.85", "1.85", "2.85", "3.85", "4.85",
                                   "5.85",  "6.85", "7.85", "8.85", "9.85"};
    for (std::size_t i = 0; i < 11; ++i) {
        const double applied = parseValue(appliedText[i], Unit::Volt);
        input.readings.push_back(
            {applied, parseValue(highText[i], Unit::Volt), Direction::Up, 0, -1});
        input.readings.push_back(
            {applied, parseValue(lowText[i], Unit::Volt), Direction::Down, 0, -1});
    }
    const EvaluationResult simple = evaluateRange(input);
    for (const PointResult& point : simple.points) {
        CHECK(point.decision == Outcome::Pass);
        CHECK(std::fabs(point.error) == 0.15); // the double nearest 0.15, at every point
    }
    input.decision = {DecisionRule::GuardedAcceptance, 1.0};
    for (const PointResult& point : evaluateRange(input).points) {
        CHECK(point.decision == Outcome::ConditionalPass);
    }
}

TEST_CASE("the same repeat number twice at a point and direction is refused") {
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.5;
    input.readings = {{5.0, 5.02, Direction::Up, 1, -1},
                      {5.0, 5.03, Direction::Up, 2, -1},
                      {5.0, 5.01, Direction::Down, 1, -1}, // other direction: fine
                      {6.0, 6.01, Direction::Up, 1, -1},   // other point: fine
                      {5.0, 5.04, Direction::Up, 2, -1}};
    try {
        evaluateRange(input);
        FAIL("a repeated repeat number must be refused");
    } catch (const EvaluationError& error) {
        CHECK(error.field() == "repeat");
        CHECK(error.readingNumber() == std::optional<std::size_t>(5));
        CHECK(error.conflictingReadingNumber() == std::optional<std::size_t>(2));
        CHECK_THAT(error.what(), Catch::Contains("reading 5 repeats number 2 of reading 2"));
    }
    // Readings without numbers (0) are repeats in the order given.
    for (EvaluationReading& reading : input.readings) {
        reading.repeat = 0;
    }
    CHECK(evaluateRange(input).points.front().readingCount == 4);
}

TEST_CASE("a point is judged by its direction with the larger error, and says which") {
    // The class limit holds for every indication, approached rising or falling, so the point
    // is judged by the worse of the two (common practice).
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 0.5;
    input.readings = {{4.0, 4.04, Direction::Up, 0, 3},
                      {4.0, 4.0, Direction::Down, 0, 3},
                      {6.0, 6.01, Direction::Up, 0, 4},
                      {6.0, 5.97, Direction::Down, 0, 4},
                      {8.0, 8.02, Direction::Up, 0, 5}};
    const auto points = evaluateRange(input).points;
    REQUIRE(points.size() == 3);
    CHECK(points[0].decidingDirection == Direction::Up);
    CHECK(points[0].error == Approx(0.04));
    CHECK(points[1].decidingDirection == Direction::Down); // |−0.03| > |+0.01|
    CHECK(points[1].error == Approx(-0.03));
    CHECK(points[2].decidingDirection == Direction::Up); // the only direction read
}
