// Prints how long the nonlinear rectifier model takes for an 11-point test plan and for a
// full-scale multiplier solve (target: under 1 ms each), against a floor measured in this run.
#include "core/circuits/rectifier_design.h"

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <vector>

namespace {

using Clock = std::chrono::steady_clock;

// Median wall time of `runs` calls, in milliseconds; `sink` keeps the work from being elided.
template <typename F>
double medianMs(int runs, F&& work, double& sink) {
    std::vector<double> times;
    times.reserve(static_cast<std::size_t>(runs));
    for (int i = 0; i < runs; ++i) {
        const auto start = Clock::now();
        sink += work();
        times.push_back(std::chrono::duration<double, std::milli>(Clock::now() - start).count());
    }
    std::sort(times.begin(), times.end());
    return times[times.size() / 2];
}

double sumIndicated(const std::vector<mw::Indication>& plan) {
    double sum = 0.0;
    for (const mw::Indication& point : plan) {
        sum += point.indicated;
    }
    return sum;
}

} // namespace

int main() {
    using namespace mw;
    constexpr int kRuns = 101;
    const std::vector<double> plan_volts{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10};
    double sink = 0.0;

    // Floor: the same 11-point plan with ideal diodes (closed form per point).
    const RectifierMeter ideal({Rectifier::Bridge, 1e-3, 1000.0, 8003.16}, IdealDiodes{});
    const double floor_ms = medianMs(
        kRuns,
        [&] { return sumIndicated(predictTestPlan(ideal, 10.0, plan_volts, WaveShape::Sine)); },
        sink);
    std::printf("floor: 11-point plan, ideal diodes (closed form)   %9.4f ms\n", floor_ms);

    for (Rectifier rectifier : {Rectifier::HalfWave, Rectifier::Bridge}) {
        const RectifierMeter prototype({rectifier, 1e-3, 1000.0, 0.0},
                                       diodePreset(DiodePreset::SmallSignalSilicon), 23.0);
        MultiplierSolution solution;
        const double solve_ms = medianMs(
            kRuns,
            [&] {
                solution = solveMultiplier(prototype, 10.0);
                return solution.multiplier_ohms;
            },
            sink);
        const RectifierMeter meter = prototype.withMultiplier(solution.multiplier_ohms);
        const double plan_ms = medianMs(
            kRuns,
            [&] { return sumIndicated(predictTestPlan(meter, 10.0, plan_volts, WaveShape::Sine)); },
            sink);
        const auto name = rectifierName(rectifier);
        std::printf("%-6s silicon, 1 mA / 1 kΩ, 10 V: 11-point plan     %9.4f ms  (%6.0f × floor)"
                    "  %s\n",
                    name.data(), plan_ms, plan_ms / floor_ms, plan_ms < 1.0 ? "ok" : "OVER 1 ms");
        std::printf("%-6s silicon, 1 mA / 1 kΩ, 10 V: multiplier solve  %9.4f ms  (%6.0f × floor)"
                    "  %s, %.3f Ω in %d period averages\n",
                    name.data(), solve_ms, solve_ms / floor_ms, solve_ms < 1.0 ? "ok" : "OVER 1 ms",
                    solution.multiplier_ohms, solution.evaluations);
    }
    std::printf("(medians of %d runs; checksum %.6g)\n", kRuns, sink);
    return 0;
}
