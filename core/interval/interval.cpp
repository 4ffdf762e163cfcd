// Staircase interval adjustment: ILAC-G24 method 1 rule, NCSL RP-1 A1 step form, our own b and
// keep zone (see interval.h for which is which).
#include "core/interval/interval.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>

namespace mw {
namespace {

void validate(int currentDays, const std::vector<AsFoundRecord>& history,
              const StaircaseSettings& settings) {
    if (currentDays < 1) {
        throw std::invalid_argument("interval: the current interval must be at least one day");
    }
    if (!(settings.lengthenFraction > 0.0) || !std::isfinite(settings.lengthenFraction)) {
        throw std::invalid_argument("interval: the lengthening fraction a must be > 0");
    }
    if (!(settings.marginFraction > 0.0 && settings.marginFraction <= 1.0)) {
        throw std::invalid_argument("interval: the keep-zone share of the limit must lie in "
                                    "(0, 1]; 1 turns the zone off");
    }
    if (settings.minimumDays < 1 || settings.maximumDays < settings.minimumDays) {
        throw std::invalid_argument("interval: the bounds need 1 <= minimum days <= maximum days");
    }
    for (std::size_t i = 1; i < history.size(); ++i) {
        if (history[i].date < history[i - 1].date) {
            throw std::invalid_argument("interval: record " + std::to_string(i + 1) +
                                        " is dated before the record before it");
        }
    }
}

} // namespace

double shortenFraction(double lengthenFraction, double reliabilityTarget) {
    if (!(reliabilityTarget > 0.0 && reliabilityTarget < 1.0)) {
        throw std::invalid_argument("interval: the reliability target must lie between 0 and 1");
    }
    if (!(lengthenFraction > 0.0)) {
        throw std::invalid_argument("interval: the lengthening fraction must be > 0");
    }
    return 1.0 - std::pow(1.0 + lengthenFraction, -reliabilityTarget / (1.0 - reliabilityTarget));
}

IntervalRecommendation recommendInterval(int currentDays, const std::vector<AsFoundRecord>& history,
                                         const StaircaseSettings& settings) {
    validate(currentDays, history, settings);
    const double b = shortenFraction(settings.lengthenFraction, settings.reliabilityTarget);
    IntervalRecommendation result;
    double interval = currentDays;
    for (const AsFoundRecord& record : history) {
        IntervalStep step;
        step.date = record.date;
        if (!record.inTolerance) {
            step.kind = IntervalStepKind::Shorten;
            interval *= 1.0 - b;
        } else if (record.worstFractionOfLimit <= settings.marginFraction) {
            step.kind = IntervalStepKind::Lengthen;
            interval *= 1.0 + settings.lengthenFraction;
        }
        interval = std::clamp(interval, static_cast<double>(settings.minimumDays),
                              static_cast<double>(settings.maximumDays));
        step.intervalDays = interval;
        result.steps.push_back(step);
        result.inToleranceCount += record.inTolerance ? 1 : 0;
    }
    result.total = history.size();
    result.observedReliability =
        result.total == 0 ? 0.0 : static_cast<double>(result.inToleranceCount) / result.total;
    result.recommendedDays = static_cast<int>(std::lround(interval));
    char text[480];
    std::snprintf(text, sizeof text,
                  "staircase (ILAC-G24:2007 / OIML D 10:2007 method 1) with NCSL RP-1 A1 "
                  "multiplicative steps: +%.0f %% after an in-tolerance result within %.0f %% of "
                  "the limit, kept above that (our own keep zone), -%.1f %% after an "
                  "out-of-tolerance result (our own step, stationary at a reliability target of "
                  "%.0f %%)",
                  settings.lengthenFraction * 100.0, settings.marginFraction * 100.0, b * 100.0,
                  settings.reliabilityTarget * 100.0);
    result.method = text;
    return result;
}

} // namespace mw
