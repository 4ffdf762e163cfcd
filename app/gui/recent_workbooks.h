// The workbooks opened lately, newest first, kept in the user's settings; the window offers them
// under Workbook → Open recent and opens the newest on start.
#pragma once

#include <QSettings>
#include <QStringList>

namespace mw::gui {

class RecentWorkbooks {
public:
    static constexpr int kKept = 8;

    explicit RecentWorkbooks(QSettings& settings)
        : settings_(settings) {}

    // Newest first, only files that still exist.
    QStringList list() const;
    void remember(const QString& path);
    void forget(const QString& path);

private:
    QSettings& settings_;
};

} // namespace mw::gui
