// The lab identity row.
#include "storage/lab_repository.h"

#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

namespace mw::storage {

std::optional<Lab> LabRepository::load() const {
    QSqlQuery query = sql::prepare(workbook_.database(),
                                   QStringLiteral("SELECT name, address, accreditation_id FROM "
                                                  "lab WHERE id = 1"));
    sql::exec(query, QStringLiteral("reading the lab identity"));
    if (!query.next()) {
        return std::nullopt;
    }
    Lab lab;
    lab.name = sql::toStd(query.value(0));
    lab.address = sql::toStd(query.value(1));
    if (!query.value(2).isNull()) {
        lab.accreditation_id = sql::toStd(query.value(2));
    }
    return lab;
}

void LabRepository::save(const Lab& lab) {
    if (QString::fromStdString(lab.name).trimmed().isEmpty()) {
        throw WorkbookError(WorkbookError::Kind::BadInput, QStringLiteral("the lab needs a name"));
    }
    Transaction transaction(workbook_);
    // Portable upsert (SQLite 3.24+, PostgreSQL 9.5+).
    QSqlQuery query = sql::prepare(
        workbook_.database(),
        QStringLiteral("INSERT INTO lab (id, name, address, accreditation_id) VALUES (1, ?, ?, ?) "
                       "ON CONFLICT (id) DO UPDATE SET name = excluded.name, address = "
                       "excluded.address, accreditation_id = excluded.accreditation_id"));
    query.addBindValue(QString::fromStdString(lab.name));
    query.addBindValue(QString::fromStdString(lab.address));
    query.addBindValue(lab.accreditation_id
                           ? QVariant(QString::fromStdString(*lab.accreditation_id))
                           : QVariant(QMetaType(QMetaType::QString)));
    sql::exec(query, QStringLiteral("saving the lab identity"));
    transaction.commit();
}

} // namespace mw::storage
