// Timing helpers shared by the benchmarks: wall time of a piece of work, and the median of
// repeated runs (a shared machine makes single runs noisy).
#pragma once

#include <algorithm>
#include <chrono>
#include <functional>
#include <vector>

namespace mwbench {

inline double millisecondsOf(const std::function<void()>& work) {
    const auto start = std::chrono::steady_clock::now();
    work();
    return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - start)
        .count();
}

inline double median(std::vector<double> values) {
    std::sort(values.begin(), values.end());
    const std::size_t n = values.size();
    return n % 2 == 1 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
}

// The median of `repeats` runs of `work(run)`, in milliseconds.
inline double medianOf(int repeats, const std::function<void(int)>& work) {
    std::vector<double> times;
    for (int i = 0; i < repeats; ++i) {
        times.push_back(millisecondsOf([&] { work(i); }));
    }
    return median(times);
}

} // namespace mwbench
