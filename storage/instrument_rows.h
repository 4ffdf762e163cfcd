// Reading instrument and range rows: one column list and one row reader, shared by the
// register and by the record digest so both see an instrument the same way.
#pragma once

#include "core/model/instrument.h"

#include <QSqlQuery>
#include <QString>

namespace mw::storage::rows {

// "SELECT <all instrument columns> FROM instruments " — append a WHERE/ORDER clause.
QString selectInstruments();
// "SELECT <all range columns> FROM instrument_ranges " — column 1 is instrument_id.
QString selectRanges();

Instrument instrumentFrom(const QSqlQuery& query);
RangeSpec rangeFrom(const QSqlQuery& query);

} // namespace mw::storage::rows
