// The demo's five years of calibrations: when each meter came to the bench, what was found,
// and where each record stands today (approved, waiting for review, returned, draft, amended).
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"
#include "storage/demo/demo_catalogue.h"

#include <chrono>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw::demo {

enum class Fate { Approved, Submitted, Returned, Draft };

// A correction made to an approved record by an amendment revision.
struct PlannedAmendment {
    Timestamp started_at{};
    Timestamp submitted_at{};
    Timestamp approved_at{};
    std::string reason;
    Reading corrected; // replaces the reading with the same key in the amended copy
};

struct PlannedSession {
    std::size_t instrument = 0; // index in the instrument list
    Fate fate = Fate::Approved;
    // Ready for SessionRepository::create() once technician_id is set: a draft holding its
    // readings, checks, notes and the standards used (with the certificate valid that day).
    CalibrationSession session;
    Timestamp submitted_at{};
    Timestamp decided_at{}; // approved or returned
    std::string return_comment;
    std::optional<PlannedAmendment> amendment;
};

// Five years of visits: the earliest falls no more than this many days before `today`...
inline constexpr int kDemoSpanDays = 5 * 365 + 1;
// ...and never before this day (a weekend visit moves back to the Friday).
std::chrono::sys_days firstDemoDay(std::chrono::sys_days today);

// The reference standards as registered (with the ids the workbook gave them) and, parallel to
// them, every certificate each held since firstDemoDay() (demo_catalogue.h).
struct DemoStandards {
    std::vector<ReferenceStandard> register_rows;
    std::vector<std::vector<DemoCertificate>> certificates;
};

// Plans and simulates every session, oldest first. `instruments` and `standards` must carry the
// ids the workbook gave them. Each session keeps a copy of the certificate its standards held on
// its day.
std::vector<PlannedSession> planSessions(const std::vector<Instrument>& instruments,
                                         const DemoStandards& standards,
                                         std::chrono::sys_days today, std::uint64_t seed);

} // namespace mw::demo
