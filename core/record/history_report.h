// The history report of one instrument as a document, for supervisors: every calibration, the
// interval recommendation and how it was reached, and the drift of each test point.
#pragma once

#include "core/history/instrument_history.h"
#include "core/model/instrument.h"
#include "core/model/lab.h"
#include "core/record/document.h"

#include <optional>

namespace mw::record {

struct HistoryReportSource {
    std::optional<Lab> lab;
    Instrument instrument;
    InstrumentHistory history; // buildHistory() of the instrument's sessions
    Timestamp printedAt{};
};

Document buildHistoryReport(const HistoryReportSource& source);

} // namespace mw::record
