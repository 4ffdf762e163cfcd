// Quick questions about sessions that need none of their contents (the register's).
#include "storage/session_repository.h"

#include "storage/sql_support.h"
#include "storage/workbook.h"

namespace mw::storage {

std::vector<OpenSession>
SessionRepository::openSessions(std::optional<std::int64_t> instrumentId) const {
    QSqlQuery q = sql::prepare(
        workbook_.database(),
        QStringLiteral("SELECT id, instrument_id, state FROM calibration_sessions WHERE state IN "
                       "('draft', 'returned', 'submitted') AND (? IS NULL OR instrument_id = ?) "
                       "ORDER BY started_at, id"));
    const QVariant instrument =
        instrumentId ? QVariant(qint64(*instrumentId)) : QVariant(QMetaType(QMetaType::LongLong));
    q.addBindValue(instrument);
    q.addBindValue(instrument);
    sql::exec(q, QStringLiteral("listing the calibrations not yet approved"));
    std::vector<OpenSession> open;
    while (q.next()) {
        OpenSession session;
        session.id = q.value(0).toLongLong();
        session.instrument_id = q.value(1).toLongLong();
        session.state = sql::enumFrom<SessionState>(q.value(2), "calibration_sessions.state");
        open.push_back(session);
    }
    return open;
}

bool SessionRepository::hasApprovedRecords(std::int64_t instrumentId) const {
    QSqlQuery q = sql::prepare(workbook_.database(),
                               QStringLiteral("SELECT EXISTS (SELECT 1 FROM calibration_sessions "
                                              "WHERE instrument_id = ? AND state IN ('approved', "
                                              "'superseded'))"));
    q.addBindValue(qint64(instrumentId));
    sql::exec(q, QStringLiteral("looking for approved records of instrument %1").arg(instrumentId));
    return q.next() && q.value(0).toInt() != 0;
}

std::map<std::int64_t, Outcome> SessionRepository::latestApprovedOutcomes() const {
    QSqlQuery q = sql::prepare(
        workbook_.database(),
        QStringLiteral("SELECT instrument_id, outcome FROM (SELECT instrument_id, outcome, "
                       "ROW_NUMBER() OVER (PARTITION BY instrument_id ORDER BY started_at DESC, "
                       "id DESC) AS newest FROM calibration_sessions WHERE state = 'approved') "
                       "WHERE newest = 1"));
    sql::exec(q, QStringLiteral("reading the latest outcome of each instrument"));
    std::map<std::int64_t, Outcome> outcomes;
    while (q.next()) {
        outcomes[q.value(0).toLongLong()] =
            sql::enumFrom<Outcome>(q.value(1), "calibration_sessions.outcome");
    }
    return outcomes;
}

} // namespace mw::storage
