// meterwright history on the invented demo: every number is the engine's (buildHistory on the
// same workbook), calibrations newest first, the JSON keys scripts rely on, and the errors.
#include "core/history/calendar.h"
#include "core/history/instrument_history.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"
#include "support/cli_process.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QJsonArray>
#include <QJsonObject>

using mwtest::args;
using mwtest::runJson;

namespace {

QString demoPath() {
    return mwtest::readOnlyDemo().path();
}

mw::InstrumentHistory engineHistory(const char* tag) {
    mw::storage::Workbook& workbook = mwtest::readOnlyDemo();
    const auto instrument =
        mw::storage::InstrumentRepository(workbook).findByTag(QString::fromLatin1(tag));
    REQUIRE(instrument);
    return mw::buildHistory(*instrument,
                            mw::storage::SessionRepository(workbook).historyOf(instrument->id),
                            mw::storage::StandardRepository(workbook).all(),
                            mw::storage::UserRepository(workbook).all());
}

QJsonObject historyJson(const char* tag) {
    return runJson({QStringLiteral("history"), demoPath(), QStringLiteral("--instrument"),
                    QString::fromLatin1(tag)});
}

QString day(std::chrono::sys_days date) {
    return QString::fromStdString(mw::formatDay(date));
}

QString outcomeText(const std::optional<mw::Outcome>& outcome) {
    return outcome ? QString::fromUtf8(mw::toText(*outcome).data()) : QString();
}

} // namespace

TEST_CASE("history --json: every calibration newest first, as the engine gives it") {
    // CFM-201 holds an amended record: a superseded revision beside its successor.
    const mw::InstrumentHistory engine = engineHistory("CFM-201");
    const QJsonArray rows = historyJson("CFM-201").value(QStringLiteral("calibrations")).toArray();
    REQUIRE(rows.size() == static_cast<qsizetype>(engine.rows.size()));
    int superseded = 0;
    for (qsizetype i = 0; i < rows.size(); ++i) {
        const mw::HistoryRow& row = engine.rows[engine.rows.size() - 1 - std::size_t(i)];
        const QJsonObject json = rows[i].toObject();
        INFO("session " << row.sessionId);
        CHECK(json.value(QStringLiteral("session")).toInteger() == row.sessionId);
        CHECK(json.value(QStringLiteral("state")).toString() ==
              QString::fromUtf8(mw::toText(row.state).data()));
        CHECK(json.value(QStringLiteral("started_on")).toString() == day(mw::dayOf(row.startedAt)));
        CHECK(json.value(QStringLiteral("as_found")).toString() == outcomeText(row.asFound));
        CHECK(json.value(QStringLiteral("as_left")).toString() == outcomeText(row.asLeft));
        REQUIRE(row.worstAsFoundFraction);
        CHECK(json.value(QStringLiteral("worst_as_found_percent_of_limit")).toDouble() ==
              Approx(*row.worstAsFoundFraction * 100.0).epsilon(1e-12));
        CHECK(json.value(QStringLiteral("technician")).toString().toStdString() == row.technician);
        CHECK(json.value(QStringLiteral("reviewer")).toString().toStdString() == row.reviewer);
        superseded += row.state == mw::SessionState::Superseded ? 1 : 0;
    }
    CHECK(superseded == 1);
    CHECK(rows.first().toObject().value(QStringLiteral("started_on")).toString() >
          rows.last().toObject().value(QStringLiteral("started_on")).toString());
}

TEST_CASE("history --json: each test point's as-found errors and drift are the engine's") {
    // CFM-205 drifts toward its limit: significant, with a projected date.
    const mw::InstrumentHistory engine = engineHistory("CFM-205");
    const QJsonArray points = historyJson("CFM-205").value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == static_cast<qsizetype>(engine.points.size()));
    int projected = 0;
    for (qsizetype i = 0; i < points.size(); ++i) {
        const mw::PointHistory& point = engine.points[std::size_t(i)];
        const QJsonObject json = points[i].toObject();
        INFO("point " << point.nominal);
        CHECK(json.value(QStringLiteral("range")).toString().toStdString() == point.rangeLabel);
        CHECK(json.value(QStringLiteral("applied")).toDouble() == point.nominal);
        CHECK(json.value(QStringLiteral("limit")).toDouble() == point.permissibleError);
        const QJsonArray observations = json.value(QStringLiteral("observations")).toArray();
        REQUIRE(observations.size() == static_cast<qsizetype>(point.asFound.size()));
        for (qsizetype k = 0; k < observations.size(); ++k) {
            const QJsonObject o = observations[k].toObject();
            CHECK(o.value(QStringLiteral("date")).toString() == day(point.asFound[k].date));
            CHECK(o.value(QStringLiteral("error")).toDouble() == point.asFound[k].error);
        }
        REQUIRE(point.drift);
        CHECK(json.value(QStringLiteral("slope_per_year")).toDouble() == point.drift->slopePerYear);
        CHECK(json.value(QStringLiteral("p_value")).toDouble() == point.drift->pValue);
        CHECK(json.value(QStringLiteral("significant")).toBool() == point.drift->significant);
        const QJsonValue date = json.value(QStringLiteral("projected_limit_date"));
        if (point.drift->projectedLimitDate) {
            CHECK(date.toString() == day(*point.drift->projectedLimitDate));
            ++projected;
        } else {
            CHECK(date.isNull());
        }
    }
    CHECK(projected >= 1);
}

TEST_CASE("history --json: no drift gives a null projection, and the interval with its steps") {
    const QJsonObject still = historyJson("CFM-104");
    for (const QJsonValue& point : still.value(QStringLiteral("points")).toArray()) {
        CHECK_FALSE(point.toObject().value(QStringLiteral("significant")).toBool());
        CHECK(point.toObject().value(QStringLiteral("projected_limit_date")).isNull());
    }
    const mw::InstrumentHistory engine = engineHistory("CFM-102");
    REQUIRE(engine.interval.recommendation);
    const QJsonObject interval =
        historyJson("CFM-102").value(QStringLiteral("interval")).toObject();
    CHECK(interval.value(QStringLiteral("recommended_days")).toInt() ==
          engine.interval.recommendation->recommendedDays);
    CHECK(interval.value(QStringLiteral("registered_days")).toInt() ==
          engine.interval.registeredDays);
    const QJsonArray steps = interval.value(QStringLiteral("steps")).toArray();
    REQUIRE(steps.size() == static_cast<qsizetype>(engine.interval.recommendation->steps.size()));
    for (qsizetype i = 0; i < steps.size(); ++i) {
        const mw::IntervalStep& step = engine.interval.recommendation->steps[std::size_t(i)];
        const QJsonObject json = steps[i].toObject();
        CHECK(json.value(QStringLiteral("date")).toString() == day(step.date));
        CHECK(json.value(QStringLiteral("interval_days")).toDouble() == step.intervalDays);
        const char* word = step.kind == mw::IntervalStepKind::Lengthen  ? "lengthen"
                           : step.kind == mw::IntervalStepKind::Shorten ? "shorten"
                                                                        : "keep";
        CHECK(json.value(QStringLiteral("step")).toString() == QLatin1String(word));
    }
}

TEST_CASE("history prints the calibrations, each point's drift and the interval as text") {
    const mwtest::CliResult result =
        mwtest::runMeterwright({QStringLiteral("history"), demoPath(),
                                QStringLiteral("--instrument"), QStringLiteral("CFM-205")});
    REQUIRE(result.exitCode == 0);
    CHECK(result.outText().startsWith(QStringLiteral("history of CFM-205")));
    CHECK(result.outText().contains(QStringLiteral("reaches the limit")));
    CHECK(result.outText().contains(QStringLiteral("interval: Starting from")));
}

TEST_CASE("history refuses an unknown tag and a missing --instrument, naming them") {
    mwtest::requireUsageError({QStringLiteral("history"), demoPath(),
                               QStringLiteral("--instrument"), QStringLiteral("CFM-999")},
                              "\"CFM-999\"");
    mwtest::requireUsageError({QStringLiteral("history"), demoPath()}, "--instrument");
    mwtest::requireUsageError(args({"history", "no-such.meterwright", "--instrument", "CFM-101"}),
                              "no-such.meterwright");
}

TEST_CASE("history --help says what it shows") {
    const mwtest::CliResult result = mwtest::runMeterwright(args({"history", "--help"}));
    CHECK(result.exitCode == 0);
    CHECK(result.outText().contains(QStringLiteral("--instrument")));
    CHECK(result.outText().contains(QStringLiteral("drift")));
}
