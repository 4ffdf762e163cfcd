// A standard's range specification typed as text and read back: every form of the engine's
// reference specifications, limits with a floor, and refusals that name the reason.
#include "core/accuracy/standard_spec_text.h"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace mw;

namespace {

StandardRangeSpec range(Unit unit, double fullScale) {
    StandardRangeSpec spec;
    spec.label = "range";
    spec.unit = unit;
    spec.full_scale = fullScale;
    return spec;
}

} // namespace

TEST_CASE("each form sets the matching fields and reads back the same") {
    StandardRangeSpec spec = range(Unit::Volt, 20.0);
    setSpecFromText(spec, "0.004%rdg+0.0008%rng");
    CHECK(spec.percent_of_reading == Approx(0.004));
    CHECK(spec.percent_of_range == Approx(0.0008));
    CHECK(spec.floor == 0.0);
    CHECK_FALSE(spec.certificate_expanded_uncertainty);
    StandardRangeSpec again = range(Unit::Volt, 20.0);
    setSpecFromText(again, specText(spec));
    CHECK(again == spec);

    // 1 ppm = 0.0001 % (SI: parts per million, 10^-6).
    setSpecFromText(spec, "20ppm+5ppm");
    CHECK(spec.percent_of_reading == Approx(0.002));
    CHECK(spec.percent_of_range == Approx(0.0005));

    setSpecFromText(spec, "0.5mV");
    CHECK(spec.floor == Approx(0.5e-3));
    CHECK(spec.percent_of_reading == 0.0);

    setSpecFromText(spec, "U=1mV,k=2,dof=8");
    REQUIRE(spec.certificate_expanded_uncertainty);
    CHECK(*spec.certificate_expanded_uncertainty == Approx(1e-3));
    CHECK(spec.coverage_factor == 2.0);
    REQUIRE(spec.degrees_of_freedom);
    CHECK(*spec.degrees_of_freedom == 8.0);
    again = range(Unit::Volt, 20.0);
    setSpecFromText(again, specText(spec));
    CHECK(again == spec);
}

TEST_CASE("limits with a floor: percentages plus a fixed value in the range's unit") {
    StandardRangeSpec spec = range(Unit::Volt, 2.0);
    setSpecFromText(spec, "0.004%rdg+0.0008%rng+5uV");
    CHECK(spec.percent_of_reading == Approx(0.004));
    CHECK(spec.floor == Approx(5e-6));
    StandardRangeSpec again = range(Unit::Volt, 2.0);
    setSpecFromText(again, specText(spec));
    CHECK(again.floor == Approx(5e-6));
    CHECK(again.percent_of_range == Approx(0.0008));
}

TEST_CASE("bad specifications are refused and leave the range as it was") {
    StandardRangeSpec spec = range(Unit::Ampere, 0.2);
    setSpecFromText(spec, "0.02%rdg+0.005%rng");
    const StandardRangeSpec before = spec;
    CHECK_THROWS_AS(setSpecFromText(spec, "0.02%rdg+5mV"), std::invalid_argument); // a volt floor
    CHECK_THROWS_AS(setSpecFromText(spec, "U=1mA,k=2+1mA"), std::invalid_argument);
    CHECK_THROWS_AS(setSpecFromText(spec, "about right"), std::invalid_argument);
    CHECK(spec == before);
}
