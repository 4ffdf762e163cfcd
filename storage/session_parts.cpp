// Row inserts for the parts of a session, with prepared statements reused across rows.
#include "storage/session_parts.h"

#include "storage/sql_support.h"

namespace mw::storage::detail {

void insertStandards(const QSqlDatabase& db, std::int64_t sessionId,
                     const std::vector<StandardUse>& standards) {
    QSqlQuery current = sql::prepare(db, QStringLiteral("SELECT certificate_number, due_date "
                                                        "FROM reference_standards WHERE id = ?"));
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO session_standards (session_id, standard_id, "
                           "certificate_number, due_date, overdue_justification) VALUES "
                           "(?, ?, ?, ?, ?)"));
    for (const StandardUse& use : standards) {
        QString certificate = QString::fromStdString(use.certificate_number);
        QString due = sql::toIsoDate(use.due_date);
        if (certificate.isEmpty()) {
            current.addBindValue(qint64(use.standard_id));
            sql::exec(current,
                      QStringLiteral("reading reference standard %1").arg(use.standard_id));
            if (!current.next()) {
                throw WorkbookError(
                    WorkbookError::Kind::NotFound,
                    QStringLiteral("no reference standard with id %1").arg(use.standard_id));
            }
            certificate = current.value(0).toString();
            due = current.value(1).toString();
            current.finish();
        }
        q.addBindValue(qint64(sessionId));
        q.addBindValue(qint64(use.standard_id));
        q.addBindValue(certificate);
        q.addBindValue(due);
        q.addBindValue(QString::fromStdString(use.overdue_justification));
        sql::exec(q, QStringLiteral("recording standard %1 as used by session %2")
                         .arg(use.standard_id)
                         .arg(sessionId));
    }
}

void insertReadings(const QSqlDatabase& db, std::int64_t sessionId,
                    const std::vector<Reading>& readings) {
    // Portable upsert (SQLite 3.24+, PostgreSQL 9.5+) on the reading's natural key.
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO readings (session_id, range_id, point_index, direction, "
                           "phase, repeat_number, unit, applied, indicated) VALUES "
                           "(?, ?, ?, ?, ?, ?, ?, ?, ?) ON CONFLICT (session_id, range_id, "
                           "point_index, direction, phase, repeat_number) DO UPDATE SET unit = "
                           "excluded.unit, applied = excluded.applied, indicated = "
                           "excluded.indicated"));
    for (const Reading& r : readings) {
        const QString context =
            QStringLiteral("saving reading %1 (%2, %3, repeat %4) of session %5")
                .arg(r.point_index)
                .arg(sql::enumText(r.direction), sql::enumText(r.phase))
                .arg(r.repeat)
                .arg(sessionId);
        q.addBindValue(qint64(sessionId));
        q.addBindValue(qint64(r.range_id));
        q.addBindValue(r.point_index);
        q.addBindValue(sql::enumText(r.direction));
        q.addBindValue(sql::enumText(r.phase));
        q.addBindValue(r.repeat);
        q.addBindValue(sql::unitText(r.unit, context));
        q.addBindValue(r.applied);
        q.addBindValue(r.indicated);
        sql::exec(q, context);
    }
}

void insertResistorCheck(const QSqlDatabase& db, std::int64_t sessionId,
                         const ResistorCheck& check) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO resistor_checks (session_id, range_id, component, "
                           "computed_ohms, measured_ohms, tolerance_percent) VALUES "
                           "(?, ?, ?, ?, ?, ?)"));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(check.range_id));
    q.addBindValue(QString::fromStdString(check.component));
    q.addBindValue(check.computed_ohms);
    q.addBindValue(check.measured_ohms);
    q.addBindValue(check.tolerance_percent);
    sql::exec(q, QStringLiteral("saving resistor check \"%1\" of session %2")
                     .arg(QString::fromStdString(check.component))
                     .arg(sessionId));
}

void insertAdjustmentNote(const QSqlDatabase& db, std::int64_t sessionId,
                          const AdjustmentNote& note) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("INSERT INTO adjustment_notes (session_id, "
                                                  "noted_at, note_text) VALUES (?, ?, ?)"));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(sql::toIso(note.at));
    q.addBindValue(QString::fromStdString(note.text));
    sql::exec(q, QStringLiteral("saving an adjustment note of session %1").arg(sessionId));
}

void requireOneRow(const QSqlQuery& query, std::int64_t sessionId) {
    if (query.numRowsAffected() != 1) {
        throw WorkbookError(WorkbookError::Kind::NotFound,
                            QStringLiteral("no calibration session with id %1").arg(sessionId));
    }
}

} // namespace mw::storage::detail
