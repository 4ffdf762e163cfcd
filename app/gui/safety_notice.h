// The safety caution shown in the About box, on records and wherever a test reaches
// hazardous voltages. One text so every place says the same.
#pragma once

#include <QString>

namespace mw::gui {

inline QString safetyNoticeTitle() {
    return QStringLiteral("Safety");
}

inline QString safetyNoticeText() {
    return QStringLiteral(
        "Bench calibration of AC voltmeters and of high DC ranges involves hazardous voltages. "
        "Above 30 V rms, 42.4 V peak or 60 V DC (the hazardous-live limits of IEC 61010-1) a "
        "shock can injure or kill. Follow your laboratory's procedures, IEC 61010-1 practice and "
        "local electrical codes: use rated test leads and guarded sources, de-energise before "
        "changing connections, and work within your qualifications. Meterwright calculates and "
        "records; it does not replace licensed practice or a competent person's judgement.");
}

} // namespace mw::gui
