// The record and history-report commands (record_commands.cpp).
#pragma once

#include "app/cli/command_table.h"

#include <vector>

namespace mw::cli {

std::vector<Command> recordCommands();

} // namespace mw::cli
