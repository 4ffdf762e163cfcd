// DC ammeter design: a single shunt, and the Ayrton (universal) shunt for several ranges.
#pragma once

#include "core/circuits/movement.h"

#include <span>
#include <vector>

namespace mw {

// Shunt for one range: R_sh = I_fs·R_m / (I - I_fs). Throws std::domain_error when the range is
// not above I_fs. With a swamping resistor in series with the coil, pass the movement with
// R_m + R_sw. The burden at full scale is then movement.fullScaleDrop_V().
double shunt_ohm(const Movement& movement, double amps_range);

// Ayrton shunt: one resistor string of n sections between the common terminal and the end of the
// string joined to the movement's free terminal. Each range has a tap on the string; the part of
// the string between the common terminal and the tap carries the shunt current, the rest of the
// string is in series with the movement.
//   - The lowest range's tap is the far end: the whole string shunts the bare movement,
//     R_total = I_fs·R_m / (I_1 - I_fs).
//   - Range k's tap resistance (common terminal to tap) is T_k = I_fs·(R_m + R_total) / I_k.
struct AyrtonShunt {
    std::vector<double> amps_ranges; // ascending
    // taps_ohm[k]: resistance from the common terminal to the tap of amps_ranges[k];
    // taps_ohm[0] is the whole string.
    std::vector<double> taps_ohm;
    // sections_ohm[j]: the j-th resistor counted from the common terminal; sections_ohm[0] is the
    // one used alone on the highest range, the last one is added only on the lowest range.
    std::vector<double> sections_ohm;
    double total_ohm = 0.0;
    // burden_V[k]: voltage across the terminals at full scale of amps_ranges[k], the movement
    // branch's I_fs·(R_m + R_total − T_k) (the burden the circuit under test sees).
    std::vector<double> burden_V;
};

// Ranges in any order (sorted ascending here). Throws std::domain_error for a range not above
// I_fs or for two equal ranges.
AyrtonShunt ayrtonShunt(const Movement& movement, std::span<const double> amps_ranges);

} // namespace mw
