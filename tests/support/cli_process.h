// Shared helpers for tests that run the built meterwright executable as a separate process.
#pragma once

#include <catch2/catch.hpp>

#include <QByteArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QProcess>
#include <QProcessEnvironment>
#include <QString>
#include <QStringList>

#include <initializer_list>

namespace mwtest {

// What one run of the executable left behind.
struct CliResult {
    int exitCode = -1;
    QByteArray out;
    QByteArray err;

    QString outText() const { return QString::fromUtf8(out); }
    QString errText() const { return QString::fromUtf8(err); }
};

// Generous: a loaded machine can be slow to start a Qt process.
inline constexpr int kCliTimeoutMs = 120'000;

// The environment of this process with every way to a display removed, as on a server or in CI.
inline QProcessEnvironment environmentWithoutDisplay() {
    QProcessEnvironment environment = QProcessEnvironment::systemEnvironment();
    for (const char* name : {"DISPLAY", "WAYLAND_DISPLAY", "QT_QPA_PLATFORM"}) {
        environment.remove(QString::fromLatin1(name));
    }
    return environment;
}

// Runs `meterwright ARGUMENTS...` to the end in `environment`; a crash or a timeout fails the
// test.
inline CliResult runMeterwrightIn(const QProcessEnvironment& environment,
                                  const QStringList& arguments, int timeoutMs = kCliTimeoutMs) {
    QProcess process;
    process.setProcessEnvironment(environment);
    process.start(QStringLiteral(MW_BINARY_DIR "/app/meterwright"), arguments);
    REQUIRE(process.waitForFinished(timeoutMs));
    REQUIRE(process.exitStatus() == QProcess::NormalExit);
    return {process.exitCode(), process.readAllStandardOutput(), process.readAllStandardError()};
}

// Runs with `input` piped to standard input (then closed), in this test's own environment.
inline CliResult runMeterwrightWithInput(const QStringList& arguments, const QByteArray& input) {
    QProcess process;
    process.start(QStringLiteral(MW_BINARY_DIR "/app/meterwright"), arguments);
    REQUIRE(process.waitForStarted(kCliTimeoutMs));
    process.write(input);
    process.closeWriteChannel();
    REQUIRE(process.waitForFinished(kCliTimeoutMs));
    REQUIRE(process.exitStatus() == QProcess::NormalExit);
    return {process.exitCode(), process.readAllStandardOutput(), process.readAllStandardError()};
}

// The same in this test's own environment.
inline CliResult runMeterwright(const QStringList& arguments, int timeoutMs = kCliTimeoutMs) {
    return runMeterwrightIn(QProcessEnvironment::systemEnvironment(), arguments, timeoutMs);
}

// Runs with --json (appended unless already given), requires exit code 0 and a JSON object.
inline QJsonObject runJson(QStringList arguments, int timeoutMs = kCliTimeoutMs) {
    if (!arguments.contains(QStringLiteral("--json"))) {
        arguments << QStringLiteral("--json");
    }
    const CliResult result = runMeterwright(arguments, timeoutMs);
    INFO("stderr: " << result.err.toStdString());
    REQUIRE(result.exitCode == 0);
    QJsonParseError error{};
    const QJsonDocument document = QJsonDocument::fromJson(result.out, &error);
    REQUIRE(error.error == QJsonParseError::NoError);
    return document.object();
}

// Exit code 2, exactly one line on stderr that contains `words`, nothing on stdout.
inline CliResult requireUsageError(const QStringList& arguments, const char* words) {
    const CliResult result = runMeterwright(arguments);
    INFO("arguments: " << arguments.join(QLatin1Char(' ')).toStdString());
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.exitCode == 2);
    CHECK(result.err.count('\n') == 1);
    CHECK(result.err.contains(words));
    CHECK(result.out.isEmpty());
    return result;
}

// Command-line words from string literals: args({"shunt", "--ifs", "1mA"}).
inline QStringList args(std::initializer_list<const char*> words) {
    QStringList list;
    for (const char* word : words) {
        list << QString::fromUtf8(word);
    }
    return list;
}

// The same runs for `meterwright calc ARGUMENTS...`, so calculator tests name only the calculation.
namespace calc {

inline QStringList withCalc(const QStringList& arguments) {
    return QStringList{QStringLiteral("calc")} + arguments;
}

inline CliResult run(const QStringList& arguments) {
    return mwtest::runMeterwright(withCalc(arguments));
}

inline QJsonObject runJson(const QStringList& arguments) {
    return mwtest::runJson(withCalc(arguments));
}

inline CliResult requireUsageError(const QStringList& arguments, const char* words) {
    return mwtest::requireUsageError(withCalc(arguments), words);
}

} // namespace calc

} // namespace mwtest
