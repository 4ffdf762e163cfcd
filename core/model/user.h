// A person who signs records in the workbook; passwords never leave storage.
#pragma once

#include "core/model/vocabulary.h"

#include <cstdint>
#include <string>

namespace mw {

struct User {
    std::int64_t id = 0; // assigned by the workbook; 0 until saved
    std::string login;   // unique within the workbook
    std::string full_name;
    Role role = Role::Technician;
    bool active = true; // users are deactivated, never deleted: records keep their signatures

    bool operator==(const User&) const = default;
};

} // namespace mw
