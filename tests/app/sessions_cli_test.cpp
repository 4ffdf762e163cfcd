// meterwright sessions: the list of a workbook's sessions, and one session with its evaluation
// by the session evaluator, in the keys of `calc evaluate --json`. On the invented demo.
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QJsonArray>
#include <QJsonObject>
#include <QSet>
#include <QTemporaryDir>

using mwtest::runJson;
using mwtest::runMeterwright;

namespace {

QString demo(const QTemporaryDir& dir) {
    const QString path = dir.filePath(QStringLiteral("demo.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("demo"), path, QStringLiteral("--as-of"),
                            QStringLiteral("2026-03-16")})
                .exitCode == 0);
    return path;
}

QSet<QString> keysOf(const QJsonObject& object) {
    QSet<QString> keys;
    for (const QString& key : object.keys()) {
        keys.insert(key);
    }
    return keys;
}

} // namespace

TEST_CASE("sessions lists a workbook's sessions, filtered by instrument and state") {
    QTemporaryDir dir;
    const QString path = demo(dir);
    const QJsonArray all =
        runJson({QStringLiteral("sessions"), path}).value(QStringLiteral("sessions")).toArray();
    CHECK(all.size() == 114);
    const QJsonArray waiting = runJson({QStringLiteral("sessions"), path, QStringLiteral("--state"),
                                        QStringLiteral("submitted")})
                                   .value(QStringLiteral("sessions"))
                                   .toArray();
    REQUIRE(waiting.size() == 3);
    for (const QJsonValue& row : waiting) {
        CHECK(row.toObject().value(QStringLiteral("state")).toString() ==
              QStringLiteral("submitted"));
        CHECK_FALSE(row.toObject().value(QStringLiteral("outcome")).isNull());
    }
    const QJsonArray history = runJson({QStringLiteral("sessions"), path,
                                        QStringLiteral("--instrument"), QStringLiteral("CFM-201")})
                                   .value(QStringLiteral("sessions"))
                                   .toArray();
    REQUIRE(history.size() >= 5);
    for (const QJsonValue& row : history) {
        CHECK(row.toObject().value(QStringLiteral("instrument")).toString() ==
              QStringLiteral("CFM-201"));
    }
    const auto text = runMeterwright({QStringLiteral("sessions"), path});
    CHECK(text.exitCode == 0);
    CHECK(text.outText().contains(QStringLiteral("CFM-402")));
}

TEST_CASE("sessions --session shows the evaluation behind the stored outcome") {
    QTemporaryDir dir;
    const QString path = demo(dir);
    const QJsonArray approved = runJson({QStringLiteral("sessions"), path,
                                         QStringLiteral("--state"), QStringLiteral("approved")})
                                    .value(QStringLiteral("sessions"))
                                    .toArray();
    REQUIRE(approved.size() > 100);
    const QString id =
        QString::number(approved.at(10).toObject().value(QStringLiteral("id")).toInteger());
    const QJsonObject one =
        runJson({QStringLiteral("sessions"), path, QStringLiteral("--session"), id});
    CHECK(one.value(QStringLiteral("inputs")).toString() ==
          QStringLiteral("sealed with the session"));
    const QJsonObject evaluation = one.value(QStringLiteral("evaluation")).toObject();
    CHECK(evaluation.value(QStringLiteral("overall")) == one.value(QStringLiteral("outcome")));
    const QJsonArray ranges = evaluation.value(QStringLiteral("ranges")).toArray();
    REQUIRE_FALSE(ranges.isEmpty());
    const QJsonObject first = ranges.first().toObject();
    CHECK_FALSE(first.value(QStringLiteral("reference")).isNull());

    // The points carry exactly the keys of `calc evaluate --json`.
    const QString csv = dir.filePath(QStringLiteral("readings.csv"));
    {
        QFile file(csv);
        REQUIRE(file.open(QIODevice::WriteOnly));
        file.write("applied,indicated\n2,2.01\n5,5.02\n10,10.03\n");
    }
    const QJsonObject calc =
        runJson({QStringLiteral("calc"), QStringLiteral("evaluate"), QStringLiteral("--readings"),
                 csv, QStringLiteral("--range"), QStringLiteral("10V"), QStringLiteral("--class"),
                 QStringLiteral("1.5")});
    CHECK(keysOf(first.value(QStringLiteral("points")).toArray().first().toObject()) ==
          keysOf(calc.value(QStringLiteral("points")).toArray().first().toObject()));
}

TEST_CASE("sessions names an unknown session, tag or state and exits 2") {
    QTemporaryDir dir;
    const QString path = demo(dir);
    auto run = runMeterwright(
        {QStringLiteral("sessions"), path, QStringLiteral("--session"), QStringLiteral("99999")});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("no calibration session with id \"99999\"")));
    run = runMeterwright({QStringLiteral("sessions"), path, QStringLiteral("--instrument"),
                          QStringLiteral("NOPE-1")});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("NOPE-1")));
    run = runMeterwright(
        {QStringLiteral("sessions"), path, QStringLiteral("--state"), QStringLiteral("lost")});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("--state \"lost\"")));
}
