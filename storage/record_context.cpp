// Reads the instrument specification and the signatories an approved record's digest covers.
#include "storage/record_context.h"

#include "storage/instrument_rows.h"
#include "storage/sql_support.h"

#include <QSqlQuery>

namespace mw::storage {
namespace {

// The same rows the register reads; nominal_ohms comes along but is never digested (an
// adjustment may legitimately change it).
void readInstruments(const QSqlDatabase& db, const QString& condition, const QVariant& value,
                     std::map<std::int64_t, Instrument>& into) {
    QSqlQuery q = sql::prepare(db, rows::selectInstruments() + condition);
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading the instruments of approved records"));
    while (q.next()) {
        Instrument i = rows::instrumentFrom(q);
        into.emplace(i.id, std::move(i));
    }
}

void readRanges(const QSqlDatabase& db, const QString& condition, const QVariant& value,
                std::map<std::int64_t, Instrument>& instruments) {
    QSqlQuery q = sql::prepare(db, rows::selectRanges() + condition +
                                       QStringLiteral(" ORDER BY instrument_id, sort_order"));
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading the ranges of approved records"));
    while (q.next()) {
        const auto owner = instruments.find(q.value(1).toLongLong());
        if (owner != instruments.end()) {
            owner->second.ranges.push_back(rows::rangeFrom(q));
        }
    }
}

std::optional<User> lookUp(const std::map<std::int64_t, User>& users,
                           std::optional<std::int64_t> id) {
    if (!id) {
        return std::nullopt;
    }
    const auto found = users.find(*id);
    return found == users.end() ? std::nullopt : std::optional(found->second);
}

} // namespace

RecordContexts::RecordContexts(const QSqlDatabase& db, std::optional<std::int64_t> instrumentId) {
    const QString condition = instrumentId ? QStringLiteral("WHERE id = ?") : QString();
    const QVariant value = instrumentId ? QVariant(qint64(*instrumentId)) : QVariant();
    readInstruments(db, condition, value, instruments_);
    readRanges(db, instrumentId ? QStringLiteral("WHERE instrument_id = ?") : QString(), value,
               instruments_);
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT id, login, full_name FROM users"));
    sql::exec(q, QStringLiteral("reading the signatories of approved records"));
    while (q.next()) {
        User u;
        u.id = q.value(0).toLongLong();
        u.login = sql::toStd(q.value(1));
        u.full_name = sql::toStd(q.value(2));
        users_.emplace(u.id, std::move(u));
    }
}

RecordContext RecordContexts::of(const CalibrationSession& session) const {
    RecordContext context;
    if (const auto found = instruments_.find(session.instrument_id); found != instruments_.end()) {
        context.instrument = found->second;
    }
    context.technician = lookUp(users_, session.technician_id);
    context.reviewer = lookUp(users_, session.reviewer_id);
    return context;
}

} // namespace mw::storage
