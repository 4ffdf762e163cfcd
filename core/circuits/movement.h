// A moving-coil movement: full-scale current, coil resistance and what follows from them.
#pragma once

namespace mw {

struct Movement {
    double amps_fs = 0.0;   // current for full-scale deflection
    double ohms_coil = 0.0; // coil resistance (at the temperature the design is made for)

    bool operator==(const Movement&) const = default;

    // Voltage across the coil at full scale: the lowest range a voltmeter can have.
    double fullScaleDrop_V() const { return amps_fs * ohms_coil; }
    // DC sensitivity in ohms per volt: 1 / I_fs.
    double sensitivity_ohm_per_V() const { return 1.0 / amps_fs; }
};

// Throws std::invalid_argument naming the field when I_fs is not positive and finite or R_m is
// negative or not finite (a zero coil resistance is allowed as an ideal movement).
void checkMovement(const Movement& movement);

} // namespace mw
