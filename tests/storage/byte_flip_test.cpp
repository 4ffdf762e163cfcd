// Random single-byte changes to copies of the demo workbook: each copy is refused, reported
// unsound, or leaves the sealed records as they were. What no approval has sealed yet (audit rows
// after the newest approval, the register's own rows, drafts) may change unseen; the test names
// those tables.
#include "storage/demo/demo_workbook.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QSqlDatabase>
#include <QSqlQuery>
#include <QSqlRecord>
#include <QTemporaryDir>

#include <chrono>
#include <map>
#include <random>
#include <set>
#include <utility>
#include <vector>

namespace {

constexpr int kFlips = 200;

// Every row of every table, in storage order, as text per table: equal texts mean equal rows.
std::map<QString, QString> contentsOf(const QString& path) {
    const QString name = QStringLiteral("byte-flip-contents");
    std::map<QString, QString> contents;
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        db.setConnectOptions(QStringLiteral("QSQLITE_OPEN_READONLY"));
        REQUIRE(db.open());
        QSqlQuery tables(db);
        tables.exec(QStringLiteral("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY "
                                   "name"));
        QStringList names;
        while (tables.next()) {
            names << tables.value(0).toString();
        }
        // Sessions are sealed when approved; one still open (a draft, or one submitted and
        // waiting for review) is not sealed yet, so its rows are compared apart.
        std::vector<std::pair<QString, QString>> selects;
        for (const QString& table : names) {
            if (table == QStringLiteral("calibration_sessions")) {
                selects.emplace_back(table, QStringLiteral("SELECT * FROM calibration_sessions "
                                                           "WHERE state IN ('approved', "
                                                           "'superseded')"));
                selects.emplace_back(QStringLiteral("calibration_sessions (not yet approved)"),
                                     QStringLiteral("SELECT * FROM calibration_sessions WHERE "
                                                    "state NOT IN ('approved', 'superseded')"));
            } else {
                selects.emplace_back(table, QStringLiteral("SELECT * FROM \"%1\"").arg(table));
            }
        }
        for (const auto& [table, select] : selects) {
            QSqlQuery rows(db);
            rows.exec(select);
            QString& text = contents[table];
            while (rows.next()) {
                for (int i = 0; i < rows.record().count(); ++i) {
                    const QVariant value = rows.value(i);
                    text += value.isNull() ? QStringLiteral("NULL") : value.toString();
                    text += QLatin1Char('|');
                }
                text += QLatin1Char('\n');
            }
        }
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
    return contents;
}

// The tables whose rows differ between two copies.
QStringList changedTables(const std::map<QString, QString>& a,
                          const std::map<QString, QString>& b) {
    QStringList changed;
    for (const auto& [table, rows] : a) {
        const auto other = b.find(table);
        if (other == b.end() || other->second != rows) {
            changed << table;
        }
    }
    return changed;
}

} // namespace

TEST_CASE("single byte flips are refused, found, or change nothing", "[byte-flip]") {
    QTemporaryDir dir;
    const QString original = dir.filePath(QStringLiteral("demo.mwb"));
    mw::demo::writeDemoWorkbook(
        original, std::chrono::sys_days{std::chrono::year{2026} / std::chrono::March / 16});
    QFile file(original);
    REQUIRE(file.open(QIODevice::ReadOnly));
    const QByteArray bytes = file.readAll();
    file.close();
    const std::map<QString, QString> contents = contentsOf(original);
    std::set<QString> changedUnseen;
    std::mt19937 random(1402);
    std::uniform_int_distribution<qsizetype> offsets(0, bytes.size() - 1);
    std::uniform_int_distribution<int> bits(0, 7);
    int refused = 0;
    int unsound = 0;
    int unchanged = 0;
    for (int flip = 0; flip < kFlips; ++flip) {
        const qsizetype offset = offsets(random);
        CAPTURE(flip, offset);
        QByteArray changed = bytes;
        changed[offset] = char(changed[offset] ^ char(1 << bits(random)));
        const QString copy = dir.filePath(QStringLiteral("flip-%1.mwb").arg(flip));
        {
            QFile out(copy);
            REQUIRE(out.open(QIODevice::WriteOnly));
            out.write(changed);
        }
        try {
            const mw::storage::VerificationReport report = mw::storage::verifyWorkbookFile(copy);
            if (!report.sound()) {
                ++unsound;
            } else {
                // Sound: the chain and the approved sessions are as they were.
                const QStringList changed = changedTables(contentsOf(copy), contents);
                CHECK_FALSE(changed.contains(QStringLiteral("record_chain")));
                CHECK_FALSE(changed.contains(QStringLiteral("calibration_sessions")));
                changedUnseen.insert(changed.begin(), changed.end());
                ++unchanged;
            }
        } catch (const mw::storage::WorkbookError&) {
            ++refused;
        }
        QFile::remove(copy);
    }
    QStringList unseen(changedUnseen.begin(), changedUnseen.end());
    WARN("byte flips: " << refused << " refused, " << unsound << " unsound, " << unchanged
                        << " sound; tables changed in sound copies: "
                        << unseen.join(QStringLiteral(", ")).toStdString());
    CHECK(refused + unsound + unchanged == kFlips);
}
