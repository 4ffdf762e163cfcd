// meterwright review --list on the invented demo: the submitted calibrations with their ids,
// as the workbook holds them, the overdue standard with its justification, and that approval
// is not offered without a window.
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "support/cli_process.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QJsonArray>
#include <QJsonObject>

#include <algorithm>
#include <set>

using mwtest::args;

namespace {

QString demoPath() {
    return mwtest::readOnlyDemo().path();
}

} // namespace

TEST_CASE("review --list --json: the submitted calibrations with their ids and outcomes") {
    mw::storage::Workbook& workbook = mwtest::readOnlyDemo();
    const auto queue =
        mw::storage::SessionRepository(workbook).withState(mw::SessionState::Submitted);
    const QJsonArray rows =
        mwtest::runJson({QStringLiteral("review"), demoPath(), QStringLiteral("--list")})
            .value(QStringLiteral("sessions"))
            .toArray();
    REQUIRE(rows.size() == static_cast<qsizetype>(queue.size()));
    REQUIRE(rows.size() == 3);
    std::set<QString> tags;
    int overdue = 0;
    for (qsizetype i = 0; i < rows.size(); ++i) {
        const QJsonObject row = rows[i].toObject();
        const mw::CalibrationSession& session = queue[std::size_t(i)];
        CHECK(row.value(QStringLiteral("id")).toInteger() == session.id);
        CHECK(row.value(QStringLiteral("outcome")).toString() ==
              QString::fromUtf8(mw::toText(*session.outcome).data()));
        CHECK(row.value(QStringLiteral("technician")).toString() ==
              QStringLiteral("Tess Marlowe-Quine"));
        CHECK(
            row.value(QStringLiteral("submitted_at")).toString().startsWith(QStringLiteral("20")));
        tags.insert(row.value(QStringLiteral("instrument")).toString());
        for (const QJsonValue& use : row.value(QStringLiteral("overdue_standards")).toArray()) {
            ++overdue;
            CHECK(use.toObject().value(QStringLiteral("asset_tag")).toString() ==
                  QStringLiteral("CFS-03"));
            const auto justified =
                std::find_if(session.standards.begin(), session.standards.end(),
                             [](const auto& u) { return !u.overdue_justification.empty(); });
            REQUIRE(justified != session.standards.end());
            CHECK(use.toObject().value(QStringLiteral("justification")).toString().toStdString() ==
                  justified->overdue_justification);
        }
    }
    CHECK(tags == std::set<QString>{QStringLiteral("CFM-103"), QStringLiteral("CFM-204"),
                                    QStringLiteral("CFM-502")});
    CHECK(overdue == 1);
}

TEST_CASE("review --list prints the queue with the justification of the overdue standard") {
    const mwtest::CliResult result =
        mwtest::runMeterwright({QStringLiteral("review"), demoPath(), QStringLiteral("--list")});
    REQUIRE(result.exitCode == 0);
    CHECK(result.outText().startsWith(QStringLiteral("3 calibrations waiting for review")));
    CHECK(result.outText().contains(QStringLiteral("uses CFS-03 past its due date")));
}

TEST_CASE("review without --list says approval is done in the window") {
    const mwtest::CliResult result =
        mwtest::requireUsageError({QStringLiteral("review"), demoPath()}, "--list");
    CHECK(result.errText().contains(QStringLiteral("window")));
}

TEST_CASE("review --help") {
    const mwtest::CliResult result = mwtest::runMeterwright(args({"review", "--help"}));
    CHECK(result.exitCode == 0);
    CHECK(result.outText().contains(QStringLiteral("--list")));
}
