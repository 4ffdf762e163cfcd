// The instrument register and its due list.
#include "storage/instrument_repository.h"

#include "core/accuracy/accuracy_class.h"
#include "storage/instrument_rows.h"
#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <set>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

// The class index as the exact member of the IEC 60051-2 series it matches (the table's CHECK
// compares exactly), or a clear error before any SQL runs.
double classIndexOf(const Instrument& i) {
    if (isStandardClassIndex(i.accuracy_class)) {
        for (double index : classIndexSeries()) {
            if (std::abs(index - i.accuracy_class) <= 1e-9 * index) {
                return index;
            }
        }
    }
    throw WorkbookError(Kind::BadInput,
                        QStringLiteral("instrument \"%1\": accuracy class %2 is not a class index "
                                       "of IEC 60051-2 (0.05, 0.1, 0.2, 0.3, 0.5, 1, 1.5, 2, 2.5, "
                                       "3, 5)")
                            .arg(QString::fromStdString(i.asset_tag))
                            .arg(i.accuracy_class));
}

void bindFields(QSqlQuery& q, const Instrument& i) {
    q.addBindValue(QString::fromStdString(i.asset_tag));
    q.addBindValue(QString::fromStdString(i.description));
    q.addBindValue(QString::fromStdString(i.manufacturer));
    q.addBindValue(QString::fromStdString(i.model));
    q.addBindValue(QString::fromStdString(i.serial));
    q.addBindValue(sql::enumText(i.kind));
    q.addBindValue(i.movement.amps_fs);
    q.addBindValue(i.movement.ohms_coil);
    q.addBindValue(sql::enumText(i.scale_type));
    q.addBindValue(i.scale_divisions);
    q.addBindValue(classIndexOf(i));
    q.addBindValue(i.interval_days);
    q.addBindValue(QString::fromStdString(i.location));
    q.addBindValue(QString::fromStdString(i.owner));
    q.addBindValue(sql::enumText(i.status));
}

QString where(const Instrument& i) {
    return QStringLiteral("instrument \"%1\"").arg(QString::fromStdString(i.asset_tag));
}

void bindRange(QSqlQuery& q, const RangeSpec& r, int order, const QString& context) {
    q.addBindValue(order);
    q.addBindValue(QString::fromStdString(r.label));
    q.addBindValue(sql::unitText(r.unit, context));
    q.addBindValue(r.lower_limit);
    q.addBindValue(r.full_scale);
    q.addBindValue(sql::nullableReal(r.nominal_ohms));
    q.addBindValue(sql::nullableReal(r.fiducial_value));
    q.addBindValue(r.signal ? QVariant(sql::enumText(*r.signal))
                            : QVariant(QMetaType(QMetaType::QString)));
    q.addBindValue(r.diode ? QVariant(sql::text(presetName(*r.diode)))
                           : QVariant(QMetaType(QMetaType::QString)));
}

void saveRanges(const QSqlDatabase& db, Instrument& instrument) {
    std::set<std::int64_t> kept;
    for (const RangeSpec& r : instrument.ranges) {
        kept.insert(r.id);
    }
    QSqlQuery existing = sql::prepare(db, QStringLiteral("SELECT id FROM instrument_ranges "
                                                         "WHERE instrument_id = ?"));
    existing.addBindValue(qint64(instrument.id));
    sql::exec(existing, QStringLiteral("reading ranges of ") + where(instrument));
    std::vector<std::int64_t> removed;
    while (existing.next()) {
        if (!kept.count(existing.value(0).toLongLong())) {
            removed.push_back(existing.value(0).toLongLong());
        }
    }
    for (std::int64_t id : removed) {
        QSqlQuery q =
            sql::prepare(db, QStringLiteral("DELETE FROM instrument_ranges WHERE id = ?"));
        q.addBindValue(qint64(id));
        sql::exec(q, QStringLiteral("removing a range of %1 (readings may refer to it)")
                         .arg(where(instrument)));
    }
    int order = 0;
    for (RangeSpec& r : instrument.ranges) {
        const QString context = QStringLiteral("range \"%1\" of %2")
                                    .arg(QString::fromStdString(r.label), where(instrument));
        QSqlQuery q = sql::prepare(
            db, r.id == 0 ? QStringLiteral("INSERT INTO instrument_ranges (sort_order, label, "
                                           "unit, lower_limit, full_scale, nominal_ohms, "
                                           "fiducial_value, signal, diode, instrument_id) VALUES "
                                           "(?, ?, ?, ?, ?, ?, ?, ?, ?, ?) RETURNING id")
                          : QStringLiteral("UPDATE instrument_ranges SET sort_order = ?, label = "
                                           "?, unit = ?, lower_limit = ?, full_scale = ?, "
                                           "nominal_ohms = ?, fiducial_value = ?, signal = ?, "
                                           "diode = ? WHERE instrument_id = ? AND id = ?"));
        bindRange(q, r, order++, context);
        q.addBindValue(qint64(instrument.id));
        if (r.id != 0) {
            q.addBindValue(qint64(r.id));
        }
        sql::exec(q, QStringLiteral("saving ") + context);
        if (r.id == 0) {
            q.next();
            r.id = q.value(0).toLongLong();
            q.finish();
        } else if (q.numRowsAffected() != 1) {
            throw WorkbookError(Kind::NotFound, context + QStringLiteral(" does not exist"));
        }
    }
}

void attachRanges(const QSqlDatabase& db, std::vector<Instrument>& instruments,
                  const QString& condition, const QVariant& value) {
    std::map<std::int64_t, Instrument*> byId;
    for (Instrument& i : instruments) {
        byId[i.id] = &i;
    }
    QSqlQuery q = sql::prepare(db, rows::selectRanges() + condition +
                                       QStringLiteral(" ORDER BY instrument_id, sort_order"));
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading instrument ranges"));
    while (q.next()) {
        if (auto found = byId.find(q.value(1).toLongLong()); found != byId.end()) {
            found->second->ranges.push_back(rows::rangeFrom(q));
        }
    }
}

std::vector<Instrument> query(const QSqlDatabase& db, const QString& condition,
                              const QVariant& value) {
    QSqlQuery q = sql::prepare(db, rows::selectInstruments() + condition);
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading instruments"));
    std::vector<Instrument> found;
    while (q.next()) {
        found.push_back(rows::instrumentFrom(q));
    }
    return found;
}

std::optional<Instrument> single(const QSqlDatabase& db, std::vector<Instrument> found) {
    if (found.empty()) {
        return std::nullopt;
    }
    attachRanges(db, found, QStringLiteral("WHERE instrument_id = ?"), qint64(found.front().id));
    return found.front();
}

} // namespace

void InstrumentRepository::add(Instrument& instrument) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO instruments (asset_tag, description, manufacturer, model, "
                           "serial, kind, movement_amps_fs, movement_ohms, scale_type, "
                           "scale_divisions, accuracy_class, interval_days, location, owner, "
                           "status) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?) "
                           "RETURNING id"));
    bindFields(q, instrument);
    sql::exec(q, QStringLiteral("adding ") + where(instrument));
    q.next();
    Instrument saved = instrument;
    saved.id = q.value(0).toLongLong();
    q.finish();
    for (RangeSpec& r : saved.ranges) {
        r.id = 0;
    }
    saveRanges(db, saved);
    transaction.commit();
    instrument = saved;
}

void InstrumentRepository::update(Instrument& instrument) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("UPDATE instruments SET asset_tag = ?, description = ?, manufacturer "
                           "= ?, model = ?, serial = ?, kind = ?, movement_amps_fs = ?, "
                           "movement_ohms = ?, scale_type = ?, scale_divisions = ?, "
                           "accuracy_class = ?, interval_days = ?, location = ?, owner = ?, "
                           "status = ? WHERE id = ?"));
    bindFields(q, instrument);
    q.addBindValue(qint64(instrument.id));
    sql::exec(q, QStringLiteral("saving ") + where(instrument));
    if (q.numRowsAffected() != 1) {
        throw WorkbookError(Kind::NotFound,
                            QStringLiteral("no instrument with id %1").arg(instrument.id));
    }
    Instrument saved = instrument;
    saveRanges(db, saved);
    transaction.commit();
    instrument = saved;
}

std::optional<Instrument> InstrumentRepository::find(std::int64_t instrumentId) const {
    const QSqlDatabase db = workbook_.database();
    return single(db, query(db, QStringLiteral("WHERE id = ?"), qint64(instrumentId)));
}

std::optional<Instrument> InstrumentRepository::findByTag(const QString& assetTag) const {
    const QSqlDatabase db = workbook_.database();
    return single(db, query(db, QStringLiteral("WHERE asset_tag = ?"), assetTag));
}

std::vector<Instrument> InstrumentRepository::all() const {
    const QSqlDatabase db = workbook_.database();
    std::vector<Instrument> found = query(db, QStringLiteral("ORDER BY asset_tag"), QVariant());
    attachRanges(db, found, QString(), QVariant());
    return found;
}

std::int64_t InstrumentRepository::count() const {
    return sql::scalar(workbook_.database(), QStringLiteral("SELECT COUNT(*) FROM instruments"),
                       QStringLiteral("counting instruments"))
        .toLongLong();
}

std::vector<DueItem> InstrumentRepository::dueList() const {
    // Date arithmetic differs between SQL dialects, so the due date is computed here.
    QSqlQuery q = sql::prepare(
        workbook_.database(),
        QStringLiteral("SELECT i.id, i.asset_tag, i.description, i.status, i.interval_days, "
                       "(SELECT MAX(s.started_at) FROM calibration_sessions s WHERE "
                       "s.state = 'approved' AND s.instrument_id = i.id) FROM instruments i "
                       "WHERE i.status <> 'retired'"));
    sql::exec(q, QStringLiteral("reading the due list"));
    std::vector<DueItem> items;
    while (q.next()) {
        DueItem item;
        item.instrument_id = q.value(0).toLongLong();
        item.asset_tag = sql::toStd(q.value(1));
        item.description = sql::toStd(q.value(2));
        item.status = sql::enumFrom<InstrumentStatus>(q.value(3), "instruments.status");
        item.interval_days = q.value(4).toInt();
        if (!q.value(5).isNull()) {
            item.last_calibrated =
                std::chrono::floor<std::chrono::days>(sql::timestampFrom(q.value(5)));
            item.due_date = *item.last_calibrated + std::chrono::days{item.interval_days};
        }
        items.push_back(std::move(item));
    }
    std::stable_sort(items.begin(), items.end(), [](const DueItem& a, const DueItem& b) {
        if (a.due_date.has_value() != b.due_date.has_value()) {
            return !a.due_date.has_value();
        }
        return a.due_date < b.due_date;
    });
    return items;
}

} // namespace mw::storage
