// DC voltmeter multipliers, series chains, input resistance and loading, against textbook
// worked examples.
#include "core/circuits/dc_voltmeter.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>
#include <vector>

using namespace mw;
using mwtest::absolute;
using mwtest::relative;

TEST_CASE("multiplier for one range") {
    // Classic textbook case (from memory; printed source not re-checked): 100 V, 1 mA, 100 Ω
    // -> 99.9 kΩ.
    CHECK(multiplier_ohm({1e-3, 100.0}, 100.0) == relative(99.9e3, 1e-12));
    // Helfrick & Cooper Example 4-3, lowest range: 10 V, 1 mA, 100 Ω -> 9.9 kΩ.
    CHECK(multiplier_ohm({1e-3, 100.0}, 10.0) == relative(9.9e3, 1e-12));
    // Sensitivity method, Helfrick & Cooper Example 4-4: R_s = S·V - R_m.
    const Movement m{1e-3, 100.0};
    CHECK(multiplier_ohm(m, 50.0) == relative(m.sensitivity_ohm_per_V() * 50.0 - 100.0, 1e-12));
}

TEST_CASE("a range at or below the movement's own drop is refused, naming the drop") {
    const Movement m{1e-3, 100.0}; // drop 100 mV
    CHECK_THROWS_AS(multiplier_ohm(m, 0.1), std::domain_error);
    CHECK_THROWS_WITH(multiplier_ohm(m, 0.05), Catch::Contains("100.0 mV"));
    CHECK_THROWS_WITH(multiplier_ohm(m, 0.05), Catch::Contains("full-scale drop"));
    CHECK_THROWS_AS(multiplier_ohm(m, -10.0), std::domain_error);
    CHECK_THROWS_AS(multiplier_ohm({0.0, 100.0}, 10.0), std::invalid_argument);
}

TEST_CASE("multi-range voltmeter as individual multipliers and as a series chain") {
    // Helfrick & Cooper Example 4-3 (p. 60): I_fs = 1 mA, R_m = 100 Ω, ranges 10/50/250/500 V;
    // series string R4 = 9.9 kΩ, R3 = 40 kΩ, R2 = 200 kΩ, R1 = 250 kΩ (R4 next to the movement).
    const Movement m{1e-3, 100.0};
    const std::vector<double> ranges{10.0, 50.0, 250.0, 500.0};
    const std::vector<double> chain = seriesChain_ohm(m, ranges);
    REQUIRE(chain.size() == 4);
    CHECK(chain[0] == relative(9.9e3, 1e-12));
    CHECK(chain[1] == relative(40e3, 1e-12));
    CHECK(chain[2] == relative(200e3, 1e-12));
    CHECK(chain[3] == relative(250e3, 1e-12));
    // Individual multipliers for the same ranges: V/I_fs - R_m each.
    const std::vector<double> single = multipliers_ohm(m, ranges);
    CHECK(single[1] == relative(49.9e3, 1e-12));
    CHECK(single[3] == relative(499.9e3, 1e-12));
    // Both arrangements put the same total resistance in series on every range.
    double sum = 0.0;
    for (std::size_t i = 0; i < ranges.size(); ++i) {
        sum += chain[i];
        CHECK(sum == relative(single[i], 1e-12));
    }
    const std::vector<double> descending{50.0, 10.0};
    CHECK_THROWS_WITH(seriesChain_ohm(m, descending), Catch::Contains("ascending"));
}

TEST_CASE("voltmeter resistance is sensitivity times range") {
    // Helfrick & Cooper Example 4-5: 1 kΩ/V on the 50 V range -> 50 kΩ; 20 kΩ/V -> 1 MΩ.
    CHECK(voltmeterResistance_ohm({1e-3, 100.0}, 50.0) == relative(50e3, 1e-12));
    CHECK(voltmeterResistance_ohm({50e-6, 2000.0}, 50.0) == relative(1e6, 1e-12));
}

TEST_CASE("loading of a divider by the voltmeter") {
    // Helfrick & Cooper Example 4-5 (p. 62): 150 V across 100 kΩ + 50 kΩ, read across the
    // 50 kΩ on the 50 V range. True 50 V; R_th = 100 kΩ || 50 kΩ = 33.3 kΩ.
    const double r_th = 100e3 * 50e3 / (100e3 + 50e3);
    const LoadedReading a = loadedReading(50.0, 50e3, r_th);  // meter A, 1 kΩ/V
    CHECK(a.volts_reading == absolute(30.0, 1e-9));           // book: 30 V
    CHECK(a.error_fraction == absolute(-0.40, 1e-12));        // book: 40 % low
    const LoadedReading b = loadedReading(50.0, 1e6, r_th);   // meter B, 20 kΩ/V
    CHECK(b.volts_reading == absolute(48.4, 0.05));           // book: about 48.4 V
    CHECK(b.error_fraction * 100.0 == absolute(-3.23, 0.05)); // book: about 3.2 % low
    // An ideal source (R_th = 0) is not loaded.
    CHECK(loadedReading(10.0, 1e3, 0.0).volts_reading == 10.0);
    CHECK_THROWS_AS(loadedReading(10.0, 0.0, 1e3), std::domain_error);
    CHECK_THROWS_AS(loadedReading(10.0, 1e3, -1.0), std::domain_error);
}
