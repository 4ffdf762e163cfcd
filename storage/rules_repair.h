// A workbook whose rules (the integrity, audit and key triggers) were dropped or changed, e.g.
// with the sqlite3 shell, opens read-only until an administrator reinstalls them.
#pragma once

#include <QStringList>

#include <cstdint>

namespace mw::storage {

class Workbook;

// Drops every trigger the workbook holds and installs those of the current version afresh,
// in one transaction, and records the repair in the audit log (who, and which rules were
// missing or changed). The workbook must be open for repair (OpenOptions::forRepair) and
// `administratorId` an active administrator (WorkbookError RuleViolation otherwise). Returns
// the names of the rules that were missing or changed; empty when there was nothing to do.
QStringList repairRules(Workbook& workbook, std::int64_t administratorId);

} // namespace mw::storage
