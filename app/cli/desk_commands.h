// The supervisor's desk without a window: history (history_command.cpp), due
// (due_command.cpp) and review --list (review_command.cpp), so that the numbers each screen
// shows can be checked and scripted.
#pragma once

#include "app/cli/command_table.h"

namespace mw::cli {

Command historyCommand();
Command dueCommand();
Command reviewCommand();

} // namespace mw::cli
