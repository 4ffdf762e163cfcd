// Waveform statistics in closed form for the analytic shapes, as sample means for records.
#include "core/circuits/waveform.h"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

double requireFinite(double volts, const char* what) {
    if (!std::isfinite(volts)) {
        throw std::invalid_argument(std::string("waveform: ") + what + " must be a finite number");
    }
    return volts;
}

double requireAmplitude(double peak_volts) {
    requireFinite(peak_volts, "the peak value");
    if (peak_volts < 0.0) {
        throw std::invalid_argument("waveform: the peak value must not be negative");
    }
    return peak_volts;
}

template <typename F>
double sampleMean(const std::vector<double>& samples, F&& f) {
    double sum = 0.0;
    for (double v : samples) {
        sum += f(v);
    }
    return sum / static_cast<double>(samples.size());
}

} // namespace

std::string_view shapeName(WaveShape shape) {
    switch (shape) {
    case WaveShape::Sine:
        return "sine";
    case WaveShape::Square:
        return "square";
    case WaveShape::Triangle:
        return "triangle";
    case WaveShape::SineWithOffset:
        return "sine-with-offset";
    case WaveShape::Sampled:
        return "sampled";
    }
    return "?";
}

Waveform::Waveform(WaveShape shape, double peak_volts, double offset_volts)
    : shape_(shape)
    , peak_volts_(peak_volts)
    , offset_volts_(offset_volts) {}

Waveform Waveform::sine(double peak_volts) {
    return {WaveShape::Sine, requireAmplitude(peak_volts), 0.0};
}

Waveform Waveform::square(double peak_volts) {
    return {WaveShape::Square, requireAmplitude(peak_volts), 0.0};
}

Waveform Waveform::triangle(double peak_volts) {
    return {WaveShape::Triangle, requireAmplitude(peak_volts), 0.0};
}

Waveform Waveform::sineWithOffset(double peak_volts, double offset_volts) {
    return {WaveShape::SineWithOffset, requireAmplitude(peak_volts),
            requireFinite(offset_volts, "the DC offset")};
}

Waveform Waveform::sampled(std::vector<double> samples_volts) {
    if (samples_volts.size() < 2) {
        throw std::invalid_argument("waveform: a sampled period needs at least 2 samples, got " +
                                    std::to_string(samples_volts.size()));
    }
    double peak = 0.0;
    for (std::size_t i = 0; i < samples_volts.size(); ++i) {
        if (!std::isfinite(samples_volts[i])) {
            throw std::invalid_argument("waveform: sample " + std::to_string(i + 1) +
                                        " is not a finite number");
        }
        peak = std::max(peak, std::abs(samples_volts[i]));
    }
    Waveform waveform(WaveShape::Sampled, peak, 0.0);
    waveform.samples_volts_ = std::move(samples_volts);
    return waveform;
}

Waveform Waveform::withRms(WaveShape shape, double rms_volts) {
    requireAmplitude(rms_volts);
    switch (shape) {
    case WaveShape::Sine:
        return sine(rms_volts * std::numbers::sqrt2);
    case WaveShape::Square:
        return square(rms_volts);
    case WaveShape::Triangle:
        return triangle(rms_volts * std::numbers::sqrt3);
    default:
        throw std::invalid_argument("waveform: only sine, square and triangle can be built from "
                                    "an rms value");
    }
}

double Waveform::valueAt(double phase) const {
    phase -= std::floor(phase);
    const double a = peak_volts_;
    switch (shape_) {
    case WaveShape::Sine:
        return a * std::sin(2.0 * std::numbers::pi * phase);
    case WaveShape::SineWithOffset:
        return offset_volts_ + a * std::sin(2.0 * std::numbers::pi * phase);
    case WaveShape::Square:
        return phase < 0.5 ? a : -a;
    case WaveShape::Triangle:
        if (phase < 0.25) {
            return 4.0 * a * phase;
        }
        return phase < 0.75 ? 2.0 * a - 4.0 * a * phase : 4.0 * a * phase - 4.0 * a;
    case WaveShape::Sampled: {
        const auto n = samples_volts_.size();
        const auto index =
            std::min(n - 1, static_cast<std::size_t>(phase * static_cast<double>(n)));
        return samples_volts_[index];
    }
    }
    return 0.0;
}

Waveform Waveform::scaled(double factor) const {
    requireFinite(factor, "the scale factor");
    if (shape_ == WaveShape::Sampled) {
        std::vector<double> samples = samples_volts_;
        for (double& v : samples) {
            v *= factor;
        }
        return sampled(std::move(samples));
    }
    // A negative factor on a symmetric shape only shifts its phase; the statistics hold.
    return {shape_, peak_volts_ * std::abs(factor), offset_volts_ * factor};
}

double Waveform::rms() const {
    const double a = peak_volts_;
    switch (shape_) {
    case WaveShape::Sine:
        return a / std::numbers::sqrt2;
    case WaveShape::Square:
        return a;
    case WaveShape::Triangle:
        return a / std::numbers::sqrt3;
    case WaveShape::SineWithOffset:
        return std::sqrt(offset_volts_ * offset_volts_ + 0.5 * a * a);
    case WaveShape::Sampled:
        return std::sqrt(sampleMean(samples_volts_, [](double v) { return v * v; }));
    }
    return 0.0;
}

double Waveform::mean() const {
    if (shape_ == WaveShape::Sampled) {
        return sampleMean(samples_volts_, [](double v) { return v; });
    }
    return offset_volts_;
}

double Waveform::rectifiedAverage() const {
    const double a = peak_volts_;
    switch (shape_) {
    case WaveShape::Sine:
        return 2.0 * a / std::numbers::pi;
    case WaveShape::Square:
        return a;
    case WaveShape::Triangle:
        return 0.5 * a;
    case WaveShape::SineWithOffset: {
        const double c = std::abs(offset_volts_);
        if (c >= a) {
            return c; // never crosses zero
        }
        // mean |c + a·sin θ| = (2/π)·(√(a² − c²) + c·asin(c/a)) when the sine crosses zero
        return 2.0 / std::numbers::pi * (std::sqrt(a * a - c * c) + c * std::asin(c / a));
    }
    case WaveShape::Sampled:
        return sampleMean(samples_volts_, [](double v) { return std::abs(v); });
    }
    return 0.0;
}

double Waveform::halfWaveAverage() const {
    // max(v, 0) = (v + |v|)/2 sample by sample, so the means add the same way.
    return 0.5 * (mean() + rectifiedAverage());
}

double Waveform::formFactor() const {
    const double average = rectifiedAverage();
    if (average == 0.0) {
        throw std::domain_error("waveform: form factor of a zero waveform is undefined");
    }
    return rms() / average;
}

double Waveform::crestFactor() const {
    const double r = rms();
    if (r == 0.0) {
        throw std::domain_error("waveform: crest factor of a zero waveform is undefined");
    }
    if (shape_ == WaveShape::Sampled) {
        return peak_volts_ / r;
    }
    return (peak_volts_ + std::abs(offset_volts_)) / r;
}

double sineAveragePerRms(Rectification rectification) {
    const double full_wave = 2.0 * std::numbers::sqrt2 / std::numbers::pi;
    return rectification == Rectification::FullWave ? full_wave : 0.5 * full_wave;
}

AverageRespondingReading averageRespondingReading(const Waveform& waveform,
                                                  Rectification rectification) {
    AverageRespondingReading reading;
    const double average = rectification == Rectification::FullWave ? waveform.rectifiedAverage()
                                                                    : waveform.halfWaveAverage();
    reading.indicated_volts = average / sineAveragePerRms(rectification);
    reading.true_rms_volts = waveform.rms();
    if (reading.true_rms_volts == 0.0) {
        throw std::domain_error(
            "waveform: the error of indication of a zero waveform is undefined");
    }
    reading.error_percent =
        (reading.indicated_volts - reading.true_rms_volts) / reading.true_rms_volts * 100.0;
    return reading;
}

} // namespace mw
