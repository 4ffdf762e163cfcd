// Where a laid-out document goes: any paged device (the PDF writer, a printer), images of its
// pages (tests, previews), and PDF files written atomically.
#pragma once

#include "core/record/document.h"

#include <QImage>
#include <QString>

#include <stdexcept>
#include <vector>

class QPagedPaintDevice;

namespace mw::record {

// A file that could not be written, with the path and the reason in the message.
class OutputError : public std::runtime_error {
public:
    explicit OutputError(const QString& message)
        : std::runtime_error(message.toStdString()) {}
};

// Lays `document` out on the device's pages (its full paintable area; the layout keeps its
// own margins) and paints them, starting a new page for each. Returns the number of pages.
int paintDocument(const Document& document, QPagedPaintDevice& device);

// Every page as an A4 image at `dpi`, on white.
std::vector<QImage> renderPages(const Document& document, int dpi = 100);

// Writes `document` as an A4 PDF at `path` through QSaveFile: the file appears complete, or not
// at all (a file that was there stays as it was). An existing file is refused unless
// `overwrite`. Returns the number of pages; throws OutputError naming the path and the reason.
int writePdf(const Document& document, const QString& path, bool overwrite);

} // namespace mw::record
