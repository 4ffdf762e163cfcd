// `meterwright calc waveform`: true rms, rectified average and form factor of a waveform (a
// shape or one period of samples) and what an average-responding meter reads for it.
#pragma once

#include "core/circuits/waveform.h"

#include <QCommandLineParser>
#include <QStringList>

namespace mw::cli {

// --waveform sine (default) | square | triangle; UsageError for anything else. Shared with
// calc indication.
WaveShape shapeFrom(const QCommandLineParser& parser);

int runWaveform(const QStringList& arguments);

} // namespace mw::cli
