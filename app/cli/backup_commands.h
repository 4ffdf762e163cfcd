// `meterwright backup` and `meterwright restore`: copies of a workbook made while it is in use,
// and putting one back.
#pragma once

#include "app/cli/command_table.h"

namespace mw::cli {

Command backupCommand();
Command restoreCommand();

} // namespace mw::cli
