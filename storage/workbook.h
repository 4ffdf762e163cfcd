// A workbook: one SQLite file opened through Qt SQL with the pragmas, checks and migrations
// that keep a lab's records safe for years. Repositories (storage/*_repository.h) work on it.
#pragma once

#include <QSqlDatabase>
#include <QString>

#include <chrono>
#include <cstdint>
#include <memory>
#include <optional>

namespace mw::storage {

class ReadTrace;

struct OpenOptions {
    bool readOnly = false;        // open read-only even when the file could be written
    bool createIfMissing = false; // create a new, empty workbook when the file does not exist
    // With createIfMissing, also turn an existing 0-byte file into a workbook. Off by default:
    // an empty file picked by mistake is refused rather than silently written to.
    bool initializeEmptyFile = false;
    // How long a write waits for another process's write to finish before failing as Locked.
    std::chrono::milliseconds busyTimeout{10000};
    bool quickCheck = true; // run PRAGMA quick_check while opening
    // With readOnly, open a workbook of an earlier schema version as it is instead of refusing
    // it (NeedsUpgrade): for commands that only copy or check it (backup, verify).
    bool acceptOlderSchema = false;
    // Open for writing even when the rules (triggers) are missing or changed, so that
    // repairRules() can reinstall them; otherwise such a workbook opens read-only, saying why.
    bool forRepair = false;
};

class Workbook {
public:
    // Opens (or with createIfMissing creates) the workbook at `path`; throws WorkbookError with
    // CannotOpen, NotAWorkbook (also for an existing empty file, see initializeEmptyFile), Corrupt,
    // NewerSchema, NeedsUpgrade or Locked. A file refused for any of these reasons is left exactly
    // as it was. An older schema is upgraded in place after a copy of the file is written beside it
    // (upgradeBackupPath()). A workbook whose rules are missing or changed opens read-only with
    // the reason (see OpenOptions::forRepair).
    explicit Workbook(const QString& path, const OpenOptions& options = {});
    ~Workbook();
    Workbook(const Workbook&) = delete;
    Workbook& operator=(const Workbook&) = delete;

    const QString& path() const { return path_; }
    bool isReadOnly() const { return !readOnlyReason_.isEmpty(); }
    // Why the workbook is read-only ("the file is marked read-only" ...); empty when writable.
    const QString& readOnlyReason() const { return readOnlyReason_; }
    int schemaVersion() const { return schemaVersion_; }
    // The version the file had when it was opened (before any upgrade; 0 for a new file).
    int versionWhenOpened() const { return versionWhenOpened_; }
    // The copy written before an upgrade on this open; empty when no upgrade ran.
    const QString& upgradeBackupPath() const { return upgradeBackupPath_; }

    // The user whose name the audit log records for writes from now on (nullopt: nobody
    // signed in, e.g. while creating the first administrator).
    void setActor(std::optional<std::int64_t> userId) { actor_ = userId; }
    std::optional<std::int64_t> actor() const { return actor_; }

    // The Qt SQL connection; for repositories and tests only, SQL stays in storage/.
    QSqlDatabase database() const;

    // Throws WorkbookError(ReadOnly) naming `what` when the workbook is read-only.
    void requireWritable(const QString& what) const;
    // Refuses every further write, saying why (e.g. a full check found damage after opening).
    void refuseWrites(const QString& reason) { readOnlyReason_ = reason; }

private:
    friend class Transaction;

    void openConnection(const OpenOptions& options);
    void checkHeaderBeforeOpening(const OpenOptions& options);
    void inspectAndMigrate(const OpenOptions& options);
    void refuseWritesWithoutRules();

    QString path_;
    std::unique_ptr<ReadTrace> trace_; // before the connection: it outlives it
    QString connectionName_;
    QString readOnlyReason_;
    QString upgradeBackupPath_;
    int schemaVersion_ = 0;
    int versionWhenOpened_ = 0;
    std::optional<std::int64_t> actor_;
    int transactionDepth_ = 0;
    bool rollbackOnly_ = false;
};

} // namespace mw::storage
