// Builds the register's rows (what the instrument list shows) from workbook data.
#pragma once

#include "app/gui/instrument_list_model.h"
#include "core/model/instrument.h"
#include "storage/instrument_repository.h"

#include <chrono>
#include <vector>

namespace mw::gui {

// One row per instrument, in the order given; the due column says "Never calibrated",
// "Overdue since …" or the due date, so status never rests on colour alone.
std::vector<InstrumentRow> buildRegisterRows(const std::vector<Instrument>& instruments,
                                             const std::vector<storage::DueItem>& dueList,
                                             std::chrono::sys_days today);

} // namespace mw::gui
