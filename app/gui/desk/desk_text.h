// The few ways the supervisor's pages put the workbook's values into words, kept in one place
// so the review queue, the history and the due list read alike.
#pragma once

#include "core/model/calibration.h"
#include "core/model/reference_standard.h"

#include <QString>

#include <map>
#include <vector>

namespace mw::gui {

// Now, to the second: what an approval, a return or an amendment is stamped with.
Timestamp currentTime();
// "2026-03-05 10:00" (UTC), as the tables show times.
QString minuteText(Timestamp at);
QString outcomeWords(Outcome outcome);
// The standards a calibration used, with the certificate it was sealed with, and for one used
// past its due date the justification written for it.
QString standardsUsedText(const std::vector<StandardUse>& uses,
                          const std::map<std::int64_t, ReferenceStandard>& standards);

} // namespace mw::gui
