// Icons drawn from the palette (so they read in light and dark themes) whose shapes carry the
// meaning, never the colour alone: a decision, a warning, and the chart's markers.
#pragma once

#include "core/model/vocabulary.h"

#include <QIcon>
#include <QImage>
#include <QPalette>

namespace mw::gui {

// Pass: a filled disc with a tick; conditional pass: an open ring with a tick; conditional
// fail: a triangle with "!"; fail: a square with a cross.
QIcon outcomeIcon(Outcome outcome, const QPalette& palette);
// True for a dark theme (charts then take their dark theme).
bool isDark(const QPalette& palette);

// A triangle with "!" for anything that needs attention (an entry refused, a TUR below 4:1).
QIcon warningIcon(const QPalette& palette);

// Chart markers: up-scale points are triangles pointing up, down-scale ones pointing down;
// as-found markers are filled, as-left ones hollow.
QImage markerImage(Direction direction, Phase phase, const QColor& colour, int size);

} // namespace mw::gui
