// A document's words in reading order, for tests that look for what a record must say.
#pragma once

#include "core/record/document.h"

#include <string>
#include <type_traits>
#include <variant>

namespace mwtest {

inline std::string documentText(const mw::record::Document& document) {
    using namespace mw::record;
    std::string text = document.title + "\n" + document.identifier + "\n" + document.runningHead +
                       "\n" + document.watermark.value_or("") + "\n" +
                       document.banner.value_or("") + "\n";
    for (const Block& block : document.blocks) {
        std::visit(
            [&text](const auto& b) {
                using T = std::decay_t<decltype(b)>;
                if constexpr (std::is_same_v<T, Heading> || std::is_same_v<T, Paragraph>) {
                    text += b.text + "\n";
                } else if constexpr (std::is_same_v<T, FieldList>) {
                    for (const Field& field : b.fields) {
                        text += field.label + ": " + field.value + "\n";
                    }
                } else if constexpr (std::is_same_v<T, Table>) {
                    for (const Column& column : b.columns) {
                        text += column.header + " | ";
                    }
                    text += "\n";
                    for (const auto& row : b.rows) {
                        for (const std::string& cell : row) {
                            text += cell + " | ";
                        }
                        text += "\n";
                    }
                } else if constexpr (std::is_same_v<T, ErrorChart>) {
                    text += b.caption + "\n";
                } else {
                    for (const DriftChart& chart : b.charts) {
                        text += chart.caption + ": " + chart.point.summary + "\n";
                    }
                }
            },
            block);
    }
    return text + document.endMark + "\n";
}

// The blocks of one kind, in order.
template <typename T>
std::vector<T> blocksOf(const mw::record::Document& document) {
    std::vector<T> found;
    for (const mw::record::Block& block : document.blocks) {
        if (const T* b = std::get_if<T>(&block)) {
            found.push_back(*b);
        }
    }
    return found;
}

} // namespace mwtest
