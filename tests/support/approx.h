// Shared tolerance helpers for tests that compare with outside sources.
#pragma once

#include <catch2/catch.hpp>

namespace mwtest {

// Relative tolerance check, e.g. within(1e-9) for exact formulas, within(5e-3) for printed tables.
inline Approx relative(double expected, double fraction) {
    return Approx(expected).epsilon(fraction).margin(0.0);
}

// Absolute tolerance check: the source printed a value to a fixed number of decimals.
inline Approx absolute(double expected, double margin) {
    return Approx(expected).epsilon(0.0).margin(margin);
}

} // namespace mwtest
