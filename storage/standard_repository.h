// Reference standards with their certificate, due date and per-range specification.
#pragma once

#include "core/model/reference_standard.h"

#include <QString>

#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

class StandardRepository {
public:
    explicit StandardRepository(Workbook& workbook)
        : workbook_(workbook) {}

    void add(ReferenceStandard& standard); // sets standard.id
    // Saves the fields and the ranges' specifications, each range updated in place by its
    // position (recalibration: a new certificate number and due date).
    void update(const ReferenceStandard& standard);

    std::optional<ReferenceStandard> find(std::int64_t standardId) const;
    std::optional<ReferenceStandard> findByTag(const QString& assetTag) const;
    std::vector<ReferenceStandard> all() const; // ordered by asset tag

private:
    Workbook& workbook_;
};

} // namespace mw::storage
