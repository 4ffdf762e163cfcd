// Shapes drawn with QPainter in the palette's colours.
#include "app/gui/status_icons.h"

#include <QPainter>
#include <QPainterPath>
#include <QPixmap>

namespace mw::gui {
namespace {

constexpr int kSize = 32; // drawn large, scaled down by QIcon

QColor accent(Outcome outcome) {
    // Colour only repeats what the shape says.
    switch (outcome) {
    case Outcome::Pass:
        return QColor(0x2e, 0x8b, 0x57);
    case Outcome::ConditionalPass:
        return QColor(0x6b, 0x8e, 0x23);
    case Outcome::ConditionalFail:
        return QColor(0xd2, 0x8c, 0x00);
    case Outcome::Fail:
        return QColor(0xc0, 0x30, 0x30);
    }
    return QColor(Qt::gray);
}

QPainterPath triangle(QRectF box, bool up) {
    QPainterPath path;
    if (up) {
        path.moveTo(box.center().x(), box.top());
        path.lineTo(box.right(), box.bottom());
        path.lineTo(box.left(), box.bottom());
    } else {
        path.moveTo(box.left(), box.top());
        path.lineTo(box.right(), box.top());
        path.lineTo(box.center().x(), box.bottom());
    }
    path.closeSubpath();
    return path;
}

void tick(QPainter& p, const QColor& colour) {
    p.setPen(QPen(colour, 4, Qt::SolidLine, Qt::RoundCap, Qt::RoundJoin));
    p.drawPolyline(QPolygonF({QPointF(9, 17), QPointF(14, 22), QPointF(23, 10)}));
}

void exclamation(QPainter& p, const QColor& colour) {
    p.setPen(QPen(colour, 4, Qt::SolidLine, Qt::RoundCap));
    p.drawLine(QPointF(16, 12), QPointF(16, 20));
    p.drawPoint(QPointF(16, 25));
}

QPixmap canvas() {
    QPixmap pixmap(kSize, kSize);
    pixmap.fill(Qt::transparent);
    return pixmap;
}

} // namespace

QIcon outcomeIcon(Outcome outcome, const QPalette& palette) {
    QPixmap pixmap = canvas();
    QPainter p(&pixmap);
    p.setRenderHint(QPainter::Antialiasing);
    const QColor ink = palette.color(QPalette::WindowText);
    const QColor fill = accent(outcome);
    const QRectF box(3, 3, kSize - 6, kSize - 6);
    switch (outcome) {
    case Outcome::Pass:
        p.setPen(QPen(ink, 1.5));
        p.setBrush(fill);
        p.drawEllipse(box);
        tick(p, Qt::white);
        break;
    case Outcome::ConditionalPass:
        p.setPen(QPen(fill, 3));
        p.setBrush(Qt::NoBrush);
        p.drawEllipse(box);
        tick(p, ink);
        break;
    case Outcome::ConditionalFail:
        p.setPen(QPen(ink, 1.5));
        p.setBrush(fill);
        p.drawPath(triangle(box, true));
        exclamation(p, Qt::black);
        break;
    case Outcome::Fail:
        p.setPen(QPen(ink, 1.5));
        p.setBrush(fill);
        p.drawRect(box);
        p.setPen(QPen(Qt::white, 4, Qt::SolidLine, Qt::RoundCap));
        p.drawLine(QPointF(10, 10), QPointF(22, 22));
        p.drawLine(QPointF(22, 10), QPointF(10, 22));
        break;
    }
    return QIcon(pixmap);
}

bool isDark(const QPalette& palette) {
    return palette.color(QPalette::Window).lightness() < 128;
}

QIcon warningIcon(const QPalette& palette) {
    QPixmap pixmap = canvas();
    QPainter p(&pixmap);
    p.setRenderHint(QPainter::Antialiasing);
    p.setPen(QPen(palette.color(QPalette::WindowText), 1.5));
    p.setBrush(QColor(0xf0, 0xb0, 0x20));
    p.drawPath(triangle(QRectF(3, 3, kSize - 6, kSize - 6), true));
    exclamation(p, Qt::black);
    return QIcon(pixmap);
}

QImage markerImage(Direction direction, Phase phase, const QColor& colour, int size) {
    QImage image(size, size, QImage::Format_ARGB32_Premultiplied);
    image.fill(Qt::transparent);
    QPainter p(&image);
    p.setRenderHint(QPainter::Antialiasing);
    p.setPen(QPen(colour, std::max(1.5, size / 8.0)));
    p.setBrush(phase == Phase::AsFound ? QBrush(colour) : QBrush(Qt::NoBrush));
    const double margin = size / 8.0;
    p.drawPath(triangle(QRectF(margin, margin, size - 2 * margin, size - 2 * margin),
                        direction == Direction::Up));
    return image;
}

} // namespace mw::gui
