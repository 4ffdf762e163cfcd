#include "app/gui/desk/desk_text.h"

#include "app/gui/calendar_days.h"
#include "storage/sql_support.h"

#include <QStringList>

namespace mw::gui {

Timestamp currentTime() {
    return std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now());
}

QString minuteText(Timestamp at) {
    return storage::sql::toIso(at).left(16).replace(QLatin1Char('T'), QLatin1Char(' '));
}

QString outcomeWords(Outcome outcome) {
    return QString::fromUtf8(displayName(outcome).data(),
                             static_cast<qsizetype>(displayName(outcome).size()));
}

QString standardsUsedText(const std::vector<StandardUse>& uses,
                          const std::map<std::int64_t, ReferenceStandard>& standards) {
    QStringList parts;
    for (const StandardUse& use : uses) {
        const auto found = standards.find(use.standard_id);
        QString part = found != standards.end() ? QString::fromStdString(found->second.asset_tag)
                                                : QObject::tr("standard %1").arg(use.standard_id);
        part += QObject::tr(" (cert. %1, due %2)")
                    .arg(QString::fromStdString(use.certificate_number), isoDate(use.due_date));
        if (!use.overdue_justification.empty()) {
            part += QObject::tr(" ⚠ used past its due date: %1")
                        .arg(QString::fromStdString(use.overdue_justification));
        }
        parts << part;
    }
    return parts.isEmpty() ? QObject::tr("none recorded") : parts.join(QStringLiteral("; "));
}

} // namespace mw::gui
