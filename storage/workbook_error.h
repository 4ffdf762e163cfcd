// The one exception the workbook throws: what went wrong, in words a person can act on.
#pragma once

#include <QString>

#include <stdexcept>

namespace mw::storage {

class WorkbookError : public std::runtime_error {
public:
    enum class Kind {
        CannotOpen,    // missing file, no permission, not a regular file
        NotAWorkbook,  // not SQLite at all, or an SQLite file of another application
        Corrupt,       // quick_check or the SQLite header says the file is damaged
        NewerSchema,   // written by a newer Meterwright; left untouched
        NeedsUpgrade,  // older schema opened read-only, so it cannot be migrated
        ReadOnly,      // a write was attempted on a workbook opened read-only
        Locked,        // another program held the write lock longer than the busy timeout
        RuleViolation, // the database refused the change (trigger, constraint, foreign key)
        NotFound,      // no record with the id or key asked for
        BadInput,      // a value the caller passed cannot be stored (empty name, bad unit ...)
        Io,            // backup/restore file operations
        Sql,           // anything else SQLite reported
        Internal,      // a failure of the program itself or a library it uses (not the input)
    };

    WorkbookError(Kind kind, const QString& message);

    Kind kind() const noexcept { return kind_; }
    QString message() const { return QString::fromUtf8(what()); }

private:
    Kind kind_;
};

} // namespace mw::storage
