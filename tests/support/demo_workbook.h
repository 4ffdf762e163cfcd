// The invented demo workbook, written once per test program and opened read-only, for tests
// that read a realistic workbook without changing it.
#pragma once

#include "storage/demo/demo_workbook.h"
#include "storage/workbook.h"

#include <QTemporaryDir>

#include <chrono>

namespace mwtest {

// The demo as of a fixed day, so that its records are the same on every run; written once per
// test program. Tests that change it work on a copy.
inline const QString& demoWorkbookPath() {
    static QTemporaryDir dir;
    static const QString path = [] {
        const QString file = dir.filePath(QStringLiteral("demo.mwb"));
        mw::demo::writeDemoWorkbook(
            file, std::chrono::sys_days{std::chrono::year{2026} / std::chrono::March / 16});
        return file;
    }();
    return path;
}

inline mw::storage::Workbook& readOnlyDemo() {
    static mw::storage::Workbook workbook(demoWorkbookPath(), mw::storage::OpenOptions{true});
    return workbook;
}

} // namespace mwtest
