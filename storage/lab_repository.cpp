// The lab identity row.
#include "storage/lab_repository.h"

#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

namespace mw::storage {

std::optional<Lab> LabRepository::load() const {
    QSqlQuery query =
        sql::prepare(workbook_.database(), QStringLiteral("SELECT name, address, accreditation_id, "
                                                          "decimal_comma, due_window_days FROM lab "
                                                          "WHERE id = 1"));
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
    lab.decimal_comma = query.value(3).toInt() != 0;
    lab.due_window_days = query.value(4).toInt();
    return lab;
}

void LabRepository::save(const Lab& lab) {
    if (QString::fromStdString(lab.name).trimmed().isEmpty()) {
        throw WorkbookError(WorkbookError::Kind::BadInput, QStringLiteral("the lab needs a name"));
    }
    if (lab.due_window_days < 1 || lab.due_window_days > 366) {
        throw WorkbookError(WorkbookError::Kind::BadInput,
                            QStringLiteral("the due-soon window must be 1 to 366 days, not %1")
                                .arg(lab.due_window_days));
    }
    Transaction transaction(workbook_);
    // Update the one row, or insert it the first time. Not an upsert: the database refuses any
    // insert over an existing key, so that no row can ever be replaced behind the audit log.
    const QVariant accreditation = lab.accreditation_id
                                       ? QVariant(QString::fromStdString(*lab.accreditation_id))
                                       : QVariant(QMetaType(QMetaType::QString));
    QSqlQuery update = sql::prepare(
        workbook_.database(),
        QStringLiteral(
            "UPDATE lab SET name = ?, address = ?, accreditation_id = ?, decimal_comma = ?, "
            "due_window_days = ? WHERE id = 1"));
    update.addBindValue(QString::fromStdString(lab.name));
    update.addBindValue(QString::fromStdString(lab.address));
    update.addBindValue(accreditation);
    update.addBindValue(lab.decimal_comma ? 1 : 0);
    update.addBindValue(lab.due_window_days);
    sql::exec(update, QStringLiteral("saving the lab identity"));
    if (update.numRowsAffected() == 0) {
        QSqlQuery insert = sql::prepare(
            workbook_.database(),
            QStringLiteral("INSERT INTO lab (id, name, address, accreditation_id, decimal_comma, "
                           "due_window_days) VALUES (1, ?, ?, ?, ?, ?)"));
        insert.addBindValue(QString::fromStdString(lab.name));
        insert.addBindValue(QString::fromStdString(lab.address));
        insert.addBindValue(accreditation);
        insert.addBindValue(lab.decimal_comma ? 1 : 0);
        insert.addBindValue(lab.due_window_days);
        sql::exec(insert, QStringLiteral("saving the lab identity"));
    }
    transaction.commit();
}

} // namespace mw::storage
