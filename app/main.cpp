// Entry point: headless subcommands and --help/--version run without a display
// (QCoreApplication); anything else opens the main window.
#include "app/cli/cli.h"
#include "app/gui/gui_entry.h"

int main(int argc, char* argv[]) {
    if (mw::cli::wantsHeadless(argc, argv)) {
        return mw::cli::runHeadless(argc, argv);
    }
    return mw::gui::runGui(argc, argv);
}
