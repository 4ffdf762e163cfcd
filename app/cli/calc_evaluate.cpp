// Headless command family; see command_table.h for the commands it will hold.
#include "app/cli/command_table.h"

namespace mw::cli {

std::vector<Command> evaluationCalcCommands() {
    return {};
}

} // namespace mw::cli
