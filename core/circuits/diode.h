// Shockley junction diode with series resistance and SPICE level-1 temperature scaling.
#pragma once

#include <optional>
#include <string_view>

namespace mw {

// Parameters as a SPICE level-1 model card states them; they hold at `nominal_celsius` (TNOM).
struct DiodeParameters {
    double saturation_current_a = 0.0;     // IS
    double emission_coefficient = 1.0;     // N
    double series_ohms = 0.0;              // RS
    double nominal_celsius = 27.0;         // TNOM, SPICE's default
    double bandgap_ev = 1.11;              // EG, SPICE's default (silicon)
    double saturation_temp_exponent = 3.0; // XTI, SPICE's default (pn junction)

    bool operator==(const DiodeParameters&) const = default;
};

// Throws std::invalid_argument naming the first parameter that is out of range.
void validate(const DiodeParameters& parameters);

enum class DiodePreset { SmallSignalSilicon, Schottky, Germanium };

// Generic parameter sets; the origin of each value is stated beside it in diode.cpp.
DiodeParameters diodePreset(DiodePreset preset);
std::string_view presetName(DiodePreset preset); // stable text: "silicon", "schottky", ...
std::optional<DiodePreset> presetFromName(std::string_view name);

// IS at `celsius` as SPICE level 1 scales it:
// IS(T) = IS · (T/TNOM)^(XTI/N) · exp((T/TNOM − 1) · EG / (N · kT/q)).
double saturationCurrentAt(const DiodeParameters& parameters, double celsius);

// W(e^x), the Wright omega function: the w > 0 with w + ln w = x. Converges or throws.
double wrightOmega(double x);

// A diode at its operating temperature. Currents in amperes, voltages in volts; a positive
// current flows from anode to cathode.
class Diode {
public:
    Diode(const DiodeParameters& parameters, double celsius);

    double saturationCurrent_A() const { return saturation_a_; }
    double slope_V() const { return slope_v_; } // n · kT/q
    double seriesOhms() const { return series_ohms_; }

    // Terminal voltage (junction + series resistance) at a current above −I_s; explicit.
    double voltageAt(double amps) const;
    // dV/dI at that current.
    double resistanceAt(double amps) const;

    // Current when `volts` lie across the diode in series with `extra_ohms` more resistance;
    // closed form through the Wright omega function (Lambert W), valid in both directions.
    double currentAt(double volts, double extra_ohms = 0.0) const;
    // dI/dV of that series combination at the current it carries.
    double conductanceAt(double amps, double extra_ohms = 0.0) const;

private:
    double saturation_a_;
    double slope_v_;
    double series_ohms_;
};

} // namespace mw
