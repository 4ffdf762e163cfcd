// Opening a workbook for a headless command: what cannot be opened becomes one line saying
// why, and an older workbook a read-only command was given says how to upgrade it.
#pragma once

#include "storage/workbook.h"

#include <QString>

#include <memory>

namespace mw::cli {

// Opens `path` read-only; throws UsageError naming the file and the reason.
std::unique_ptr<storage::Workbook> openForReading(const QString& path);

// Opens `path` for writing (an older workbook is upgraded after a copy is kept); throws
// UsageError naming the file and the reason.
std::unique_ptr<storage::Workbook> openForWriting(const QString& path);

// The one WORKBOOK argument of a command; UsageError otherwise.
QString onlyWorkbookArgument(const QStringList& positional);

} // namespace mw::cli
