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

void requireOneRow(const QSqlQuery& query, std::int64_t sessionId) {
    if (query.numRowsAffected() != 1) {
        throw WorkbookError(WorkbookError::Kind::NotFound,
                            QStringLiteral("no calibration session with id %1").arg(sessionId));
    }
}

} // namespace mw::storage::detail
