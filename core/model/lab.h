// The laboratory's identity as it appears on every record.
#pragma once

#include <optional>
#include <string>

namespace mw {

struct Lab {
    std::string name;
    std::string address; // may span several lines
    std::optional<std::string> accreditation_id;

    bool operator==(const Lab&) const = default;
};

} // namespace mw
