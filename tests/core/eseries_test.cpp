// IEC 60063 preferred values, nearest-value choice, trimmer range and dissipation.
#include "core/circuits/eseries.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <stdexcept>

using namespace mw;
using mwtest::relative;

TEST_CASE("each series has its number of values per decade") {
    // IEC 60063:2015: the number after E is the count per decade.
    CHECK(eseriesDecade(ESeries::E6).size() == 6);
    CHECK(eseriesDecade(ESeries::E12).size() == 12);
    CHECK(eseriesDecade(ESeries::E24).size() == 24);
    CHECK(eseriesDecade(ESeries::E48).size() == 48);
    CHECK(eseriesDecade(ESeries::E96).size() == 96);
    CHECK(eseriesDecade(ESeries::E192).size() == 192);
}

TEST_CASE("E24 and E96 values agree with the published tables") {
    // IEC 60063:2015 Table 1, E24 column: the values that do not follow 10^(i/24) rounding.
    const auto e24 = eseriesDecade(ESeries::E24);
    CHECK(e24[10] == 27);
    CHECK(e24[11] == 30);
    CHECK(e24[12] == 33);
    CHECK(e24[13] == 36);
    CHECK(e24[14] == 39);
    CHECK(e24[15] == 43);
    CHECK(e24[16] == 47);
    CHECK(e24[22] == 82);
    CHECK(e24[23] == 91);
    // IEC 60063:2015 Table 1: E12 and E6 as printed.
    const int e12[] = {10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82};
    for (std::size_t i = 0; i < 12; ++i) {
        CHECK(eseriesDecade(ESeries::E12)[i] == e12[i]);
    }
    CHECK(eseriesDecade(ESeries::E6)[4] == 47);
    // IEC 60063:2015 Table 2, E96 column.
    const auto e96 = eseriesDecade(ESeries::E96);
    CHECK(e96[1] == 102);
    CHECK(e96[13] == 137);
    CHECK(e96[39] == 255);
    CHECK(e96[50] == 332);
    CHECK(e96[67] == 499);
    CHECK(e96[95] == 976);
    // IEC 60063:2015 Table 2, E48 column.
    CHECK(eseriesDecade(ESeries::E48)[47] == 953);
}

TEST_CASE("E48 and E96 follow 10^(i/n) rounded to three digits; E192 except for 920") {
    // Construction rule of the three-digit series (IEC 60063:2015 clause 4, from memory),
    // checked independently here; the single E192 exception 9.20 is computed from the rule.
    for (const auto series : {ESeries::E48, ESeries::E96, ESeries::E192}) {
        const auto decade = eseriesDecade(series);
        const double n = static_cast<double>(decade.size());
        for (std::size_t i = 0; i < decade.size(); ++i) {
            const int geometric =
                static_cast<int>(std::lround(100.0 * std::pow(10.0, static_cast<double>(i) / n)));
            if (series == ESeries::E192 && decade[i] == 920) {
                CHECK(geometric == 919);
                continue;
            }
            INFO(toText(series) << " index " << i);
            CHECK(decade[i] == geometric);
        }
    }
}

TEST_CASE("series names round-trip") {
    CHECK(eseriesFromText("E96") == ESeries::E96);
    CHECK(eseriesFromText("e24") == ESeries::E24);
    CHECK(eseriesFromText("E192") == ESeries::E192);
    CHECK_FALSE(eseriesFromText("E7").has_value());
    CHECK_FALSE(eseriesFromText("").has_value());
    CHECK_FALSE(eseriesFromText("E9600").has_value());
}

TEST_CASE("nearest standard value by absolute difference") {
    // Test vectors computed from the IEC 60063:2015 E24 / E96 tables (nearest value).
    CHECK(nearestStandard(99900.0, ESeries::E24) == relative(100e3, 1e-12));
    CHECK(nearestStandard(99900.0, ESeries::E96) == relative(100e3, 1e-12));
    CHECK(nearestStandard(8950.0, ESeries::E24) == relative(9.1e3, 1e-12));
    CHECK(nearestStandard(8950.0, ESeries::E96) == relative(8.87e3, 1e-12));
    CHECK(nearestStandard(1800.0, ESeries::E24) == relative(1.8e3, 1e-12));
    CHECK(nearestStandard(1800.0, ESeries::E96) == relative(1.82e3, 1e-12)); // tie: log distance
    CHECK(nearestStandard(40040.0, ESeries::E24) == relative(39e3, 1e-12));
    CHECK(nearestStandard(40040.0, ESeries::E96) == relative(40.2e3, 1e-12));
    CHECK(nearestStandard(0.05005, ESeries::E24) == relative(0.051, 1e-12));
    CHECK(nearestStandard(0.05005, ESeries::E96) == relative(0.0499, 1e-12));
    CHECK(nearestStandard(225.0, ESeries::E24) == relative(220.0, 1e-12));
    CHECK(nearestStandard(225.0, ESeries::E96) == relative(226.0, 1e-12));
}

TEST_CASE("nearest value not above, so that a series trimmer can only add") {
    // Values from IEC 60063:2015 Tables 1 and 2.
    CHECK(nearestNotAbove(4700.0, ESeries::E24) == 4700.0);
    CHECK(nearestNotAbove(4699.0, ESeries::E24) == relative(4300.0, 1e-12));
    CHECK(nearestNotAbove(4699.999999999999, ESeries::E24) == 4700.0);
    CHECK(nearestNotAbove(8950.0, ESeries::E96) == relative(8870.0, 1e-12));
    CHECK(nearestNotAbove(99900.0, ESeries::E96) == relative(97600.0, 1e-12));
    CHECK(nearestNotAbove(1000.0, ESeries::E96) == relative(1000.0, 1e-12));
    CHECK(nearestNotAbove(999.0, ESeries::E96) == relative(976.0, 1e-12));
    CHECK(nearestNotAbove(0.005005, ESeries::E96) == relative(0.00499, 1e-12));
    CHECK(nearestNotAbove(9.25e6, ESeries::E192) == relative(9.2e6, 1e-12));
    CHECK_THROWS_AS(nearestNotAbove(0.0, ESeries::E96), std::domain_error);
    CHECK_THROWS_AS(nearestNotAbove(-10.0, ESeries::E96), std::domain_error);
    CHECK_THROWS_AS(nearestNotAbove(std::numeric_limits<double>::quiet_NaN(), ESeries::E96),
                    std::domain_error);
}

TEST_CASE("trim and trimmer range for a multiplier") {
    // Helfrick & Cooper Example 4-9 multiplier, 8 950 Ω, as an E96 part (1 % tolerance,
    // IEC 60063 usual pairing) plus a 1-2-5 trimmer (common practice).
    const ResistorChoice choice = chooseResistor(8950.0, ESeries::E96);
    CHECK(choice.ohms_standard == relative(8870.0, 1e-12));
    CHECK(choice.ohms_trim == relative(80.0, 1e-9));
    CHECK(choice.ohms_trim_range == relative(8950.0 - 8870.0 * 0.99, 1e-12)); // 168.7 Ω
    CHECK(choice.ohms_trimmer == relative(200.0, 1e-12));
    // An exact standard value needs no trim, only the tolerance range.
    const ResistorChoice exact = chooseResistor(9900.0, ESeries::E24);
    CHECK(exact.ohms_standard == relative(9100.0, 1e-12)); // 9.9 kΩ is not in E24
    CHECK(chooseResistor(10000.0, ESeries::E24).ohms_trim == 0.0);
    CHECK(chooseResistor(10000.0, ESeries::E24).ohms_trimmer == relative(500.0, 1e-12));
}

TEST_CASE("dissipation at full scale and at 120 % overrange") {
    // Helfrick & Cooper Example 4-3: the 250 kΩ section at 1 mA dissipates I²R = 0.25 W.
    const Dissipation big = dissipation(250e3, 1e-3);
    CHECK(big.watts_fs == relative(0.25, 1e-12));
    CHECK(big.watts_overrange == relative(0.36, 1e-12));
    CHECK(big.volts_overrange == relative(300.0, 1e-12));
    CHECK(big.volts_fs == relative(250.0, 1e-12));
    CHECK(big.aboveDeratedRating); // common practice: 0.25 W parts run at half rating
    CHECK(big.overRating);         // 0.36 W at 120 % on a 0.25 W part
    const Dissipation small = dissipation(9.9e3, 1e-3);
    CHECK(small.watts_fs == relative(9.9e-3, 1e-12));
    CHECK_FALSE(small.aboveDeratedRating);
    CHECK_FALSE(small.overRating);
    CHECK_FALSE(small.overVoltageRating);
    CHECK_FALSE(dissipation(250e3, 1e-3, 1.0).aboveDeratedRating); // a 1 W part is fine
    CHECK_THROWS_AS(dissipation(-1.0, 1e-3), std::domain_error);
    CHECK_THROWS_AS(dissipation(1.0, 1e-3, 0.0), std::domain_error);
    CHECK_THROWS_AS(dissipation(1.0, 1e-3, 0.25, 0.5, 0.0), std::domain_error);
}

TEST_CASE("a part over its power rating is called over, not merely above half") {
    // A 0.1 Ω shunt carrying 3.162 A dissipates 1 W at full scale (I²R), four times a 0.25 W
    // rating (values of our own).
    const Dissipation shunt = dissipation(0.1, std::sqrt(10.0));
    CHECK(shunt.watts_fs == relative(1.0, 1e-12));
    CHECK(shunt.overRating);
    const auto caution = ratingCaution(shunt, "the shunt");
    REQUIRE(caution);
    CHECK_THAT(*caution, Catch::StartsWith("OVER the power rating: the shunt dissipates 1.00 W"));
    // Between half the rating and the rating: the derating note, not "over".
    const Dissipation warm = dissipation(0.1, 1.2); // 0.207 W at 120 %
    CHECK(warm.aboveDeratedRating);
    CHECK_FALSE(warm.overRating);
    CHECK_THAT(ratingCaution(warm, "the shunt").value_or(""),
               Catch::StartsWith("Above the derated power"));
    CHECK_FALSE(ratingCaution(dissipation(9.9e3, 1e-3), "the multiplier").has_value());
}

TEST_CASE("a multiplier over the working voltage of one resistor is named") {
    // A 5 MΩ multiplier of a 50 µA movement on a 250 V range has 250 V across it at full scale
    // and 300 V at 120 % (Ohm's law); a 0.25 W film resistor is rated for about 250 V (common
    // practice, from memory), so one part is not enough. 12.5 mW is well within its power.
    const Dissipation multiplier = dissipation(5e6, 50e-6);
    CHECK(multiplier.volts_overrange == relative(300.0, 1e-12));
    CHECK(multiplier.volts_rating == kTypicalVoltageRating_V);
    CHECK(multiplier.overVoltageRating);
    CHECK_FALSE(multiplier.aboveDeratedRating);
    const auto caution = ratingCaution(multiplier, "the multiplier");
    REQUIRE(caution);
    CHECK_THAT(*caution, Catch::StartsWith("OVER the voltage rating: the multiplier has 300 V "
                                           "across it") &&
                             Catch::Contains("resistors in series"));
    // A part rated for 500 V takes it.
    CHECK_FALSE(dissipation(5e6, 50e-6, 0.25, 0.5, 500.0).overVoltageRating);
}

TEST_CASE("a trim only a sub-ohm trimmer could make is not suggested") {
    // Helfrick & Cooper Example 4-1 shunt, 1.0101 Ω, as E96: 1.00 Ω + 10.1 mΩ. Covering the
    // 1 % tolerance takes 20.1 mΩ, far below the smallest practical trimmer (about 10 Ω,
    // common practice, from memory).
    const ResistorChoice shunt = chooseResistor(1.0101, ESeries::E96);
    CHECK(shunt.ohms_standard == relative(1.0, 1e-12));
    CHECK_FALSE(shunt.trimPractical);
    CHECK_THAT(shunt.trimNote,
               Catch::StartsWith("no trim suggested") && Catch::Contains("smallest practical one"));
    // The multiplier of Example 4-9 needs a 200 Ω trimmer: practical.
    CHECK(chooseResistor(8950.0, ESeries::E96).trimPractical);
    CHECK(chooseResistor(8950.0, ESeries::E96).trimNote.empty());
}
