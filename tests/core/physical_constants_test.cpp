// The exact 2019 SI constants and the thermal voltage derived from them.
#include "core/circuits/physical_constants.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace mw;
using mwtest::relative;

TEST_CASE("Boltzmann constant and elementary charge are the exact 2019 SI values") {
    // SI Brochure, 9th edition (2019), Table 1: defining constants, exact by definition.
    CHECK(kBoltzmann_J_per_K == 1.380649e-23);
    CHECK(kElementaryCharge_C == 1.602176634e-19);
    // Not the CODATA 2014 charge that pre-2019 libraries carry (1.6021766208e-19 C).
    CHECK(kElementaryCharge_C != 1.6021766208e-19);
    // k/e = 8.617 333 262... × 10⁻⁵ V/K: CODATA 2018 lists it as exact (from the two above).
    CHECK(kBoltzmann_J_per_K / kElementaryCharge_C == relative(8.617333262e-5, 1e-10));
}

TEST_CASE("thermal voltage kT/q at the usual temperatures") {
    // Computed from the exact 2019 SI constants (9th SI Brochure) in 30-digit arithmetic;
    // 25.85 mV at 300 K is the textbook figure (common practice).
    CHECK(thermalVoltage_V(300.0) == relative(25.852000e-3, 1e-7));
    CHECK(thermalVoltage_V(293.15) == relative(25.261712e-3, 1e-7));
    CHECK(thermalVoltage_V(296.15) == relative(25.520232e-3, 1e-7));
    CHECK(thermalVoltage_V(298.15) == relative(25.692579e-3, 1e-7));
    CHECK(thermalVoltage_V(kZeroCelsius_K) == relative(23.538246e-3, 1e-7));
}

TEST_CASE("thermal voltage refuses temperatures at or below absolute zero") {
    CHECK_THROWS_AS(thermalVoltage_V(0.0), std::domain_error);
    CHECK_THROWS_AS(thermalVoltage_V(-1.0), std::domain_error);
}
