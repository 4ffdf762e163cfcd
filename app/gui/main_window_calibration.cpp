// The main window's calibration actions: start one from the register, open one on the bench,
// change its set-up, submit it. The dialogs ask; the workbook and the edits facade do the work.
#include "app/gui/bench/bench_session.h"
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/main_window.h"
#include "app/gui/session_edits.h"
#include "app/gui/workspace.h"
#include "core/plan/session_plan.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"

#include <QMessageBox>
#include <QStatusBar>

#include <algorithm>
#include <chrono>

namespace mw::gui {
namespace {

Timestamp now() {
    return std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now());
}

std::chrono::sys_days today() {
    return std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
}

} // namespace

bool MainWindow::startCalibration(std::int64_t instrumentId, const SessionSetup& setup,
                                  QString* error) {
    try {
        if (!workspace_->can(Capability::Calibrate)) {
            throw std::runtime_error(tr("only a technician (or an administrator) starts a "
                                        "calibration")
                                         .toStdString());
        }
        storage::Workbook& workbook = *workspace_->workbook();
        const auto instrument = storage::InstrumentRepository(workbook).find(instrumentId);
        if (!instrument) {
            throw std::runtime_error(tr("the instrument no longer exists").toStdString());
        }
        CalibrationSession session;
        session.instrument_id = instrumentId;
        session.technician_id = workspace_->user()->id;
        session.started_at = now();
        session.environment = setup.environment;
        session.method = setup.method;
        session.standards = setup.standards;
        session.decision_rule = setup.rule;
        session.guard_factor = setup.guardFactor;
        session.settings = setup.settings;
        session.phases = setup.phases;
        for (const RangeSpec& range : instrument->ranges) {
            if (std::count(setup.ranges.begin(), setup.ranges.end(), range.id) > 0) {
                const auto points = defaultPoints(*instrument, range, setup.repeats);
                session.plan.insert(session.plan.end(), points.begin(), points.end());
            }
        }
        storage::SessionRepository(workbook).create(session);
        emit workspace_->notifier()->sessionStateChanged(session.id);
        return openCalibration(session.id, error);
    } catch (const std::exception& failure) {
        if (error != nullptr) {
            *error = QString::fromUtf8(failure.what());
        }
        return false;
    }
}

bool MainWindow::openCalibration(std::int64_t sessionId, QString* error) {
    try {
        bench()->openSession(sessionId);
    } catch (const std::exception& failure) {
        if (error != nullptr) {
            *error = QString::fromUtf8(failure.what());
        }
        return false;
    }
    showBench();
    return true;
}

void MainWindow::askToStart(qint64 instrumentId) {
    try {
        storage::Workbook& workbook = *workspace_->workbook();
        const auto instrument = storage::InstrumentRepository(workbook).find(instrumentId);
        if (!instrument) {
            return;
        }
        SessionSetupDialog dialog(*instrument, storage::StandardRepository(workbook).all(),
                                  std::nullopt, today(), this);
        if (dialog.exec() != QDialog::Accepted) {
            return;
        }
        QString error;
        if (!startCalibration(instrumentId, dialog.setup(), &error)) {
            QMessageBox::warning(this, tr("Calibration not started"), error);
        }
    } catch (const std::exception& failure) {
        QMessageBox::warning(this, tr("Calibration not started"),
                             QString::fromUtf8(failure.what()));
    }
}

void MainWindow::askToChangeSetup() {
    const BenchSession* bench = bench_ != nullptr ? bench_->bench() : nullptr;
    if (bench == nullptr || !bench->editable()) {
        report(tr("Open a calibration you may change on the bench first."));
        return;
    }
    SessionSetupDialog dialog(bench->instrument(), bench->standards(), bench->session(), today(),
                              this);
    if (dialog.exec() != QDialog::Accepted) {
        return;
    }
    const SessionSetup setup = dialog.setup();
    const CalibrationSession before = bench->session();
    CalibrationSession after = before;
    after.environment = setup.environment;
    after.method = setup.method;
    after.decision_rule = setup.rule;
    after.guard_factor = setup.guardFactor;
    after.settings = setup.settings;
    after.phases = setup.phases;
    const Instrument instrument = bench->instrument();
    QUndoStack* undo = workspace_->undoStack();
    undo->beginMacro(tr("Change the set-up"));
    try {
        SessionEdits& edits = workspace_->edits();
        edits.changeDetails(before, after);
        std::vector<std::int64_t> usedBefore;
        for (const StandardUse& use : before.standards) {
            usedBefore.push_back(use.standard_id);
        }
        std::vector<StandardUse> standards = setup.standards;
        for (StandardUse& use : standards) {
            for (const StandardUse& old : before.standards) {
                if (old.standard_id == use.standard_id) {
                    use.certificate_number = old.certificate_number; // the copy is kept
                    use.due_date = old.due_date;
                }
            }
        }
        if (standards != before.standards) {
            edits.changeStandards(before.id, before.standards, standards);
        }
        const std::vector<TestPoint> plan = effectivePlan(before);
        for (const RangeSpec& range : instrument.ranges) {
            const bool wanted = std::count(setup.ranges.begin(), setup.ranges.end(), range.id) > 0;
            const bool planned = std::any_of(plan.begin(), plan.end(), [&range](const auto& p) {
                return p.range_id == range.id;
            });
            if (wanted && !planned) {
                for (const TestPoint& point : defaultPoints(instrument, range, setup.repeats)) {
                    edits.addPoint(before.id, range.id, point.nominal, point.repeats);
                }
            } else if (!wanted && planned) {
                for (const TestPoint& point : plan) {
                    if (point.range_id == range.id) {
                        edits.removePoint(before.id, range.id, point.point_index);
                    }
                }
            }
        }
    } catch (const std::exception& failure) {
        undo->endMacro();
        undo->undo(); // the parts that were saved are taken back: the set-up is all or nothing
        QMessageBox::warning(this, tr("Set-up not changed"), QString::fromUtf8(failure.what()));
        return;
    }
    undo->endMacro();
    report(tr("Set-up saved."));
}

void MainWindow::askToSubmit() {
    const BenchSession* bench = bench_ != nullptr ? bench_->bench() : nullptr;
    if (bench == nullptr || !bench->editable()) {
        report(tr("Open a calibration you may submit on the bench first."));
        return;
    }
    const SessionEvaluation& evaluation = bench->evaluation();
    const QString outcome = evaluation.overall
                                ? QString::fromUtf8(displayName(*evaluation.overall).data())
                                : tr("none yet");
    const auto answer = QMessageBox::question(
        this, tr("Submit for review"),
        tr("Submit the calibration of %1 for review?\n\nOutcome as evaluated now: %2.\n\nOnce "
           "submitted it cannot be changed unless the reviewer returns it.")
            .arg(QString::fromStdString(bench->instrument().asset_tag), outcome));
    if (answer != QMessageBox::Yes) {
        return;
    }
    QString message;
    if (MainWindow::bench()->submit(&message)) {
        report(message);
    } else {
        QMessageBox::warning(this, tr("Not submitted"), message);
    }
}

} // namespace mw::gui
