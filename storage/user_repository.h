// Users of the workbook: roles, active flag and Argon2id password hashes (libsodium).
#pragma once

#include "core/model/user.h"

#include <QString>

#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

class UserRepository {
public:
    explicit UserRepository(Workbook& workbook)
        : workbook_(workbook) {}

    // Inserts `user` with `password` hashed; sets user.id. BadInput for an empty login or
    // password, RuleViolation when the login is taken.
    void add(User& user, const QString& password);
    // Saves full name, role and active flag (login included; it must stay unique).
    void update(const User& user);
    void setPassword(std::int64_t userId, const QString& password);

    // The active user with this login and password; nullopt for a wrong login or password
    // or a deactivated user (the caller cannot tell which, on purpose).
    std::optional<User> authenticate(const QString& login, const QString& password) const;

    std::optional<User> find(std::int64_t userId) const;
    std::optional<User> findByLogin(const QString& login) const;
    std::vector<User> all() const; // ordered by login

private:
    Workbook& workbook_;
};

} // namespace mw::storage
