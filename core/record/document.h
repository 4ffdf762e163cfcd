// A printed document as plain data: headings, paragraphs, label/value lists, tables and charts
// in reading order, plus what goes on every page (identifier, running head, draft watermark,
// superseded banner). Core fills it with words and formatted numbers; the app lays it out on
// pages and paints it, and decides nothing about its content.
#pragma once

#include "core/evaluation/session_chart.h"
#include "core/history/instrument_history.h"

#include <optional>
#include <string>
#include <variant>
#include <vector>

namespace mw::record {

struct Heading {
    std::string text;
    int level = 1; // 1: a section, 2: a part of one (kept with what follows it)
};

enum class ParagraphStyle {
    Body,
    Small,     // notes under a table
    Statement, // a statement of conformity, set apart
    Caution,   // safety: boxed, with a caution mark
    Notice,    // the state of the record (amendment, draft), boxed
};

struct Paragraph {
    std::string text;
    ParagraphStyle style = ParagraphStyle::Body;
};

struct Field {
    std::string label;
    std::string value;     // may hold line breaks ('\n')
    bool verbatim = false; // fixed-width and never broken: digests, key fingerprints
};

// Label/value pairs in two columns; a page may break between fields, never inside one.
struct FieldList {
    std::vector<Field> fields;
};

enum class Align { Left, Right };

struct Column {
    std::string header;
    Align align = Align::Left;
};

// A table breaks between rows only; its header is repeated on every page it spans.
struct Table {
    std::vector<Column> columns;
    std::vector<std::vector<std::string>> rows; // one cell per column
    // Rows set in bold so the eye finds them without colour (a point that did not pass).
    std::vector<bool> emphasised; // empty, or one per row
};

// The errors of one range against the applied value, in % of the fiducial value.
struct ErrorChart {
    std::string caption;
    RangeChart chart;
    Unit unit = Unit::Volt; // of the applied values on the x axis
};

// One test point's error over the years, with its limit and drift line.
struct DriftChart {
    std::string caption;
    PointHistory point;
};

// Drift charts side by side, two to a row; a page breaks between rows.
struct DriftChartGrid {
    std::vector<DriftChart> charts;
};

using Block = std::variant<Heading, Paragraph, FieldList, Table, ErrorChart, DriftChartGrid>;

struct Document {
    std::string title;                    // at the top of the first page
    std::string identifier;               // on every page, beside "page x of y"
    std::string runningHead;              // at the top of every page (the laboratory)
    std::optional<std::string> watermark; // across every page: work that is no record
    std::optional<std::string> banner;    // boxed at the top of every page: superseded
    std::string endMark;                  // after the last block, so the end is clear
    std::vector<Block> blocks;
};

} // namespace mw::record
