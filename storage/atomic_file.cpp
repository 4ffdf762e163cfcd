// Whole-or-nothing file creation: partial names, fsync, rename, and cleaning up after kills.
#include "storage/atomic_file.h"

#include "storage/workbook_error.h"

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QRandomGenerator>
#include <QRegularExpression>

#include <cerrno>
#include <csignal>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <unistd.h>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

const QRegularExpression& partialPattern() {
    static const QRegularExpression pattern(
        QStringLiteral("^\\..+\\.partial-([0-9]+)-[0-9a-f]{8}(-wal|-shm|-journal)?$"));
    return pattern;
}

bool processRunning(qint64 pid) {
    if (pid <= 0 || pid == qint64(::getpid())) {
        return pid > 0;
    }
    return ::kill(pid_t(pid), 0) == 0 || errno == EPERM;
}

bool syncPath(const QString& path, bool directory) {
    const int fd =
        ::open(QFile::encodeName(path).constData(), directory ? (O_RDONLY | O_DIRECTORY) : O_RDWR);
    if (fd < 0) {
        return false;
    }
    const bool synced = ::fsync(fd) == 0;
    return ::close(fd) == 0 && synced;
}

// rename(2) that never replaces an existing file; file systems without RENAME_NOREPLACE fall
// back to link + unlink, which fails the same way on an existing name.
bool renameNoReplace(const QString& from, const QString& to) {
    const QByteArray source = QFile::encodeName(from);
    const QByteArray target = QFile::encodeName(to);
    if (::renameat2(AT_FDCWD, source.constData(), AT_FDCWD, target.constData(), RENAME_NOREPLACE) ==
        0) {
        return true;
    }
    if (errno != EINVAL && errno != ENOSYS) {
        return false;
    }
    return ::link(source.constData(), target.constData()) == 0 && ::unlink(source.constData()) == 0;
}

} // namespace

QString partialPathFor(const QString& targetPath) {
    const QFileInfo target(targetPath);
    return target.absoluteDir().filePath(
        QStringLiteral(".%1.partial-%2-%3")
            .arg(target.fileName())
            .arg(qint64(::getpid()))
            .arg(QRandomGenerator::global()->generate(), 8, 16, QLatin1Char('0')));
}

bool isPartialName(const QString& fileName) {
    return partialPattern().match(fileName).hasMatch();
}

int removeLeftovers(const QString& folder) {
    int removed = 0;
    const QDir dir(folder);
    for (const QString& name :
         dir.entryList({QStringLiteral(".*.partial-*")}, QDir::Files | QDir::Hidden)) {
        const QRegularExpressionMatch match = partialPattern().match(name);
        if (match.hasMatch() && !processRunning(match.captured(1).toLongLong()) &&
            QFile::remove(dir.filePath(name))) {
            ++removed;
        }
    }
    return removed;
}

void removeWithCompanions(const QString& path) {
    for (const char* suffix : {"", "-wal", "-shm", "-journal"}) {
        QFile::remove(path + QLatin1String(suffix));
    }
}

AtomicFile::AtomicFile(const QString& targetPath, Existing existing)
    : target_(QFileInfo(targetPath).absoluteFilePath())
    , partial_(partialPathFor(targetPath))
    , existing_(existing) {
    const QFileInfo target(target_);
    if (!target.absoluteDir().exists()) {
        throw WorkbookError(
            Kind::Io, QStringLiteral("the folder %1 does not exist").arg(target.absolutePath()));
    }
    if (existing_ == Existing::Refuse && (target.exists() || target.isSymLink())) {
        throw WorkbookError(
            Kind::Io,
            QStringLiteral("%1 already exists; it is never written over").arg(targetPath));
    }
    removeLeftovers(target.absolutePath());
}

AtomicFile::~AtomicFile() {
    if (!committed_) {
        removeWithCompanions(partial_);
    }
}

void AtomicFile::commit() {
    if (!syncPath(partial_, false)) {
        throw WorkbookError(Kind::Io,
                            QStringLiteral("%1 could not be written to disk (%2)")
                                .arg(target_, QString::fromLocal8Bit(std::strerror(errno))));
    }
    const bool moved = existing_ == Existing::Replace
                           ? std::rename(QFile::encodeName(partial_).constData(),
                                         QFile::encodeName(target_).constData()) == 0
                           : renameNoReplace(partial_, target_);
    if (!moved) {
        throw WorkbookError(Kind::Io,
                            QStringLiteral("%1 could not be put in place (%2)")
                                .arg(target_, QString::fromLocal8Bit(std::strerror(errno))));
    }
    committed_ = true;
    // The rename itself is only durable once the folder's entry is on disk.
    syncPath(QFileInfo(target_).absolutePath(), true);
}

} // namespace mw::storage
