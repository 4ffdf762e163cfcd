// An anchor for the digest chain: an older copy of the workbook (a backup, a file kept
// elsewhere) to compare the chain with. The chain alone cannot show that its newest records were
// removed or that it was recomputed from some record on; every entry of an older copy must
// still be in the workbook, at the same position, with the same digest.
#pragma once

#include <QSqlDatabase>
#include <QString>

#include <cstdint>
#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

// One entry of the chain of approved records, with what names its record to a person.
struct ChainEntry {
    int position = 0; // 1 for the first record approved in the workbook
    std::int64_t sessionId = 0;
    QString digest;
    QString instrument; // the instrument's asset tag (its id when the tag cannot be read)
    std::optional<int> revision;
    QString approvedAt; // as stored; empty when unknown
};

// The chain as one file holds it, with what tells one laboratory's workbook from another's.
struct StoredChain {
    int schemaVersion = 0;
    QString labName; // empty while the laboratory is not described
    std::vector<ChainEntry> entries;
};

// The newest entry of a chain: how many records it holds and the digest of the last.
struct ChainHead {
    int length = 0;
    QString digest; // empty for an empty chain
};

// What comparing a workbook's chain with an older copy's found.
struct AnchorComparison {
    int copyLength = 0;
    int workbookLength = 0;
    int unchanged = 0;  // entries of the copy found at their position with their digest
    int addedSince = 0; // entries of the workbook after the copy's last one
    // The first entry of the copy removed or changed in the workbook, in words, and its
    // session; nullopt when the copy's whole chain is still there.
    std::optional<QString> firstDifference;
    std::int64_t firstDifferenceSessionId = 0;

    bool holds() const { return !firstDifference; }
};

// "record 57 (session 212, instrument VM-001, revision 1, approved 2024-03-05T10:00:00Z)".
QString describeEntry(const ChainEntry& entry);

ChainHead headOf(const std::vector<ChainEntry>& entries);

// Compares the chain of the workbook with that of an older copy (named `copyName` in the
// words). Pure: no file is read.
AnchorComparison compareWithCopy(const std::vector<ChainEntry>& copy,
                                 const std::vector<ChainEntry>& workbook, const QString& copyName);

// The chain of an open database, in order; of any schema version (record_chain exists since
// version 1). Throws WorkbookError (NotAWorkbook) when the table or a column it needs is missing.
std::vector<ChainEntry> readChain(const QSqlDatabase& db);

// The head of an open workbook's chain, read with one query.
ChainHead chainHead(const Workbook& workbook);

// Opens the workbook file at `path` read-only and as it is (as verifyWorkbookFile does: an older
// version is not upgraded, nothing is written) and reads its chain. Throws WorkbookError when
// the file cannot be opened as a workbook.
StoredChain readChainFile(const QString& path);
// The head of the chain of the workbook file at `path`, opened read-only and as it is like
// readChainFile, without its quick_check: for a copy just written, read back at once.
ChainHead chainHeadOfFile(const QString& path);

// Reads both files and compares their chains. Throws WorkbookError (BadInput) naming the copy
// when it is a workbook of another laboratory: its lab's name differs and its first record is
// not the workbook's (a laboratory renamed since the copy still compares).
AnchorComparison compareWorkbookWithCopy(const QString& workbookPath, const QString& copyPath);

} // namespace mw::storage
