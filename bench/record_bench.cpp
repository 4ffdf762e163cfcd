// Record benchmark: on the demo workbook, times one calibration record (read from the workbook,
// evaluated, laid out and written as PDF) and a batch of 100 records, beside a floor measured in
// the same run: a minimal one-page A4 QPdfWriter document (a heading, a small table, a line)
// written the same way. Prints medians and ratios; not a test.
//
// Usage: record_bench [--workbook FILE]   (default: a demo workbook written to a temporary folder)
#include "app/record/document_output.h"
#include "app/record/record_loader.h"
#include "bench/bench_timing.h"
#include "core/record/calibration_record.h"
#include "storage/demo/demo_workbook.h"
#include "storage/session_repository.h"
#include "storage/workbook.h"

#include <QDir>
#include <QFileInfo>
#include <QGuiApplication>
#include <QPageSize>
#include <QPainter>
#include <QPdfWriter>
#include <QSaveFile>
#include <QTemporaryDir>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <functional>
#include <vector>

namespace {

using namespace std::chrono;

// Targets of the record issue.
constexpr double kRecordTargetMs = 300.0;
constexpr double kBatchTargetMs = 20'000.0;
constexpr int kBatchSize = 100;

using mwbench::medianOf;
using mwbench::millisecondsOf;

// The floor: the least a one-page PDF through QSaveFile and QPdfWriter costs here.
void minimalPdf(const QString& path) {
    QSaveFile file(path);
    file.open(QIODevice::WriteOnly);
    {
        QPdfWriter writer(&file);
        writer.setPageSize(QPageSize(QPageSize::A4));
        writer.setResolution(600);
        QPainter painter(&writer);
        QFont font(QStringLiteral("DejaVu Sans"));
        font.setPointSizeF(11.0);
        painter.setFont(font);
        painter.drawText(QPointF(400, 600), QStringLiteral("Calibration record"));
        font.setPointSizeF(8.0);
        painter.setFont(font);
        for (int row = 0; row < 6; ++row) {
            for (int column = 0; column < 5; ++column) {
                painter.drawText(QPointF(400 + column * 700, 900 + row * 120),
                                 QStringLiteral("%1.000 V").arg(row * 2 + column));
            }
        }
        painter.drawLine(QPointF(400, 1700), QPointF(4500, 1700));
    }
    file.commit();
}

void report(const char* what, double ms, double floor, double target) {
    std::printf("%-46s %9.1f ms  %6.1f x floor  (target < %.0f ms: %s)\n", what, ms, ms / floor,
                target, ms < target ? "met" : "NOT met");
}

} // namespace

int main(int argc, char* argv[]) {
    qputenv("QT_QPA_PLATFORM", "offscreen");
    int programOnly = 1;
    QGuiApplication app(programOnly, argv);
    QTemporaryDir dir;
    QString path = dir.filePath(QStringLiteral("demo.mwb"));
    for (int i = 1; i + 1 < argc; ++i) {
        if (QString::fromLocal8Bit(argv[i]) == QStringLiteral("--workbook")) {
            path = QString::fromLocal8Bit(argv[i + 1]);
        }
    }
    if (!QFileInfo::exists(path)) {
        mw::demo::writeDemoWorkbook(path, floor<days>(system_clock::now()));
    }
    mw::storage::OpenOptions options;
    options.readOnly = true;
    mw::storage::Workbook workbook(path, options);
    std::vector<std::int64_t> ids;
    for (const mw::CalibrationSession& s :
         mw::storage::SessionRepository(workbook).withState(mw::SessionState::Approved)) {
        ids.push_back(s.id);
    }
    if (ids.empty()) {
        std::fprintf(stderr, "record_bench: the workbook has no approved record\n");
        return 2;
    }

    const double cold =
        millisecondsOf([&] { minimalPdf(dir.filePath(QStringLiteral("cold.pdf"))); });
    const double floorMs = medianOf(
        15, [&](int i) { minimalPdf(dir.filePath(QStringLiteral("floor-%1.pdf").arg(i))); });
    // The record with the most readings: the longest work of one record.
    std::int64_t largest = ids.front();
    std::size_t most = 0;
    for (std::int64_t id : ids) {
        const auto s = mw::storage::SessionRepository(workbook).find(id);
        if (s && s->readings.size() > most) {
            most = s->readings.size();
            largest = id;
        }
    }
    int pages = 0;
    // One record as the window or `meterwright record` makes it: read, evaluate, lay out, write.
    const double one = medianOf(15, [&](int i) {
        const mw::record::RecordLoader loader(workbook);
        const auto source = loader.record(largest, mw::record::printTime());
        pages = mw::record::writePdf(mw::record::buildCalibrationRecord(*source),
                                     dir.filePath(QStringLiteral("one-%1.pdf").arg(i)), false);
    });
    const QString batchDir = dir.filePath(QStringLiteral("batch"));
    QDir().mkpath(batchDir);
    const double batch = medianOf(3, [&](int round) {
        const mw::record::RecordLoader loader(workbook);
        for (int i = 0; i < kBatchSize; ++i) {
            const std::int64_t id = ids[static_cast<std::size_t>(i) % ids.size()];
            const auto source = loader.record(id, mw::record::printTime());
            mw::record::writePdf(
                mw::record::buildCalibrationRecord(*source),
                QDir(batchDir).filePath(QStringLiteral("%1-%2.pdf").arg(round).arg(i)), true);
        }
    });

    std::printf("records: %zu approved in the workbook; one record timed: session %lld, %zu "
                "readings, %d pages\n",
                ids.size(), static_cast<long long>(largest), most, pages);
    std::printf("%-46s %9.1f ms  (first PDF of the process, fonts loaded: %.1f ms)\n",
                "floor: minimal one-page A4 QPdfWriter document", floorMs, cold);
    report("one record (read, evaluate, lay out, write)", one, floorMs, kRecordTargetMs);
    report("100 records in a batch", batch, floorMs * kBatchSize, kBatchTargetMs);
    std::printf("%-46s %9.1f ms  %6.1f x floor\n", "  per record in the batch", batch / kBatchSize,
                batch / kBatchSize / floorMs);
    return 0;
}
