// Linear drift of an error over time with a significance test of the slope.
#include "core/interval/drift.h"

#include "core/uncertainty/distributions.h"

#include <cmath>
#include <cstdio>
#include <limits>
#include <stdexcept>

namespace mw {
namespace {

constexpr double kDaysPerYear = 365.25;

std::string formatDate(std::chrono::sys_days day) {
    const std::chrono::year_month_day ymd{day};
    char text[16];
    std::snprintf(text, sizeof text, "%04d-%02u-%02u", static_cast<int>(ymd.year()),
                  static_cast<unsigned>(ymd.month()), static_cast<unsigned>(ymd.day()));
    return text;
}

// Projected date and the summary sentence; `intercept` is the fitted error at `origin`.
void describe(DriftResult& result, double intercept, double limit, std::chrono::sys_days origin,
              double significanceLevel) {
    char text[200];
    if (!result.significant) {
        std::snprintf(text, sizeof text,
                      "no significant drift (slope %.3g per year, p = %.2g, t-test at %.0f %%)",
                      result.slopePerYear, result.pValue, significanceLevel * 100.0);
        result.summary = text;
        return;
    }
    const double target = result.slopePerYear > 0.0 ? limit : -limit;
    const double years = (target - intercept) / result.slopePerYear;
    result.projectedLimitDate =
        origin + std::chrono::days(static_cast<long>(std::floor(years * kDaysPerYear)));
    std::snprintf(
        text, sizeof text,
        "drift of %.3g per year (p = %.2g); the error reaches the limit of %.3g around %s",
        result.slopePerYear, result.pValue, target, formatDate(*result.projectedLimitDate).c_str());
    result.summary = text;
}

} // namespace

DriftResult analyseDrift(const std::vector<DriftObservation>& observations, double limit,
                         double significanceLevel) {
    if (observations.size() < 3) {
        throw std::invalid_argument("drift: needs at least three as-found results, got " +
                                    std::to_string(observations.size()));
    }
    if (!(limit > 0.0)) {
        throw std::invalid_argument("drift: the permissible error must be > 0");
    }
    const auto origin = observations.front().date;
    const auto n = static_cast<double>(observations.size());
    double meanT = 0.0, meanE = 0.0;
    for (const DriftObservation& o : observations) {
        meanT += (o.date - origin).count() / kDaysPerYear / n;
        meanE += o.error / n;
    }
    double stt = 0.0, ste = 0.0;
    for (const DriftObservation& o : observations) {
        const double t = (o.date - origin).count() / kDaysPerYear - meanT;
        stt += t * t;
        ste += t * (o.error - meanE);
    }
    if (!(stt > 0.0)) {
        throw std::invalid_argument("drift: all results carry the same date");
    }
    DriftResult result;
    result.slopePerYear = ste / stt;
    const double intercept = meanE - result.slopePerYear * meanT; // at the first date
    double sse = 0.0;
    double lastYears = 0.0;
    for (const DriftObservation& o : observations) {
        const double t = (o.date - origin).count() / kDaysPerYear;
        const double residual = o.error - (intercept + result.slopePerYear * t);
        sse += residual * residual;
        lastYears = std::max(lastYears, t);
    }
    result.dof = n - 2.0;
    result.errorAtLast = intercept + result.slopePerYear * lastYears;
    result.slopeStandardError = std::sqrt(sse / result.dof / stt);
    if (result.slopeStandardError > 0.0) {
        result.tStatistic = result.slopePerYear / result.slopeStandardError;
        result.pValue = 2.0 * studentTCdf(-std::fabs(result.tStatistic), result.dof);
    } else {
        result.tStatistic =
            result.slopePerYear == 0.0 ? 0.0 : std::numeric_limits<double>::infinity();
        result.pValue = result.slopePerYear == 0.0 ? 1.0 : 0.0;
    }
    result.significant = result.pValue < significanceLevel;
    describe(result, intercept, limit, origin, significanceLevel);
    return result;
}

} // namespace mw
