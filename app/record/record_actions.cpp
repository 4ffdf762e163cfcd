// Print and export entry points for the window.
#include "app/record/record_actions.h"

#include "app/record/document_output.h"
#include "app/record/record_loader.h"
#include "core/record/record_format.h"
#include "storage/workbook_error.h"

#include <QDir>
#include <QFileDialog>
#include <QMessageBox>
#include <QPageSize>
#include <QPrintPreviewDialog>
#include <QPrinter>
#include <QStandardPaths>

namespace mw::record {
namespace {

void complain(QWidget* parent, const QString& title, const QString& message) {
    QMessageBox::warning(parent, title, message);
}

// The document `make` builds; a session or instrument not found, or a workbook that cannot be
// read, becomes a message over `parent`, never an exception through Qt.
template <typename Make>
std::optional<Document> load(QWidget* parent, const QString& title, const QString& notFound,
                             Make make) {
    try {
        if (std::optional<Document> document = make()) {
            return document;
        }
        complain(parent, title, notFound);
    } catch (const storage::WorkbookError& error) {
        complain(parent, title, error.message());
    } catch (const std::exception& error) {
        complain(parent, title, QString::fromStdString(error.what()));
    }
    return std::nullopt;
}

QString fileNameFor(const Document& document) {
    const std::string stem = safeFileStem(document.identifier);
    QString folder = QStandardPaths::writableLocation(QStandardPaths::DocumentsLocation);
    if (folder.isEmpty()) {
        folder = QDir::homePath();
    }
    return QDir(folder).filePath(QString::fromStdString(stem) + QStringLiteral(".pdf"));
}

QString exportPdf(QWidget* parent, const std::optional<Document>& document, const QString& title) {
    if (!document) {
        return {};
    }
    const QString path = QFileDialog::getSaveFileName(parent, title, fileNameFor(*document),
                                                      QObject::tr("PDF documents (*.pdf)"));
    if (path.isEmpty()) {
        return {};
    }
    try {
        // The file dialog has asked before replacing a file.
        writePdf(*document, path, true);
    } catch (const OutputError& error) {
        complain(parent, title, QString::fromStdString(error.what()));
        return {};
    }
    return path;
}

std::optional<Document> recordFor(QWidget* parent, storage::Workbook& workbook,
                                  std::int64_t sessionId, const QString& title) {
    return load(parent, title,
                QObject::tr("There is no calibration session %1 in this workbook.").arg(sessionId),
                [&] { return sessionRecord(workbook, sessionId); });
}

std::optional<Document> historyFor(QWidget* parent, storage::Workbook& workbook,
                                   std::int64_t instrumentId, const QString& title) {
    return load(parent, title,
                QObject::tr("There is no instrument %1 in this workbook.").arg(instrumentId),
                [&] { return instrumentHistory(workbook, instrumentId); });
}

} // namespace

std::optional<Document> sessionRecord(storage::Workbook& workbook, std::int64_t sessionId) {
    const auto source = RecordLoader(workbook).record(sessionId, printTime());
    return source ? std::optional<Document>(buildCalibrationRecord(*source)) : std::nullopt;
}

std::optional<Document> instrumentHistory(storage::Workbook& workbook, std::int64_t instrumentId) {
    const auto source = RecordLoader(workbook).history(instrumentId, printTime());
    return source ? std::optional<Document>(buildHistoryReport(*source)) : std::nullopt;
}

QPrintPreviewDialog* previewAndPrint(QWidget* parent, Document document) {
    auto* dialog = new QPrintPreviewDialog(parent);
    dialog->setAttribute(Qt::WA_DeleteOnClose);
    dialog->setWindowTitle(
        QString::fromStdString(document.title + " \u2013 " + document.identifier));
    QPrinter* printer = dialog->printer();
    // The layout keeps its own margins, inside any printer's unprintable edge.
    printer->setFullPage(true);
    printer->setPageSize(QPageSize(QPageSize::A4));
    printer->setDocName(QString::fromStdString(document.identifier));
    QObject::connect(dialog, &QPrintPreviewDialog::paintRequested, dialog,
                     [dialog, document = std::move(document)](QPrinter* target) {
                         try {
                             paintDocument(document, *target);
                         } catch (const std::exception& error) {
                             complain(dialog, QObject::tr("Print"),
                                      QString::fromStdString(error.what()));
                         }
                     });
    dialog->open();
    return dialog;
}

void printSessionRecord(QWidget* parent, storage::Workbook& workbook, std::int64_t sessionId) {
    if (auto document = recordFor(parent, workbook, sessionId, QObject::tr("Print record"))) {
        previewAndPrint(parent, std::move(*document));
    }
}

void printInstrumentHistory(QWidget* parent, storage::Workbook& workbook,
                            std::int64_t instrumentId) {
    if (auto document =
            historyFor(parent, workbook, instrumentId, QObject::tr("Print history report"))) {
        previewAndPrint(parent, std::move(*document));
    }
}

QString exportSessionRecordPdf(QWidget* parent, storage::Workbook& workbook,
                               std::int64_t sessionId) {
    const QString title = QObject::tr("Export record as PDF");
    return exportPdf(parent, recordFor(parent, workbook, sessionId, title), title);
}

QString exportInstrumentHistoryPdf(QWidget* parent, storage::Workbook& workbook,
                                   std::int64_t instrumentId) {
    const QString title = QObject::tr("Export history report as PDF");
    return exportPdf(parent, historyFor(parent, workbook, instrumentId, title), title);
}

} // namespace mw::record
