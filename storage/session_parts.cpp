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

namespace {

QString readingContext(const Reading& r, std::int64_t sessionId) {
    return QStringLiteral("saving reading %1 (%2, %3, repeat %4) of session %5")
        .arg(r.point_index + 1)
        .arg(sql::enumText(r.direction), sql::enumText(r.phase))
        .arg(r.repeat)
        .arg(sessionId);
}

// Binds the key columns of a reading in table order after its session.
void bindKey(QSqlQuery& q, std::int64_t sessionId, const ReadingKey& key) {
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(key.range_id));
    q.addBindValue(key.point_index);
    q.addBindValue(sql::enumText(key.direction));
    q.addBindValue(sql::enumText(key.phase));
    q.addBindValue(key.repeat);
}

const QString kKeyCondition = QStringLiteral(
    "session_id = ? AND range_id = ? AND point_index = ? AND direction = ? AND phase = ? AND "
    "repeat_number = ?");

} // namespace

void insertReadings(const QSqlDatabase& db, std::int64_t sessionId,
                    const std::vector<Reading>& readings) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO readings (session_id, range_id, point_index, direction, "
                           "phase, repeat_number, unit, applied, indicated) VALUES "
                           "(?, ?, ?, ?, ?, ?, ?, ?, ?)"));
    for (const Reading& r : readings) {
        const QString context = readingContext(r, sessionId);
        bindKey(q, sessionId, keyOf(r));
        q.addBindValue(sql::unitText(r.unit, context));
        q.addBindValue(r.applied);
        q.addBindValue(sql::nullableReal(r.indicated));
        sql::exec(q, context);
    }
}

std::optional<Reading> findReading(const QSqlDatabase& db, std::int64_t sessionId,
                                   const ReadingKey& key) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT unit, applied, indicated FROM readings WHERE ") + kKeyCondition);
    bindKey(q, sessionId, key);
    sql::exec(q, QStringLiteral("reading a reading of session %1").arg(sessionId));
    if (!q.next()) {
        return std::nullopt;
    }
    Reading r;
    r.range_id = key.range_id;
    r.point_index = key.point_index;
    r.direction = key.direction;
    r.phase = key.phase;
    r.repeat = key.repeat;
    r.unit = sql::unitFrom(q.value(0));
    r.applied = q.value(1).toDouble();
    if (!q.value(2).isNull()) {
        r.indicated = q.value(2).toDouble();
    }
    return r;
}

std::optional<Reading> putReading(const QSqlDatabase& db, std::int64_t sessionId,
                                  const Reading& reading) {
    const QString context = readingContext(reading, sessionId);
    std::optional<Reading> previous = findReading(db, sessionId, keyOf(reading));
    if (!previous) {
        insertReadings(db, sessionId, {reading});
        return previous;
    }
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("UPDATE readings SET unit = ?, applied = ?, indicated = ? WHERE ") +
                kKeyCondition);
    q.addBindValue(sql::unitText(reading.unit, context));
    q.addBindValue(reading.applied);
    q.addBindValue(sql::nullableReal(reading.indicated));
    bindKey(q, sessionId, keyOf(reading));
    sql::exec(q, context);
    return previous;
}

void deleteReading(const QSqlDatabase& db, std::int64_t sessionId, const ReadingKey& key) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("DELETE FROM readings WHERE ") + kKeyCondition);
    bindKey(q, sessionId, key);
    sql::exec(q, QStringLiteral("removing a reading of session %1").arg(sessionId));
}

void insertPlan(const QSqlDatabase& db, std::int64_t sessionId,
                const std::vector<TestPoint>& points) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("INSERT INTO session_points (session_id, "
                                                  "range_id, point_index, nominal, repeats) "
                                                  "VALUES (?, ?, ?, ?, ?)"));
    for (const TestPoint& point : points) {
        q.addBindValue(qint64(sessionId));
        q.addBindValue(qint64(point.range_id));
        q.addBindValue(point.point_index);
        q.addBindValue(point.nominal);
        q.addBindValue(point.repeats);
        sql::exec(q, QStringLiteral("planning point %1 of range %2 in session %3")
                         .arg(point.point_index + 1)
                         .arg(point.range_id)
                         .arg(sessionId));
    }
}

std::int64_t insertResistorCheck(const QSqlDatabase& db, std::int64_t sessionId,
                                 const ResistorCheck& check) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO resistor_checks (session_id, range_id, component, "
                           "computed_ohms, measured_ohms, tolerance_percent) VALUES "
                           "(?, ?, ?, ?, ?, ?) RETURNING id"));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(check.range_id));
    q.addBindValue(QString::fromStdString(check.component));
    q.addBindValue(check.computed_ohms);
    q.addBindValue(check.measured_ohms);
    q.addBindValue(check.tolerance_percent);
    sql::exec(q, QStringLiteral("saving resistor check \"%1\" of session %2")
                     .arg(QString::fromStdString(check.component))
                     .arg(sessionId));
    q.next();
    const std::int64_t id = q.value(0).toLongLong();
    q.finish();
    return id;
}

std::int64_t insertAdjustmentNote(const QSqlDatabase& db, std::int64_t sessionId,
                                  const AdjustmentNote& note) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("INSERT INTO adjustment_notes (session_id, "
                                                  "noted_at, note_text) VALUES (?, ?, ?) "
                                                  "RETURNING id"));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(sql::toIso(note.at));
    q.addBindValue(QString::fromStdString(note.text));
    sql::exec(q, QStringLiteral("saving an adjustment note of session %1").arg(sessionId));
    q.next();
    const std::int64_t id = q.value(0).toLongLong();
    q.finish();
    return id;
}

void requireOneRow(const QSqlQuery& query, std::int64_t sessionId) {
    if (query.numRowsAffected() != 1) {
        throw WorkbookError(WorkbookError::Kind::NotFound,
                            QStringLiteral("no calibration session with id %1").arg(sessionId));
    }
}

} // namespace mw::storage::detail
