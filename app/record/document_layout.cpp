// Pagination of documents and the furniture of every page.
#include "app/record/document_layout.h"

#include <QPainter>

#include <cmath>

namespace mw::record {
namespace {

// Page margins and bands, in millimetres.
constexpr double kSide = 18.0;
constexpr double kTop = 12.0;
constexpr double kBottom = 12.0;
constexpr double kBandGap = 3.0;
constexpr double kTitleAfter = 2.0;

QString qs(const std::string& text) {
    return QString::fromStdString(text);
}

} // namespace

DocumentLayout::DocumentLayout(const Document& document, const QPaintDevice& device,
                               QSizeF pageSize)
    : document_(document)
    , style_(device)
    , page_(pageSize)
    , body_(style_.mm(kSide), 0.0, pageSize.width() - 2.0 * style_.mm(kSide), 0.0)
    , blocks_(style_, pageSize.width() - 2.0 * style_.mm(kSide)) {
    const double width = body_.width();
    headHeight_ = style_.metrics(style_.small).height();
    if (document_.banner) {
        bannerHeight_ = style_.textHeight(style_.bodyBold, width - 2.0 * style_.mm(2.5),
                                          qs(*document_.banner)) +
                        2.0 * style_.mm(2.0) + style_.mm(kBandGap);
    }
    const double top = style_.mm(kTop) + headHeight_ + style_.mm(kBandGap) + bannerHeight_;
    const double bottom = page_.height() - style_.mm(kBottom) - headHeight_ - style_.mm(kBandGap);
    body_ = QRectF(body_.left(), top, width, bottom - top);
    titleHeight_ =
        style_.textHeight(style_.title, width, qs(document_.title)) + style_.mm(kTitleAfter);
    endHeight_ = style_.textHeight(style_.body, width, qs(document_.endMark)) + style_.mm(4.0);
    blocks_.setLabelWidth(blocks_.labelWidth(document_));
    measured_.reserve(document_.blocks.size());
    for (const Block& block : document_.blocks) {
        measured_.push_back(blocks_.measure(block));
    }
    paginate();
}

double DocumentLayout::roomToStart(std::size_t index, bool atTop) const {
    double room = 0.0;
    for (std::size_t i = index; i < measured_.size(); ++i) {
        const MeasuredBlock& m = measured_[i];
        room += (i == index && atTop ? 0.0 : m.spaceBefore) + m.header +
                (m.units.empty() ? 0.0 : m.units.front());
        if (i + 1 == measured_.size() && m.units.size() <= 1) {
            room += endHeight_; // the end mark goes with the last piece
        }
        if (!m.keepWithNext) {
            break;
        }
    }
    return room;
}

void DocumentLayout::paginate() {
    pages_.assign(1, Page{});
    double y = body_.top() + titleHeight_;
    bool atTop = true; // nothing placed on this page yet
    const auto newPage = [&] {
        pages_.emplace_back();
        y = body_.top();
        atTop = true;
    };
    for (std::size_t b = 0; b < measured_.size(); ++b) {
        const MeasuredBlock& m = measured_[b];
        if (m.units.empty()) {
            continue;
        }
        if (!atTop && y + roomToStart(b, false) > body_.bottom()) {
            newPage();
        }
        y += atTop ? 0.0 : m.spaceBefore;
        Piece piece{b, 0, 0, m.header > 0.0, y};
        y += m.header;
        const bool lastBlock = b + 1 == measured_.size();
        for (std::size_t u = 0; u < m.units.size(); ++u) {
            // A piece never splits: a unit that does not fit starts the next page (a unit taller
            // than a whole page is placed anyway and runs off its foot, rather than vanish). The
            // end mark goes with the last unit, so that no page holds the end mark alone.
            const bool last = lastBlock && u + 1 == m.units.size();
            const double needed = m.units[u] + (last ? endHeight_ : 0.0);
            if (u > piece.first && y + needed > body_.bottom()) {
                piece.last = u;
                pages_.back().pieces.push_back(piece);
                newPage();
                piece = Piece{b, u, u, m.header > 0.0, y};
                y += m.header;
            }
            y += m.units[u];
        }
        piece.last = m.units.size();
        pages_.back().pieces.push_back(piece);
        atTop = false;
    }
    if (y + endHeight_ > body_.bottom() && !atTop) {
        newPage();
    }
    endTop_ = y + style_.mm(4.0);
}

std::vector<DocumentLayout::Placement> DocumentLayout::placements(int index) const {
    std::vector<Placement> result;
    for (const Piece& piece : pages_.at(static_cast<std::size_t>(index)).pieces) {
        const MeasuredBlock& m = measured_[piece.block];
        double height = piece.header ? m.header : 0.0;
        for (std::size_t u = piece.first; u < piece.last; ++u) {
            height += m.units[u];
        }
        result.push_back({piece.block, piece.first, piece.last, piece.header,
                          QRectF(body_.left(), piece.top, body_.width(), height)});
    }
    return result;
}

void DocumentLayout::paintFrame(QPainter& painter, int index) const {
    const double left = body_.left();
    const double right = body_.right();
    const double headTop = style_.mm(kTop);
    painter.setPen(style_.muted);
    style_.drawText(painter, style_.small, QRectF(left, headTop, body_.width(), headHeight_),
                    qs(document_.runningHead));
    style_.drawText(painter, style_.small, QRectF(left, headTop, body_.width(), headHeight_),
                    qs(document_.identifier), Qt::AlignRight);
    painter.setPen(QPen(style_.rule, style_.pt(0.5)));
    const double headRule = headTop + headHeight_ + style_.mm(1.0);
    painter.drawLine(QPointF(left, headRule), QPointF(right, headRule));

    const double footTop = page_.height() - style_.mm(kBottom) - headHeight_;
    painter.drawLine(QPointF(left, footTop - style_.mm(1.0)),
                     QPointF(right, footTop - style_.mm(1.0)));
    painter.setPen(style_.muted);
    // A draft says so at the foot of every page too, in words that survive a photocopy and
    // text extraction, where the diagonal watermark may not.
    if (document_.watermark) {
        painter.setPen(style_.ink);
        style_.drawText(painter, style_.tableBold,
                        QRectF(left, footTop, body_.width(), headHeight_),
                        qs(*document_.watermark));
        painter.setPen(style_.muted);
    } else {
        style_.drawText(painter, style_.small, QRectF(left, footTop, body_.width(), headHeight_),
                        qs(document_.title));
    }
    style_.drawText(painter, style_.small, QRectF(left, footTop, body_.width(), headHeight_),
                    QStringLiteral("Page %1 of %2").arg(index + 1).arg(pageCount()),
                    Qt::AlignRight);

    if (document_.banner) {
        const QRectF box(left, headRule + style_.mm(kBandGap) - style_.mm(1.0), body_.width(),
                         bannerHeight_ - style_.mm(kBandGap));
        painter.setPen(QPen(style_.ink, style_.pt(2.0)));
        painter.setBrush(style_.shade);
        painter.drawRect(box);
        painter.setBrush(Qt::NoBrush);
        painter.setPen(style_.ink);
        style_.drawText(painter, style_.bodyBold,
                        box.adjusted(style_.mm(2.5), style_.mm(2.0), -style_.mm(2.5), 0.0),
                        qs(*document_.banner));
    }
}

void DocumentLayout::paintPage(QPainter& painter, int index) const {
    painter.save();
    paintFrame(painter, index);
    painter.setPen(style_.ink);
    if (index == 0) {
        style_.drawText(painter, style_.title,
                        QRectF(body_.left(), body_.top(), body_.width(), titleHeight_),
                        qs(document_.title));
    }
    for (const Piece& piece : pages_.at(static_cast<std::size_t>(index)).pieces) {
        blocks_.paint(painter, document_.blocks[piece.block], measured_[piece.block],
                      QPointF(body_.left(), piece.top), piece.first, piece.last, piece.header);
    }
    if (index + 1 == pageCount()) {
        painter.setPen(style_.muted);
        style_.drawText(painter, style_.body,
                        QRectF(body_.left(), endTop_, body_.width(), endHeight_),
                        qs(document_.endMark), Qt::AlignHCenter);
    }
    if (document_.watermark) {
        // Across the page's diagonal, over the content, in a light ink that leaves it legible.
        painter.save();
        painter.translate(page_.width() / 2.0, page_.height() / 2.0);
        painter.rotate(-std::atan2(page_.height(), page_.width()) * 180.0 / M_PI);
        const QString words = qs(*document_.watermark);
        QFont font = style_.watermark;
        const double diagonal = std::hypot(page_.width(), page_.height());
        const double wide = style_.metrics(font).horizontalAdvance(words);
        font.setPointSizeF(font.pointSizeF() * std::min(1.0, 0.75 * diagonal / wide));
        painter.setFont(font);
        painter.setPen(style_.watermarkInk);
        const QFontMetricsF fm = style_.metrics(font);
        painter.drawText(QPointF(-fm.horizontalAdvance(words) / 2.0, fm.ascent() / 2.0), words);
        painter.restore();
    }
    painter.restore();
}

} // namespace mw::record
