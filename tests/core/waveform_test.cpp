// Waveform statistics and the reading of an average-responding, rms-scaled meter, against the
// form factors and waveform errors of rectifier-instrument practice.
#include "core/circuits/waveform.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <vector>

using namespace mw;

namespace {

// An independent numerical mean of f(v(t)) over a period (midpoint rule, many points).
template <typename F>
double numericMean(const Waveform& w, F&& f, int points = 200000) {
    double sum = 0.0;
    for (int k = 0; k < points; ++k) {
        sum += f(w.valueAt((k + 0.5) / points));
    }
    return sum / points;
}

} // namespace

TEST_CASE("form factors of sine, square and triangle") {
    // Exact forms, computed: π/(2√2) = 1.110721, 1, 2/√3 = 1.154701.
    CHECK(Waveform::sine(1.0).formFactor() == mwtest::relative(1.110721, 1e-6));
    CHECK(Waveform::square(3.0).formFactor() == mwtest::relative(1.0, 1e-15));
    CHECK(Waveform::triangle(2.0).formFactor() == mwtest::relative(1.154701, 1e-6));
    // Crest factors √2, 1, √3 (exact forms, computed).
    CHECK(Waveform::sine(5.0).crestFactor() == mwtest::relative(1.414214, 1e-6));
    CHECK(Waveform::square(5.0).crestFactor() == mwtest::relative(1.0, 1e-15));
    CHECK(Waveform::triangle(5.0).crestFactor() == mwtest::relative(1.732051, 1e-6));
}

TEST_CASE("rectified averages of a sine: 2/π and 1/π of the peak, 0.9003 and 0.4502 of rms") {
    // Exact forms, computed: full-wave 2/π = 0.636620, half-wave 1/π = 0.318310 of the peak;
    // 2√2/π = 0.900316 and √2/π = 0.450158 of the rms.
    const Waveform w = Waveform::sine(10.0);
    CHECK(w.rectifiedAverage() == mwtest::relative(6.36620, 1e-6));
    CHECK(w.halfWaveAverage() == mwtest::relative(3.18310, 1e-6));
    CHECK(sineAveragePerRms(Rectification::FullWave) == mwtest::relative(0.900316, 1e-6));
    CHECK(sineAveragePerRms(Rectification::HalfWave) == mwtest::relative(0.450158, 1e-6));
    CHECK(Waveform::withRms(WaveShape::Sine, 10.0).peakVolts() ==
          mwtest::relative(14.142136, 1e-7));
}

TEST_CASE("average-responding meter: sine reads true, square +11.07 %, triangle −3.81 %") {
    // Exact forms, computed: indication per true rms 1.110721 (square) and 0.961912 (triangle);
    // errors +11.07 % and −3.81 % (not −3.85 %).
    CHECK(averageRespondingReading(Waveform::sine(2.0)).error_percent ==
          mwtest::absolute(0.0, 1e-12));
    const AverageRespondingReading square = averageRespondingReading(Waveform::square(1.0));
    CHECK(square.indicated_volts == mwtest::relative(1.110721, 1e-6));
    CHECK(square.error_percent == mwtest::absolute(11.07, 0.005));
    const AverageRespondingReading triangle =
        averageRespondingReading(Waveform::withRms(WaveShape::Triangle, 1.0));
    CHECK(triangle.indicated_volts == mwtest::relative(0.961912, 1e-6));
    CHECK(triangle.error_percent == mwtest::absolute(-3.81, 0.005));
    // A half-wave meter scaled for the sine reads a symmetric waveform as a full-wave one does.
    CHECK(averageRespondingReading(Waveform::square(1.0), Rectification::HalfWave).error_percent ==
          mwtest::absolute(11.07, 0.005));
}

TEST_CASE("sine with DC offset: closed forms agree with a numerical mean") {
    for (double offset : {0.0, 0.3, -0.7, 1.0, 2.5}) {
        const Waveform w = Waveform::sineWithOffset(1.0, offset);
        INFO("offset " << offset);
        // rms from a numerical mean of v² (independent of the closed form c² + A²/2).
        const double mean_square = numericMean(w, [](double v) { return v * v; });
        CHECK(w.rms() == mwtest::relative(std::sqrt(mean_square), 1e-9));
        CHECK(w.rectifiedAverage() ==
              mwtest::relative(numericMean(w, [](double v) { return std::abs(v); }), 1e-8));
        CHECK(w.halfWaveAverage() ==
              mwtest::relative(numericMean(w, [](double v) { return std::max(v, 0.0); }), 1e-8));
        CHECK(w.mean() == offset);
    }
    // A half-wave meter responds to the offset: the DC part shifts its reading.
    const auto shifted =
        averageRespondingReading(Waveform::sineWithOffset(1.0, 0.2), Rectification::HalfWave);
    CHECK(shifted.indicated_volts >
          averageRespondingReading(Waveform::sine(1.0), Rectification::HalfWave).indicated_volts);
}

TEST_CASE("sampled waveform statistics are the sample means of a digitiser record") {
    const Waveform record = Waveform::sampled({1.0, 1.0, -1.0, -1.0});
    CHECK(record.rms() == 1.0);
    CHECK(record.rectifiedAverage() == 1.0);
    CHECK(record.formFactor() == 1.0);
    // A finely sampled sine approaches the sine's exact form factor π/(2√2), computed.
    std::vector<double> samples;
    for (int k = 0; k < 4096; ++k) {
        samples.push_back(std::sin(2.0 * std::numbers::pi * (k + 0.5) / 4096));
    }
    const Waveform sampled_sine = Waveform::sampled(samples);
    CHECK(sampled_sine.formFactor() == mwtest::relative(1.110721, 1e-5));
    CHECK(sampled_sine.scaled(2.0).rms() == mwtest::relative(2.0 / std::sqrt(2.0), 1e-5));
    CHECK(sampled_sine.valueAt(0.25) == mwtest::relative(1.0, 1e-5));
}

TEST_CASE("waveform values follow the documented phase convention") {
    CHECK(Waveform::sine(2.0).valueAt(0.25) == mwtest::relative(2.0, 1e-15));
    CHECK(Waveform::triangle(2.0).valueAt(0.125) == mwtest::relative(1.0, 1e-15));
    CHECK(Waveform::triangle(2.0).valueAt(0.75) == mwtest::relative(-2.0, 1e-15));
    CHECK(Waveform::square(2.0).valueAt(0.6) == -2.0);
    CHECK(Waveform::square(2.0).valueAt(1.1) == 2.0); // wraps into the period
}

TEST_CASE("bad waveforms are refused with the reason") {
    CHECK_THROWS_WITH(Waveform::sampled({1.0}), Catch::Contains("at least 2 samples"));
    CHECK_THROWS_WITH(Waveform::sampled({1.0, std::nan(""), 2.0}), Catch::Contains("sample 2"));
    CHECK_THROWS_WITH(Waveform::sine(-1.0), Catch::Contains("must not be negative"));
    CHECK_THROWS_AS(Waveform::withRms(WaveShape::Sampled, 1.0), std::invalid_argument);
    CHECK_THROWS_AS(Waveform::sine(0.0).formFactor(), std::domain_error);
}
