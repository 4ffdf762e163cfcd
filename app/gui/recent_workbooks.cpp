// Recent workbooks in QSettings.
#include "app/gui/recent_workbooks.h"

#include <QFileInfo>

namespace mw::gui {
namespace {

const QString kKey = QStringLiteral("workbooks/recent");

} // namespace

QStringList RecentWorkbooks::list() const {
    QStringList existing;
    for (const QString& path : settings_.value(kKey).toStringList()) {
        if (QFileInfo::exists(path)) {
            existing << path;
        }
    }
    return existing;
}

void RecentWorkbooks::remember(const QString& path) {
    const QString absolute = QFileInfo(path).absoluteFilePath();
    QStringList paths = settings_.value(kKey).toStringList();
    paths.removeAll(absolute);
    paths.prepend(absolute);
    settings_.setValue(kKey, paths.mid(0, kKept));
}

void RecentWorkbooks::forget(const QString& path) {
    QStringList paths = settings_.value(kKey).toStringList();
    paths.removeAll(QFileInfo(path).absoluteFilePath());
    settings_.setValue(kKey, paths);
}

} // namespace mw::gui
