// Creating a workbook: built under a temporary name in the target's folder, then renamed.
#include "storage/new_workbook.h"

#include "storage/lab_repository.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QUuid>

#include <unistd.h>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

void removeWithCompanions(const QString& path) {
    for (const QString& suffix :
         {QString(), QStringLiteral("-wal"), QStringLiteral("-shm"), QStringLiteral("-journal")}) {
        QFile::remove(path + suffix);
    }
}

} // namespace

QString passwordProblem(const QString& password) {
    if (password.size() < kMinimumPasswordLength) {
        return QStringLiteral("a password needs at least %1 characters")
            .arg(kMinimumPasswordLength);
    }
    if (password.trimmed().isEmpty()) {
        return QStringLiteral("a password cannot be only spaces");
    }
    return {};
}

void createWorkbook(const NewWorkbook& request) {
    const QFileInfo target(request.path);
    if (target.exists()) {
        throw WorkbookError(Kind::BadInput,
                            QStringLiteral("%1 already exists; a new workbook is only written to a "
                                           "new file, never over an existing one")
                                .arg(request.path));
    }
    if (!target.absoluteDir().exists()) {
        throw WorkbookError(
            Kind::CannotOpen,
            QStringLiteral("the folder %1 does not exist").arg(target.absolutePath()));
    }
    if (QString::fromStdString(request.lab.name).trimmed().isEmpty()) {
        throw WorkbookError(Kind::BadInput, QStringLiteral("the lab needs a name"));
    }
    if (QString::fromStdString(request.administrator.login).trimmed().isEmpty()) {
        throw WorkbookError(Kind::BadInput, QStringLiteral("the administrator needs a login name"));
    }
    if (const QString problem = passwordProblem(request.password); !problem.isEmpty()) {
        throw WorkbookError(Kind::BadInput, problem);
    }
    // A name nobody else picks, in the same folder so that the rename cannot cross file systems.
    const QString partial = target.absoluteDir().filePath(
        QStringLiteral(".%1.creating-%2")
            .arg(target.fileName(), QUuid::createUuid().toString(QUuid::Id128).left(8)));
    try {
        {
            OpenOptions options;
            options.createIfMissing = true;
            Workbook workbook(partial, options);
            LabRepository(workbook).save(request.lab);
            User administrator = request.administrator;
            administrator.role = Role::Administrator;
            administrator.active = true;
            UserRepository(workbook).add(administrator, request.password);
        } // closed: the write-ahead log is folded into the file
        QFile file(partial);
        if (!file.open(QIODevice::ReadWrite) || !file.flush() || ::fsync(file.handle()) != 0) {
            throw WorkbookError(Kind::CannotOpen,
                                QStringLiteral("%1 could not be written to disk").arg(partial));
        }
        file.close();
        // QFile::rename never replaces an existing file (on Linux it asks the kernel not to).
        if (!QFile::rename(partial, target.absoluteFilePath())) {
            throw WorkbookError(Kind::BadInput,
                                QStringLiteral("%1 could not be created (it may have appeared "
                                               "meanwhile)")
                                    .arg(request.path));
        }
    } catch (...) {
        removeWithCompanions(partial);
        throw;
    }
}

} // namespace mw::storage
