// Workbook → New through the dialog with typed keys: a new lab's workbook written, opened and
// signed in as its administrator, remembered among the recent workbooks and opened again on the
// next start; refusals (a short password, an existing file) keep what was typed.
#include "app/gui/admin/new_workbook_dialog.h"
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/recent_workbooks.h"
#include "app/gui/workspace.h"
#include "storage/lab_repository.h"

#include <catch2/catch.hpp>

#include <QApplication>
#include <QDir>
#include <QLabel>
#include <QLineEdit>
#include <QPlainTextEdit>
#include <QSettings>
#include <QTemporaryDir>
#include <QTest>

using mw::gui::NewWorkbookDialog;

namespace {

void typeInto(NewWorkbookDialog& dialog, const char* name, const QString& text) {
    auto* field = dialog.findChild<QWidget*>(QLatin1String(name));
    REQUIRE(field != nullptr);
    if (auto* line = qobject_cast<QLineEdit*>(field)) {
        line->clear();
    }
    field->setFocus();
    QTest::keyClicks(field, text);
}

} // namespace

TEST_CASE("a new lab's workbook is created from the dialog and opened as its administrator") {
    mw::gui::initResources();
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("shop.meterwright"));
    NewWorkbookDialog dialog;
    dialog.show();
    typeInto(dialog, "path", path);
    typeInto(dialog, "labName", QStringLiteral("Invented Meter Shop"));
    typeInto(dialog, "labAddress", QStringLiteral("1 Bench Row"));
    typeInto(dialog, "adminLogin", QStringLiteral("ada"));
    typeInto(dialog, "adminName", QStringLiteral("Ada Invented"));
    typeInto(dialog, "newPassword", QStringLiteral("short"));
    typeInto(dialog, "repeatPassword", QStringLiteral("short"));
    const auto* reason = dialog.findChild<QLabel*>(QStringLiteral("passwordReason"));
    CHECK(reason->text().contains(QStringLiteral("at least 8")));
    CHECK_FALSE(dialog.create());
    CHECK_FALSE(QFileInfo::exists(path));
    // What was typed stays; only the password is typed again.
    CHECK(dialog.findChild<QLineEdit*>(QStringLiteral("labName"))->text() ==
          QStringLiteral("Invented Meter Shop"));
    typeInto(dialog, "newPassword", QStringLiteral("first-secret"));
    typeInto(dialog, "repeatPassword", QStringLiteral("first-secret"));
    CHECK(reason->text().contains(QStringLiteral("can be used")));
    REQUIRE(dialog.create());
    CHECK(QFileInfo::exists(path));
    // Once it exists, the dialog will not write over it.
    CHECK_FALSE(dialog.create());
    CHECK(dialog.message().contains(QStringLiteral("already exists")));

    {
        mw::gui::MainWindow window;
        REQUIRE(window.openNewWorkbook(path, dialog.login(), dialog.password()));
        CHECK(window.workspace().user()->login == "ada");
        CHECK(window.workspace().can(mw::gui::Capability::Administer));
        CHECK(window.workspace().lab().name == "Invented Meter Shop");
        QSettings settings;
        CHECK(mw::gui::RecentWorkbooks(settings).list().front() ==
              QFileInfo(path).absoluteFilePath());
    }
}

TEST_CASE("recent workbooks: newest first, at most eight, only files that exist") {
    QTemporaryDir dir;
    QSettings settings(dir.filePath(QStringLiteral("settings.ini")), QSettings::IniFormat);
    mw::gui::RecentWorkbooks recent(settings);
    QStringList made;
    for (int i = 0; i < 10; ++i) {
        const QString path = dir.filePath(QStringLiteral("w%1.meterwright").arg(i));
        QFile file(path);
        REQUIRE(file.open(QIODevice::WriteOnly));
        made << path;
        recent.remember(path);
    }
    QStringList list = recent.list();
    REQUIRE(list.size() == mw::gui::RecentWorkbooks::kKept);
    CHECK(list.front() == made.back());
    recent.remember(made[5]); // opened again: first once more, not twice
    list = recent.list();
    CHECK(list.front() == made[5]);
    CHECK(list.count(made[5]) == 1);
    QFile::remove(made[9]);
    CHECK_FALSE(recent.list().contains(made[9]));
}
