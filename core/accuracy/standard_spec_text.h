// A reference standard's range specification in the compact text a technician types and reads
// back: "0.004%rdg+0.0008%rng", "20ppm+5ppm", "0.5mV", "U=1mV,k=2,dof=8", and limits with a
// floor, "0.004%rdg+0.0008%rng+5uV".
#pragma once

#include "core/model/reference_standard.h"
#include "core/units/quantity.h"

#include <string>
#include <string_view>

namespace mw {

// Sets the accuracy fields of `spec` (percentages, floor, certificate U, k, ν) from `text`, in
// the range's unit; every other field is kept. Throws std::invalid_argument naming the text, the
// place and the reason; `spec` is unchanged then.
void setSpecFromText(StandardRangeSpec& spec, std::string_view text,
                     const ParseOptions& options = {});

// The text form of the accuracy fields (parses back to the same values).
std::string specText(const StandardRangeSpec& spec);

} // namespace mw
