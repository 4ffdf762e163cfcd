// Painting documents on paged devices, images and PDF files.
#include "app/record/document_output.h"

#include "app/record/document_layout.h"
#include "storage/atomic_file.h"
#include "storage/workbook_error.h"

#include <QFile>
#include <QFileInfo>
#include <QPageSize>
#include <QPagedPaintDevice>
#include <QPainter>
#include <QPdfWriter>

namespace mw::record {
namespace {

// Vector output does not depend on it; it sets the grid text and lines are placed on.
constexpr int kPdfResolution = 600;

} // namespace

int paintDocument(const Document& document, QPagedPaintDevice& device) {
    const DocumentLayout layout(document, device, QSizeF(device.width(), device.height()));
    QPainter painter;
    if (!painter.begin(&device)) {
        throw OutputError(QStringLiteral("the output device could not be opened for painting"));
    }
    for (int page = 0; page < layout.pageCount(); ++page) {
        if (page > 0 && !device.newPage()) {
            throw OutputError(QStringLiteral("page %1 could not be started").arg(page + 1));
        }
        layout.paintPage(painter, page);
    }
    painter.end();
    return layout.pageCount();
}

std::vector<QImage> renderPages(const Document& document, int dpi) {
    const QSize size = QPageSize(QPageSize::A4).sizePixels(dpi);
    QImage probe(size, QImage::Format_RGB32);
    const int dotsPerMeter = qRound(dpi / 0.0254);
    probe.setDotsPerMeterX(dotsPerMeter);
    probe.setDotsPerMeterY(dotsPerMeter);
    const DocumentLayout layout(document, probe, QSizeF(size));
    std::vector<QImage> pages;
    for (int page = 0; page < layout.pageCount(); ++page) {
        QImage image = probe.copy();
        image.fill(Qt::white);
        QPainter painter(&image);
        layout.paintPage(painter, page);
        painter.end();
        pages.push_back(std::move(image));
    }
    return pages;
}

int writePdf(const Document& document, const QString& path, bool overwrite) {
    if (!overwrite && QFileInfo::exists(path)) {
        throw OutputError(QStringLiteral("%1 already exists; nothing was written (use --force "
                                         "to replace it)")
                              .arg(path));
    }
    int pages = 0;
    try {
        // Written under a partial name and renamed when complete, like every file the program
        // creates: a reader never finds half a record under the chosen name.
        storage::AtomicFile target(path, overwrite ? storage::AtomicFile::Existing::Replace
                                                   : storage::AtomicFile::Existing::Refuse);
        QFile file(target.partialPath());
        if (!file.open(QIODevice::WriteOnly | QIODevice::NewOnly)) {
            throw OutputError(
                QStringLiteral("%1 cannot be written: %2").arg(path, file.errorString()));
        }
        {
            QPdfWriter writer(&file);
            writer.setPageSize(QPageSize(QPageSize::A4));
            writer.setPageMargins(QMarginsF(0, 0, 0, 0));
            writer.setResolution(kPdfResolution);
            writer.setTitle(
                QString::fromStdString(document.title + " \u2013 " + document.identifier));
            writer.setCreator(QStringLiteral("Meterwright"));
            pages = paintDocument(document, writer);
        }
        if (!file.flush() || file.error() != QFileDevice::NoError) {
            throw OutputError(
                QStringLiteral("%1 cannot be written: %2").arg(path, file.errorString()));
        }
        file.close();
        target.commit();
    } catch (const storage::WorkbookError& error) {
        throw OutputError(QStringLiteral("%1 cannot be written: %2").arg(path, error.message()));
    }
    return pages;
}

} // namespace mw::record
