#include "app/gui/desk/due_page.h"

#include "app/gui/calendar_days.h"
#include "app/gui/desk/desk_tables.h"
#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"

#include <QApplication>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QSpinBox>
#include <QStringList>
#include <QTableWidget>
#include <QVBoxLayout>

#include <chrono>

namespace mw::gui {
namespace {

QTableWidget* dueTable(const QStringList& headers, const char* name, QWidget* parent) {
    QTableWidget* table = readOnlyTable(headers, parent);
    table->setObjectName(QLatin1String(name));
    return table;
}

QString text(const std::string& value) {
    return QString::fromStdString(value);
}

QTableWidgetItem* stateItem(const DueEntry& entry) {
    auto* item = new QTableWidgetItem(dueStateText(entry));
    // Overdue (or never calibrated) carries a shape as well as words.
    if (!entry.daysOverdue || *entry.daysOverdue > 0) {
        item->setIcon(warningIcon(QApplication::palette()));
    }
    return item;
}

QString standardsText(const DueEntry& entry) {
    QStringList parts;
    for (const DueStandardUse& use : entry.standards) {
        parts << (use.inDate
                      ? QObject::tr("%1 (in date)").arg(text(use.assetTag))
                      : QObject::tr("⚠ %1 (out of date%2)")
                            .arg(text(use.assetTag),
                                 use.dueDate ? QObject::tr(" since %1").arg(isoDate(*use.dueDate))
                                             : QObject::tr(", no longer registered")));
    }
    return parts.isEmpty() ? QObject::tr("—") : parts.join(QStringLiteral(", "));
}

QString dayCount(int days) {
    return days == 1 ? QObject::tr("1 day") : QObject::tr("%1 days").arg(days);
}

} // namespace

QString dueStateText(const DueEntry& entry) {
    if (!entry.dueDate) {
        return QObject::tr("never calibrated");
    }
    const int days = entry.daysOverdue.value_or(0);
    if (days > 0) {
        return QObject::tr("overdue by %1").arg(dayCount(days));
    }
    if (days == 0) {
        return QObject::tr("due today");
    }
    return QObject::tr("due in %1").arg(dayCount(-days));
}

DuePage::DuePage(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("duePage"));
    auto* layout = new QVBoxLayout(this);
    auto* top = new QHBoxLayout;
    days_ = new QSpinBox(this);
    days_->setObjectName(QStringLiteral("dueWindowDays"));
    days_->setRange(0, 366);
    days_->setSuffix(tr(" days"));
    top->addWidget(new QLabel(tr("Due within"), this));
    top->addWidget(days_);
    summary_ = new QLabel(this);
    top->addWidget(summary_, 1);
    layout->addLayout(top);
    layout->addWidget(new QLabel(tr("<b>Instruments</b> (double-click for the history)"), this));
    instruments_ = dueTable({tr("Asset tag"), tr("Description"), tr("Where it is"), tr("Due"),
                             tr("State"), tr("Standards its last calibration used")},
                            "dueInstruments", this);
    layout->addWidget(instruments_, 3);
    layout->addWidget(new QLabel(tr("<b>Reference standards</b>"), this));
    standards_ =
        dueTable({tr("Asset tag"), tr("Description"), tr("Certificate"), tr("Due"), tr("State")},
                 "dueStandards", this);
    layout->addWidget(standards_, 2);
    connect(days_, &QSpinBox::valueChanged, this, [this](int) {
        windowChosen_ = true;
        reload();
    });
    connect(instruments_, &QTableWidget::cellDoubleClicked, this, [this](int row) {
        emit historyRequested(instruments_->item(row, Tag)->data(Qt::UserRole).toLongLong());
    });
}

void DuePage::setWindowDays(int days) {
    days_->setValue(days); // reloads
}

void DuePage::reload() {
    report_.reset();
    if (workspace_.isOpen()) {
        if (!windowChosen_) {
            const QSignalBlocker blocker(days_);
            days_->setValue(workspace_.lab().due_window_days);
        }
        const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
        try {
            report_ = storage::dueReport(*workspace_.workbook(), today, days_->value());
        } catch (const std::exception& error) {
            emit statusMessage(tr("The due list could not be read: %1").arg(error.what()));
        }
    }
    fill();
}

void DuePage::fill() {
    instruments_->setRowCount(0);
    standards_->setRowCount(0);
    if (!report_) {
        summary_->setText(workspace_.isOpen() ? QString() : tr("No workbook open."));
        return;
    }
    int overdue = 0;
    for (const DueEntry& entry : report_->entries) {
        overdue += (!entry.daysOverdue || *entry.daysOverdue > 0) ? 1 : 0;
        const QString due = entry.dueDate ? isoDate(*entry.dueDate) : tr("—");
        if (entry.subject == DueSubject::Instrument) {
            const int row = instruments_->rowCount();
            instruments_->insertRow(row);
            auto* tag = new QTableWidgetItem(text(entry.assetTag));
            tag->setData(Qt::UserRole, qint64(entry.id));
            instruments_->setItem(row, Tag, tag);
            instruments_->setItem(row, Description, new QTableWidgetItem(text(entry.description)));
            instruments_->setItem(row, Location, new QTableWidgetItem(text(entry.location)));
            instruments_->setItem(row, DueDate, new QTableWidgetItem(due));
            QTableWidgetItem* state = stateItem(entry);
            if (entry.openState) {
                state->setText(
                    state->text() +
                    tr(" · calibration open: %1")
                        .arg(QString::fromUtf8(displayName(*entry.openState).data()).toLower()));
            }
            instruments_->setItem(row, State, state);
            instruments_->setItem(row, StandardsUsed, new QTableWidgetItem(standardsText(entry)));
        } else {
            const int row = standards_->rowCount();
            standards_->insertRow(row);
            auto* tag = new QTableWidgetItem(text(entry.assetTag));
            tag->setData(Qt::UserRole, qint64(entry.id));
            standards_->setItem(row, StandardTag, tag);
            standards_->setItem(row, StandardDescription,
                                new QTableWidgetItem(text(entry.description)));
            standards_->setItem(
                row, Certificate,
                new QTableWidgetItem(entry.lastCalibrated
                                         ? tr("calibrated %1").arg(isoDate(*entry.lastCalibrated))
                                         : QString()));
            standards_->setItem(row, StandardDue, new QTableWidgetItem(due));
            standards_->setItem(row, StandardState, stateItem(entry));
        }
    }
    instruments_->resizeColumnsToContents();
    standards_->resizeColumnsToContents();
    summary_->setText(tr("  as of %1: instruments due %2, standards due %3; overdue or never "
                         "calibrated: %4.")
                          .arg(isoDate(report_->asOf))
                          .arg(instruments_->rowCount())
                          .arg(standards_->rowCount())
                          .arg(overdue));
}

} // namespace mw::gui
