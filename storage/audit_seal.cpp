// Folding audit rows into the running digest, for sealing and for checking.
#include "storage/audit_seal.h"

#include "storage/sql_support.h"

#include <QCryptographicHash>
#include <QSqlQuery>
#include <QVariant>

#include <vector>

namespace mw::storage {
namespace {

const QString kRows = QStringLiteral("SELECT id, at, user_id, table_name, row_id, action, "
                                     "old_values, new_values FROM audit_log ");

// One field as "N;" (NULL) or "<length>:<UTF-8>;", so no two rows serialise alike.
void addField(QCryptographicHash& hash, const QVariant& value) {
    if (value.isNull()) {
        hash.addData(QByteArrayView("N;", 2));
        return;
    }
    const QByteArray bytes = value.toString().toUtf8();
    hash.addData(QByteArray::number(bytes.size()) + ':');
    hash.addData(bytes);
    hash.addData(QByteArrayView(";", 1));
}

QString fold(const QString& previous, const QSqlQuery& row) {
    QCryptographicHash hash(QCryptographicHash::Sha256);
    hash.addData(previous.toLatin1());
    hash.addData(QByteArrayView("\n", 1));
    for (int i = 0; i < 8; ++i) {
        addField(hash, row.value(i));
    }
    return QString::fromLatin1(hash.result().toHex());
}

struct SealRow {
    int position = 0;
    std::int64_t sessionId = 0;
    std::int64_t throughId = 0;
    QString digest;
};

std::vector<SealRow> sealRows(const QSqlDatabase& db) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT session_id, audit_through_id, "
                                                  "audit_digest FROM record_chain ORDER BY id"));
    sql::exec(q, QStringLiteral("reading the seals of the audit log"));
    std::vector<SealRow> rows;
    int position = 0;
    while (q.next()) {
        ++position;
        if (!q.value(1).isNull()) {
            rows.push_back({position, q.value(0).toLongLong(), q.value(1).toLongLong(),
                            q.value(2).toString()});
        }
    }
    return rows;
}

QString sealName(const SealRow& seal) {
    return QStringLiteral("the audit log as sealed by record %1 (session %2) through row %3")
        .arg(seal.position)
        .arg(seal.sessionId)
        .arg(seal.throughId);
}

} // namespace

AuditSeal auditSealStart() {
    return {0, QString(64, QLatin1Char('0'))};
}

AuditSeal lastAuditSeal(const QSqlDatabase& db) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT audit_through_id, audit_digest FROM "
                                                  "record_chain WHERE audit_through_id IS NOT "
                                                  "NULL ORDER BY id DESC LIMIT 1"));
    sql::exec(q, QStringLiteral("reading the last seal of the audit log"));
    if (!q.next()) {
        return auditSealStart();
    }
    return {q.value(0).toLongLong(), q.value(1).toString()};
}

AuditSeal extendAuditSeal(const QSqlDatabase& db, const AuditSeal& from) {
    QSqlQuery q = sql::prepare(db, kRows + QStringLiteral("WHERE id > ? ORDER BY id"));
    q.setForwardOnly(true);
    q.addBindValue(qint64(from.throughId));
    sql::exec(q, QStringLiteral("sealing the audit log"));
    AuditSeal seal = from;
    while (q.next()) {
        seal.digest = fold(seal.digest, q);
        seal.throughId = q.value(0).toLongLong();
    }
    return seal;
}

QByteArray approvalMessage(const QString& recordDigest, const AuditSeal& seal) {
    return QByteArrayLiteral("meterwright approval 1\nrecord ") + recordDigest.toLatin1() +
           QByteArrayLiteral("\naudit ") + QByteArray::number(qint64(seal.throughId)) + ' ' +
           seal.digest.toLatin1() + '\n';
}

QStringList auditSealProblems(const QSqlDatabase& db, int& rowsChecked, int& rowsUnsealed) {
    const std::vector<SealRow> seals = sealRows(db);
    QSqlQuery q = sql::prepare(db, kRows + QStringLiteral("ORDER BY id"));
    q.setForwardOnly(true);
    sql::exec(q, QStringLiteral("reading the audit log"));
    QString digest = auditSealStart().digest;
    std::int64_t lastId = 0;
    std::int64_t firstGap = 0;
    bool more = q.next();
    std::int64_t previousThrough = 0;
    for (const SealRow& seal : seals) {
        if (seal.throughId < previousThrough) {
            return {sealName(seal) +
                    QStringLiteral(": the seal goes back to an earlier row than the seal before "
                                   "it (row %1)")
                        .arg(previousThrough)};
        }
        previousThrough = seal.throughId;
        while (more && q.value(0).toLongLong() <= seal.throughId) {
            const std::int64_t id = q.value(0).toLongLong();
            if (firstGap == 0 && id != lastId + 1) {
                firstGap = lastId + 1;
            }
            digest = fold(digest, q);
            lastId = id;
            ++rowsChecked;
            more = q.next();
        }
        if (lastId != seal.throughId) {
            return {sealName(seal) + QStringLiteral(": row %1 is missing from the log")
                                         .arg(firstGap != 0 ? firstGap : seal.throughId)};
        }
        if (digest != seal.digest) {
            QString problem = sealName(seal) + QStringLiteral(": a row up to that one was "
                                                              "changed or removed");
            if (firstGap != 0) {
                problem += QStringLiteral(" (row %1 is missing)").arg(firstGap);
            }
            return {problem};
        }
    }
    while (more) {
        ++rowsChecked;
        ++rowsUnsealed;
        more = q.next();
    }
    return {};
}

} // namespace mw::storage
