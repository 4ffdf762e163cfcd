// The copies a session is sealed with at submission: the standards' specifications and each
// range as the register held them.
#include "storage/session_parts.h"

#include "storage/sql_support.h"

namespace mw::storage::detail {
namespace {

QVariant nullableInt(const std::optional<std::int64_t>& value) {
    return value ? QVariant(qint64(*value)) : QVariant(QMetaType(QMetaType::LongLong));
}

void insertSpecCopies(const QSqlDatabase& db, std::int64_t sessionId,
                      const std::vector<StandardSpecCopy>& specs) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO session_standard_specs (session_id, standard_id, "
                           "sort_order, label, unit, signal, full_scale, percent_of_reading, "
                           "percent_of_range, floor_value, certificate_expanded_uncertainty, "
                           "coverage_factor, certificate_dof) VALUES "
                           "(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)"));
    for (const StandardSpecCopy& copy : specs) {
        const QString context =
            QStringLiteral("copying range \"%1\" of standard %2 into session %3")
                .arg(QString::fromStdString(copy.spec.label))
                .arg(copy.standard_id)
                .arg(sessionId);
        q.addBindValue(qint64(sessionId));
        q.addBindValue(qint64(copy.standard_id));
        q.addBindValue(copy.sort_order);
        q.addBindValue(QString::fromStdString(copy.spec.label));
        q.addBindValue(sql::unitText(copy.spec.unit, context));
        q.addBindValue(sql::enumText(copy.spec.signal));
        q.addBindValue(copy.spec.full_scale);
        q.addBindValue(copy.spec.percent_of_reading);
        q.addBindValue(copy.spec.percent_of_range);
        q.addBindValue(copy.spec.floor);
        q.addBindValue(sql::nullableReal(copy.spec.certificate_expanded_uncertainty));
        q.addBindValue(copy.spec.coverage_factor);
        q.addBindValue(sql::nullableReal(copy.spec.degrees_of_freedom));
        sql::exec(q, context);
    }
}

void insertRangeCopies(const QSqlDatabase& db, std::int64_t sessionId,
                       const std::vector<RangeAsUsed>& ranges) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO session_ranges (session_id, range_id, signal, "
                           "diode_saturation_amps, diode_emission_coefficient, "
                           "diode_series_ohms, diode_nominal_celsius, diode_bandgap_ev, "
                           "diode_saturation_exponent, resistor_ohms, divisions, "
                           "reference_standard_id, reference_sort_order, shunt_standard_id, "
                           "shunt_sort_order) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, "
                           "?)"));
    for (const RangeAsUsed& range : ranges) {
        const auto diode = [&range](double DiodeParameters::*field) {
            return range.diode ? QVariant((*range.diode).*field)
                               : QVariant(QMetaType(QMetaType::Double));
        };
        q.addBindValue(qint64(sessionId));
        q.addBindValue(qint64(range.range_id));
        q.addBindValue(sql::enumText(range.signal));
        q.addBindValue(diode(&DiodeParameters::saturation_current_a));
        q.addBindValue(diode(&DiodeParameters::emission_coefficient));
        q.addBindValue(diode(&DiodeParameters::series_ohms));
        q.addBindValue(diode(&DiodeParameters::nominal_celsius));
        q.addBindValue(diode(&DiodeParameters::bandgap_ev));
        q.addBindValue(diode(&DiodeParameters::saturation_temp_exponent));
        q.addBindValue(sql::nullableReal(range.resistor_ohms));
        q.addBindValue(range.divisions);
        q.addBindValue(nullableInt(range.reference ? std::optional(range.reference->standard_id)
                                                   : std::nullopt));
        q.addBindValue(range.reference ? QVariant(range.reference->sort_order)
                                       : QVariant(QMetaType(QMetaType::Int)));
        q.addBindValue(nullableInt(range.reference_shunt
                                       ? std::optional(range.reference_shunt->standard_id)
                                       : std::nullopt));
        q.addBindValue(range.reference_shunt ? QVariant(range.reference_shunt->sort_order)
                                             : QVariant(QMetaType(QMetaType::Int)));
        sql::exec(
            q,
            QStringLiteral("copying range %1 into session %2").arg(range.range_id).arg(sessionId));
    }
}

} // namespace

void replaceSealedInputs(const QSqlDatabase& db, std::int64_t sessionId,
                         const SealedInputs& inputs) {
    for (const char* table : {"session_ranges", "session_standard_specs"}) {
        QSqlQuery del = sql::prepare(
            db, QStringLiteral("DELETE FROM %1 WHERE session_id = ?").arg(QLatin1String(table)));
        del.addBindValue(qint64(sessionId));
        sql::exec(del, QStringLiteral("replacing the copies of session %1").arg(sessionId));
    }
    insertSpecCopies(db, sessionId, inputs.specs);
    insertRangeCopies(db, sessionId, inputs.ranges);
}

} // namespace mw::storage::detail
