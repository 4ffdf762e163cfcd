// `meterwright new` and `meterwright user …` run as separate processes: a new lab's workbook with
// its first administrator, people added, disabled and given new passwords, passwords only from
// standard input (never an option), and the refusals with exit code 2.
#include "storage/lab_repository.h"
#include "storage/user_repository.h"
#include "storage/verification.h"
#include "storage/workbook.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QTemporaryDir>

using mwtest::CliResult;
using mwtest::runMeterwrightWithInput;

namespace {

QStringList newArguments(const QString& path) {
    return {QStringLiteral("new"),       path,
            QStringLiteral("--lab"),     QStringLiteral("Invented Meter Shop"),
            QStringLiteral("--address"), QStringLiteral("1 Bench Row\\nNowhere"),
            QStringLiteral("--admin"),   QStringLiteral("ada"),
            QStringLiteral("--name"),    QStringLiteral("Ada Invented")};
}

void requireRefused(const CliResult& result, const char* words) {
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.exitCode == 2);
    CHECK(result.err.count('\n') == 1);
    CHECK(result.err.contains(words));
}

} // namespace

TEST_CASE("new writes an empty workbook with the lab and its first administrator") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.meterwright"));
    const CliResult made =
        runMeterwrightWithInput(newArguments(path), "first-secret\nfirst-secret\n");
    INFO("stderr: " << made.err.toStdString());
    REQUIRE(made.exitCode == 0);
    CHECK(made.outText().contains(QStringLiteral("sign in as ada")));
    CHECK_FALSE(made.out.contains("first-secret")); // never echoed
    // Nothing but the workbook is left in the folder (no temporary or journal files).
    CHECK(QDir(dir.path()).entryList(QDir::Files | QDir::Hidden) ==
          QStringList{QStringLiteral("lab.meterwright")});

    mw::storage::Workbook workbook(path);
    const auto lab = mw::storage::LabRepository(workbook).load();
    REQUIRE(lab);
    CHECK(lab->name == "Invented Meter Shop");
    CHECK(lab->address == "1 Bench Row\nNowhere");
    mw::storage::UserRepository users(workbook);
    const auto admin = users.authenticate(QStringLiteral("ada"), QStringLiteral("first-secret"));
    REQUIRE(admin);
    CHECK(admin->role == mw::Role::Administrator);
    CHECK(admin->full_name == "Ada Invented");
    CHECK(mw::storage::verifyWorkbook(workbook).sound());
    // The hash, not the password, is stored (Argon2id, RFC 9106).
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    CHECK_FALSE(file.readAll().contains("first-secret"));
}

TEST_CASE("new refuses an existing file, a short or mismatched password, missing options") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.meterwright"));
    requireRefused(runMeterwrightWithInput(newArguments(path), "short\n"), "at least 8");
    requireRefused(runMeterwrightWithInput(newArguments(path), "long-enough\nlong-enougH\n"),
                   "differ");
    requireRefused(runMeterwrightWithInput(newArguments(path), ""), "no password");
    CHECK(QDir(dir.path()).entryList(QDir::Files | QDir::Hidden).isEmpty());
    requireRefused(runMeterwrightWithInput({QStringLiteral("new"), path, QStringLiteral("--admin"),
                                            QStringLiteral("ada")},
                                           "long-enough\n"),
                   "--lab");
    // There is no password option: it would show in process lists and shell history.
    requireRefused(runMeterwrightWithInput(newArguments(path) << QStringLiteral("--password")
                                                              << QStringLiteral("long-enough"),
                                           ""),
                   "password");
    REQUIRE(runMeterwrightWithInput(newArguments(path), "long-enough\n").exitCode == 0);
    const QByteArray before = [&] {
        QFile file(path);
        REQUIRE(file.open(QIODevice::ReadOnly));
        return file.readAll();
    }();
    requireRefused(runMeterwrightWithInput(newArguments(path), "long-enough\n"), "already exists");
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    CHECK(file.readAll() == before);
}

TEST_CASE("user adds, disables and re-passwords people; refusals exit 2") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.meterwright"));
    REQUIRE(runMeterwrightWithInput(newArguments(path), "first-secret\n").exitCode == 0);
    const QStringList add = {
        QStringLiteral("user"),         QStringLiteral("add"),    path,
        QStringLiteral("--login"),      QStringLiteral("tom"),    QStringLiteral("--name"),
        QStringLiteral("Tom Invented"), QStringLiteral("--role"), QStringLiteral("technician")};
    const CliResult added = runMeterwrightWithInput(add, "tom-secret-1\ntom-secret-1\n");
    INFO("stderr: " << added.err.toStdString());
    REQUIRE(added.exitCode == 0);
    requireRefused(runMeterwrightWithInput(add, "tom-secret-1\n"), "taken");
    QStringList badRole = add;
    badRole[2 + 2] = QStringLiteral("zed");
    badRole.last() = QStringLiteral("boss");
    requireRefused(runMeterwrightWithInput(badRole, "zed-secret-1\n"), "technician, reviewer");
    requireRefused(runMeterwrightWithInput({QStringLiteral("user"), QStringLiteral("remove"), path,
                                            QStringLiteral("--login"), QStringLiteral("tom")},
                                           ""),
                   "unknown action");
    requireRefused(runMeterwrightWithInput({QStringLiteral("user"), QStringLiteral("disable"), path,
                                            QStringLiteral("--login"), QStringLiteral("nobody")},
                                           ""),
                   "no user");

    const CliResult changed =
        runMeterwrightWithInput({QStringLiteral("user"), QStringLiteral("passwd"), path,
                                 QStringLiteral("--login"), QStringLiteral("tom")},
                                "tom-secret-2\n");
    REQUIRE(changed.exitCode == 0);
    {
        mw::storage::Workbook workbook(path);
        mw::storage::UserRepository users(workbook);
        CHECK_FALSE(users.authenticate(QStringLiteral("tom"), QStringLiteral("tom-secret-1")));
        REQUIRE(users.authenticate(QStringLiteral("tom"), QStringLiteral("tom-secret-2")));
        CHECK(users.authenticate(QStringLiteral("tom"), QStringLiteral("tom-secret-2"))->role ==
              mw::Role::Technician);
    }
    REQUIRE(runMeterwrightWithInput({QStringLiteral("user"), QStringLiteral("disable"), path,
                                     QStringLiteral("--login"), QStringLiteral("tom")},
                                    "")
                .exitCode == 0);
    mw::storage::Workbook workbook(path);
    mw::storage::UserRepository users(workbook);
    CHECK_FALSE(users.authenticate(QStringLiteral("tom"), QStringLiteral("tom-secret-2")));
    REQUIRE(users.findByLogin(QStringLiteral("tom"))); // kept, not deleted
    CHECK_FALSE(users.findByLogin(QStringLiteral("tom"))->active);
}
