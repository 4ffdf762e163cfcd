// Reads the instrument specification and the signatories an approved record's digest covers.
#include "storage/record_context.h"

#include "storage/sql_support.h"

#include <QSqlQuery>

namespace mw::storage {
namespace {

// Rows read with the same columns the instrument repository writes; nominal_ohms is read too
// but never digested (an adjustment may legitimately change it).
void readInstruments(const QSqlDatabase& db, const QString& condition, const QVariant& value,
                     std::map<std::int64_t, Instrument>& into) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT id, asset_tag, serial, kind, movement_amps_fs, movement_ohms, "
                           "scale_type, scale_divisions, accuracy_class FROM instruments ") +
                condition);
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading the instruments of approved records"));
    while (q.next()) {
        Instrument i;
        i.id = q.value(0).toLongLong();
        i.asset_tag = sql::toStd(q.value(1));
        i.serial = sql::toStd(q.value(2));
        i.kind = sql::enumFrom<InstrumentKind>(q.value(3), "instruments.kind");
        i.movement = {q.value(4).toDouble(), q.value(5).toDouble()};
        i.scale_type = sql::enumFrom<ScaleType>(q.value(6), "instruments.scale_type");
        i.scale_divisions = q.value(7).toInt();
        i.accuracy_class = q.value(8).toDouble();
        into.emplace(i.id, std::move(i));
    }
}

void readRanges(const QSqlDatabase& db, const QString& condition, const QVariant& value,
                std::map<std::int64_t, Instrument>& instruments) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT id, instrument_id, label, unit, lower_limit, full_scale, "
                           "nominal_ohms, fiducial_value FROM instrument_ranges ") +
                condition + QStringLiteral(" ORDER BY instrument_id, sort_order"));
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading the ranges of approved records"));
    while (q.next()) {
        const auto owner = instruments.find(q.value(1).toLongLong());
        if (owner == instruments.end()) {
            continue;
        }
        RangeSpec r;
        r.id = q.value(0).toLongLong();
        r.label = sql::toStd(q.value(2));
        r.unit = sql::unitFrom(q.value(3));
        r.lower_limit = q.value(4).toDouble();
        r.full_scale = q.value(5).toDouble();
        if (!q.value(6).isNull()) {
            r.nominal_ohms = q.value(6).toDouble();
        }
        if (!q.value(7).isNull()) {
            r.fiducial_value = q.value(7).toDouble();
        }
        owner->second.ranges.push_back(std::move(r));
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
