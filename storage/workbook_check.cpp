// Verifying a workbook as it is: file-level checks on the file itself, the records of an older
// version in an upgraded throw-away copy.
#include "storage/verification.h"

#include "storage/schema.h"
#include "storage/schema_check.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QTemporaryDir>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

// The chain is computed by the current schema's code, so an older workbook's records are read
// from a copy upgraded in a temporary folder; the workbook itself is never written.
void checkOlderRecords(const Workbook& workbook, VerificationReport& report) {
    const QTemporaryDir scratch;
    if (!scratch.isValid()) {
        throw WorkbookError(Kind::Io, QStringLiteral("no temporary folder to check the records "
                                                     "of an older workbook in (%1)")
                                          .arg(scratch.errorString()));
    }
    const QString copy = scratch.filePath(QStringLiteral("upgraded.mwb"));
    dialect::vacuumInto(workbook.database(), copy);
    OpenOptions options;
    options.quickCheck = false;
    const Workbook upgraded(copy, options);
    detail::checkRecords(upgraded.database(), report);
}

template <typename Check>
void guarded(VerificationReport& report, const QString& what, Check check) {
    try {
        check();
    } catch (const WorkbookError& error) {
        report.note(QStringLiteral("%1 could not be checked: %2").arg(what, error.message()));
    }
}

} // namespace

void VerificationReport::note(const QString& problem, std::int64_t sessionId, qsizetype at) {
    if (at >= 0 && at <= problems.size()) {
        problems.insert(at, problem);
    } else {
        problems.append(problem);
    }
    // The first mismatch is the first problem that names a record, when there is one (the
    // chain's, placed with `at`, before the sessions'): it says the most about what changed.
    const bool namesRecord = sessionId != 0;
    const bool firstNamesRecord = firstMismatchSessionId.value_or(0) != 0;
    if (!firstMismatch || (namesRecord && (!firstNamesRecord || at >= 0))) {
        firstMismatch = problem;
        firstMismatchSessionId = sessionId;
    }
}

VerificationReport verifyWorkbook(const Workbook& workbook) {
    const QSqlDatabase db = workbook.database();
    VerificationReport report;
    report.schemaVersion = workbook.schemaVersion();
    report.integrityMessage = dialect::integrityCheck(db);
    report.integrityOk = report.integrityMessage == QLatin1String("ok");
    if (!report.integrityOk) {
        report.note(QStringLiteral("SQLite's integrity check: %1").arg(report.integrityMessage));
    }
    guarded(report, QStringLiteral("the foreign keys"), [&] {
        if (const auto problem = dialect::foreignKeyProblem(db)) {
            report.note(QStringLiteral("foreign keys: %1").arg(*problem));
        }
    });
    guarded(report, QStringLiteral("the schema"), [&] {
        for (const QString& difference : schema::differences(db, report.schemaVersion)) {
            report.note(QStringLiteral("schema: %1").arg(difference));
        }
    });
    guarded(report, QStringLiteral("the stored values"), [&] {
        for (const QString& problem :
             schema::valueProblems(workbook.path(), report.schemaVersion)) {
            report.note(QStringLiteral("values: %1").arg(problem));
        }
    });
    guarded(report, QStringLiteral("the records"), [&] {
        if (report.schemaVersion < schema::kCurrentVersion) {
            checkOlderRecords(workbook, report);
        } else {
            detail::checkRecords(db, report);
        }
    });
    return report;
}

VerificationReport verifyWorkbookFile(const QString& path) {
    OpenOptions options;
    options.readOnly = true;
    options.acceptOlderSchema = true;
    // quick_check while opening refuses a damaged file as before (exit 2); integrity_check
    // then also compares every index with its table, as a finding.
    const Workbook workbook(path, options);
    return verifyWorkbook(workbook);
}

} // namespace mw::storage
