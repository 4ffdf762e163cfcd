// `meterwright demo WORKBOOK`: writes the invented demo workbook to a new file.
#pragma once

#include "app/cli/command_table.h"

namespace mw::cli {

Command demoCommand();

} // namespace mw::cli
