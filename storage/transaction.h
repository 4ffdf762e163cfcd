// Scoped write transaction: rolls back in its destructor unless commit() ran. Nested guards
// join the outermost one, so a caller can batch many repository writes into one commit.
#pragma once

namespace mw::storage {

class Workbook;

class Transaction {
public:
    enum class Durability {
        Normal, // WAL with synchronous=NORMAL: durable once the WAL is checkpointed
        Full,   // synchronous=FULL for this commit (approvals): on disk when commit() returns;
                // nested in a Normal guard it takes the outer guard's durability
    };

    // Takes the write lock at once (BEGIN IMMEDIATE) so that concurrent writers queue on the
    // busy timeout instead of failing; throws WorkbookError(ReadOnly / Locked).
    explicit Transaction(Workbook& workbook, Durability durability = Durability::Normal);
    ~Transaction();
    Transaction(const Transaction&) = delete;
    Transaction& operator=(const Transaction&) = delete;

    // Commits (the outermost guard) or marks this level done (a nested guard). A nested guard
    // destroyed without commit() makes the whole outer transaction roll back.
    void commit();

private:
    Workbook& workbook_;
    bool outermost_ = false;
    bool done_ = false;
    Durability durability_;
};

} // namespace mw::storage
