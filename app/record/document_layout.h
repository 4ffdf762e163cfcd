// A document laid out on pages of one paint device: every block measured at the body's width,
// then placed page by page, breaking tables between rows (with the header repeated), keeping
// headings with what they head, and painting the running head, "page x of y", the superseded
// banner and the draft watermark on every page.
#pragma once

#include "app/record/block_painter.h"
#include "app/record/page_style.h"
#include "core/record/document.h"

#include <QRectF>
#include <QSizeF>

#include <vector>

class QPainter;

namespace mw::record {

class DocumentLayout {
public:
    // `pageSize` in the device's pixels; the document must outlive the layout.
    DocumentLayout(const Document& document, const QPaintDevice& device, QSizeF pageSize);

    int pageCount() const { return static_cast<int>(pages_.size()); }
    // Paints page `index` (0-based) with the page's top-left at the painter's origin.
    void paintPage(QPainter& painter, int index) const;

    // Where the pieces of blocks stand on a page (for tests and previews): pieces [first, last)
    // of block `block`, under a repeated header when `header`, within `box`.
    struct Placement {
        std::size_t block = 0;
        std::size_t first = 0;
        std::size_t last = 0;
        bool header = false;
        QRectF box;
    };
    std::vector<Placement> placements(int index) const;
    // The area blocks are placed in on every page (the first also holds the title at its top).
    const QRectF& body() const { return body_; }

private:
    struct Piece {
        std::size_t block = 0;
        std::size_t first = 0; // units [first, last) of the block
        std::size_t last = 0;
        bool header = false;
        double top = 0.0;
    };
    struct Page {
        std::vector<Piece> pieces;
    };

    void paginate();
    // Room the block at `index` needs before a page may start it: its first unit, and for a
    // heading what follows it.
    double roomToStart(std::size_t index, bool atTop) const;
    void paintFrame(QPainter& painter, int index) const;

    const Document& document_;
    PageStyle style_;
    QSizeF page_;
    QRectF body_;
    double headHeight_ = 0.0;
    double titleHeight_ = 0.0;
    double bannerHeight_ = 0.0;
    double endHeight_ = 0.0;
    double endTop_ = 0.0;
    BlockPainter blocks_;
    std::vector<MeasuredBlock> measured_;
    std::vector<Page> pages_;
};

} // namespace mw::record
