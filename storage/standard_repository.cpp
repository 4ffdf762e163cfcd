// Reference standards and their per-range specifications.
#include "storage/standard_repository.h"

#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

#include <map>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

const QString kSelect = QStringLiteral(
    "SELECT id, asset_tag, description, certificate_number, due_date, calibrated_on FROM "
    "reference_standards ");

QString where(const ReferenceStandard& s) {
    return QStringLiteral("reference standard \"%1\"").arg(QString::fromStdString(s.asset_tag));
}

void bindFields(QSqlQuery& q, const ReferenceStandard& s) {
    q.addBindValue(QString::fromStdString(s.asset_tag));
    q.addBindValue(QString::fromStdString(s.description));
    q.addBindValue(QString::fromStdString(s.certificate_number));
    q.addBindValue(sql::toIsoDate(s.due_date));
    q.addBindValue(s.calibrated_on ? QVariant(sql::toIsoDate(*s.calibrated_on))
                                   : QVariant(QMetaType(QMetaType::QString)));
}

void bindSpec(QSqlQuery& q, const StandardRangeSpec& spec, const QString& context) {
    q.addBindValue(QString::fromStdString(spec.label));
    q.addBindValue(sql::unitText(spec.unit, context));
    q.addBindValue(sql::enumText(spec.signal));
    q.addBindValue(spec.full_scale);
    q.addBindValue(spec.percent_of_reading);
    q.addBindValue(spec.percent_of_range);
    q.addBindValue(spec.floor);
    q.addBindValue(sql::nullableReal(spec.certificate_expanded_uncertainty));
    q.addBindValue(spec.coverage_factor);
    q.addBindValue(sql::nullableReal(spec.degrees_of_freedom));
}

// Saves the ranges of a standard by position: a range that stays is updated in place (so the
// audit log shows what changed in it), new positions are added, positions no longer listed are
// removed. Records never depend on these rows: each session keeps its own copies.
void saveSpecs(const QSqlDatabase& db, const ReferenceStandard& s) {
    const QString columns = QStringLiteral(
        "label = ?, unit = ?, signal = ?, full_scale = ?, percent_of_reading = ?, "
        "percent_of_range = ?, floor_value = ?, certificate_expanded_uncertainty = ?, "
        "coverage_factor = ?, certificate_dof = ?");
    QSqlQuery update = sql::prepare(
        db, QStringLiteral("UPDATE standard_specs SET %1 WHERE standard_id = ? AND sort_order = ?")
                .arg(columns));
    QSqlQuery insert = sql::prepare(
        db, QStringLiteral("INSERT INTO standard_specs (label, unit, signal, full_scale, "
                           "percent_of_reading, percent_of_range, floor_value, "
                           "certificate_expanded_uncertainty, coverage_factor, certificate_dof, "
                           "standard_id, sort_order) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)"));
    for (std::size_t i = 0; i < s.specs.size(); ++i) {
        const StandardRangeSpec& spec = s.specs[i];
        const QString context =
            QStringLiteral("range \"%1\" of %2").arg(QString::fromStdString(spec.label), where(s));
        bindSpec(update, spec, context);
        update.addBindValue(qint64(s.id));
        update.addBindValue(int(i));
        sql::exec(update, QStringLiteral("saving ") + context);
        if (update.numRowsAffected() == 1) {
            continue;
        }
        bindSpec(insert, spec, context);
        insert.addBindValue(qint64(s.id));
        insert.addBindValue(int(i));
        sql::exec(insert, QStringLiteral("saving ") + context);
    }
    QSqlQuery removed = sql::prepare(db, QStringLiteral("DELETE FROM standard_specs WHERE "
                                                        "standard_id = ? AND sort_order >= ?"));
    removed.addBindValue(qint64(s.id));
    removed.addBindValue(int(s.specs.size()));
    sql::exec(removed, QStringLiteral("removing ranges no longer listed of ") + where(s));
}

std::vector<ReferenceStandard> query(const QSqlDatabase& db, const QString& condition,
                                     const QVariant& value) {
    QSqlQuery q = sql::prepare(db, kSelect + condition);
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading reference standards"));
    std::vector<ReferenceStandard> found;
    std::map<std::int64_t, std::size_t> index;
    while (q.next()) {
        ReferenceStandard s;
        s.id = q.value(0).toLongLong();
        s.asset_tag = sql::toStd(q.value(1));
        s.description = sql::toStd(q.value(2));
        s.certificate_number = sql::toStd(q.value(3));
        s.due_date = sql::dateFrom(q.value(4));
        if (!q.value(5).isNull()) {
            s.calibrated_on = sql::dateFrom(q.value(5));
        }
        index[s.id] = found.size();
        found.push_back(std::move(s));
    }
    if (found.empty()) {
        return found;
    }
    QSqlQuery specs = sql::prepare(
        db, QStringLiteral("SELECT standard_id, label, unit, full_scale, percent_of_reading, "
                           "percent_of_range, floor_value, certificate_expanded_uncertainty, "
                           "coverage_factor, certificate_dof, signal FROM standard_specs ORDER BY "
                           "standard_id, sort_order"));
    sql::exec(specs, QStringLiteral("reading reference standard specifications"));
    while (specs.next()) {
        const auto at = index.find(specs.value(0).toLongLong());
        if (at == index.end()) {
            continue;
        }
        StandardRangeSpec spec;
        spec.label = sql::toStd(specs.value(1));
        spec.unit = sql::unitFrom(specs.value(2));
        spec.full_scale = specs.value(3).toDouble();
        spec.percent_of_reading = specs.value(4).toDouble();
        spec.percent_of_range = specs.value(5).toDouble();
        spec.floor = specs.value(6).toDouble();
        if (!specs.value(7).isNull()) {
            spec.certificate_expanded_uncertainty = specs.value(7).toDouble();
        }
        spec.coverage_factor = specs.value(8).toDouble();
        if (!specs.value(9).isNull()) {
            spec.degrees_of_freedom = specs.value(9).toDouble();
        }
        spec.signal = sql::enumFrom<SignalKind>(specs.value(10), "standard_specs.signal");
        found[at->second].specs.push_back(std::move(spec));
    }
    return found;
}

} // namespace

void StandardRepository::add(ReferenceStandard& standard) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(db, QStringLiteral("INSERT INTO reference_standards (asset_tag, "
                                                  "description, certificate_number, due_date, "
                                                  "calibrated_on) VALUES (?, ?, ?, ?, ?) "
                                                  "RETURNING id"));
    bindFields(q, standard);
    sql::exec(q, QStringLiteral("adding ") + where(standard));
    q.next();
    ReferenceStandard saved = standard;
    saved.id = q.value(0).toLongLong();
    q.finish();
    saveSpecs(db, saved);
    transaction.commit();
    standard.id = saved.id;
}

void StandardRepository::update(const ReferenceStandard& standard) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(db, QStringLiteral("UPDATE reference_standards SET asset_tag = ?, "
                                                  "description = ?, certificate_number = ?, "
                                                  "due_date = ?, calibrated_on = ? WHERE id = ?"));
    bindFields(q, standard);
    q.addBindValue(qint64(standard.id));
    sql::exec(q, QStringLiteral("saving ") + where(standard));
    if (q.numRowsAffected() != 1) {
        throw WorkbookError(Kind::NotFound,
                            QStringLiteral("no reference standard with id %1").arg(standard.id));
    }
    saveSpecs(db, standard);
    transaction.commit();
}

std::optional<ReferenceStandard> StandardRepository::find(std::int64_t standardId) const {
    auto found = query(workbook_.database(), QStringLiteral("WHERE id = ?"), qint64(standardId));
    return found.empty() ? std::nullopt : std::optional(found.front());
}

std::optional<ReferenceStandard> StandardRepository::findByTag(const QString& assetTag) const {
    auto found = query(workbook_.database(), QStringLiteral("WHERE asset_tag = ?"), assetTag);
    return found.empty() ? std::nullopt : std::optional(found.front());
}

std::vector<ReferenceStandard> StandardRepository::all() const {
    return query(workbook_.database(), QStringLiteral("ORDER BY asset_tag"), QVariant());
}

} // namespace mw::storage
