// Shunts and Ayrton shunts against textbook worked examples, tested by topology.
#include "core/circuits/ammeter.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>
#include <vector>

using namespace mw;
using mwtest::relative;

TEST_CASE("shunt for one range") {
    // Helfrick & Cooper Example 4-1 (p. 56): 1 mA, 100 Ω movement on 100 mA -> 1.01 Ω.
    CHECK(shunt_ohm({1e-3, 100.0}, 0.1) == relative(1.0101010101, 1e-9));
    // R_sh = R_m / (n - 1) with n = I / I_fs (common practice form).
    CHECK(shunt_ohm({50e-6, 2000.0}, 10e-3) == relative(2000.0 / 199.0, 1e-12));
}

TEST_CASE("a range not above I_fs is refused") {
    CHECK_THROWS_AS(shunt_ohm({1e-3, 100.0}, 1e-3), std::domain_error);
    CHECK_THROWS_WITH(shunt_ohm({1e-3, 100.0}, 0.5e-3), Catch::Contains("I_fs = 1.000 mA"));
}

TEST_CASE("Ayrton shunt of Helfrick & Cooper Example 4-2, by topology") {
    // Helfrick & Cooper Example 4-2 (p. 57): I_fs = 1 mA, R_m = 50 Ω, ranges 1 A, 5 A, 10 A.
    // Book: total 0.05005 Ω split 0.005005 / 0.005005 / 0.04004 Ω (read by topology:
    // the section used alone on 10 A, the one added for 5 A, the one added for 1 A).
    const Movement m{1e-3, 50.0};
    const std::vector<double> ranges{10.0, 1.0, 5.0}; // any order
    const AyrtonShunt s = ayrtonShunt(m, ranges);
    REQUIRE(s.amps_ranges == std::vector<double>{1.0, 5.0, 10.0});
    CHECK(s.total_ohm == relative(0.05005005, 1e-6));
    REQUIRE(s.sections_ohm.size() == 3);
    CHECK(s.sections_ohm[0] == relative(0.005005, 1e-3)); // alone on 10 A
    CHECK(s.sections_ohm[1] == relative(0.005005, 1e-3)); // added for 5 A
    CHECK(s.sections_ohm[2] == relative(0.04004, 1e-3));  // added for 1 A
    CHECK(s.taps_ohm[0] == relative(s.total_ohm, 1e-12));
    CHECK(s.taps_ohm[2] == relative(s.sections_ohm[0], 1e-12));
    // Burden at full scale: the movement branch I_fs·(R_m + R_total − T_k), which by
    // Kirchhoff's laws on the same topology equals the drop (I_k − I_fs)·T_k across the tapped
    // part of the string; on 1 A it is the movement's 1 mA × 50 Ω = 50 mV (Ohm's law).
    REQUIRE(s.burden_V.size() == 3);
    CHECK(s.burden_V[0] == relative(0.05, 1e-12));
    for (std::size_t k = 0; k < 3; ++k) {
        CHECK(s.burden_V[k] == relative((s.amps_ranges[k] - 1e-3) * s.taps_ohm[k], 1e-12));
    }
}

TEST_CASE("every Ayrton tap gives full scale at its range (circuit check)") {
    // Kirchhoff: on range k the tap part T_k carries I - I_m, the rest of the string R_total - T_k
    // is in series with the movement; the two branches share the voltage. Full scale needs
    // I_m = I_fs when I = I_k (Ayrton shunt principle, common practice).
    const Movement m{50e-6, 1800.0};
    const std::vector<double> ranges{1e-3, 10e-3, 100e-3, 1.0};
    const AyrtonShunt s = ayrtonShunt(m, ranges);
    for (std::size_t k = 0; k < s.amps_ranges.size(); ++k) {
        const double tap = s.taps_ohm[k];
        const double movement_branch = m.ohms_coil + (s.total_ohm - tap);
        const double amps_movement = s.amps_ranges[k] * tap / (tap + movement_branch);
        CHECK(amps_movement == relative(m.amps_fs, 1e-12));
    }
    double sum = 0.0;
    for (const double section : s.sections_ohm) {
        CHECK(section > 0.0);
        sum += section;
    }
    CHECK(sum == relative(s.total_ohm, 1e-12));
}

TEST_CASE("impossible Ayrton ranges are refused") {
    const Movement m{1e-3, 50.0};
    const std::vector<double> twice{1.0, 1.0};
    CHECK_THROWS_WITH(ayrtonShunt(m, twice), Catch::Contains("given twice"));
    const std::vector<double> tooLow{1.0, 0.5e-3};
    CHECK_THROWS_AS(ayrtonShunt(m, tooLow), std::domain_error);
    CHECK_THROWS_AS(ayrtonShunt(m, std::vector<double>{}), std::domain_error);
}
