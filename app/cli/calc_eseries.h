// `meterwright calc eseries`: the IEC 60063 value not above a computed resistance, its trim and
// the part's dissipation.
#pragma once

#include <QStringList>

namespace mw::cli {

int runEseries(const QStringList& arguments);

} // namespace mw::cli
