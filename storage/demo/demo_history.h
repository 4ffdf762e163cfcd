// How one demo meter behaves over the years (drift, friction, non-linearity) and what a
// technician records each time it is calibrated: readings, resistor checks, adjustments.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "storage/demo/demo_random.h"

#include <cstdint>
#include <optional>
#include <vector>

namespace mw::demo {

struct SessionContent {
    std::vector<Reading> readings;
    std::vector<ResistorCheck> resistor_checks;
    std::vector<AdjustmentNote> adjustments;
    int minutes = 0; // bench time the work took
};

// The largest |indicated - applied| of `readings` in `phase` as a fraction of the limit of
// error of its range (class index % of the fiducial value, IEC 60051-1). What the simulated
// technician looks at to decide whether to adjust; the verdict comes from the session evaluator.
// Zero when there is no such reading.
double worstErrorFraction(const Instrument& instrument, const std::vector<Reading>& readings,
                          Phase phase);

// A meter given a steady part in the history screens: its span error starts at `startPct` and
// changes by `ratePctPerYear` (both in % of the fiducial value), with little randomness besides,
// and it is adjusted only when found out of tolerance.
struct ScriptedDrift {
    double startPct = 0.0;
    double ratePctPerYear = 0.0;
};

class MeterSimulation {
public:
    // `instrument` must have its range ids. A fast-drifting meter drifts by most of its class
    // index a year, so it is found out of tolerance now and then.
    MeterSimulation(const Instrument& instrument, std::uint64_t seed, bool fastDrift,
                    std::optional<ScriptedDrift> script = std::nullopt);

    // Time in service since the last calibration.
    void age(int days);

    // A full calibration starting at `start`: as-found, an adjustment and as-left when the
    // meter was out of (or close to) tolerance; resistor checks on the first visit and on any
    // range whose resistor is replaced.
    SessionContent calibrate(Timestamp start, bool firstVisit);

    // A meter whose pivot has been damaged: as-found only, not adjustable, failed.
    SessionContent calibrateDamaged(Timestamp start);

    // The first `count` as-found readings of a calibration still in progress.
    SessionContent partialAsFound(int count);

private:
    struct RangeState {
        double span_pct = 0.0;      // extra span error of this range's resistor, % of fiducial
        double span_rate_pct = 0.0; // per year
    };
    std::vector<Reading> run(Phase phase);
    Reading readAt(std::size_t rangeIndex, int pointIndex, double nominal, Direction direction,
                   Phase phase);
    double errorPercent(std::size_t rangeIndex, double nominal, Direction direction);
    void adjust(Timestamp at, const std::vector<Reading>& asFound, SessionContent& content);
    ResistorCheck checkResistor(std::size_t rangeIndex);

    const Instrument& instrument_;
    DemoRandom random_;
    double class_;
    double zero_pct_ = 0.0;
    double span_pct_ = 0.0;
    double span_rate_pct_ = 0.0;
    double nonlinear_pct_ = 0.0;
    double friction_pct_ = 0.0;
    double rectifier_pct_ = 0.0; // low-end loss of a rectifier meter
    bool damaged_ = false;
    double walk_ = 0.05;        // random walk of zero and span, class index per sqrt(year)
    double wear_ = 0.01;        // growth of friction, class index per year
    double adjustAbove_ = 0.75; // share of the limit above which the technician adjusts
    std::vector<RangeState> ranges_;
};

} // namespace mw::demo
