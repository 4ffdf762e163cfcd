// Slows down repeated wrong sign-ins: after the second wrong attempt in a row, each further
// attempt waits twice as long as the one before (1 s, 2 s, 4 s ... up to 30 s). A right
// sign-in clears it. Pure logic over a clock the caller passes in, so tests need not wait.
#pragma once

#include <chrono>

namespace mw::gui {

class SignInThrottle {
public:
    using Clock = std::chrono::steady_clock;

    // How long until the next attempt is allowed (zero: now).
    std::chrono::milliseconds waitBefore(Clock::time_point now) const;
    void recordFailure(Clock::time_point now);
    void recordSuccess() { failures_ = 0; }
    int failures() const { return failures_; }

    static constexpr std::chrono::seconds kLongestWait{30};

private:
    int failures_ = 0;
    Clock::time_point allowedAfter_{};
};

} // namespace mw::gui
