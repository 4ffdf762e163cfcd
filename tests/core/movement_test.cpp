// Movement figures: full-scale drop and DC sensitivity (ohms per volt).
#include "core/circuits/movement.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <limits>
#include <stdexcept>

using namespace mw;
using mwtest::relative;

TEST_CASE("sensitivity is the reciprocal of the full-scale current") {
    // Helfrick & Cooper Example 4-4: I_fs = 1 mA gives S = 1000 Ω/V.
    CHECK(Movement{1e-3, 100.0}.sensitivity_ohm_per_V() == relative(1000.0, 1e-12));
    // 50 µA movements are the "20 000 Ω/V" meters: common practice.
    CHECK(Movement{50e-6, 2000.0}.sensitivity_ohm_per_V() == relative(20000.0, 1e-12));
}

TEST_CASE("full-scale drop is I_fs times the coil resistance") {
    // Helfrick & Cooper Example 4-1 movement: 1 mA, 100 Ω -> 100 mV across the coil.
    CHECK(Movement{1e-3, 100.0}.fullScaleDrop_V() == relative(0.1, 1e-12));
    // Helfrick & Cooper Example 4-2 movement: 1 mA, 50 Ω -> 50 mV.
    CHECK(Movement{1e-3, 50.0}.fullScaleDrop_V() == relative(0.05, 1e-12));
}

TEST_CASE("impossible movements are refused with the field named") {
    CHECK_NOTHROW(checkMovement({1e-3, 0.0}));
    CHECK_THROWS_WITH(checkMovement({0.0, 100.0}), Catch::Contains("I_fs"));
    CHECK_THROWS_WITH(checkMovement({-1e-3, 100.0}), Catch::Contains("I_fs"));
    CHECK_THROWS_WITH(checkMovement({std::numeric_limits<double>::quiet_NaN(), 100.0}),
                      Catch::Contains("I_fs"));
    CHECK_THROWS_AS(checkMovement({1e-3, -5.0}), std::invalid_argument);
    CHECK_THROWS_WITH(checkMovement({1e-3, std::numeric_limits<double>::infinity()}),
                      Catch::Contains("R_m"));
}
