// Reading a workbook leaves no trace: SQLite's read-only connections create the -wal and -shm
// files of a WAL database and cannot delete them on closing, so they are removed here when this
// process made them and nobody else is using them.
#pragma once

#include <QString>

namespace mw::storage {

// Held for as long as this process reads `path` over read-only connections. The last guard of
// a path in this process removes the -wal and -shm files that did not exist when the first one
// was taken, provided the -wal is empty (nobody wrote) and no other process holds SQLite's lock
// on the -shm (nobody else has the file open).
class ReadTrace {
public:
    explicit ReadTrace(const QString& path);
    ~ReadTrace();
    ReadTrace(const ReadTrace&) = delete;
    ReadTrace& operator=(const ReadTrace&) = delete;

private:
    QString path_;
};

} // namespace mw::storage
