// The people dialog for administrators (add, deactivate, reset a password) and the own-password
// dialog for everyone, on the demo workbook: each good entry saved, each bad one refused with its
// reason and nothing saved.
#include "app/gui/admin/people_dialog.h"
#include "app/gui/main_window.h"
#include "app/gui/workspace.h"
#include "storage/user_repository.h"

#include "tests/support/demo_window.h"

#include <catch2/catch.hpp>

#include <QTableWidget>
#include <QTemporaryDir>

#include <chrono>

namespace {

struct Lab : mwtest::DemoWindow {
    using DemoWindow::DemoWindow;
    mw::storage::UserRepository users() { return mw::storage::UserRepository(workbook()); }
};

} // namespace

TEST_CASE("an administrator adds a person, resets a password and deactivates, never deletes") {
    Lab lab("morgan", "demo-admin");
    mw::gui::PeopleDialog dialog(lab.window.workspace());
    const int before = dialog.table()->rowCount();
    REQUIRE(dialog.addPerson(QStringLiteral("nell"), QStringLiteral("Nell Invented"),
                             mw::Role::Technician, QStringLiteral("nell-secret")));
    CHECK(dialog.table()->rowCount() == before + 1);
    CHECK(lab.users().authenticate(QStringLiteral("nell"), QStringLiteral("nell-secret")));
    CHECK_FALSE(dialog.addPerson(QStringLiteral("nell"), QStringLiteral("Another"),
                                 mw::Role::Reviewer, QStringLiteral("other-secret")));
    CHECK(dialog.message().contains(QStringLiteral("taken")));
    CHECK(dialog.table()->rowCount() == before + 1);

    REQUIRE(dialog.resetPassword(QStringLiteral("nell"), QStringLiteral("nell-secret-2")));
    CHECK_FALSE(lab.users().authenticate(QStringLiteral("nell"), QStringLiteral("nell-secret")));
    CHECK(lab.users().authenticate(QStringLiteral("nell"), QStringLiteral("nell-secret-2")));

    // Tess signed records: she is deactivated, kept, and can no longer sign in.
    REQUIRE(dialog.deactivate(QStringLiteral("tess")));
    CHECK(dialog.message().contains(QStringLiteral("keep their name")));
    REQUIRE(lab.users().findByLogin(QStringLiteral("tess")));
    CHECK_FALSE(lab.users().authenticate(QStringLiteral("tess"), QStringLiteral("demo-tech")));
    CHECK_FALSE(dialog.deactivate(QStringLiteral("morgan"))); // not oneself
    CHECK(dialog.message().contains(QStringLiteral("yourself")));
}

TEST_CASE("only an administrator adds people; everyone changes their own password") {
    Lab lab("tess", "demo-tech");
    mw::gui::PeopleDialog people(lab.window.workspace());
    CHECK_FALSE(people.addPerson(QStringLiteral("zed"), QStringLiteral("Zed"), mw::Role::Reviewer,
                                 QStringLiteral("zed-secret-1")));
    CHECK(people.message().contains(QStringLiteral("administrator")));
    CHECK_FALSE(lab.users().findByLogin(QStringLiteral("zed")));

    mw::gui::OwnPasswordDialog own(lab.window.workspace());
    CHECK_FALSE(own.change(QStringLiteral("wrong"), QStringLiteral("tess-new-secret")));
    CHECK(own.message().contains(QStringLiteral("current password")));
    CHECK_FALSE(own.change(QStringLiteral("demo-tech"), QStringLiteral("short")));
    CHECK(lab.users().authenticate(QStringLiteral("tess"), QStringLiteral("demo-tech")));
    REQUIRE(own.change(QStringLiteral("demo-tech"), QStringLiteral("tess-new-secret")));
    CHECK(lab.users().authenticate(QStringLiteral("tess"), QStringLiteral("tess-new-secret")));
}
