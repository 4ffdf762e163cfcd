// Users: insert, update, passwords and sign-in checks.
#include "storage/user_repository.h"

#include "storage/password_hash.h"
#include "storage/signing_keys.h"
#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

const QString kSelect =
    QStringLiteral("SELECT id, login, full_name, role, active, password_hash FROM users ");

User userFrom(const QSqlQuery& query) {
    User user;
    user.id = query.value(0).toLongLong();
    user.login = sql::toStd(query.value(1));
    user.full_name = sql::toStd(query.value(2));
    user.role = sql::enumFrom<Role>(query.value(3), "users.role");
    user.active = query.value(4).toInt() != 0;
    return user;
}

void requirePassword(const QString& password) {
    if (password.isEmpty()) {
        throw WorkbookError(Kind::BadInput, QStringLiteral("a password cannot be empty"));
    }
}

void requireLogin(const User& user) {
    if (QString::fromStdString(user.login).trimmed().isEmpty()) {
        throw WorkbookError(Kind::BadInput, QStringLiteral("a user needs a login name"));
    }
}

} // namespace

void UserRepository::add(User& user, const QString& password) {
    requireLogin(user);
    requirePassword(password);
    const QByteArray hash = hashPassword(password);
    Transaction transaction(workbook_);
    QSqlQuery query = sql::prepare(workbook_.database(),
                                   QStringLiteral("INSERT INTO users (login, full_name, role, "
                                                  "active, password_hash) VALUES (?, ?, ?, ?, ?) "
                                                  "RETURNING id"));
    query.addBindValue(QString::fromStdString(user.login));
    query.addBindValue(QString::fromStdString(user.full_name));
    query.addBindValue(sql::enumText(user.role));
    query.addBindValue(user.active ? 1 : 0);
    query.addBindValue(QString::fromLatin1(hash));
    sql::exec(query, QStringLiteral("adding user \"%1\"").arg(QString::fromStdString(user.login)));
    query.next();
    const std::int64_t id = query.value(0).toLongLong();
    query.finish();
    transaction.commit();
    user.id = id;
}

void UserRepository::update(const User& user) {
    requireLogin(user);
    Transaction transaction(workbook_);
    QSqlQuery query = sql::prepare(workbook_.database(),
                                   QStringLiteral("UPDATE users SET login = ?, full_name = ?, "
                                                  "role = ?, active = ? WHERE id = ?"));
    query.addBindValue(QString::fromStdString(user.login));
    query.addBindValue(QString::fromStdString(user.full_name));
    query.addBindValue(sql::enumText(user.role));
    query.addBindValue(user.active ? 1 : 0);
    query.addBindValue(qint64(user.id));
    sql::exec(query, QStringLiteral("saving user \"%1\"").arg(QString::fromStdString(user.login)));
    if (query.numRowsAffected() != 1) {
        throw WorkbookError(Kind::NotFound, QStringLiteral("no user with id %1").arg(user.id));
    }
    transaction.commit();
}

void UserRepository::setPassword(std::int64_t userId, const QString& password) {
    requirePassword(password);
    const QByteArray hash = hashPassword(password);
    Transaction transaction(workbook_);
    QSqlQuery query = sql::prepare(
        workbook_.database(), QStringLiteral("UPDATE users SET password_hash = ? WHERE id = ?"));
    query.addBindValue(QString::fromLatin1(hash));
    query.addBindValue(qint64(userId));
    sql::exec(query, QStringLiteral("changing the password of user %1").arg(userId));
    if (query.numRowsAffected() != 1) {
        throw WorkbookError(Kind::NotFound, QStringLiteral("no user with id %1").arg(userId));
    }
    // The sealed approval key opens only with the old password: it is retired (what it signed
    // stays verifiable) and the next approval issues one under the new password.
    retireApprovalKey(workbook_.database(), userId,
                      std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now()));
    transaction.commit();
}

std::optional<User> UserRepository::authenticate(const QString& login,
                                                 const QString& password) const {
    QSqlQuery query = sql::prepare(workbook_.database(),
                                   kSelect + QStringLiteral("WHERE login = ? AND active = 1"));
    query.addBindValue(login);
    sql::exec(query, QStringLiteral("signing in"));
    if (!query.next()) {
        hashPassword(password); // same work as a real check, so timing does not reveal logins
        return std::nullopt;
    }
    if (!passwordMatches(password, query.value(5).toString().toLatin1())) {
        return std::nullopt;
    }
    return userFrom(query);
}

std::optional<User> UserRepository::find(std::int64_t userId) const {
    QSqlQuery query = sql::prepare(workbook_.database(), kSelect + QStringLiteral("WHERE id = ?"));
    query.addBindValue(qint64(userId));
    sql::exec(query, QStringLiteral("reading user %1").arg(userId));
    return query.next() ? std::optional<User>(userFrom(query)) : std::nullopt;
}

std::optional<User> UserRepository::findByLogin(const QString& login) const {
    QSqlQuery query =
        sql::prepare(workbook_.database(), kSelect + QStringLiteral("WHERE login = ?"));
    query.addBindValue(login);
    sql::exec(query, QStringLiteral("reading user \"%1\"").arg(login));
    return query.next() ? std::optional<User>(userFrom(query)) : std::nullopt;
}

std::vector<User> UserRepository::all() const {
    QSqlQuery query =
        sql::prepare(workbook_.database(), kSelect + QStringLiteral("ORDER BY login"));
    sql::exec(query, QStringLiteral("listing users"));
    std::vector<User> users;
    while (query.next()) {
        users.push_back(userFrom(query));
    }
    return users;
}

} // namespace mw::storage
