// Shockley diode: presets, SPICE level-1 temperature scaling, explicit and Lambert-W solutions.
#include "core/circuits/diode.h"
#include "core/units/quantity.h"

#include "core/circuits/physical_constants.h"

#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

void require(bool condition, const std::string& message) {
    if (!condition) {
        throw std::invalid_argument("diode parameters: " + message);
    }
}

double kelvinFromCelsius(double celsius, const char* what) {
    const double kelvin = celsius + kZeroCelsius_K;
    if (!std::isfinite(celsius) || !(kelvin > 0.0)) {
        throw std::invalid_argument(std::string("diode: ") + what +
                                    " must be a finite temperature above absolute zero");
    }
    return kelvin;
}

} // namespace

void validate(const DiodeParameters& p) {
    require(std::isfinite(p.saturation_current_a) && p.saturation_current_a > 0.0 &&
                p.saturation_current_a < 1.0,
            "saturation current IS must be above 0 A and below 1 A");
    require(std::isfinite(p.emission_coefficient) && p.emission_coefficient >= 0.5 &&
                p.emission_coefficient <= 10.0,
            "emission coefficient N must lie between 0.5 and 10");
    require(std::isfinite(p.series_ohms) && p.series_ohms >= 0.0,
            "series resistance RS must be 0 Ω or more");
    require(std::isfinite(p.bandgap_ev) && p.bandgap_ev > 0.0 && p.bandgap_ev < 5.0,
            "band gap EG must lie between 0 and 5 eV");
    require(std::isfinite(p.saturation_temp_exponent) && std::abs(p.saturation_temp_exponent) < 20,
            "saturation-current temperature exponent XTI must lie between -20 and 20");
    kelvinFromCelsius(p.nominal_celsius, "the nominal temperature TNOM");
}

DiodeParameters diodePreset(DiodePreset preset) {
    DiodeParameters p;
    switch (preset) {
    case DiodePreset::SmallSignalSilicon:
        // The widely circulated SPICE model of the 1N4148/1N914 small-signal switching diode
        // (IS = 2.52 nA, N = 1.752, RS = 0.568 Ω), from memory; silicon EG = 1.11 eV and
        // XTI = 3 are the SPICE defaults. Gives about 0.58 V at 1 mA and 27 °C.
        p.saturation_current_a = 2.52e-9;
        p.emission_coefficient = 1.752;
        p.series_ohms = 0.568;
        break;
    case DiodePreset::Schottky:
        // Typical small-signal Schottky barrier diode (about 0.2 V at 1 mA): IS of order
        // 0.1 µA, N close to 1, a few ohms of series resistance -- typical values, from memory.
        // EG = 0.69 eV and XTI = 2 are the usual SPICE settings for a Schottky barrier
        // (common practice).
        p.saturation_current_a = 2.0e-7;
        p.emission_coefficient = 1.02;
        p.series_ohms = 2.0;
        p.bandgap_ev = 0.69;
        p.saturation_temp_exponent = 2.0;
        break;
    case DiodePreset::Germanium:
        // Typical germanium point-contact signal diode (about 0.25 V at 1 mA, microampere
        // leakage): IS = 1 µA, N = 1.5, RS = 10 Ω -- typical values, from memory. EG = 0.67 eV
        // is the band gap of germanium (common practice); XTI = 3 as for a pn junction.
        p.saturation_current_a = 1.0e-6;
        p.emission_coefficient = 1.5;
        p.series_ohms = 10.0;
        p.bandgap_ev = 0.67;
        break;
    }
    return p;
}

std::string_view presetName(DiodePreset preset) {
    switch (preset) {
    case DiodePreset::SmallSignalSilicon:
        return "silicon";
    case DiodePreset::Schottky:
        return "schottky";
    case DiodePreset::Germanium:
        return "germanium";
    }
    return "?";
}

std::optional<DiodePreset> presetFromName(std::string_view name) {
    for (DiodePreset preset :
         {DiodePreset::SmallSignalSilicon, DiodePreset::Schottky, DiodePreset::Germanium}) {
        if (presetName(preset) == name) {
            return preset;
        }
    }
    return std::nullopt;
}

double saturationCurrentAt(const DiodeParameters& p, double celsius) {
    validate(p);
    const double kelvin = kelvinFromCelsius(celsius, "the operating temperature");
    const double nominal_kelvin = kelvinFromCelsius(p.nominal_celsius, "TNOM");
    const double ratio = kelvin / nominal_kelvin;
    const double slope_v = p.emission_coefficient * thermalVoltage_V(kelvin);
    // Same arrangement as the SPICE level-1 temperature update (EG / (N·V_T(T)) · (T/TNOM − 1)).
    const double exponent = (ratio - 1.0) * p.bandgap_ev / slope_v +
                            p.saturation_temp_exponent / p.emission_coefficient * std::log(ratio);
    return p.saturation_current_a * std::exp(exponent);
}

double wrightOmega(double x) {
    if (std::isnan(x)) {
        throw std::invalid_argument("Wright omega: argument is not a number");
    }
    if (x == std::numeric_limits<double>::infinity()) {
        return x;
    }
    if (x < -18.0) {
        // Series of W(z) at z = e^x < 1.6e-8: z − z² + 1.5·z³ − …, exact to double precision;
        // this is the reverse-biased diode, the common case, so it skips the iteration.
        const double z = std::exp(x);
        return z * (1.0 - z * (1.0 - 1.5 * z));
    }
    double w = x > 1.0 ? x - std::log(x) : std::exp(x) / (1.0 + std::exp(x));
    // Newton on f(w) = w + ln w − x, written to stay positive; quadratic from these starts.
    // x itself carries a rounding error of |x|·ε, which bounds the attainable accuracy of w.
    const double tolerance = 8.0 * std::numeric_limits<double>::epsilon() * (1.0 + std::abs(x));
    for (int iteration = 0; iteration < 100; ++iteration) {
        double next = w * (1.0 + x - std::log(w)) / (1.0 + w);
        if (!(next > 0.0)) {
            next = 0.1 * w;
        }
        const double change = std::abs(next - w);
        w = next;
        if (change <= tolerance * w) {
            return w;
        }
    }
    throw std::runtime_error("Wright omega: Newton iteration did not converge for x = " +
                             formatPlain(x));
}

Diode::Diode(const DiodeParameters& parameters, double celsius)
    : saturation_a_(saturationCurrentAt(parameters, celsius))
    , slope_v_(parameters.emission_coefficient *
               thermalVoltage_V(kelvinFromCelsius(celsius, "the operating temperature")))
    , series_ohms_(parameters.series_ohms) {}

double Diode::voltageAt(double amps) const {
    if (!(amps > -saturation_a_)) {
        throw std::domain_error("diode: a reverse current cannot exceed the saturation current");
    }
    return slope_v_ * std::log1p(amps / saturation_a_) + amps * series_ohms_;
}

double Diode::resistanceAt(double amps) const {
    return series_ohms_ + slope_v_ / (amps + saturation_a_);
}

double Diode::currentAt(double volts, double extra_ohms) const {
    const double ohms = series_ohms_ + extra_ohms;
    if (!(ohms >= 0.0) || std::isnan(volts)) {
        throw std::invalid_argument("diode: series resistance must be 0 Ω or more");
    }
    if (ohms == 0.0) {
        return saturation_a_ * std::expm1(volts / slope_v_); // may be +inf far forward
    }
    // V + I_s·R = (I + I_s)·R + nV_T·ln((I + I_s)/I_s); with w = (I + I_s)·R/(nV_T) this is
    // w + ln w = x, so w = W(e^x) (Lambert W of an exponential, computed without overflow).
    const double x =
        (volts + saturation_a_ * ohms) / slope_v_ + std::log(saturation_a_ * ohms / slope_v_);
    return wrightOmega(x) * slope_v_ / ohms - saturation_a_;
}

double Diode::conductanceAt(double amps, double extra_ohms) const {
    return 1.0 / (series_ohms_ + extra_ohms + slope_v_ / (amps + saturation_a_));
}

} // namespace mw
