// Validation of movement parameters, shared by every circuit built around a movement.
#include "core/circuits/movement.h"

#include <cmath>
#include <stdexcept>

namespace mw {

void checkMovement(const Movement& movement) {
    if (!std::isfinite(movement.amps_fs) || movement.amps_fs <= 0.0) {
        throw std::invalid_argument("movement: full-scale current I_fs must be above zero");
    }
    if (!std::isfinite(movement.ohms_coil) || movement.ohms_coil < 0.0) {
        throw std::invalid_argument("movement: coil resistance R_m must not be negative");
    }
}

} // namespace mw
