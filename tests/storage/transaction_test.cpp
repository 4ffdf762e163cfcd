// The write transaction guard: commit, rollback, nesting, and two processes writing the same
// workbook at once without losing a write or seeing "database is locked".
#include "storage/transaction.h"

#include "storage/audit_repository.h"
#include "storage/lab_repository.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QCoreApplication>
#include <QProcess>
#include <QProcessEnvironment>

using mw::storage::Transaction;
using mw::storage::Workbook;

namespace {

std::int64_t instrumentCount(Workbook& workbook) {
    return mw::storage::InstrumentRepository(workbook).count();
}

} // namespace

TEST_CASE("a guard rolls back unless committed, and nested guards join the outer one",
          "[transaction]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    mw::storage::InstrumentRepository instruments(*workbook);

    SECTION("not committed: nothing saved") {
        {
            Transaction outer(*workbook);
            mw::Instrument i = mwtest::demoInstrument("A-1");
            instruments.add(i); // nested guard, committed
        }
        CHECK(instrumentCount(*workbook) == 0);
    }
    SECTION("committed: everything saved") {
        Transaction outer(*workbook);
        for (const char* tag : {"A-1", "A-2", "A-3"}) {
            mw::Instrument i = mwtest::demoInstrument(tag);
            instruments.add(i);
        }
        outer.commit();
        CHECK(instrumentCount(*workbook) == 3);
    }
    SECTION("a failed inner step spoils the whole transaction") {
        Transaction outer(*workbook);
        mw::Instrument first = mwtest::demoInstrument("A-1");
        instruments.add(first);
        mw::Instrument duplicate = mwtest::demoInstrument("A-1");
        CHECK_THROWS_AS(instruments.add(duplicate), mw::storage::WorkbookError);
        CHECK_THROWS_AS(outer.commit(), mw::storage::WorkbookError);
    }
    CHECK(instrumentCount(*workbook) <= 3);
    // The workbook is usable after each case.
    mw::Instrument after = mwtest::demoInstrument("B-1");
    instruments.add(after);
}

TEST_CASE("the audit log names the signed-in user only for the app's own writes", "[transaction]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    workbook->setActor(seed.admin.id);
    mw::storage::LabRepository(*workbook).save({"Lab", "Road", std::nullopt});
    // Someone edits the file directly: the log records no user for it.
    REQUIRE(
        mwtest::rawExec(temp.path(), QStringLiteral("UPDATE lab SET address = 'Lane'")).isEmpty());
    const auto entries = mw::storage::AuditRepository(*workbook).entries(QStringLiteral("lab"));
    REQUIRE(entries.size() == 2);
    CHECK(entries[0].user_id == seed.admin.id);
    CHECK(entries[0].action == QStringLiteral("insert"));
    CHECK_FALSE(entries[1].user_id);
    CHECK(entries[1].action == QStringLiteral("update"));
    CHECK(entries[1].oldValues.contains(QStringLiteral("\"address\":\"Road\"")));
    CHECK(entries[1].newValues.contains(QStringLiteral("\"address\":\"Lane\"")));
}

TEST_CASE("an approval-grade transaction commits with synchronous=FULL", "[transaction]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    auto synchronous = [&] {
        QSqlQuery query(workbook->database());
        query.exec(QStringLiteral("PRAGMA synchronous"));
        query.next();
        return query.value(0).toInt();
    };
    CHECK(synchronous() == 1); // NORMAL: enough for WAL between approvals
    {
        Transaction approval(*workbook, Transaction::Durability::Full);
        CHECK(synchronous() == 2); // FULL (sqlite.org/pragma.html#pragma_synchronous)
        approval.commit();
    }
    CHECK(synchronous() == 1);
}

// Run by the two-process test below in child processes, never on its own (hidden tag).
TEST_CASE("writer process", "[.writer]") {
    const QString path = qEnvironmentVariable("MW_WRITER_WORKBOOK");
    const int writes = qEnvironmentVariableIntValue("MW_WRITER_COUNT");
    const QString prefix = qEnvironmentVariable("MW_WRITER_PREFIX");
    REQUIRE_FALSE(path.isEmpty());
    Workbook workbook(path);
    mw::storage::InstrumentRepository instruments(workbook);
    for (int n = 0; n < writes; ++n) {
        mw::Instrument i =
            mwtest::demoInstrument(QStringLiteral("%1-%2").arg(prefix).arg(n).toStdString());
        instruments.add(i); // one transaction per write
    }
}

TEST_CASE("two processes writing 1000 times each lose nothing", "[transaction]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    constexpr int kWrites = 1000;
    std::vector<std::unique_ptr<QProcess>> writers;
    for (const char* prefix : {"P", "Q"}) {
        auto process = std::make_unique<QProcess>();
        QProcessEnvironment env = QProcessEnvironment::systemEnvironment();
        env.insert(QStringLiteral("MW_WRITER_WORKBOOK"), temp.path());
        env.insert(QStringLiteral("MW_WRITER_COUNT"), QString::number(kWrites));
        env.insert(QStringLiteral("MW_WRITER_PREFIX"), QString::fromLatin1(prefix));
        process->setProcessEnvironment(env);
        process->start(QCoreApplication::applicationFilePath(), {QStringLiteral("[.writer]")});
        writers.push_back(std::move(process));
    }
    for (auto& process : writers) {
        REQUIRE(process->waitForFinished(300000));
        const QString output =
            QString::fromUtf8(process->readAllStandardOutput() + process->readAllStandardError());
        INFO(output.toStdString());
        CHECK(process->exitCode() == 0);
        CHECK_FALSE(output.contains(QStringLiteral("locked")));
    }
    Workbook workbook(temp.path());
    CHECK(instrumentCount(workbook) == 2 * kWrites);
    CHECK(mw::storage::InstrumentRepository(workbook).findByTag(QStringLiteral("P-999")));
    CHECK(mw::storage::InstrumentRepository(workbook).findByTag(QStringLiteral("Q-999")));
}
