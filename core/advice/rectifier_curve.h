// The error a rectifier voltmeter's circuit model predicts along its scale, as a curve the
// adjustment advice compares the measured non-linearity with.
#pragma once

#include "core/circuits/rectifier_meter.h"

#include <functional>

namespace mw {

// Error of indication (indicated − applied, in volts rms) that `meter` shows for a sine of
// true rms `applied` on its `rangeVoltsRms` range, from predictIndication() of
// core/circuits/rectifier_design.h. The meter is copied into the returned function.
std::function<double(double applied)> predictedRectifierError(const RectifierMeter& meter,
                                                              double rangeVoltsRms);

} // namespace mw
