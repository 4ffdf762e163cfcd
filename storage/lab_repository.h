// The laboratory identity (a single row): name, address, accreditation id.
#pragma once

#include "core/model/lab.h"

#include <optional>

namespace mw::storage {

class Workbook;

class LabRepository {
public:
    explicit LabRepository(Workbook& workbook)
        : workbook_(workbook) {}

    std::optional<Lab> load() const; // nullopt until the lab has been described
    void save(const Lab& lab);       // BadInput for an empty name

private:
    Workbook& workbook_;
};

} // namespace mw::storage
