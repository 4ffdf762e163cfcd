// The windowed side of the meterwright executable.
#include "app/gui/gui_entry.h"

#include "app/gui/main_window.h"

#include <QApplication>

#include <cstdio>
#include <cstdlib>

// Q_INIT_RESOURCE must be used outside any namespace.
static void initMeterwrightResources() {
    Q_INIT_RESOURCE(resources);
}

namespace mw::gui {

void initResources() {
    initMeterwrightResources();
}

namespace {

bool hasDisplay() {
    const char* platform = std::getenv("QT_QPA_PLATFORM");
    if (platform != nullptr && *platform != '\0') {
        return true; // the caller chose a platform (offscreen, vnc, ...) explicitly
    }
    const char* x11 = std::getenv("DISPLAY");
    const char* wayland = std::getenv("WAYLAND_DISPLAY");
    return (x11 != nullptr && *x11 != '\0') || (wayland != nullptr && *wayland != '\0');
}

} // namespace

int runGui(int argc, char* argv[]) {
    if (!hasDisplay()) {
        std::fputs("meterwright: no display found (DISPLAY and WAYLAND_DISPLAY are not set).\n"
                   "To run the window on a virtual display: xvfb-run -a meterwright [WORKBOOK]\n"
                   "Commands that need no display: meterwright --help\n",
                   stderr);
        return 2;
    }
    QApplication app(argc, argv);
    QApplication::setApplicationName(QStringLiteral("Meterwright"));
    QApplication::setApplicationVersion(QStringLiteral(MW_VERSION));
    QApplication::setOrganizationName(QStringLiteral("Meterwright"));
    initResources();

    MainWindow window;
    window.show();
    const QStringList arguments = QApplication::arguments();
    // Asks who is working once the window is up; closes the workbook if nobody signs in.
    if (arguments.size() > 1) {
        QMetaObject::invokeMethod(
            &window, [&window, path = arguments.at(1)] { window.openAndSignIn(path); },
            Qt::QueuedConnection);
    } else {
        QMetaObject::invokeMethod(
            &window, [&window] { window.openLastWorkbook(); }, Qt::QueuedConnection);
    }
    return QApplication::exec();
}

} // namespace mw::gui
