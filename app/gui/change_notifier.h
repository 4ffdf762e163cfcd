// One notifier for every change made to the open workbook, saying exactly what changed (which
// session, which readings, which points), so that models update only the rows concerned.
#pragma once

#include "core/plan/session_plan.h"

#include <QList>
#include <QObject>
#include <QString>

#include <cstdint>

namespace mw::gui {

class ChangeNotifier : public QObject {
    Q_OBJECT
public:
    explicit ChangeNotifier(QObject* parent = nullptr)
        : QObject(parent) {}

signals:
    void readingsChanged(qint64 sessionId, const QList<mw::ReadingKey>& keys);
    void planChanged(qint64 sessionId, qint64 rangeId);
    void detailsChanged(qint64 sessionId); // header fields, standards used, settings
    void notesChanged(qint64 sessionId);
    void resistorChecksChanged(qint64 sessionId);
    void sessionStateChanged(qint64 sessionId); // created, submitted, returned, approved ...
    void registerChanged();                     // instruments, standards, people
    // An edit, undo or redo the workbook refused: the message says why; nothing was saved.
    void editRefused(const QString& message);
};

} // namespace mw::gui
