// Corrected multiplier and shunt values, trims and resistor deviations.
#include "core/advice/resistor_correction.h"

#include "core/units/quantity.h"

#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

void requirePositive(double value, const char* what, Unit unit) {
    if (!(value > 0.0) || !std::isfinite(value)) {
        const std::string shown =
            unit == Unit::Dimensionless ? formatPlain(value) : formatEngineering(value, 4, unit);
        throw std::invalid_argument(std::string(what) + " must be a finite value > 0, got " +
                                    shown);
    }
}

} // namespace

double correctedMultiplierOhms(double multiplierOhms, double movementOhms, double spanFactor) {
    requirePositive(multiplierOhms, "multiplier resistance", Unit::Ohm);
    requirePositive(movementOhms, "movement resistance", Unit::Ohm);
    requirePositive(spanFactor, "span factor", Unit::Dimensionless);
    const double corrected = spanFactor * (multiplierOhms + movementOhms) - movementOhms;
    if (!(corrected > 0.0)) {
        throw std::invalid_argument("no multiplier value can null a span factor of " +
                                    formatPlain(spanFactor));
    }
    return corrected;
}

double correctedShuntOhms(double shuntOhms, double movementOhms, double spanFactor) {
    requirePositive(shuntOhms, "shunt resistance", Unit::Ohm);
    requirePositive(movementOhms, "movement resistance", Unit::Ohm);
    requirePositive(spanFactor, "span factor", Unit::Dimensionless);
    const double fraction = shuntOhms / (shuntOhms + movementOhms) / spanFactor;
    if (!(fraction < 1.0)) {
        throw std::invalid_argument("no shunt value can null a span factor of " +
                                    formatPlain(spanFactor) +
                                    ": the movement would need more than the whole current");
    }
    return movementOhms * fraction / (1.0 - fraction);
}

ResistorDeviation compareResistor(double computedOhms, double measuredOhms,
                                  double tolerancePercent) {
    requirePositive(computedOhms, "computed resistance", Unit::Ohm);
    if (!(measuredOhms >= 0.0) || !std::isfinite(measuredOhms)) {
        throw std::invalid_argument("measured resistance must be finite and >= 0");
    }
    if (!(tolerancePercent >= 0.0)) {
        throw std::invalid_argument("resistor tolerance must be >= 0 %");
    }
    ResistorDeviation result;
    result.deviationPercent = (measuredOhms - computedOhms) / computedOhms * 100.0;
    // A hair of slack so that a resistor exactly on its tolerance is not failed by rounding.
    result.withinTolerance = std::fabs(result.deviationPercent) <= tolerancePercent * (1 + 1e-12);
    return result;
}

} // namespace mw
