// One query per table for any set of sessions: the history of an instrument stays fast.
#include "storage/session_loader.h"

#include "storage/sql_support.h"

#include <map>

namespace mw::storage::detail {
namespace {

CalibrationSession sessionFrom(const QSqlQuery& q) {
    CalibrationSession s;
    s.id = q.value(0).toLongLong();
    s.instrument_id = q.value(1).toLongLong();
    s.technician_id = q.value(2).toLongLong();
    s.started_at = sql::timestampFrom(q.value(3));
    s.finished_at = sql::optionalTimestamp(q.value(4));
    s.environment = {q.value(5).toDouble(), q.value(6).toDouble()};
    s.method = sql::toStd(q.value(7));
    s.decision_rule = sql::enumFrom<DecisionRule>(q.value(8), "calibration_sessions.decision_rule");
    s.guard_factor = q.value(9).toDouble();
    if (!q.value(10).isNull()) {
        s.outcome = sql::enumFrom<Outcome>(q.value(10), "calibration_sessions.outcome");
    }
    s.state = sql::enumFrom<SessionState>(q.value(11), "calibration_sessions.state");
    s.submitted_at = sql::optionalTimestamp(q.value(12));
    s.return_comment = sql::toStd(q.value(13));
    s.returned_at = sql::optionalTimestamp(q.value(14));
    if (!q.value(15).isNull()) {
        s.reviewer_id = q.value(15).toLongLong();
    }
    s.approved_at = sql::optionalTimestamp(q.value(16));
    s.revision = q.value(17).toInt();
    if (!q.value(18).isNull()) {
        s.supersedes_id = q.value(18).toLongLong();
    }
    s.amendment_reason = sql::toStd(q.value(19));
    s.amended_at = sql::optionalTimestamp(q.value(20));
    s.digest = sql::toStd(q.value(21));
    s.record_format = q.value(25).toInt();
    s.phases = sql::enumFrom<PhasePlan>(q.value(26), "calibration_sessions.phases");
    if (q.value(22).isNull() || q.value(23).isNull() || q.value(24).isNull()) {
        s.settings.reset(); // a record sealed before the settings were recorded
    } else {
        s.settings = EvaluationSettings{q.value(22).toDouble(), q.value(23).toDouble(),
                                        q.value(24).toDouble()};
    }
    return s;
}

using Index = std::map<std::int64_t, CalibrationSession*>;

// Runs "SELECT session_id, ... FROM table WHERE session_id IN (matching sessions)" and hands
// each row to `take` with its session.
template <typename Take>
void forEachPart(const QSqlDatabase& db, const QString& columns, const QString& table,
                 const QString& condition, const QVariant& value, const Index& index, Take take) {
    // Rows come in the order they were entered; readings, which have no id, in the order of a
    // test plan (range, point, up before down, as-found before as-left, repeat).
    QString order = QStringLiteral("id");
    if (table == QLatin1String("readings")) {
        order = QStringLiteral("range_id, point_index, CASE direction WHEN 'up' THEN 0 ELSE 1 "
                               "END, phase, repeat_number");
    } else if (table == QLatin1String("session_standard_specs")) {
        order = QStringLiteral("standard_id, sort_order");
    } else if (table == QLatin1String("session_ranges")) {
        order = QStringLiteral("range_id");
    } else if (table == QLatin1String("session_points")) {
        order = QStringLiteral("range_id, point_index");
    }
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT session_id, %1 FROM %2 WHERE session_id IN (SELECT s.id FROM "
                           "calibration_sessions s WHERE %3) ORDER BY session_id, %4")
                .arg(columns, table, condition, order));
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading ") + table);
    while (q.next()) {
        if (auto at = index.find(q.value(0).toLongLong()); at != index.end()) {
            take(*at->second, q);
        }
    }
}

std::optional<double> optionalReal(const QVariant& value) {
    return value.isNull() ? std::nullopt : std::optional(value.toDouble());
}

std::optional<SpecRef> optionalRef(const QVariant& standard, const QVariant& position) {
    if (standard.isNull()) {
        return std::nullopt;
    }
    return SpecRef{standard.toLongLong(), position.toInt()};
}

SealedInputs& sealedOf(CalibrationSession& s) {
    if (!s.sealed) {
        s.sealed = SealedInputs{};
    }
    return *s.sealed;
}

// The copies a session was submitted with (an amendment has those of the record it amends from
// the start). A session without any has `sealed` left empty.
void loadSealedParts(const QSqlDatabase& db, const QString& condition, const QVariant& value,
                     const Index& index) {
    forEachPart(db,
                QStringLiteral("standard_id, sort_order, label, unit, signal, full_scale, "
                               "percent_of_reading, percent_of_range, floor_value, "
                               "certificate_expanded_uncertainty, coverage_factor, "
                               "certificate_dof"),
                QStringLiteral("session_standard_specs"), condition, value, index,
                [](CalibrationSession& s, const QSqlQuery& q) {
                    StandardSpecCopy copy;
                    copy.standard_id = q.value(1).toLongLong();
                    copy.sort_order = q.value(2).toInt();
                    copy.spec.label = sql::toStd(q.value(3));
                    copy.spec.unit = sql::unitFrom(q.value(4));
                    copy.spec.signal =
                        sql::enumFrom<SignalKind>(q.value(5), "session_standard_specs.signal");
                    copy.spec.full_scale = q.value(6).toDouble();
                    copy.spec.percent_of_reading = q.value(7).toDouble();
                    copy.spec.percent_of_range = q.value(8).toDouble();
                    copy.spec.floor = q.value(9).toDouble();
                    copy.spec.certificate_expanded_uncertainty = optionalReal(q.value(10));
                    copy.spec.coverage_factor = q.value(11).toDouble();
                    copy.spec.degrees_of_freedom = optionalReal(q.value(12));
                    sealedOf(s).specs.push_back(std::move(copy));
                });
    forEachPart(db,
                QStringLiteral("range_id, signal, diode_saturation_amps, "
                               "diode_emission_coefficient, diode_series_ohms, "
                               "diode_nominal_celsius, diode_bandgap_ev, "
                               "diode_saturation_exponent, resistor_ohms, divisions, "
                               "reference_standard_id, reference_sort_order, shunt_standard_id, "
                               "shunt_sort_order"),
                QStringLiteral("session_ranges"), condition, value, index,
                [](CalibrationSession& s, const QSqlQuery& q) {
                    RangeAsUsed range;
                    range.range_id = q.value(1).toLongLong();
                    range.signal = sql::enumFrom<SignalType>(q.value(2), "session_ranges.signal");
                    if (!q.value(3).isNull()) {
                        range.diode = DiodeParameters{q.value(3).toDouble(), q.value(4).toDouble(),
                                                      q.value(5).toDouble(), q.value(6).toDouble(),
                                                      q.value(7).toDouble(), q.value(8).toDouble()};
                    }
                    range.resistor_ohms = optionalReal(q.value(9));
                    range.divisions = q.value(10).toInt();
                    range.reference = optionalRef(q.value(11), q.value(12));
                    range.reference_shunt = optionalRef(q.value(13), q.value(14));
                    sealedOf(s).ranges.push_back(range);
                });
}

void loadParts(const QSqlDatabase& db, const QString& condition, const QVariant& value,
               const Index& index) {
    forEachPart(db,
                QStringLiteral("standard_id, certificate_number, due_date, "
                               "overdue_justification"),
                QStringLiteral("session_standards"), condition, value, index,
                [](CalibrationSession& s, const QSqlQuery& q) {
                    s.standards.push_back({q.value(1).toLongLong(), sql::toStd(q.value(2)),
                                           sql::dateFrom(q.value(3)), sql::toStd(q.value(4))});
                });
    forEachPart(db,
                QStringLiteral("range_id, point_index, direction, phase, repeat_number, "
                               "unit, applied, indicated"),
                QStringLiteral("readings"), condition, value, index,
                [](CalibrationSession& s, const QSqlQuery& q) {
                    Reading r;
                    r.range_id = q.value(1).toLongLong();
                    r.point_index = q.value(2).toInt();
                    r.direction = sql::enumFrom<Direction>(q.value(3), "readings.direction");
                    r.phase = sql::enumFrom<Phase>(q.value(4), "readings.phase");
                    r.repeat = q.value(5).toInt();
                    r.unit = sql::unitFrom(q.value(6));
                    r.applied = q.value(7).toDouble();
                    if (!q.value(8).isNull()) {
                        r.indicated = q.value(8).toDouble();
                    }
                    s.readings.push_back(r);
                });
    forEachPart(db,
                QStringLiteral("range_id, component, computed_ohms, measured_ohms, "
                               "tolerance_percent, id"),
                QStringLiteral("resistor_checks"), condition, value, index,
                [](CalibrationSession& s, const QSqlQuery& q) {
                    s.resistor_checks.push_back({q.value(6).toLongLong(), q.value(1).toLongLong(),
                                                 sql::toStd(q.value(2)), q.value(3).toDouble(),
                                                 q.value(4).toDouble(), q.value(5).toDouble()});
                });
    forEachPart(db, QStringLiteral("range_id, point_index, nominal, repeats"),
                QStringLiteral("session_points"), condition, value, index,
                [](CalibrationSession& s, const QSqlQuery& q) {
                    s.plan.push_back({q.value(1).toLongLong(), q.value(2).toInt(),
                                      q.value(3).toDouble(), q.value(4).toInt()});
                });
    forEachPart(db, QStringLiteral("noted_at, note_text, id"), QStringLiteral("adjustment_notes"),
                condition, value, index, [](CalibrationSession& s, const QSqlQuery& q) {
                    s.adjustments.push_back({q.value(3).toLongLong(),
                                             sql::timestampFrom(q.value(1)),
                                             sql::toStd(q.value(2))});
                });
    loadSealedParts(db, condition, value, index);
}

} // namespace

std::vector<CalibrationSession> loadSessions(const QSqlDatabase& db, const QString& condition,
                                             const QVariant& value) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT s.id, s.instrument_id, s.technician_id, s.started_at, "
                           "s.finished_at, s.ambient_celsius, s.relative_humidity_percent, "
                           "s.method, s.decision_rule, s.guard_factor, s.outcome, s.state, "
                           "s.submitted_at, s.return_comment, s.returned_at, s.reviewer_id, "
                           "s.approved_at, s.revision, s.supersedes_id, s.amendment_reason, "
                           "s.amended_at, c.digest, s.readability_fraction, "
                           "s.coverage_probability, s.reference_celsius, s.record_format, "
                           "s.phases FROM "
                           "calibration_sessions s LEFT JOIN "
                           "record_chain c ON c.session_id = s.id WHERE %1 ORDER BY "
                           "s.started_at, s.id")
                .arg(condition));
    if (value.isValid()) {
        q.addBindValue(value);
    }
    sql::exec(q, QStringLiteral("reading calibration sessions"));
    std::vector<CalibrationSession> sessions;
    while (q.next()) {
        sessions.push_back(sessionFrom(q));
    }
    if (sessions.empty()) {
        return sessions;
    }
    Index index;
    for (CalibrationSession& s : sessions) {
        index[s.id] = &s;
    }
    loadParts(db, condition, value, index);
    return sessions;
}

} // namespace mw::storage::detail
