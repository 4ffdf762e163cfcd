// `meterwright calc coverage` run as a separate process: coverage factors against JCGM
// 100:2008 Table G.2, text and JSON output, and bad options giving exit code 2.
#include "support/approx.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QJsonObject>
#include <QStringList>

using mwtest::absolute;
using mwtest::args;
using mwtest::calc::requireUsageError;
using mwtest::calc::runJson;

TEST_CASE("calc coverage reproduces GUM Table G.2") {
    // JCGM 100:2008 Table G.2: t_95.45(16) = 2.17, t_95(2) = 4.30, t_99(16) = 2.92, ∞ -> 2.000.
    CHECK(runJson(args({"coverage", "--dof", "16"})).value(QStringLiteral("k")).toDouble() ==
          absolute(2.17, 0.005));
    CHECK(runJson(args({"coverage", "--dof", "2", "--probability", "95%"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(4.30, 0.005));
    CHECK(runJson(args({"coverage", "--dof", "16.7", "--probability", "99%"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(2.92, 0.005)); // GUM H.1: ν_eff 16.7 -> 16
    CHECK(runJson(args({"coverage", "--dof", "inf", "--probability", "95.45%"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(2.000, 0.0005));
    CHECK(runJson(args({"coverage", "--dof", "100", "--probability", "0.9545"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(2.025, 0.0005));
}

TEST_CASE("calc coverage refuses bad options") {
    requireUsageError(args({"coverage"}), "--dof");
    requireUsageError(args({"coverage", "--dof", "0"}), "--dof");
    requireUsageError(args({"coverage", "--dof", "ten"}), "--dof");
    requireUsageError(args({"coverage", "--dof", "5", "--probability", "150%"}), "--probability");
}

TEST_CASE("calc coverage prints text unless --json, and refuses a dof below 1") {
    // JCGM 100:2008 G.4.1: ν_eff is truncated to the next lower integer; Table G.2 starts at 1.
    const mwtest::CliResult text = mwtest::calc::run(args({"coverage", "--dof", "16.7"}));
    CHECK(text.exitCode == 0);
    CHECK(text.outText().startsWith(QStringLiteral("k = 2.169 for 16 degrees of freedom (16.7 "
                                                   "truncated)")));
    CHECK_FALSE(text.out.contains('{'));
    const auto below = requireUsageError(args({"coverage", "--dof", "0.5"}), "--dof \"0.5\"");
    CHECK(below.err.contains("Table G.2 starts at 1"));
    CHECK(runJson(args({"coverage", "--dof", "1"})).value(QStringLiteral("dof_used")).toDouble() ==
          1.0);
    // A command that reads no quantities offers no --decimal-comma.
    requireUsageError(args({"coverage", "--dof", "5", "--decimal-comma"}), "decimal-comma");
}
