// Periodic test waveforms and what an average-responding, rms-scaled meter makes of them.
#pragma once

#include <string_view>
#include <vector>

namespace mw {

enum class WaveShape { Sine, Square, Triangle, SineWithOffset, Sampled };

std::string_view shapeName(WaveShape shape);

// One period of a voltage waveform. The analytic shapes are symmetric about zero except the
// offset sine; a sampled waveform is one period of equally spaced samples, each held for 1/N of
// the period, so its statistics are the plain sample means a digitiser record gives.
class Waveform {
public:
    static Waveform sine(double peak_volts);
    static Waveform square(double peak_volts); // 50 % duty cycle
    static Waveform triangle(double peak_volts);
    static Waveform sineWithOffset(double peak_volts, double offset_volts);
    static Waveform sampled(std::vector<double> samples_volts);
    // A sine, square or triangle whose true rms value is `rms_volts`.
    static Waveform withRms(WaveShape shape, double rms_volts);

    WaveShape shape() const { return shape_; }
    double peakVolts() const { return peak_volts_; } // amplitude of the AC part
    double offsetVolts() const { return offset_volts_; }
    const std::vector<double>& samplesVolts() const { return samples_volts_; }

    // Instantaneous value at `phase` (fraction of the period, wrapped into [0, 1)). Phase 0 is
    // the rising zero crossing of sine and triangle and the start of the square's high half.
    double valueAt(double phase) const;
    Waveform scaled(double factor) const;

    double rms() const;
    double mean() const;
    double rectifiedAverage() const; // mean of |v| (full-wave rectified)
    double halfWaveAverage() const;  // mean of max(v, 0) over the whole period
    double formFactor() const;       // rms / rectified average
    double crestFactor() const;      // largest |v| / rms

private:
    Waveform(WaveShape shape, double peak_volts, double offset_volts);

    WaveShape shape_;
    double peak_volts_;
    double offset_volts_;
    std::vector<double> samples_volts_;
};

enum class Rectification { FullWave, HalfWave };

// Rectified average per rms of a sine: 2√2/π (full-wave) and √2/π (half-wave).
double sineAveragePerRms(Rectification rectification);

// An average-responding meter whose scale is marked in rms of a sine: it multiplies the
// rectified average by the sine's rms/average ratio (π/(2√2) full-wave, π/√2 half-wave).
struct AverageRespondingReading {
    double indicated_volts = 0.0;
    double true_rms_volts = 0.0;
    double error_percent = 0.0; // (indicated − true rms) / true rms × 100
};
AverageRespondingReading
averageRespondingReading(const Waveform& waveform,
                         Rectification rectification = Rectification::FullWave);

} // namespace mw
