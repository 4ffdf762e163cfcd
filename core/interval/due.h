// What is due: instruments and reference standards whose due date falls within a window after a
// given day, most overdue first, each instrument with the reference standards its last approved
// calibration used and whether those are in date on that day. Due and overdue are computed,
// never stored.
#pragma once

#include "core/model/reference_standard.h"
#include "core/model/vocabulary.h"

#include <chrono>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

// An instrument as the due list needs it (storage reads these, storage/due_query.h).
struct InstrumentDueSource {
    std::int64_t instrumentId = 0;
    std::string assetTag;
    std::string description;
    std::string location;
    InstrumentStatus status = InstrumentStatus::InService;
    int intervalDays = 0;
    // The day its latest approved calibration started, and that calibration; nullopt when it
    // has none (never calibrated: due at once).
    std::optional<std::chrono::sys_days> lastCalibrated;
    std::optional<std::int64_t> lastSessionId;
    std::vector<std::int64_t> standardsUsed; // by that calibration, in the order it lists them
    // A calibration under way (draft, returned or submitted, the latest if several).
    std::optional<std::int64_t> openSessionId;
    std::optional<SessionState> openState;
};

enum class DueSubject { Instrument, Standard };

// A reference standard as the next calibration of an instrument would use it.
struct DueStandardUse {
    std::int64_t standardId = 0;
    std::string assetTag; // "standard 7" when it is no longer on the register
    std::optional<std::chrono::sys_days> dueDate; // nullopt when no longer on the register
    bool inDate = false;                          // its certificate runs to the as-of day or later
};

struct DueEntry {
    DueSubject subject = DueSubject::Instrument;
    std::int64_t id = 0; // instrument or standard id
    std::string assetTag;
    std::string description;
    std::string location;                                  // instruments only
    InstrumentStatus status = InstrumentStatus::InService; // instruments only
    std::optional<std::chrono::sys_days> lastCalibrated;   // standards: their certificate's
    std::optional<std::int64_t> lastSessionId;             // instruments only
    std::optional<std::chrono::sys_days> dueDate;          // nullopt: never calibrated
    std::optional<int> daysOverdue;            // as-of day − due date: negative when not yet due
    std::vector<DueStandardUse> standards;     // instruments only
    std::optional<std::int64_t> openSessionId; // instruments: a calibration under way
    std::optional<SessionState> openState;
};

// The lab's due window when the caller names none (Lab::due_window_days' default).
inline constexpr int kDefaultDueWindowDays = 30;

// Instruments (due date = last approved calibration + interval, as the register counts it) and
// standards (their certificate's due date) due on or before `asOf` + `withinDays`, overdue
// first: never-calibrated instruments, then by due date, instruments before standards on the
// same day, then by asset tag. Retired instruments are never due. Throws std::invalid_argument
// for a negative window.
std::vector<DueEntry> selectDue(const std::vector<InstrumentDueSource>& instruments,
                                const std::vector<ReferenceStandard>& standards,
                                std::chrono::sys_days asOf, int withinDays);

} // namespace mw
