// A small invented meter, its calibrator and people, and calibrations of it in any state, for
// the tests of histories and records. All values are demo data.
#pragma once

#include "core/evaluation/session_evaluation.h"
#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"
#include "core/model/user.h"

#include <chrono>
#include <optional>
#include <vector>

namespace mwtest {

inline constexpr std::int64_t kFixtureRange = 11;

// 10 V DC, class 1.5 on a zero-at-end scale of 50 divisions: ±0.15 V everywhere (IEC 60051-1
// 5.2.3), registered with a 365-day interval.
inline mw::Instrument fixtureMeter() {
    mw::Instrument i;
    i.id = 1;
    i.asset_tag = "DEMO-1";
    i.description = "DC voltmeter, panel";
    i.manufacturer = "Demo Works";
    i.model = "PV-10";
    i.serial = "SN-0001";
    i.owner = "Demo customer";
    i.movement = mw::Movement{1e-3, 100.0};
    i.scale_divisions = 50;
    i.accuracy_class = 1.5;
    i.interval_days = 365;
    mw::RangeSpec volts;
    volts.id = kFixtureRange;
    volts.label = "10 V";
    volts.full_scale = 10.0;
    volts.nominal_ohms = 9900.0;
    i.ranges = {volts};
    return i;
}

// A calibrator with a 20 V DC range of 0.004 % of reading.
inline std::vector<mw::ReferenceStandard> fixtureStandards() {
    mw::ReferenceStandard calibrator;
    calibrator.id = 5;
    calibrator.asset_tag = "STD-5";
    calibrator.description = "Demo calibrator";
    calibrator.certificate_number = "C-1";
    mw::StandardRangeSpec dc;
    dc.label = "20 V DC";
    dc.full_scale = 20.0;
    dc.percent_of_reading = 0.004;
    calibrator.specs = {dc};
    return {calibrator};
}

inline std::vector<mw::User> fixturePeople() {
    return {{7, "tess", "Tess Demo", mw::Role::Technician, true},
            {8, "rowan", "Rowan Demo", mw::Role::Reviewer, true}};
}

inline std::chrono::sys_days fixtureDay(int days) {
    using namespace std::chrono;
    return sys_days{year{2020} / January / 1} + std::chrono::days{days};
}

// Points at 0, 5 and 10 V, read up and down alike; the error at 10 V is `errorAtTop`, half of
// it at 5 V, none at zero.
inline void readPhase(mw::CalibrationSession& s, mw::Phase phase, double errorAtTop) {
    for (int point = 0; point < 3; ++point) {
        const double applied = 5.0 * point;
        const double error = errorAtTop * point / 2.0;
        for (mw::Direction d : {mw::Direction::Up, mw::Direction::Down}) {
            s.readings.push_back(
                {kFixtureRange, point, d, phase, 1, mw::Unit::Volt, applied, applied + error});
        }
    }
}

// A calibration of the fixture meter started on fixtureDay(day) at 09:00 UTC by Tess, sealed
// and evaluated once submitted, approved by Rowan two days later when approved or superseded.
inline mw::CalibrationSession
fixtureCalibration(std::int64_t id, int day, double asFoundAtTop,
                   std::optional<double> asLeftAtTop = std::nullopt,
                   mw::SessionState state = mw::SessionState::Approved) {
    using namespace std::chrono;
    mw::CalibrationSession s;
    s.id = id;
    s.instrument_id = 1;
    s.technician_id = 7;
    s.started_at = mw::Timestamp{fixtureDay(day)} + hours{9};
    s.finished_at = s.started_at + hours{2};
    s.method = "Comparison with a calibrator at five-tenths of the scale, up and down";
    s.standards = {{5, "C-1", fixtureDay(day + 200), ""}};
    s.state = state;
    s.phases = asLeftAtTop ? mw::PhasePlan::AsFoundAndAsLeft : mw::PhasePlan::AsFound;
    for (int point = 0; point < 3; ++point) {
        s.plan.push_back({kFixtureRange, point, 5.0 * point, 1});
    }
    readPhase(s, mw::Phase::AsFound, asFoundAtTop);
    if (asLeftAtTop) {
        readPhase(s, mw::Phase::AsLeft, *asLeftAtTop);
    }
    if (state != mw::SessionState::Draft && state != mw::SessionState::Returned) {
        s.submitted_at = s.started_at + hours{3};
        s.sealed = mw::sealInputs(fixtureMeter(), s, fixtureStandards());
        s.outcome = mw::evaluateSession(fixtureMeter(), s, *s.sealed).overall;
    }
    if (state == mw::SessionState::Approved || state == mw::SessionState::Superseded) {
        s.reviewer_id = 8;
        s.approved_at = s.started_at + days{2};
    }
    return s;
}

} // namespace mwtest
