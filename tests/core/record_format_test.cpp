// Number formats of records: values in the range's prefix, signed percentages of the fiducial
// value, coverage in words, safe file names.
#include "core/record/record_format.h"

#include <catch2/catch.hpp>

using namespace mw;
using namespace mw::record;

namespace {

RangeSpec range(double lower, double upper, Unit unit) {
    RangeSpec r;
    r.lower_limit = lower;
    r.full_scale = upper;
    r.unit = unit;
    return r;
}

} // namespace

TEST_CASE("scale values stand in the range's prefix to five digits of its limit") {
    // Common practice: a column of one range reads in one prefix, zero included.
    CHECK(scaleValue(0.0, range(0, 10, Unit::Volt)) == "0.000 V");
    CHECK(scaleValue(8.0, range(0, 10, Unit::Volt)) == "8.000 V");
    CHECK(scaleValue(10.0499, range(0, 10, Unit::Volt)) == "10.050 V");
    CHECK(scaleValue(250.0, range(0, 300, Unit::Volt)) == "250.00 V");
    CHECK(scaleValue(25e-6, range(0, 50e-6, Unit::Ampere)) == "25.000 \u00B5A");
    CHECK(scaleValue(-10.0, range(-10, 10, Unit::Ampere)) == "-10.000 A");
}

TEST_CASE("percentages of the fiducial value carry a sign and a hundredth of the class") {
    CHECK(signedPercent(0.5, 1.5) == "+0.50 %");
    CHECK(signedPercent(-0.0845, 0.5) == "-0.085 %");
    CHECK(signedPercent(0.0, 1.0) == "0.00 %");
    CHECK(signedPercent(1.234, 2.5) == "+1.23 %");
}

TEST_CASE("coverage probabilities, days and file stems in words") {
    // GUM Table G.2: the 95.45 % column is the two-sigma probability.
    CHECK(coverageWords(0.95449973610364158) == "about 95.45 %");
    CHECK(coverageWords(0.95) == "95 %");
    CHECK(days(1) == "1 day");
    CHECK(days(365) == "365 days");
    CHECK(safeFileStem("CFM 201/a:b") == "CFM_201_a_b");
    CHECK(safeFileStem("CFM-201-00066") == "CFM-201-00066");
}
