// The dispatcher of the meterwright executable run with no display: --version and --help, the
// one-line errors for unknown commands and options, and the advice when a window is asked for.
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QStringList>
#include <QTemporaryDir>

using mwtest::args;
using mwtest::CliResult;

namespace {

CliResult runWithoutDisplay(const QStringList& arguments) {
    return mwtest::runMeterwrightIn(mwtest::environmentWithoutDisplay(), arguments);
}

// Exit code 2 and exactly one line on stderr containing `words`, nothing on stdout.
void requireOneLineError(const QStringList& arguments, const char* words) {
    const CliResult result = runWithoutDisplay(arguments);
    INFO("arguments: " << arguments.join(QLatin1Char(' ')).toStdString());
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.exitCode == 2);
    CHECK(result.err.count('\n') == 1);
    CHECK(result.err.contains(words));
    CHECK(result.out.isEmpty());
}

} // namespace

TEST_CASE("meterwright --version prints the version without a display") {
    // Common practice (GNU coding standards, --version): name and version on stdout, exit 0.
    const CliResult result = runWithoutDisplay(args({"--version"}));
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.exitCode == 0);
    CHECK(result.outText().trimmed() == QStringLiteral("meterwright " MW_VERSION));
    CHECK(result.err.isEmpty());
}

TEST_CASE("meterwright --help lists the commands without a display") {
    const CliResult result = runWithoutDisplay(args({"--help"}));
    INFO("stdout: " << result.out.toStdString());
    CHECK(result.exitCode == 0);
    for (const char* command : {"demo", "verify", "calc"}) {
        INFO(command);
        CHECK(result.outText().contains(QStringLiteral("\n  %1 ").arg(QLatin1String(command))));
    }
    CHECK(result.err.isEmpty());
    const CliResult calc = runWithoutDisplay(args({"calc", "--help"}));
    CHECK(calc.exitCode == 0);
    for (const char* command : {"multiplier", "indication", "shunt", "ayrton", "waveform",
                                "temperature", "eseries", "coverage", "evaluate"}) {
        INFO(command);
        CHECK(calc.outText().contains(QLatin1String(command)));
    }
}

TEST_CASE("meterwright refuses unknown commands and options in one line, exit code 2") {
    // Common practice (POSIX utility conventions, exit status > 1 for usage errors).
    requireOneLineError(args({"bogus"}), "unknown command \"bogus\"");
    requireOneLineError(args({"--bogus"}), "unknown option \"--bogus\"");
    requireOneLineError(args({"calc", "nosuch"}), "unknown command \"nosuch\"");
    requireOneLineError(args({"calc", "shunt", "--nosuch", "1"}), "nosuch");
}

TEST_CASE("meterwright calc with no calculation is a usage error") {
    // One line on stderr pointing to the list of calculations, nothing on stdout.
    requireOneLineError(args({"calc"}), "no command given; see meterwright calc --help");
}

TEST_CASE("meterwright with a workbook and no display says how to use xvfb-run") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString workbook = dir.filePath(QStringLiteral("shop.mwb"));
    const CliResult result = runWithoutDisplay(QStringList{workbook});
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.exitCode == 2);
    CHECK(result.err.contains("no display"));
    CHECK(result.err.contains("xvfb-run"));
    CHECK(result.out.isEmpty());
}
