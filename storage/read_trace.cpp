// Removing the -wal and -shm files a read-only look at a workbook made.
#include "storage/read_trace.h"

#include <QFile>
#include <QFileInfo>
#include <QHash>
#include <QMutex>

#include <fcntl.h>
#include <unistd.h>

namespace mw::storage {
namespace {

struct Entry {
    int readers = 0;
    bool companionsExisted = false;
};

QMutex& registryMutex() {
    static QMutex mutex;
    return mutex;
}

QHash<QString, Entry>& registry() {
    static QHash<QString, Entry> entries;
    return entries;
}

bool anyCompanionExists(const QString& path) {
    return QFileInfo::exists(path + QStringLiteral("-wal")) ||
           QFileInfo::exists(path + QStringLiteral("-shm"));
}

// SQLite's unix VFS holds a shared lock on byte 128 of the -shm (the "DMS" slot, os_unix.c:
// UNIX_SHM_BASE 120 + SQLITE_SHM_NLOCK 8) for as long as a connection has the database open.
// F_GETLK only asks; it takes no lock. It does not see this process's own locks, which the
// registry above accounts for.
bool shmInUseElsewhere(const QString& shmPath) {
    const int fd = ::open(QFile::encodeName(shmPath).constData(), O_RDONLY);
    if (fd < 0) {
        return false;
    }
    struct flock lock {};
    lock.l_type = F_WRLCK;
    lock.l_whence = SEEK_SET;
    lock.l_start = 128;
    lock.l_len = 1;
    const bool asked = ::fcntl(fd, F_GETLK, &lock) == 0;
    ::close(fd);
    return !asked || lock.l_type != F_UNLCK;
}

void removeIfUnused(const QString& path) {
    const QString wal = path + QStringLiteral("-wal");
    const QString shm = path + QStringLiteral("-shm");
    if (QFileInfo(wal).size() > 0 || shmInUseElsewhere(shm)) {
        return;
    }
    QFile::remove(shm);
    QFile::remove(wal);
}

} // namespace

ReadTrace::ReadTrace(const QString& path)
    : path_(QFileInfo(path).absoluteFilePath()) {
    const QMutexLocker locker(&registryMutex());
    Entry& entry = registry()[path_];
    if (entry.readers++ == 0) {
        entry.companionsExisted = anyCompanionExists(path_);
    }
}

ReadTrace::~ReadTrace() {
    const QMutexLocker locker(&registryMutex());
    Entry& entry = registry()[path_];
    if (--entry.readers > 0) {
        return;
    }
    if (!entry.companionsExisted) {
        removeIfUnused(path_);
    }
    registry().remove(path_);
}

} // namespace mw::storage
