// Charts on paper: round ticks, units in the prefix of the values, and both charts drawing
// inside the area they are given and nowhere else. Invented data.
#include "app/record/chart_painters.h"

#include <catch2/catch.hpp>

#include <QImage>
#include <QPainter>

using namespace mw;
using namespace mw::record;

namespace {

QImage blank() {
    QImage image(900, 700, QImage::Format_RGB32);
    image.setDotsPerMeterX(qRound(100 / 0.0254));
    image.setDotsPerMeterY(qRound(100 / 0.0254));
    image.fill(Qt::white);
    return image;
}

// Pixels that are not white inside and outside `area`.
std::pair<int, int> inkIn(const QImage& image, const QRect& area) {
    int inside = 0;
    int outside = 0;
    for (int y = 0; y < image.height(); ++y) {
        for (int x = 0; x < image.width(); ++x) {
            if (image.pixel(x, y) != qRgb(255, 255, 255)) {
                (area.contains(x, y) ? inside : outside) += 1;
            }
        }
    }
    return {inside, outside};
}

} // namespace

TEST_CASE("axes tick at round values within their ends") {
    // Common practice for chart axes: steps of 1, 2, 2.5 or 5 times a power of ten.
    const chart::Axis y = chart::niceAxis(-1.725, 1.725, 8);
    CHECK(y.low == -1.725);
    CHECK(y.high == 1.725);
    CHECK(y.ticks == std::vector<double>{-1.5, -1.0, -0.5, 0.0, 0.5, 1.0, 1.5});
    const chart::Axis x = chart::niceAxis(-0.4, 10.4, 10);
    CHECK(x.ticks.front() == 0.0);
    CHECK(x.ticks.back() == 10.0);
    CHECK(chart::tickText(0.25) == QStringLiteral("0.25"));
    CHECK(chart::tickText(100.0) == QStringLiteral("100"));
}

TEST_CASE("values are charted in the prefix of the largest") {
    CHECK(chart::unitScale(0.15, Unit::Volt).symbol == QStringLiteral("mV"));
    CHECK(chart::unitScale(0.15, Unit::Volt).factor == 1e-3);
    CHECK(chart::unitScale(50e-6, Unit::Ampere).symbol == QStringLiteral("\u00B5A"));
    CHECK(chart::unitScale(300.0, Unit::Volt).symbol == QStringLiteral("V"));
}

TEST_CASE("the session chart and the drift chart draw inside their area only") {
    const QRect area(100, 80, 600, 400);
    {
        RangeChart chart;
        chart.lower = 0.0;
        chart.upper = 10.0;
        chart.limitPercent = 1.5;
        chart.yExtent = 2.0;
        ChartSeries up{Phase::AsFound, Direction::Up, {}};
        for (int i = 0; i <= 5; ++i) {
            up.marks.push_back({2.0 * i, 0.2 * i, 0.24, i == 5 ? Outcome::Fail : Outcome::Pass});
        }
        chart.series = {up};
        QImage image = blank();
        QPainter painter(&image);
        const PageStyle style(image);
        paintRangeChart(painter, style, chart, Unit::Volt, area);
        painter.end();
        const auto [inside, outside] = inkIn(image, area);
        CHECK(inside > 2000);
        CHECK(outside == 0);
    }
    {
        PointHistory point;
        point.rangeLabel = "10 V";
        point.nominal = 10.0;
        point.permissibleError = 0.15;
        for (int i = 0; i < 4; ++i) {
            point.asFound.push_back(
                {std::chrono::sys_days{std::chrono::year{2021 + i} / std::chrono::March / 1}, i + 1,
                 Phase::AsFound, 10.0, 0.03 * i});
        }
        QImage image = blank();
        QPainter painter(&image);
        const PageStyle style(image);
        paintDriftPlot(painter, style, point, area);
        painter.end();
        const auto [inside, outside] = inkIn(image, area);
        CHECK(inside > 2000);
        CHECK(outside == 0);
    }
}
