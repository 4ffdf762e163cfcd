// The windowed side of the meterwright executable.
#pragma once

namespace mw::gui {

// Creates the QApplication and the main window; argv may name a workbook to open.
int runGui(int argc, char* argv[]);

// Registers the compiled-in resources (icons, templates) of the static app library.
void initResources();

} // namespace mw::gui
