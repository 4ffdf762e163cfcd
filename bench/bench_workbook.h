// The large workbook the storage benchmarks time: instruments cloned from the demo's register,
// each calibrated once a year for N years with 50 readings, built through the repositories (one
// bulk transaction, then the approvals, each its own commit as approve() asks).
#pragma once

#include "bench/bench_timing.h"

#include "storage/demo/demo_catalogue.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/transaction.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"

#include <QString>

#include <chrono>
#include <cstdio>
#include <vector>

namespace mwbench {

using namespace std::chrono;
using mw::Timestamp;
using mw::storage::Workbook;

struct Settings {
    int instruments = 2000;
    int years = 10;
    QString keep;
};

// 50 readings: five cardinal points, up and down, five repeats each.
inline std::vector<mw::Reading> readingsOf(const mw::Instrument& instrument, int count,
                                           double drift) {
    const mw::RangeSpec& range = instrument.ranges.front();
    std::vector<mw::Reading> readings;
    for (int i = 0; i < count; ++i) {
        mw::Reading reading;
        reading.range_id = range.id;
        reading.point_index = i % 5;
        reading.direction = (i / 5) % 2 == 0 ? mw::Direction::Up : mw::Direction::Down;
        reading.repeat = 1 + i / 10;
        reading.unit = range.unit;
        const double mark = range.full_scale * (reading.point_index + 1) / 5.0;
        reading.indicated = mark;
        reading.applied = mark * (1.0 - drift + 1e-4 * (i % 7));
        readings.push_back(reading);
    }
    return readings;
}

struct People {
    std::int64_t technician = 0;
    std::int64_t reviewer = 0;
};

inline mw::CalibrationSession sessionOf(const mw::Instrument& instrument, const People& people,
                                        std::int64_t standardId, sys_days day, int readings) {
    mw::CalibrationSession session;
    session.instrument_id = instrument.id;
    session.technician_id = people.technician;
    session.started_at = day + hours(9);
    session.finished_at = day + hours(10);
    session.method = "Comparison with the calibrator; pointer on the cardinal marks.";
    // An empty certificate makes the repository copy the standard's current one (the database
    // refuses copies that differ from it).
    session.standards.push_back({standardId, "", {}, ""});
    session.readings =
        readingsOf(instrument, readings, 1e-3 * (day.time_since_epoch().count() % 9));
    return session;
}

// The bulk path: every write of the build joins one outer transaction, except the approvals:
// approve() asks for synchronous=FULL, which SQLite refuses to change inside an open transaction,
// so each approval commits on its own while a nested guard cannot ask for FULL.
inline void build(const QString& path, const Settings& settings) {
    mw::storage::OpenOptions options;
    options.createIfMissing = true;
    Workbook workbook(path, options);
    mw::storage::UserRepository users(workbook);
    mw::User technician{0, "bench-tech", "Bench Technician", mw::Role::Technician, true};
    mw::User reviewer{0, "bench-review", "Bench Reviewer", mw::Role::Reviewer, true};
    users.add(technician, QStringLiteral("bench-password"));
    users.add(reviewer, QStringLiteral("bench-password"));
    const People people{technician.id, reviewer.id};
    const sys_days today = floor<days>(system_clock::now());
    std::vector<mw::ReferenceStandard> standards = mw::demo::demoStandards(today + days(400));
    const std::vector<mw::Instrument> catalogue = mw::demo::demoInstruments();

    std::vector<std::pair<std::int64_t, Timestamp>> toApprove;
    const double bulkMs = millisecondsOf([&] {
        mw::storage::Transaction transaction(workbook);
        mw::storage::StandardRepository(workbook).add(standards.front());
        mw::storage::InstrumentRepository instruments(workbook);
        mw::storage::SessionRepository sessions(workbook);
        for (int i = 0; i < settings.instruments; ++i) {
            mw::Instrument instrument = catalogue[static_cast<std::size_t>(i) % catalogue.size()];
            instrument.asset_tag = "BW-" + std::to_string(10000 + i);
            instrument.status = mw::InstrumentStatus::InService;
            instruments.add(instrument);
            for (int year = settings.years; year >= 1; --year) {
                const sys_days day = today - days(365 * year - (i % 300));
                mw::CalibrationSession session =
                    sessionOf(instrument, people, standards.front().id, day, 50);
                sessions.create(session);
                sessions.submit(session.id, *session.finished_at + minutes(5));
                // One instrument in ten has its latest record still waiting for review.
                if (year > 1 || i % 10 != 0) {
                    toApprove.emplace_back(session.id, session.started_at + days(2));
                }
            }
        }
        transaction.commit();
    });
    std::printf("  bulk part (one transaction): %.1f s\n", bulkMs / 1000);
    std::fflush(stdout);
    mw::storage::SessionRepository sessions(workbook);
    const mw::storage::ApprovalSigner signer = mw::storage::unlockApprovalKey(
        workbook, people.reviewer, QStringLiteral("bench-password"), today - days(365 * 20));
    const double approveMs = millisecondsOf([&] {
        for (std::size_t i = 0; i < toApprove.size(); ++i) {
            sessions.approve(toApprove[i].first, signer, toApprove[i].second);
            if ((i + 1) % 2000 == 0) {
                std::printf("  approved %zu of %zu\n", i + 1, toApprove.size());
                std::fflush(stdout);
            }
        }
    });
    std::printf("  approvals (one commit each): %.1f s\n", approveMs / 1000);
}

} // namespace mwbench
