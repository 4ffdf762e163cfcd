// Users: every field round-trips, logins are unique, passwords sign in, deactivation.
#include "storage/user_repository.h"

#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

using mw::Role;
using mw::User;
using mw::storage::UserRepository;
using mw::storage::WorkbookError;

TEST_CASE("users round-trip every field and sign in with their password", "[users]") {
    mwtest::TempWorkbook temp;
    User written{0, "rory", "Rory Review", Role::Reviewer, true};
    {
        auto workbook = temp.open();
        UserRepository(*workbook).add(written, QStringLiteral("s3cret"));
        REQUIRE(written.id > 0);
    }
    mw::storage::Workbook workbook(temp.path());
    UserRepository users(workbook);
    CHECK(users.find(written.id) == written);
    CHECK(users.findByLogin(QStringLiteral("rory")) == written);
    CHECK(users.authenticate(QStringLiteral("rory"), QStringLiteral("s3cret")) == written);
    CHECK_FALSE(users.authenticate(QStringLiteral("rory"), QStringLiteral("S3cret")));
    CHECK_FALSE(users.authenticate(QStringLiteral("nobody"), QStringLiteral("s3cret")));

    User changed = written;
    changed.full_name = "Rory R. Review";
    changed.role = Role::Administrator;
    users.update(changed);
    CHECK(users.find(written.id) == changed);
    users.setPassword(written.id, QStringLiteral("new one"));
    CHECK(users.authenticate(QStringLiteral("rory"), QStringLiteral("new one")));
    CHECK_FALSE(users.authenticate(QStringLiteral("rory"), QStringLiteral("s3cret")));

    changed.active = false;
    users.update(changed);
    CHECK(users.find(written.id)->active == false);
    CHECK_FALSE(users.authenticate(QStringLiteral("rory"), QStringLiteral("new one")));
}

TEST_CASE("bad users are refused with a reason", "[users]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    UserRepository users(*workbook);
    User first{0, "tess", "Tess", Role::Technician, true};
    users.add(first, QStringLiteral("a"));
    User again{0, "tess", "Another Tess", Role::Technician, true};
    try {
        users.add(again, QStringLiteral("b"));
        FAIL("a duplicate login was accepted");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
        CHECK(error.message().contains(QStringLiteral("users.login")));
    }
    User noLogin{0, " ", "Nobody", Role::Technician, true};
    CHECK_THROWS_AS(users.add(noLogin, QStringLiteral("x")), WorkbookError);
    User noPassword{0, "pat", "Pat", Role::Technician, true};
    CHECK_THROWS_AS(users.add(noPassword, QString()), WorkbookError);
    User ghost{4242, "ghost", "Ghost", Role::Technician, true};
    CHECK_THROWS_AS(users.update(ghost), WorkbookError);
    const auto all = users.all();
    REQUIRE(all.size() == 1);
    CHECK(all[0] == first);
}
