// The demo command: a new workbook with an invented shop's five years of records, for trying
// the application without typing a register first. It never writes over an existing file.
#include "app/cli/demo_command.h"

#include "app/cli/cli_support.h"
#include "storage/demo/demo_workbook.h"

#include <QCommandLineParser>
#include <QFileInfo>
#include <QJsonObject>

#include <chrono>

namespace mw::cli {
namespace {

const QString kCommand = QStringLiteral("demo");

std::chrono::sys_days lastDay(const QCommandLineParser& parser) {
    if (const auto day = optionalDate(parser, QStringLiteral("as-of"))) {
        return *day;
    }
    return std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
}

QJsonObject toJson(const QString& path, const demo::DemoSummary& s) {
    return QJsonObject{
        {QStringLiteral("workbook"), path},
        {QStringLiteral("instruments"), s.instruments},
        {QStringLiteral("standards"), s.standards},
        {QStringLiteral("overdue_standards"), s.overdueStandards},
        {QStringLiteral("users"), s.users},
        {QStringLiteral("sessions"), s.sessions},
        {QStringLiteral("approved"), s.approved},
        {QStringLiteral("superseded"), s.superseded},
        {QStringLiteral("amendments"), s.amendments},
        {QStringLiteral("submitted"), s.submitted},
        {QStringLiteral("returned"), s.returned},
        {QStringLiteral("drafts"), s.drafts},
        {QStringLiteral("out_of_tolerance_as_found"), s.outOfToleranceAsFound},
        {QStringLiteral("readings"), s.readings},
    };
}

QString toText(const QString& path, const demo::DemoSummary& s) {
    return QStringLiteral("wrote the demo workbook %1\n"
                          "  %2 instruments, %3 reference standards (%4 overdue), %5 users\n"
                          "  %6 calibration records: %7 approved, %8 amended, %9 waiting for "
                          "review, %10 returned, %11 draft; %12 readings\n"
                          "  sign in as tess (technician), rowan (reviewer) or morgan "
                          "(administrator); the demo passwords are in the README")
        .arg(path)
        .arg(s.instruments)
        .arg(s.standards)
        .arg(s.overdueStandards)
        .arg(s.users)
        .arg(s.sessions)
        .arg(s.approved)
        .arg(s.amendments)
        .arg(s.submitted)
        .arg(s.returned)
        .arg(s.drafts)
        .arg(s.readings);
}

int runDemo(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(
        QStringLiteral("Writes a demo workbook of an invented instrument shop (five years of "
                       "calibrations) to a new file. An existing file is never overwritten."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"),
                                 QStringLiteral("The new workbook file to write."));
    parser.addOption({QStringLiteral("as-of"),
                      QStringLiteral("Last day of the demo's five years (default: today, UTC); "
                                     "the same day always gives the same workbook."),
                      QStringLiteral("YYYY-MM-DD")});
    parseOptions(parser, kCommand, arguments);
    if (helpRequested(parser, kCommand)) {
        return 0;
    }
    const QStringList positional = parser.positionalArguments();
    if (positional.size() != 1) {
        throw UsageError(QStringLiteral("expected one WORKBOOK file name, got %1 arguments")
                             .arg(positional.size()));
    }
    const QString path = positional.front();
    if (QFileInfo::exists(path)) {
        throw UsageError(QStringLiteral("%1 already exists; the demo is only written to a new "
                                        "file, never over an existing one")
                             .arg(path));
    }
    const demo::DemoSummary summary = demo::writeDemoWorkbook(path, lastDay(parser));
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(toJson(path, summary));
    } else {
        printLine(toText(path, summary));
    }
    return 0;
}

} // namespace

Command demoCommand() {
    return Command{kCommand, QStringLiteral("write the demo workbook to a new file"), runDemo};
}

} // namespace mw::cli
