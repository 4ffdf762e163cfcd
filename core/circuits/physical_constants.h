// Exact defining constants of the 2019 SI and the diode thermal voltage derived from them.
#pragma once

#include <stdexcept>

namespace mw {

// Exact by definition since the 2019 redefinition of the SI (SI Brochure, 9th edition, Table 1).
inline constexpr double kBoltzmann_J_per_K = 1.380649e-23;
inline constexpr double kElementaryCharge_C = 1.602176634e-19;

// 0 °C on the kelvin scale, exact by the definition of the Celsius scale.
inline constexpr double kZeroCelsius_K = 273.15;

// Thermal voltage V_T = k·T/q used by the Shockley diode equation.
inline double thermalVoltage_V(double kelvin) {
    if (!(kelvin > 0.0)) {
        throw std::domain_error("thermal voltage: temperature must be above 0 K");
    }
    return kBoltzmann_J_per_K * kelvin / kElementaryCharge_C;
}

} // namespace mw
