// Pieces shared by the calibration record and the history report: words for a range, the
// identification of the item and of the laboratory.
#include "core/record/record_parts.h"

#include "core/record/record_format.h"

#include <cstdio>

namespace mw::record::detail {

std::string text(std::string_view view) {
    return std::string(view);
}

const RangeSpec* rangeById(const Instrument& instrument, std::int64_t rangeId) {
    for (const RangeSpec& range : instrument.ranges) {
        if (range.id == rangeId) {
            return &range;
        }
    }
    return nullptr;
}

std::string rangeWords(const RangeSpec& range, std::optional<SignalType> signal) {
    return range.label + " (" + quantity(range.lower_limit, range.unit) + " to " +
           quantity(range.full_scale, range.unit) + ", " +
           (signal ? text(displayName(*signal)) : std::string("signal not recorded")) + ")";
}

std::vector<Field> instrumentFields(const Instrument& instrument) {
    std::vector<Field> fields;
    fields.push_back({"Description", instrument.description.empty()
                                         ? text(displayName(instrument.kind))
                                         : instrument.description + " (" +
                                               text(displayName(instrument.kind)) + ")"});
    fields.push_back({"Maker and model", instrument.manufacturer + " " + instrument.model});
    fields.push_back({"Serial number", instrument.serial.empty() ? "none" : instrument.serial});
    fields.push_back({"Asset tag", instrument.asset_tag});
    fields.push_back({"Movement", quantity(instrument.movement.amps_fs, Unit::Ampere) +
                                      " full scale, coil " +
                                      quantity(instrument.movement.ohms_coil, Unit::Ohm)});
    std::string ranges;
    for (const RangeSpec& range : instrument.ranges) {
        if (!ranges.empty()) {
            ranges += '\n';
        }
        ranges += rangeWords(range, range.signal);
    }
    fields.push_back({"Ranges", ranges.empty() ? "none registered" : ranges});
    char accuracy[160];
    std::snprintf(accuracy, sizeof accuracy,
                  "class %g (IEC 60051-2): limit of error \u00B1%g %% of the fiducial value",
                  instrument.accuracy_class, instrument.accuracy_class);
    fields.push_back({"Accuracy class", accuracy});
    std::string scale = text(displayName(instrument.scale_type));
    if (instrument.scale_divisions > 0) {
        scale += ", " + std::to_string(instrument.scale_divisions) + " divisions";
    }
    fields.push_back({"Scale", scale});
    return fields;
}

std::vector<Field> labFields(const std::optional<Lab>& lab) {
    if (!lab) {
        return {{"Laboratory", "not described in the workbook (an administrator enters it)"}};
    }
    std::vector<Field> fields{{"Laboratory", lab->name}, {"Address", lab->address}};
    if (lab->accreditation_id && !lab->accreditation_id->empty()) {
        fields.push_back({"Accreditation", *lab->accreditation_id});
    }
    return fields;
}

std::string runningHead(const std::optional<Lab>& lab) {
    return lab ? lab->name : std::string("Laboratory not described");
}

} // namespace mw::record::detail
