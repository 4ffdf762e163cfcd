// The sessions command (session_commands.cpp).
#pragma once

#include "app/cli/command_table.h"

namespace mw::cli {

Command sessionsCommand();

} // namespace mw::cli
