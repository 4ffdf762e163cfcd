// Builds the register's rows (what the instrument list shows) from workbook data.
#pragma once

#include "app/gui/instrument_list_model.h"
#include "core/model/instrument.h"
#include "storage/instrument_repository.h"

#include <chrono>
#include <map>
#include <vector>

namespace mw::gui {

// The state of an instrument's calibration that is still open (draft, submitted or returned),
// by instrument id; instruments with none are absent.
using OpenCalibrations = std::map<std::int64_t, SessionState>;

// One row per instrument, in the order given; the due column says "Never calibrated",
// "Overdue since …" or the due date, and what an open calibration is waiting for, so status
// never rests on colour alone.
// `lastOutcomes`: each instrument's latest approved outcome; an instrument due within
// `dueSoonDays` of `today` is due soon.
std::vector<InstrumentRow>
buildRegisterRows(const std::vector<Instrument>& instruments,
                  const std::vector<storage::DueItem>& dueList, const OpenCalibrations& open,
                  std::chrono::sys_days today,
                  const std::map<std::int64_t, Outcome>& lastOutcomes = {}, int dueSoonDays = 30);

} // namespace mw::gui
