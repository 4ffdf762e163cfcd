// Files the program creates appear whole or not at all: each is written under a partial name in
// the target's folder, synced, and renamed into place only when complete.
#pragma once

#include <QString>

namespace mw::storage {

// The partial name for `targetPath`: ".<file name>.partial-<process id>-<random>" in the same
// folder (so the rename cannot cross file systems). The leading dot hides it and keeps it out of
// every pattern the program looks for, e.g. the rolling set of automatic backups.
QString partialPathFor(const QString& targetPath);
// True for a file name partialPathFor() gives (with or without SQLite's -wal, -shm, -journal).
bool isPartialName(const QString& fileName);
// Removes the partial files in `folder` whose writing process is no longer running (left by a
// run that was killed or lost its power); returns how many files were removed.
int removeLeftovers(const QString& folder);
// Removes a file with the -wal, -shm and -journal files SQLite may have put beside it.
void removeWithCompanions(const QString& path);

// One file being created. The destructor removes the partial file (and its companions) unless
// commit() put it in place, so every failure, exception or early return leaves nothing behind.
class AtomicFile {
public:
    enum class Existing { Refuse, Replace };
    // Throws WorkbookError (Io) when the target exists and `existing` is Refuse, or its folder
    // does not exist. Removes leftovers of killed runs from the folder first.
    explicit AtomicFile(const QString& targetPath, Existing existing = Existing::Refuse);
    ~AtomicFile();
    AtomicFile(const AtomicFile&) = delete;
    AtomicFile& operator=(const AtomicFile&) = delete;

    // Where to write; nothing exists there yet.
    const QString& partialPath() const { return partial_; }
    const QString& targetPath() const { return target_; }
    // Syncs the partial file to disk, renames it to the target (never over an existing file
    // under Existing::Refuse) and syncs the folder. Throws WorkbookError (Io) on failure; the
    // partial file is then removed by the destructor and the target is as it was.
    void commit();

private:
    QString target_;
    QString partial_;
    Existing existing_;
    bool committed_ = false;
};

} // namespace mw::storage
