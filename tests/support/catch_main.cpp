// Catch2 main for tests of the pure C++ engine; compiled once and linked into each test.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>
