// The history page's interval part: the staircase's recommendation beside the registered
// interval, the steps that led to it, and its adoption by an administrator.
#include "app/gui/calendar_days.h"
#include "app/gui/desk/history_page.h"
#include "app/gui/workspace.h"
#include "storage/instrument_repository.h"

#include <QLabel>
#include <QMessageBox>
#include <QPushButton>
#include <QTableWidget>

#include <cmath>

namespace mw::gui {
namespace {

QString text(const std::string& value) {
    return QString::fromStdString(value);
}

QTableWidgetItem* item(const QString& value) {
    return new QTableWidgetItem(value);
}

QString stepWords(IntervalStepKind kind) {
    switch (kind) {
    case IntervalStepKind::Lengthen:
        return QObject::tr("lengthened");
    case IntervalStepKind::Keep:
        return QObject::tr("kept");
    case IntervalStepKind::Shorten:
        return QObject::tr("shortened");
    }
    return {};
}

} // namespace

void HistoryPage::fillInterval() {
    steps_->setRowCount(0);
    if (!history_ || !instrument_) {
        interval_->clear();
        method_->clear();
        adopt_->setEnabled(false);
        return;
    }
    const IntervalFinding& finding = history_->interval;
    const int registered = instrument_->interval_days;
    if (!finding.recommendation) {
        interval_->setText(tr("Interval on the register: <b>%1 days</b>. %2")
                               .arg(registered)
                               .arg(text(finding.summary).toHtmlEscaped()));
        method_->clear();
        adopt_->setEnabled(false);
        return;
    }
    const IntervalRecommendation& r = *finding.recommendation;
    interval_->setText(
        tr("Interval on the register: <b>%1 days</b> · recommended: <b>%2 days</b>%3<br>%4")
            .arg(registered)
            .arg(r.recommendedDays)
            .arg(r.recommendedDays < registered   ? tr(" (shorter)")
                 : r.recommendedDays > registered ? tr(" (longer)")
                                                  : tr(" (the same)"),
                 text(finding.summary).toHtmlEscaped()));
    for (std::size_t i = 0; i < r.steps.size(); ++i) {
        const IntervalStep& step = r.steps[i];
        const int at = steps_->rowCount();
        steps_->insertRow(at);
        steps_->setItem(at, 0, item(isoDate(step.date)));
        QString found;
        if (i < finding.history.size()) {
            const AsFoundRecord& record = finding.history[i];
            found = record.inTolerance ? tr("in tolerance, %1 % of limit")
                                             .arg(std::lround(record.worstFractionOfLimit * 100.0))
                                       : tr("✖ out of tolerance, %1 % of limit")
                                             .arg(std::lround(record.worstFractionOfLimit * 100.0));
        }
        steps_->setItem(at, 1, item(found));
        steps_->setItem(at, 2, item(stepWords(step.kind)));
        steps_->setItem(at, 3, item(tr("%1 days").arg(std::lround(step.intervalDays))));
    }
    steps_->resizeColumnsToContents();
    // The summary usually states the method already; say it once.
    method_->setText(finding.summary.find(r.method) == std::string::npos
                         ? tr("Method: %1").arg(text(r.method))
                         : QString());
    const bool admin = workspace_.can(Capability::Administer);
    adopt_->setEnabled(admin && r.recommendedDays != registered &&
                       !workspace_.workbook()->isReadOnly());
    adopt_->setToolTip(admin ? QString() : tr("An administrator sets an instrument's interval."));
}

bool HistoryPage::adoptRecommendation(QString* message) {
    if (!instrument_ || !history_ || !history_->interval.recommendation) {
        *message = tr("Not changed: there is no recommendation for this instrument.");
        return false;
    }
    if (!workspace_.can(Capability::Administer)) {
        *message = tr("Not changed: an administrator sets an instrument's interval.");
        return false;
    }
    Instrument changed = *instrument_;
    const int before = changed.interval_days;
    changed.interval_days = history_->interval.recommendation->recommendedDays;
    try {
        storage::InstrumentRepository(*workspace_.workbook()).update(changed);
    } catch (const std::exception& error) {
        *message = tr("Not changed: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
    *message = tr("Interval of %1 changed from %2 to %3 days (recorded in the audit log).")
                   .arg(text(changed.asset_tag))
                   .arg(before)
                   .arg(changed.interval_days);
    emit workspace_.notifier()->registerChanged();
    emit instrumentChanged(changed.id);
    showInstrument(changed.id);
    return true;
}

void HistoryPage::askToAdopt() {
    if (!instrument_ || !history_ || !history_->interval.recommendation) {
        return;
    }
    const auto answer = QMessageBox::question(
        this, tr("Adopt the recommended interval"),
        tr("Change the calibration interval of %1 from %2 to %3 days? The change is recorded in "
           "the audit log and the next due date follows it.")
            .arg(text(instrument_->asset_tag))
            .arg(instrument_->interval_days)
            .arg(history_->interval.recommendation->recommendedDays));
    if (answer != QMessageBox::Yes) {
        return;
    }
    QString message;
    adoptRecommendation(&message);
    emit statusMessage(message);
}

} // namespace mw::gui
