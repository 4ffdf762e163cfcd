// The laboratory's identity as it appears on every record.
#pragma once

#include <optional>
#include <string>

namespace mw {

struct Lab {
    std::string name;
    std::string address; // may span several lines
    std::optional<std::string> accreditation_id;
    // How people at this lab write numbers: "12,5" rather than "12.5" (the decimal comma of much
    // of Europe). A comma then never separates thousands.
    bool decimal_comma = false;
    // Instruments and standards due within this many days are listed as due soon.
    int due_window_days = 30;

    bool operator==(const Lab&) const = default;
};

} // namespace mw
