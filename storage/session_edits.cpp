// The edits a technician makes to a draft at the bench, each in its own short transaction and
// each returning what undoing it needs (the row as it was, or the rows it took away).
#include "storage/session_parts.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

std::optional<TestPoint> findPoint(const QSqlDatabase& db, std::int64_t sessionId,
                                   std::int64_t rangeId, int pointIndex) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT nominal, repeats FROM session_points "
                                                  "WHERE session_id = ? AND range_id = ? AND "
                                                  "point_index = ?"));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(rangeId));
    q.addBindValue(pointIndex);
    sql::exec(q, QStringLiteral("reading the plan of session %1").arg(sessionId));
    if (!q.next()) {
        return std::nullopt;
    }
    return TestPoint{rangeId, pointIndex, q.value(0).toDouble(), q.value(1).toInt()};
}

TestPoint requirePoint(const QSqlDatabase& db, std::int64_t sessionId, std::int64_t rangeId,
                       int pointIndex) {
    if (auto point = findPoint(db, sessionId, rangeId, pointIndex)) {
        return *point;
    }
    throw WorkbookError(Kind::NotFound, QStringLiteral("session %1 plans no point %2 on range %3")
                                            .arg(sessionId)
                                            .arg(pointIndex + 1)
                                            .arg(rangeId));
}

void requireRepeats(int repeats) {
    if (repeats < 1 || repeats > 20) {
        throw WorkbookError(
            Kind::BadInput,
            QStringLiteral("a test point is taken 1 to 20 times, not %1").arg(repeats));
    }
}

// Reads the one row of `table` with `id` in `sessionId`, for an undo to put back.
QSqlQuery rowOf(const QSqlDatabase& db, const QString& columns, const QString& table,
                std::int64_t sessionId, std::int64_t id) {
    QSqlQuery q = sql::prepare(
        db,
        QStringLiteral("SELECT %1 FROM %2 WHERE session_id = ? AND id = ?").arg(columns, table));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(id));
    sql::exec(q, QStringLiteral("reading %1 of session %2").arg(table).arg(sessionId));
    if (!q.next()) {
        throw WorkbookError(
            Kind::NotFound,
            QStringLiteral("session %1 has no row %2 in %3").arg(sessionId).arg(id).arg(table));
    }
    return q;
}

void deleteRow(const QSqlDatabase& db, const QString& table, std::int64_t id) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("DELETE FROM %1 WHERE id = ?").arg(table));
    q.addBindValue(qint64(id));
    sql::exec(q, QStringLiteral("removing row %1 of %2").arg(id).arg(table));
}

} // namespace

std::optional<Reading> SessionRepository::putReading(std::int64_t sessionId,
                                                     const Reading& reading) {
    return putReadings(sessionId, {reading}).front();
}

std::vector<std::optional<Reading>>
SessionRepository::putReadings(std::int64_t sessionId, const std::vector<Reading>& readings) {
    Transaction transaction(workbook_);
    std::vector<std::optional<Reading>> previous;
    for (const Reading& reading : readings) {
        previous.push_back(detail::putReading(workbook_.database(), sessionId, reading));
    }
    transaction.commit();
    return previous;
}

std::vector<std::optional<Reading>>
SessionRepository::setReadings(std::int64_t sessionId, const std::vector<ReadingChange>& changes) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    std::vector<std::optional<Reading>> previous;
    for (const ReadingChange& change : changes) {
        if (change.value) {
            if (keyOf(*change.value) != change.key) {
                throw WorkbookError(Kind::BadInput,
                                    QStringLiteral("a reading set under another reading's key"));
            }
            previous.push_back(detail::putReading(db, sessionId, *change.value));
            continue;
        }
        previous.push_back(detail::findReading(db, sessionId, change.key));
        if (previous.back()) {
            detail::deleteReading(db, sessionId, change.key);
        }
    }
    transaction.commit();
    return previous;
}

Reading SessionRepository::removeReading(std::int64_t sessionId, const ReadingKey& key) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    const std::optional<Reading> removed = detail::findReading(db, sessionId, key);
    if (!removed) {
        throw WorkbookError(Kind::NotFound,
                            QStringLiteral("session %1 has no such reading to remove (point %2, "
                                           "%3, %4, repeat %5)")
                                .arg(sessionId)
                                .arg(key.point_index + 1)
                                .arg(sql::enumText(key.direction), sql::enumText(key.phase))
                                .arg(key.repeat));
    }
    detail::deleteReading(db, sessionId, key);
    transaction.commit();
    return *removed;
}

TestPoint SessionRepository::addTestPoint(std::int64_t sessionId, std::int64_t rangeId,
                                          double nominal, int repeats) {
    requireRepeats(repeats);
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    // The next index no point or reading of the range uses (an upgraded record's readings may
    // use indices its empty plan does not).
    QSqlQuery next = sql::prepare(
        db, QStringLiteral("SELECT max(i) FROM (SELECT max(point_index) AS i FROM session_points "
                           "WHERE session_id = ? AND range_id = ? UNION ALL SELECT "
                           "max(point_index) FROM readings WHERE session_id = ? AND range_id = "
                           "?)"));
    for (int twice = 0; twice < 2; ++twice) {
        next.addBindValue(qint64(sessionId));
        next.addBindValue(qint64(rangeId));
    }
    sql::exec(next, QStringLiteral("planning a point in session %1").arg(sessionId));
    next.next();
    const int index = next.value(0).isNull() ? 0 : next.value(0).toInt() + 1;
    next.finish();
    const TestPoint point{rangeId, index, nominal, repeats};
    detail::insertPlan(db, sessionId, {point});
    transaction.commit();
    return point;
}

TestPoint SessionRepository::updateTestPoint(std::int64_t sessionId, const TestPoint& point) {
    requireRepeats(point.repeats);
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    const TestPoint previous = requirePoint(db, sessionId, point.range_id, point.point_index);
    QSqlQuery q = sql::prepare(db, QStringLiteral("UPDATE session_points SET nominal = ?, repeats "
                                                  "= ? WHERE session_id = ? AND range_id = ? AND "
                                                  "point_index = ?"));
    q.addBindValue(point.nominal);
    q.addBindValue(point.repeats);
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(point.range_id));
    q.addBindValue(point.point_index);
    sql::exec(q, QStringLiteral("changing point %1 of session %2")
                     .arg(point.point_index + 1)
                     .arg(sessionId));
    transaction.commit();
    return previous;
}

RemovedPoint SessionRepository::removeTestPoint(std::int64_t sessionId, std::int64_t rangeId,
                                                int pointIndex) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    RemovedPoint removed{requirePoint(db, sessionId, rangeId, pointIndex), {}};
    const auto session = find(sessionId);
    for (const Reading& reading : session->readings) {
        if (reading.range_id == rangeId && reading.point_index == pointIndex) {
            removed.readings.push_back(reading);
            detail::deleteReading(db, sessionId, keyOf(reading));
        }
    }
    QSqlQuery q = sql::prepare(db, QStringLiteral("DELETE FROM session_points WHERE session_id = "
                                                  "? AND range_id = ? AND point_index = ?"));
    q.addBindValue(qint64(sessionId));
    q.addBindValue(qint64(rangeId));
    q.addBindValue(pointIndex);
    sql::exec(q,
              QStringLiteral("removing point %1 of session %2").arg(pointIndex + 1).arg(sessionId));
    transaction.commit();
    return removed;
}

void SessionRepository::restoreTestPoint(std::int64_t sessionId, const RemovedPoint& removed) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    detail::insertPlan(db, sessionId, {removed.point});
    detail::insertReadings(db, sessionId, removed.readings);
    transaction.commit();
}

ResistorCheck SessionRepository::addResistorCheck(std::int64_t sessionId, ResistorCheck check) {
    Transaction transaction(workbook_);
    check.id = detail::insertResistorCheck(workbook_.database(), sessionId, check);
    transaction.commit();
    return check;
}

ResistorCheck SessionRepository::removeResistorCheck(std::int64_t sessionId, std::int64_t checkId) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    const QSqlQuery q = rowOf(db,
                              QStringLiteral("range_id, component, computed_ohms, measured_ohms, "
                                             "tolerance_percent"),
                              QStringLiteral("resistor_checks"), sessionId, checkId);
    const ResistorCheck removed{checkId,
                                q.value(0).toLongLong(),
                                sql::toStd(q.value(1)),
                                q.value(2).toDouble(),
                                q.value(3).toDouble(),
                                q.value(4).toDouble()};
    deleteRow(db, QStringLiteral("resistor_checks"), checkId);
    transaction.commit();
    return removed;
}

AdjustmentNote SessionRepository::addAdjustmentNote(std::int64_t sessionId, AdjustmentNote note) {
    if (note.text.find_first_not_of(" \t\r\n") == std::string::npos) {
        throw WorkbookError(Kind::BadInput, QStringLiteral("an adjustment note needs some text"));
    }
    Transaction transaction(workbook_);
    note.id = detail::insertAdjustmentNote(workbook_.database(), sessionId, note);
    transaction.commit();
    return note;
}

AdjustmentNote SessionRepository::removeAdjustmentNote(std::int64_t sessionId,
                                                       std::int64_t noteId) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    const QSqlQuery q = rowOf(db, QStringLiteral("noted_at, note_text"),
                              QStringLiteral("adjustment_notes"), sessionId, noteId);
    const AdjustmentNote removed{noteId, sql::timestampFrom(q.value(0)), sql::toStd(q.value(1))};
    deleteRow(db, QStringLiteral("adjustment_notes"), noteId);
    transaction.commit();
    return removed;
}

} // namespace mw::storage
