// A main window on a fresh demo workbook with someone signed in, for GUI tests.
#pragma once

#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/workspace.h"
#include "storage/demo/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QTemporaryDir>

#include <chrono>

namespace mwtest {

struct DemoWindow {
    QTemporaryDir dir;
    QString path = dir.filePath(QStringLiteral("demo.meterwright"));
    mw::gui::MainWindow window;

    // The demo's people: tess / demo-tech, rowan / demo-review, morgan / demo-admin.
    DemoWindow(const char* login, const char* password) {
        mw::gui::initResources();
        mw::demo::writeDemoWorkbook(
            path, std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now()));
        QString error;
        REQUIRE(window.openWorkbook(path, &error));
        REQUIRE(window.signIn(QLatin1String(login), QLatin1String(password)));
        window.workspace().waitForBackgroundWork();
    }
    mw::gui::Workspace& workspace() { return window.workspace(); }
    mw::storage::Workbook& workbook() { return *window.workbook(); }
};

} // namespace mwtest
