// `meterwright repair`: an administrator reinstalls a workbook's rules (its triggers).
#pragma once

#include "app/cli/command_table.h"

namespace mw::cli {

Command repairCommand();

} // namespace mw::cli
