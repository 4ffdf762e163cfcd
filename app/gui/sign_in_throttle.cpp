// Exponential back-off of repeated wrong sign-ins.
#include "app/gui/sign_in_throttle.h"

#include <algorithm>

namespace mw::gui {

std::chrono::milliseconds SignInThrottle::waitBefore(Clock::time_point now) const {
    if (now >= allowedAfter_) {
        return std::chrono::milliseconds(0);
    }
    return std::chrono::ceil<std::chrono::milliseconds>(allowedAfter_ - now);
}

void SignInThrottle::recordFailure(Clock::time_point now) {
    ++failures_;
    if (failures_ < 2) {
        return; // one slip of the finger costs nothing
    }
    const auto doubling = std::chrono::seconds(1LL << std::min(failures_ - 2, 5));
    allowedAfter_ = now + std::min<std::chrono::seconds>(doubling, kLongestWait);
}

} // namespace mw::gui
