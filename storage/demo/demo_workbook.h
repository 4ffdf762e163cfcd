// Writes the invented demo workbook: a small instrument shop's lab with five years of records.
#pragma once

#include <QString>

#include <chrono>
#include <cstdint>

namespace mw::demo {

// The fixed seed of the demo: the same date gives the same workbook, record for record.
inline constexpr std::uint64_t kDemoSeed = 0x4D57'0005'DE30'2026ULL;

struct DemoSummary {
    int instruments = 0;
    int standards = 0;
    int overdueStandards = 0;
    int users = 0;
    int sessions = 0; // every revision counted
    int approved = 0; // approved and not superseded
    int superseded = 0;
    int submitted = 0;
    int returned = 0;
    int drafts = 0;
    int amendments = 0;
    int outOfToleranceAsFound = 0;
    int readings = 0;
};

// Writes the demo to a new workbook file at `path`, with its five years ending on `today`
// (standards' due dates and the due list follow that date). Throws WorkbookError (Io) when
// `path` already exists — the demo never overwrites a file — or whatever the workbook throws;
// a file it started is removed again on failure.
DemoSummary writeDemoWorkbook(const QString& path, std::chrono::sys_days today,
                              std::uint64_t seed = kDemoSeed);

} // namespace mw::demo
