// Reading instrument and range rows with one column list.
#include "storage/instrument_rows.h"

#include "storage/sql_support.h"

namespace mw::storage::rows {

QString selectInstruments() {
    return QStringLiteral(
        "SELECT id, asset_tag, description, manufacturer, model, serial, kind, movement_amps_fs, "
        "movement_ohms, scale_type, scale_divisions, accuracy_class, interval_days, location, "
        "owner, status FROM instruments ");
}

QString selectRanges() {
    return QStringLiteral(
        "SELECT id, instrument_id, label, unit, lower_limit, full_scale, nominal_ohms, "
        "fiducial_value, signal, diode FROM instrument_ranges ");
}

Instrument instrumentFrom(const QSqlQuery& q) {
    Instrument i;
    i.id = q.value(0).toLongLong();
    i.asset_tag = sql::toStd(q.value(1));
    i.description = sql::toStd(q.value(2));
    i.manufacturer = sql::toStd(q.value(3));
    i.model = sql::toStd(q.value(4));
    i.serial = sql::toStd(q.value(5));
    i.kind = sql::enumFrom<InstrumentKind>(q.value(6), "instruments.kind");
    i.movement = {q.value(7).toDouble(), q.value(8).toDouble()};
    i.scale_type = sql::enumFrom<ScaleType>(q.value(9), "instruments.scale_type");
    i.scale_divisions = q.value(10).toInt();
    i.accuracy_class = q.value(11).toDouble();
    i.interval_days = q.value(12).toInt();
    i.location = sql::toStd(q.value(13));
    i.owner = sql::toStd(q.value(14));
    i.status = sql::enumFrom<InstrumentStatus>(q.value(15), "instruments.status");
    return i;
}

RangeSpec rangeFrom(const QSqlQuery& q) {
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
    r.signal =
        q.value(8).isNull()
            ? std::nullopt
            : std::optional(sql::enumFrom<SignalType>(q.value(8), "instrument_ranges.signal"));
    if (!q.value(9).isNull()) {
        const auto diode = presetFromName(sql::toStd(q.value(9)));
        if (!diode) {
            throw WorkbookError(WorkbookError::Kind::Corrupt,
                                QStringLiteral("unknown value \"%1\" in column "
                                               "instrument_ranges.diode")
                                    .arg(q.value(9).toString()));
        }
        r.diode = diode;
    }
    return r;
}

} // namespace mw::storage::rows
