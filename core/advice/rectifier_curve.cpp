// Predicted error curve of a rectifier voltmeter from its circuit model.
#include "core/advice/rectifier_curve.h"

#include "core/circuits/rectifier_design.h"

#include <cmath>

namespace mw {

std::function<double(double applied)> predictedRectifierError(const RectifierMeter& meter,
                                                              double rangeVoltsRms) {
    return [meter, rangeVoltsRms](double applied) {
        const Waveform sine = Waveform::sine(std::fabs(applied) * std::sqrt(2.0));
        return predictIndication(meter, rangeVoltsRms, sine).indicated - std::fabs(applied);
    };
}

} // namespace mw
