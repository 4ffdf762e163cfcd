// A fixed-seed random source whose sequence is the same on every platform and standard library.
#pragma once

#include <cmath>
#include <cstdint>
#include <numbers>

namespace mw::demo {

// SplitMix64 (Steele, Lea & Flood, "Fast splittable pseudorandom number generators", 2014).
// std::mt19937 is portable but the std distributions are not, so the demo draws its own
// uniform and normal numbers: the same seed must give the same workbook everywhere.
class DemoRandom {
public:
    explicit DemoRandom(std::uint64_t seed)
        : state_(seed) {}

    std::uint64_t next() {
        std::uint64_t z = (state_ += 0x9E3779B97F4A7C15ULL);
        z = (z ^ (z >> 30U)) * 0xBF58476D1CE4E5B9ULL;
        z = (z ^ (z >> 27U)) * 0x94D049BB133111EBULL;
        return z ^ (z >> 31U);
    }

    // Uniform in [0, 1) with 53 random bits.
    double uniform() { return static_cast<double>(next() >> 11U) * 0x1.0p-53; }

    double uniform(double low, double high) { return low + (high - low) * uniform(); }

    // Integer in [low, high], both included.
    int between(int low, int high) {
        const auto span = static_cast<std::uint64_t>(high - low + 1);
        return low + static_cast<int>(next() % span);
    }

    bool chance(double probability) { return uniform() < probability; }

    // Normal deviate by the Box-Muller transform; one value per call keeps the stream simple.
    double normal(double mean, double sigma) {
        const double u1 = 1.0 - uniform(); // (0, 1]: log stays finite
        const double u2 = uniform();
        return mean +
               sigma * std::sqrt(-2.0 * std::log(u1)) * std::cos(2.0 * std::numbers::pi * u2);
    }

private:
    std::uint64_t state_;
};

} // namespace mw::demo
