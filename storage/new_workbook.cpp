// Creating a workbook: built under a temporary name in the target's folder, then renamed.
#include "storage/new_workbook.h"

#include "storage/atomic_file.h"
#include "storage/lab_repository.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QDir>
#include <QFileInfo>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

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
    AtomicFile file(request.path);
    {
        OpenOptions options;
        options.createIfMissing = true;
        Workbook workbook(file.partialPath(), options);
        LabRepository(workbook).save(request.lab);
        User administrator = request.administrator;
        administrator.role = Role::Administrator;
        administrator.active = true;
        UserRepository(workbook).add(administrator, request.password);
    } // closed: the write-ahead log is folded into the file
    try {
        file.commit();
    } catch (const WorkbookError& error) {
        throw WorkbookError(
            Kind::BadInput,
            QStringLiteral("%1 could not be created: %2").arg(request.path, error.message()));
    }
}

} // namespace mw::storage
