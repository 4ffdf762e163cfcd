// Axes, ticks, markers and legends shared by the charts of printed documents.
#include "app/record/chart_painters.h"

#include <QPainter>

#include <algorithm>
#include <cmath>

namespace mw::record::chart {
namespace {

QString prefixSymbol(int power) {
    switch (power) {
    case -12:
        return QStringLiteral("p");
    case -9:
        return QStringLiteral("n");
    case -6:
        return QStringLiteral("\u00B5");
    case -3:
        return QStringLiteral("m");
    case 3:
        return QStringLiteral("k");
    case 6:
        return QStringLiteral("M");
    case 9:
        return QStringLiteral("G");
    default:
        return QString();
    }
}

constexpr double kTick = 1.2; // mm
constexpr double kGap = 1.0;  // mm between a label and what it labels

} // namespace

Axis niceAxis(double low, double high, int target) {
    if (!(high > low)) {
        const double pad = std::max(std::fabs(low) * 0.1, 1e-12);
        low -= pad;
        high += pad;
    }
    const double rough = (high - low) / std::max(target, 1);
    const double power = std::pow(10.0, std::floor(std::log10(rough)));
    double step = power;
    for (double m : {1.0, 2.0, 2.5, 5.0, 10.0}) {
        step = m * power;
        if (step >= rough) {
            break;
        }
    }
    Axis axis;
    axis.low = low;
    axis.high = high;
    const long firstTick = std::lround(std::ceil(low / step - 1e-9));
    for (long i = firstTick; i * step <= high + step * 1e-9; ++i) {
        axis.ticks.push_back(i == 0 ? 0.0 : static_cast<double>(i) * step);
    }
    return axis;
}

UnitScale unitScale(double largest, Unit unit) {
    const QString symbol =
        QString::fromUtf8(unitSymbol(unit).data(), static_cast<qsizetype>(unitSymbol(unit).size()));
    if (!(largest > 0.0) || unit == Unit::Percent) {
        return {1.0, symbol};
    }
    const int power =
        std::clamp(static_cast<int>(std::floor(std::log10(largest) / 3.0)) * 3, -12, 9);
    return {std::pow(10.0, power), prefixSymbol(power) + symbol};
}

QString tickText(double value) {
    return QString::number(value, 'g', 4);
}

void drawMarker(QPainter& painter, QPointF at, double size, Marker shape, bool filled) {
    const QRectF box(at.x() - size / 2.0, at.y() - size / 2.0, size, size);
    painter.setBrush(filled ? QBrush(painter.pen().color()) : QBrush(Qt::white));
    if (shape == Marker::Circle) {
        painter.drawEllipse(box);
    } else {
        painter.drawRect(box);
    }
    painter.setBrush(Qt::NoBrush);
}

Frame::Frame(QPainter& painter, const PageStyle& style, const QRectF& outer, Axis x, Axis y,
             const std::vector<QString>& xLabels, const std::vector<QString>& yLabels,
             const QString& xTitle, const QString& yTitle, const std::vector<LegendItem>& legend)
    : painter_(painter)
    , style_(style)
    , outer_(outer)
    , x_(std::move(x))
    , y_(std::move(y))
    , xLabels_(xLabels)
    , yLabels_(yLabels)
    , xTitle_(xTitle)
    , yTitle_(yTitle)
    , legend_(legend) {
    const QFontMetricsF fm = style_.metrics(style_.chart);
    double labelWidth = 0.0;
    for (const QString& label : yLabels_) {
        labelWidth = std::max(labelWidth, fm.horizontalAdvance(label));
    }
    const double line = fm.height();
    const double left = line + style_.mm(kGap) + labelWidth + style_.mm(kTick + kGap);
    const double bottom = style_.mm(kTick + kGap) + line + style_.mm(kGap) + line +
                          style_.mm(kGap) + legendHeight(outer.width() - left);
    plot_ = QRectF(outer.left() + left, outer.top() + line / 2.0,
                   outer.width() - left -
                       fm.horizontalAdvance(xLabels_.empty() ? QString() : xLabels_.back()) / 2.0,
                   outer.height() - bottom - line / 2.0);
}

QPointF Frame::map(double x, double y) const {
    const double fx = (x - x_.low) / (x_.high - x_.low);
    const double fy = (y - y_.low) / (y_.high - y_.low);
    return {plot_.left() + fx * plot_.width(), plot_.bottom() - fy * plot_.height()};
}

double Frame::legendHeight(double width) const {
    if (legend_.empty()) {
        return 0.0;
    }
    const QFontMetricsF fm = style_.metrics(style_.chart);
    const double swatch = style_.mm(6.0);
    double x = 0.0;
    int lines = 1;
    for (const LegendItem& item : legend_) {
        const double w = swatch + style_.mm(1.0) + fm.horizontalAdvance(item.words) + style_.mm(4);
        if (x > 0.0 && x + w > width) {
            ++lines;
            x = 0.0;
        }
        x += w;
    }
    return lines * fm.height() * 1.3;
}

void Frame::drawAxes() const {
    const QFontMetricsF fm = style_.metrics(style_.chart);
    painter_.setFont(style_.chart);
    painter_.setPen(QPen(style_.grid, style_.pt(0.4)));
    for (double t : x_.ticks) {
        painter_.drawLine(map(t, y_.low), map(t, y_.high));
    }
    for (double t : y_.ticks) {
        painter_.drawLine(map(x_.low, t), map(x_.high, t));
    }
    painter_.setPen(QPen(style_.muted, style_.pt(0.6)));
    painter_.drawRect(plot_);
    painter_.setPen(style_.muted);
    const double tick = style_.mm(kTick);
    for (std::size_t i = 0; i < x_.ticks.size() && i < xLabels_.size(); ++i) {
        const QPointF at = map(x_.ticks[i], y_.low);
        painter_.drawLine(at, at + QPointF(0.0, tick));
        const double w = fm.horizontalAdvance(xLabels_[i]);
        painter_.drawText(QPointF(at.x() - w / 2.0, at.y() + tick + style_.mm(kGap) + fm.ascent()),
                          xLabels_[i]);
    }
    for (std::size_t i = 0; i < y_.ticks.size() && i < yLabels_.size(); ++i) {
        const QPointF at = map(x_.low, y_.ticks[i]);
        painter_.drawLine(at, at - QPointF(tick, 0.0));
        const double w = fm.horizontalAdvance(yLabels_[i]);
        painter_.drawText(QPointF(at.x() - tick - style_.mm(kGap) - w,
                                  at.y() + fm.ascent() / 2.0 - fm.descent() / 2.0),
                          yLabels_[i]);
    }
    const double titleY = plot_.bottom() + tick + style_.mm(kGap) + fm.height() + style_.mm(kGap);
    painter_.drawText(
        QPointF(plot_.center().x() - fm.horizontalAdvance(xTitle_) / 2.0, titleY + fm.ascent()),
        xTitle_);
    painter_.save();
    painter_.translate(outer_.left() + fm.ascent(), plot_.center().y());
    painter_.rotate(-90.0);
    painter_.drawText(QPointF(-fm.horizontalAdvance(yTitle_) / 2.0, 0.0), yTitle_);
    painter_.restore();

    const double swatch = style_.mm(6.0);
    double x = plot_.left();
    double y = titleY + fm.height() + style_.mm(kGap);
    for (const LegendItem& item : legend_) {
        const double w = swatch + style_.mm(1.0) + fm.horizontalAdvance(item.words) + style_.mm(4);
        if (x > plot_.left() && x + w > outer_.right()) {
            x = plot_.left();
            y += fm.height() * 1.3;
        }
        painter_.save();
        item.draw(painter_, QRectF(x, y, swatch, fm.height()));
        painter_.restore();
        painter_.setPen(style_.ink);
        painter_.drawText(QPointF(x + swatch + style_.mm(1.0), y + fm.ascent()), item.words);
        x += w;
    }
}

} // namespace mw::record::chart
