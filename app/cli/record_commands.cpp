// meterwright record and meterwright history-report: calibration records and instrument
// histories as PDF files, without a display. Every id and tag is checked, and every target
// path, before the first file is written.
#include "app/cli/record_commands.h"

#include "app/cli/cli_support.h"
#include "app/cli/workbook_access.h"
#include "app/record/document_output.h"
#include "app/record/record_loader.h"
#include "core/record/calibration_record.h"
#include "core/record/history_report.h"
#include "core/record/record_format.h"
#include "storage/record_digest.h"

#include <QDir>
#include <QFileInfo>
#include <QJsonArray>
#include <QJsonObject>

namespace mw::cli {
namespace {

using record::RecordLoader;

struct Job {
    std::int64_t sessionId = 0;
    record::RecordSource source;
    QString path;
};

QString joined(const QStringList& words) {
    return words.join(QStringLiteral(", "));
}

void addOutputOptions(QCommandLineParser& parser) {
    parser.addOption({QStringLiteral("out"),
                      QStringLiteral("The PDF file to write; with several --session, the folder "
                                     "that receives one file per record, named by the record."),
                      QStringLiteral("FILE")});
    parser.addOption(
        {QStringLiteral("force"), QStringLiteral("Replace files that already exist.")});
}

std::vector<std::int64_t> requestedSessions(const QCommandLineParser& parser,
                                            const RecordLoader& loader, const QString& workbook) {
    const bool bySession = parser.isSet(QStringLiteral("session"));
    const bool byInstrument = parser.isSet(QStringLiteral("instrument"));
    const bool latest = parser.isSet(QStringLiteral("latest"));
    if (bySession == byInstrument) {
        throw UsageError(QStringLiteral("give --session ID (one or more) or --instrument TAG "
                                        "--latest"));
    }
    if (byInstrument != latest) {
        throw UsageError(byInstrument ? QStringLiteral("--instrument needs --latest (the "
                                                       "instrument's latest approved record)")
                                      : QStringLiteral("--latest needs --instrument TAG"));
    }
    if (byInstrument) {
        const QString tag = parser.value(QStringLiteral("instrument"));
        const auto instrument = loader.instrumentByTag(tag);
        if (!instrument) {
            throw UsageError(QStringLiteral("no instrument with asset tag \"%1\" in %2; nothing "
                                            "was written")
                                 .arg(tag, workbook));
        }
        const auto id = loader.latestApproved(instrument->id);
        if (!id) {
            throw UsageError(QStringLiteral("%1 has no approved record yet; print a draft with "
                                            "--session ID (see meterwright sessions)")
                                 .arg(tag));
        }
        return {*id};
    }
    std::vector<std::int64_t> ids;
    for (const QString& raw : parser.values(QStringLiteral("session"))) {
        bool ok = false;
        const qint64 id = raw.toLongLong(&ok);
        ids.push_back(ok ? id : -1);
    }
    return ids;
}

// Every record loaded and every target decided before anything is written.
std::vector<Job> plan(const QCommandLineParser& parser, const RecordLoader& loader,
                      const QString& workbook) {
    const QString out = requireText(parser, QStringLiteral("out"));
    const std::vector<std::int64_t> ids = requestedSessions(parser, loader, workbook);
    const Timestamp now = record::printTime();
    std::vector<Job> jobs;
    QStringList unknown;
    const QStringList raw = parser.values(QStringLiteral("session"));
    for (std::size_t i = 0; i < ids.size(); ++i) {
        auto source = ids[i] >= 0 ? loader.record(ids[i], now) : std::nullopt;
        if (!source) {
            unknown << (i < std::size_t(raw.size()) ? raw.at(qsizetype(i))
                                                    : QString::number(ids[i]));
            continue;
        }
        jobs.push_back({ids[i], std::move(*source), QString()});
    }
    if (!unknown.isEmpty()) {
        throw UsageError(QStringLiteral("no calibration session with id %1 in %2; nothing was "
                                        "written (see meterwright sessions)")
                             .arg(joined(unknown), workbook));
    }
    const bool many = jobs.size() > 1;
    if (many && QFileInfo(out).exists() && !QFileInfo(out).isDir()) {
        throw UsageError(QStringLiteral("with several --session, --out names a folder, and %1 is "
                                        "a file; nothing was written")
                             .arg(out));
    }
    QStringList existing;
    for (Job& job : jobs) {
        const std::string id = record::recordIdentifier(job.source.instrument, job.sessionId);
        job.path = many ? QDir(out).filePath(QString::fromStdString(record::safeFileStem(id)) +
                                             QStringLiteral(".pdf"))
                        : out;
        if (QFileInfo::exists(job.path) && !parser.isSet(QStringLiteral("force"))) {
            existing << job.path;
        }
    }
    if (!existing.isEmpty()) {
        throw UsageError(
            QStringLiteral("%1 already exist%2; nothing was written (use --force to "
                           "replace)")
                .arg(joined(existing), existing.size() == 1 ? QStringLiteral("s") : QString()));
    }
    if (many && !QDir().mkpath(out)) {
        throw UsageError(
            QStringLiteral("the folder %1 cannot be made; nothing was written").arg(out));
    }
    return jobs;
}

QString stateWords(const CalibrationSession& session) {
    return record::isRecord(session) ? QString::fromUtf8(toText(session.state).data())
                                     : QStringLiteral("draft, watermarked: not a record");
}

int write(const Job& job, bool force) {
    const record::Document document = record::buildCalibrationRecord(job.source);
    try {
        return record::writePdf(document, job.path, force);
    } catch (const record::OutputError& error) {
        throw UsageError(QString::fromStdString(error.what()));
    }
}

int runRecord(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Writes the calibration record of a session as a PDF: with --session ID (the ids "
        "meterwright sessions lists; repeat it for one file per record), or the latest approved "
        "record of an instrument with --instrument TAG --latest. A session that is not approved "
        "prints as a draft, watermarked on every page. Unknown ids or tags, and existing files "
        "without --force, are refused before anything is written."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("session"),
                      QStringLiteral("A session to print; repeat for several."),
                      QStringLiteral("ID")});
    parser.addOption({QStringLiteral("instrument"),
                      QStringLiteral("The instrument whose latest approved record to print."),
                      QStringLiteral("TAG")});
    parser.addOption({QStringLiteral("latest"),
                      QStringLiteral("With --instrument: its latest approved record.")});
    addOutputOptions(parser);
    const QString command = QStringLiteral("record");
    parseOptions(parser, command, arguments);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const auto workbook = openForReading(path);
    const RecordLoader loader(*workbook);
    const std::vector<Job> jobs = plan(parser, loader, path);
    const bool json = parser.isSet(QStringLiteral("json"));
    const bool force = parser.isSet(QStringLiteral("force"));
    QJsonArray files;
    for (std::size_t i = 0; i < jobs.size(); ++i) {
        const Job& job = jobs[i];
        const int pages = write(job, force);
        const CalibrationSession& s = job.source.session;
        const QString id =
            QString::fromStdString(record::recordIdentifier(job.source.instrument, s.id));
        files.append(QJsonObject{
            {QStringLiteral("session"), qint64(s.id)},
            {QStringLiteral("record"), id},
            {QStringLiteral("state"), QString::fromUtf8(toText(s.state).data())},
            {QStringLiteral("draft"), !record::isRecord(s)},
            {QStringLiteral("path"), job.path},
            {QStringLiteral("pages"), pages},
            {QStringLiteral("digest"), QString::fromStdString(s.digest)},
        });
        if (!json) {
            printLine(QStringLiteral("record %1 of %2: session %3, %4 (%5), %6 page%7 -> %8")
                          .arg(i + 1)
                          .arg(jobs.size())
                          .arg(s.id)
                          .arg(id, stateWords(s))
                          .arg(pages)
                          .arg(pages == 1 ? QString() : QStringLiteral("s"), job.path));
        }
    }
    if (json) {
        printJson(
            QJsonObject{{QStringLiteral("workbook"), path}, {QStringLiteral("files"), files}});
    }
    return 0;
}

int runHistoryReport(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Writes the history report of one instrument as a PDF: every calibration with its "
        "outcomes and signatories, the recalibration interval its approved results lead to and "
        "how, and a drift chart per test point."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("instrument"), QStringLiteral("The instrument's asset tag."),
                      QStringLiteral("TAG")});
    addOutputOptions(parser);
    const QString command = QStringLiteral("history-report");
    parseOptions(parser, command, arguments);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const QString tag = requireText(parser, QStringLiteral("instrument"));
    const QString out = requireText(parser, QStringLiteral("out"));
    const auto workbook = openForReading(path);
    const RecordLoader loader(*workbook);
    const auto instrument = loader.instrumentByTag(tag);
    if (!instrument) {
        throw UsageError(
            QStringLiteral("no instrument with asset tag \"%1\" in %2; nothing was written")
                .arg(tag, path));
    }
    const bool force = parser.isSet(QStringLiteral("force"));
    if (QFileInfo::exists(out) && !force) {
        throw UsageError(QStringLiteral("%1 already exists; nothing was written (use --force to "
                                        "replace it)")
                             .arg(out));
    }
    const auto source = loader.history(instrument->id, record::printTime());
    int pages = 0;
    try {
        pages = record::writePdf(record::buildHistoryReport(*source), out, force);
    } catch (const record::OutputError& error) {
        throw UsageError(QString::fromStdString(error.what()));
    }
    const auto calibrations = static_cast<qint64>(source->history.rows.size());
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(QJsonObject{{QStringLiteral("instrument"), tag},
                              {QStringLiteral("calibrations"), calibrations},
                              {QStringLiteral("path"), out},
                              {QStringLiteral("pages"), pages}});
    } else {
        printLine(QStringLiteral("history of %1: %2 calibration%3, %4 page%5 -> %6")
                      .arg(tag)
                      .arg(calibrations)
                      .arg(calibrations == 1 ? QString() : QStringLiteral("s"))
                      .arg(pages)
                      .arg(pages == 1 ? QString() : QStringLiteral("s"), out));
    }
    return 0;
}

} // namespace

std::vector<Command> recordCommands() {
    return {
        {QStringLiteral("record"),
         QStringLiteral("write the calibration record of a session as PDF"), runRecord, true},
        {QStringLiteral("history-report"),
         QStringLiteral("write the history report of an instrument as PDF"), runHistoryReport,
         true},
    };
}

} // namespace mw::cli
