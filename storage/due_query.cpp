// The due list's reads: the latest approved calibration of each instrument comes from the
// sessions_by_state index, so the cost grows with the number of instruments, not of readings.
#include "storage/due_query.h"

#include "storage/lab_repository.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/standard_repository.h"
#include "storage/workbook.h"

#include <QSqlQuery>
#include <QVariant>

#include <map>

namespace mw::storage {
namespace {

// The latest approved calibration of instrument i (a superseded record's amendment is the
// approved one).
const char* const kLatestApproved =
    "(SELECT s.id FROM calibration_sessions s WHERE s.state = 'approved' AND "
    "s.instrument_id = i.id ORDER BY s.started_at DESC, s.id DESC LIMIT 1)";

} // namespace

std::vector<InstrumentDueSource> dueSources(Workbook& workbook) {
    const QSqlDatabase db = workbook.database();
    const QString latest = QString::fromLatin1(kLatestApproved);
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT i.id, i.asset_tag, i.description, i.location, i.status, "
                           "i.interval_days, s.id, s.started_at FROM instruments i LEFT JOIN "
                           "calibration_sessions s ON s.id = %1 WHERE i.status <> 'retired' "
                           "ORDER BY i.asset_tag")
                .arg(latest));
    sql::exec(q, QStringLiteral("reading the instruments for the due list"));
    std::vector<InstrumentDueSource> sources;
    std::map<std::int64_t, std::size_t> bySession;
    while (q.next()) {
        InstrumentDueSource source;
        source.instrumentId = q.value(0).toLongLong();
        source.assetTag = sql::toStd(q.value(1));
        source.description = sql::toStd(q.value(2));
        source.location = sql::toStd(q.value(3));
        source.status = sql::enumFrom<InstrumentStatus>(q.value(4), "instruments.status");
        source.intervalDays = q.value(5).toInt();
        if (!q.value(6).isNull()) {
            source.lastSessionId = q.value(6).toLongLong();
            source.lastCalibrated =
                std::chrono::floor<std::chrono::days>(sql::timestampFrom(q.value(7)));
            bySession[*source.lastSessionId] = sources.size();
        }
        sources.push_back(std::move(source));
    }
    QSqlQuery used = sql::prepare(
        db, QStringLiteral("SELECT u.session_id, u.standard_id FROM session_standards u JOIN "
                           "(SELECT %1 AS session_id FROM instruments i WHERE i.status <> "
                           "'retired') latest ON latest.session_id = u.session_id ORDER BY "
                           "u.session_id, u.id")
                .arg(latest));
    sql::exec(used, QStringLiteral("reading the standards of the latest calibrations"));
    while (used.next()) {
        const auto it = bySession.find(used.value(0).toLongLong());
        if (it != bySession.end()) {
            sources[it->second].standardsUsed.push_back(used.value(1).toLongLong());
        }
    }
    // Oldest first: the latest open calibration of an instrument is the one kept.
    std::map<std::int64_t, std::size_t> byInstrument;
    for (std::size_t i = 0; i < sources.size(); ++i) {
        byInstrument[sources[i].instrumentId] = i;
    }
    for (const OpenSession& open : SessionRepository(workbook).openSessions()) {
        if (const auto it = byInstrument.find(open.instrument_id); it != byInstrument.end()) {
            sources[it->second].openSessionId = open.id;
            sources[it->second].openState = open.state;
        }
    }
    return sources;
}

DueReport dueReport(Workbook& workbook, std::chrono::sys_days asOf, std::optional<int> withinDays) {
    DueReport report;
    report.asOf = asOf;
    if (withinDays) {
        report.withinDays = *withinDays;
    } else if (const auto lab = LabRepository(workbook).load()) {
        report.withinDays = lab->due_window_days;
    }
    report.entries = selectDue(dueSources(workbook), StandardRepository(workbook).all(), asOf,
                               report.withinDays);
    return report;
}

} // namespace mw::storage
