// meterwright due on the invented demo: the same list as storage's dueReport and the register's
// due list, overdue first, the standards each meter last used with whether they are in date,
// the window (the lab's setting by default), and the errors.
#include "core/history/calendar.h"
#include "storage/due_query.h"
#include "storage/instrument_repository.h"
#include "support/cli_process.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QJsonArray>
#include <QJsonObject>

#include <map>

using namespace std::chrono;
using mwtest::args;
using mwtest::runJson;

namespace {

const sys_days kAsOf = sys_days{year{2026} / March / 16};

QString demoPath() {
    return mwtest::readOnlyDemo().path();
}

QJsonArray dueItems(const QStringList& extra) {
    return runJson(QStringList{QStringLiteral("due"), demoPath(), QStringLiteral("--as-of"),
                               QStringLiteral("2026-03-16")} +
                   extra)
        .value(QStringLiteral("items"))
        .toArray();
}

QJsonObject itemWith(const QJsonArray& items, const QString& tag) {
    for (const QJsonValue& item : items) {
        if (item.toObject().value(QStringLiteral("asset_tag")).toString() == tag) {
            return item.toObject();
        }
    }
    FAIL("no due item " << tag.toStdString());
    return {};
}

} // namespace

TEST_CASE("due --json lists what dueReport selects, in its order, with its numbers") {
    const mw::storage::DueReport report =
        mw::storage::dueReport(mwtest::readOnlyDemo(), kAsOf, std::nullopt);
    const QJsonObject out = runJson({QStringLiteral("due"), demoPath(), QStringLiteral("--as-of"),
                                     QStringLiteral("2026-03-16")});
    CHECK(out.value(QStringLiteral("as_of")).toString() == QStringLiteral("2026-03-16"));
    CHECK(out.value(QStringLiteral("within_days")).toInt() == 30); // the lab's setting
    const QJsonArray items = out.value(QStringLiteral("items")).toArray();
    REQUIRE(items.size() == static_cast<qsizetype>(report.entries.size()));
    QString previous;
    for (qsizetype i = 0; i < items.size(); ++i) {
        const mw::DueEntry& entry = report.entries[std::size_t(i)];
        const QJsonObject item = items[i].toObject();
        INFO(entry.assetTag);
        CHECK(item.value(QStringLiteral("asset_tag")).toString().toStdString() == entry.assetTag);
        REQUIRE(entry.dueDate);
        const QString due = item.value(QStringLiteral("due_date")).toString();
        CHECK(due == QString::fromStdString(mw::formatDay(*entry.dueDate)));
        CHECK(item.value(QStringLiteral("days_overdue")).toInt() == *entry.daysOverdue);
        CHECK(item.value(QStringLiteral("days_overdue")).toInt() ==
              (kAsOf - *entry.dueDate).count());
        CHECK(due >= previous); // overdue first
        previous = due;
    }
    // The meter out on loan, 45 days past its interval, and the shunt 23 days past its due date.
    CHECK(
        itemWith(items, QStringLiteral("CFM-104")).value(QStringLiteral("days_overdue")).toInt() ==
        45);
    const QJsonObject shunt = itemWith(items, QStringLiteral("CFS-03"));
    CHECK(shunt.value(QStringLiteral("kind")).toString() == QStringLiteral("standard"));
    CHECK(shunt.value(QStringLiteral("days_overdue")).toInt() == 23);
}

TEST_CASE("due --within: every meter's due date is the register's, retired ones left out") {
    const QJsonArray items = dueItems({QStringLiteral("--within"), QStringLiteral("2000")});
    const auto register_ = mw::storage::InstrumentRepository(mwtest::readOnlyDemo()).dueList();
    int meters = 0;
    int notYetDue = 0;
    for (const QJsonValue& value : items) {
        const QJsonObject item = value.toObject();
        if (item.value(QStringLiteral("kind")).toString() != QStringLiteral("instrument")) {
            continue;
        }
        ++meters;
        notYetDue += item.value(QStringLiteral("days_overdue")).toInt() < 0 ? 1 : 0;
        const std::string tag = item.value(QStringLiteral("asset_tag")).toString().toStdString();
        const auto listed = std::find_if(register_.begin(), register_.end(),
                                         [&](const auto& d) { return d.asset_tag == tag; });
        REQUIRE(listed != register_.end());
        REQUIRE(listed->due_date);
        CHECK(item.value(QStringLiteral("due_date")).toString().toStdString() ==
              mw::formatDay(*listed->due_date));
        CHECK_FALSE(item.value(QStringLiteral("location")).toString().isEmpty());
    }
    CHECK(meters == static_cast<int>(register_.size()));
    CHECK(notYetDue > 10);
    CHECK_FALSE(std::any_of(items.begin(), items.end(), [](const QJsonValue& v) {
        return v.toObject().value(QStringLiteral("asset_tag")).toString() ==
               QStringLiteral("CFM-105");
    }));
}

TEST_CASE("due: each meter with the standards its last calibration used, in date or not") {
    const QJsonArray items = dueItems({QStringLiteral("--within"), QStringLiteral("2000")});
    std::map<QString, bool> inDate;
    for (const QJsonValue& value : items) {
        for (const QJsonValue& use :
             value.toObject().value(QStringLiteral("standards")).toArray()) {
            const QJsonObject u = use.toObject();
            inDate[u.value(QStringLiteral("asset_tag")).toString()] =
                u.value(QStringLiteral("in_date")).toBool();
        }
    }
    CHECK(inDate.at(QStringLiteral("CFS-01")));
    CHECK_FALSE(inDate.at(QStringLiteral("CFS-03"))); // the overdue shunt
    const QJsonObject loaned = itemWith(items, QStringLiteral("CFM-104"));
    CHECK(loaned.value(QStringLiteral("location")).toString() ==
          QStringLiteral("Field kit 1 (on loan)"));
    CHECK_FALSE(loaned.value(QStringLiteral("standards")).toArray().isEmpty());
    CHECK(loaned.value(QStringLiteral("open_session")).isNull());
    // Overdue, but its calibration is waiting for review.
    const QJsonObject waiting =
        itemWith(items, QStringLiteral("CFM-204")).value(QStringLiteral("open_session")).toObject();
    CHECK(waiting.value(QStringLiteral("state")).toString() == QStringLiteral("submitted"));
}

TEST_CASE("due prints one line per item, overdue first") {
    const mwtest::CliResult result =
        mwtest::runMeterwright({QStringLiteral("due"), demoPath(), QStringLiteral("--as-of"),
                                QStringLiteral("2026-03-16")});
    REQUIRE(result.exitCode == 0);
    const QStringList lines = result.outText().trimmed().split(QLatin1Char('\n'));
    REQUIRE(lines.size() >= 3);
    CHECK(lines[0].startsWith(
        QStringLiteral("due on or before 2026-04-15 (30 days from 2026-03-16)")));
    CHECK(result.outText().contains(QStringLiteral("45 days overdue")));
}

TEST_CASE("due refuses a bad window or date, naming the option") {
    mwtest::requireUsageError(
        {QStringLiteral("due"), demoPath(), QStringLiteral("--within"), QStringLiteral("-3")},
        "--within \"-3\"");
    mwtest::requireUsageError(
        {QStringLiteral("due"), demoPath(), QStringLiteral("--within"), QStringLiteral("soon")},
        "--within \"soon\"");
    mwtest::requireUsageError({QStringLiteral("due"), demoPath(), QStringLiteral("--as-of"),
                               QStringLiteral("2026-13-01")},
                              "--as-of \"2026-13-01\"");
}

TEST_CASE("due --help names the window and the day") {
    const mwtest::CliResult result = mwtest::runMeterwright(args({"due", "--help"}));
    CHECK(result.exitCode == 0);
    CHECK(result.outText().contains(QStringLiteral("--within")));
    CHECK(result.outText().contains(QStringLiteral("--as-of")));
}
