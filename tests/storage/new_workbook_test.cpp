// A new workbook is complete or absent: the lab and its first administrator, written under a
// temporary name and renamed; every refusal leaves the folder as it was.
#include "storage/new_workbook.h"

#include "storage/lab_repository.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QTemporaryDir>

using mw::storage::createWorkbook;
using mw::storage::NewWorkbook;
using mw::storage::WorkbookError;

namespace {

NewWorkbook request(const QString& path) {
    NewWorkbook made;
    made.path = path;
    made.lab = {"Invented Meter Shop", "1 Bench Row", std::nullopt};
    made.administrator.login = "ada";
    made.administrator.full_name = "Ada Invented";
    made.administrator.role = mw::Role::Technician; // set to administrator whatever is asked
    made.password = QStringLiteral("long-enough");
    return made;
}

QStringList filesIn(const QTemporaryDir& dir) {
    return QDir(dir.path()).entryList(QDir::Files | QDir::Hidden | QDir::NoDotAndDotDot);
}

} // namespace

TEST_CASE("a new workbook holds the lab and an administrator, and nothing else is left") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.meterwright"));
    createWorkbook(request(path));
    CHECK(filesIn(dir) == QStringList{QStringLiteral("lab.meterwright")});
    mw::storage::Workbook workbook(path);
    CHECK(mw::storage::LabRepository(workbook).load()->name == "Invented Meter Shop");
    const auto admin = mw::storage::UserRepository(workbook).authenticate(
        QStringLiteral("ada"), QStringLiteral("long-enough"));
    REQUIRE(admin);
    CHECK(admin->role == mw::Role::Administrator);
}

TEST_CASE("creating a workbook refuses and leaves nothing behind") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.meterwright"));
    NewWorkbook bad = request(path);
    bad.password = QStringLiteral("seven77");
    CHECK_THROWS_WITH(createWorkbook(bad), Catch::Contains("at least 8 characters"));
    bad = request(path);
    bad.lab.name = "  ";
    CHECK_THROWS_WITH(createWorkbook(bad), Catch::Contains("lab needs a name"));
    bad = request(path);
    bad.administrator.login = "";
    CHECK_THROWS_WITH(createWorkbook(bad), Catch::Contains("login"));
    CHECK(filesIn(dir).isEmpty());
    bad = request(dir.filePath(QStringLiteral("no/such/folder/lab.meterwright")));
    CHECK_THROWS_WITH(createWorkbook(bad), Catch::Contains("does not exist"));

    QFile existing(path);
    REQUIRE(existing.open(QIODevice::WriteOnly));
    existing.write("someone's notes");
    existing.close();
    CHECK_THROWS_WITH(createWorkbook(request(path)), Catch::Contains("already exists"));
    REQUIRE(existing.open(QIODevice::ReadOnly));
    CHECK(existing.readAll() == "someone's notes");
    CHECK(filesIn(dir) == QStringList{QStringLiteral("lab.meterwright")});
}

TEST_CASE("a chosen password has at least 8 characters (NIST SP 800-63B 5.1.1.1)") {
    CHECK_FALSE(mw::storage::passwordProblem(QStringLiteral("1234567")).isEmpty());
    CHECK(mw::storage::passwordProblem(QStringLiteral("12345678")).isEmpty());
    CHECK_FALSE(mw::storage::passwordProblem(QStringLiteral("        ")).isEmpty());
}
