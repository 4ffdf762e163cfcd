// The review desk on the demo workbook: the three submitted calibrations queued; one approved
// by the reviewer only with their own password typed again (a wrong one refused and nothing
// changed); one returned only with a comment, which the technician then sees on the bench; and
// a technician (or a reviewer who did the work) not offered their own work to approve.
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/desk/desk_dialogs.h"
#include "app/gui/desk/review_page.h"
#include "app/gui/register_page.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"
#include "tests/support/demo_window.h"
#include "tests/support/keyboard.h"

#include <catch2/catch.hpp>

#include <QLabel>
#include <QLineEdit>
#include <QPlainTextEdit>
#include <QPushButton>
#include <QTableWidget>
#include <QTest>
#include <QTimer>

using mw::SessionState;
using mw::gui::MainWindow;
using mw::gui::ReviewPage;

namespace {

std::int64_t queuedSession(ReviewPage& page, int row) {
    return page.queue()->item(row, ReviewPage::Instrument)->data(Qt::UserRole).toLongLong();
}

SessionState stateOf(mwtest::DemoWindow& lab, std::int64_t id) {
    return mw::storage::SessionRepository(lab.workbook()).find(id)->state;
}

// Morgan calibrates the demo's laboratory voltmeter at the bench and submits it.
std::int64_t submitOwnCalibration(mwtest::DemoWindow& lab) {
    using mw::gui::ReadingGridModel;
    mw::storage::Workbook& workbook = lab.workbook();
    const auto meter =
        mw::storage::InstrumentRepository(workbook).findByTag(QStringLiteral("CFM-103"));
    const auto calibrator =
        mw::storage::StandardRepository(workbook).findByTag(QStringLiteral("CFS-01"));
    REQUIRE(meter);
    REQUIRE(calibrator);
    mw::gui::SessionSetup setup;
    setup.ranges = {meter->ranges.front().id};
    setup.phases = mw::PhasePlan::AsFound;
    setup.standards = {{calibrator->id, "", {}, ""}};
    setup.method = "Calibrator set to each test point.";
    QString error;
    REQUIRE(lab.window.startCalibration(meter->id, setup, &error));
    lab.window.show(); // typed keys reach only a shown window
    QApplication::setActiveWindow(&lab.window);
    mw::gui::BenchView* bench = lab.window.bench();
    ReadingGridModel* model = bench->gridModel();
    bench->grid()->setCurrentIndex(model->index(0, ReadingGridModel::Indicated));
    for (int row = 0; row < model->rowCount(); ++row) {
        const double applied = model->index(row, ReadingGridModel::Applied)
                                   .data(ReadingGridModel::ValueRole)
                                   .toDouble();
        mwtest::typeInto(bench->grid(), QString::number(applied + 0.01, 'f', 3));
    }
    QString message;
    const bool submitted = bench->submit(&message);
    INFO(message.toStdString());
    REQUIRE(submitted);
    return *bench->sessionId();
}

} // namespace

TEST_CASE("the queue lists every submitted calibration with its technician and outcome") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    lab.window.showPage(MainWindow::Page::Review);
    ReviewPage* page = lab.window.review();
    const auto submitted =
        mw::storage::SessionRepository(lab.workbook()).withState(SessionState::Submitted);
    REQUIRE(page->queue()->rowCount() == int(submitted.size()));
    REQUIRE(submitted.size() == 3); // the demo's waiting work
    for (int row = 0; row < page->queue()->rowCount(); ++row) {
        CHECK(queuedSession(*page, row) == submitted[std::size_t(row)].id); // oldest first
        CHECK(page->queue()->item(row, ReviewPage::Technician)->text() ==
              QStringLiteral("Tess Marlowe-Quine"));
        CHECK_FALSE(page->queue()->item(row, ReviewPage::Outcome)->text().isEmpty());
        CHECK_FALSE(page->queue()->item(row, ReviewPage::Outcome)->icon().isNull());
        CHECK(page->queue()->item(row, ReviewPage::Standards)->text().contains("cert."));
    }
    // Choosing a row shows it read-only, with the bench's grid and results.
    page->queue()->selectRow(1);
    REQUIRE(page->sessionId() == submitted[1].id);
    CHECK(page->view()->gridModel()->rowCount() > 0);
    CHECK_FALSE(page->view()->bench()->editable());
    CHECK(page->view()->overallText().startsWith(QStringLiteral("<b>Outcome:"))); // not "so far"
    CHECK(page->approveButton()->isEnabled());
    CHECK(page->returnButton()->isEnabled());
}

TEST_CASE("approval needs the reviewer's own password and shows the sealed digest") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    ReviewPage* page = lab.window.review();
    lab.window.showPage(MainWindow::Page::Review);
    const std::int64_t id = queuedSession(*page, 0);
    REQUIRE(page->openSession(id));

    QString message;
    CHECK_FALSE(page->approve(QStringLiteral("demo-tech"), &message)); // someone else's
    CHECK(message.contains(QStringLiteral("not your password")));
    CHECK(stateOf(lab, id) == SessionState::Submitted);
    CHECK(page->queue()->rowCount() == 3);

    // Through the dialog, as a person does it: the password typed, Enter.
    QTimer::singleShot(0, [] {
        auto* dialog = qobject_cast<mw::gui::SignatureDialog*>(QApplication::activeModalWidget());
        REQUIRE(dialog != nullptr);
        auto* password = dialog->findChild<QLineEdit*>(QStringLiteral("signaturePassword"));
        QTest::keyClicks(password, QStringLiteral("demo-review"));
        QTest::keyClick(password, Qt::Key_Return);
    });
    QTest::mouseClick(page->approveButton(), Qt::LeftButton);

    const auto approved = mw::storage::SessionRepository(lab.workbook()).find(id);
    REQUIRE(approved->state == SessionState::Approved);
    CHECK(approved->reviewer_id == lab.workspace().user()->id);
    REQUIRE(approved->digest.size() == 64);
    CHECK(page->verdictLabel()->isVisibleTo(page));
    CHECK(page->verdictLabel()->text().contains(QString::fromStdString(approved->digest)));
    CHECK(page->queue()->rowCount() == 2);
    CHECK_FALSE(page->approveButton()->isEnabled()); // approved: nothing more to do here
}

TEST_CASE("a return needs a comment, and the technician sees it") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    ReviewPage* page = lab.window.review();
    const std::int64_t id = queuedSession(*page, 0);
    REQUIRE(page->openSession(id));
    QString message;
    CHECK_FALSE(page->returnToTechnician(QStringLiteral("   "), &message));
    CHECK(message.contains(QStringLiteral("comment is required")));
    CHECK(stateOf(lab, id) == SessionState::Submitted);

    // The dialog's OK stays disabled until something is written.
    QTimer::singleShot(0, [] {
        auto* dialog = qobject_cast<mw::gui::CommentDialog*>(QApplication::activeModalWidget());
        REQUIRE(dialog != nullptr);
        auto* ok = dialog->findChildren<QPushButton*>().first();
        CHECK_FALSE(ok->isEnabled());
        QTest::keyClicks(dialog->editor(), QStringLiteral("Repeat point 3 down-scale: tapped?"));
        CHECK(ok->isEnabled());
        dialog->accept();
    });
    QTest::mouseClick(page->returnButton(), Qt::LeftButton);
    const auto returned = mw::storage::SessionRepository(lab.workbook()).find(id);
    REQUIRE(returned->state == SessionState::Returned);
    CHECK(returned->return_comment == "Repeat point 3 down-scale: tapped?");

    REQUIRE(lab.window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech")));
    REQUIRE(lab.window.registerPage()->selectByTag(
        QString::fromStdString(mw::storage::InstrumentRepository(lab.workbook())
                                   .find(returned->instrument_id)
                                   ->asset_tag)));
    CHECK(lab.window.registerPage()
              ->findChild<QLabel*>(QStringLiteral("registerOpenNote"))
              ->text()
              .contains(QStringLiteral("Repeat point 3 down-scale")));
    QString error;
    REQUIRE(lab.window.openCalibration(id, &error));
    CHECK(lab.window.bench()
              ->findChild<QLabel*>(QStringLiteral("benchHeader"))
              ->text()
              .contains(QStringLiteral("Repeat point 3 down-scale")));
}

TEST_CASE("nobody is offered their own work to approve, and a technician none at all") {
    mwtest::DemoWindow lab("tess", "demo-tech");
    ReviewPage* page = lab.window.review();
    const std::int64_t id = queuedSession(*page, 0);
    REQUIRE(page->openSession(id));
    CHECK_FALSE(page->approveButton()->isEnabled());
    CHECK(page->actionBlocker().contains(QStringLiteral("Only a reviewer")));
    QString message;
    CHECK_FALSE(page->approve(QStringLiteral("demo-tech"), &message));
    CHECK(stateOf(lab, id) == SessionState::Submitted);

    // An administrator may approve Tess's work, but not a calibration of their own.
    REQUIRE(lab.window.signIn(QStringLiteral("morgan"), QStringLiteral("demo-admin")));
    REQUIRE(page->openSession(id));
    CHECK(page->approveButton()->isEnabled());
    const std::int64_t own = submitOwnCalibration(lab);
    REQUIRE(page->openSession(own));
    CHECK_FALSE(page->approveButton()->isEnabled());
    CHECK_FALSE(page->returnButton()->isEnabled());
    CHECK(page->actionBlocker().contains(QStringLiteral("You calibrated this meter")));
    CHECK_FALSE(page->approve(QStringLiteral("demo-admin"), &message));
    CHECK(stateOf(lab, own) == SessionState::Submitted);
}
