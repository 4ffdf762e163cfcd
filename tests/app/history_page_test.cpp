// One meter's history on the demo workbook: every calibration newest first; the drift chart
// drawing exactly the engine's numbers (buildHistory) for a point and for the overview; an
// approved record amended with a reason, both revisions shown and linked once the new one is
// approved; the recommended interval adopted by an administrator only, as an audited edit.
#include "app/gui/desk/desk_text.h"
#include "app/gui/desk/drift_chart_view.h"
#include "app/gui/desk/history_page.h"
#include "app/gui/desk/review_page.h"
#include "app/record/record_loader.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "tests/support/demo_window.h"

#include <catch2/catch.hpp>

#include <QComboBox>
#include <QLabel>
#include <QPushButton>
#include <QSqlQuery>
#include <QTableWidget>
#include <QTest>

using mw::SessionState;
using mw::gui::HistoryPage;
using mw::gui::MainWindow;

namespace {

std::int64_t idOf(mwtest::DemoWindow& lab, const char* tag) {
    return mw::storage::InstrumentRepository(lab.workbook()).findByTag(QLatin1String(tag))->id;
}

// The engine's history of the instrument, read independently of the page.
mw::InstrumentHistory engineHistory(mwtest::DemoWindow& lab, std::int64_t instrumentId) {
    return mw::record::RecordLoader(lab.workbook())
        .history(instrumentId, mw::record::printTime())
        ->history;
}

} // namespace

TEST_CASE("the history lists every calibration newest first") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    HistoryPage* page = lab.window.history();
    const std::int64_t meter = idOf(lab, "CFM-203");
    REQUIRE(page->showInstrument(meter));
    const auto sessions = mw::storage::SessionRepository(lab.workbook()).historyOf(meter);
    REQUIRE(page->calibrations()->rowCount() == int(sessions.size()));
    REQUIRE(sessions.size() >= 5); // years of records
    const auto idAt = [page](int row) {
        return page->calibrations()
            ->item(row, HistoryPage::Started)
            ->data(Qt::UserRole)
            .toLongLong();
    };
    CHECK(idAt(0) == sessions.back().id); // historyOf is oldest first
    CHECK(idAt(page->calibrations()->rowCount() - 1) == sessions.front().id);
    CHECK(page->calibrations()->item(0, HistoryPage::Reviewer)->text() ==
          QStringLiteral("Rowan Ettrick"));
    CHECK(page->calibrations()->item(0, HistoryPage::Worst)->text().contains("% of limit"));
}

TEST_CASE("the drift chart draws the engine's series") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    HistoryPage* page = lab.window.history();
    const std::int64_t meter = idOf(lab, "CFM-203");
    REQUIRE(page->showInstrument(meter));
    const mw::InstrumentHistory engine = engineHistory(lab, meter);
    REQUIRE_FALSE(engine.points.empty());
    for (std::size_t i = 0; i < engine.points.size(); ++i) {
        const mw::PointHistory& point = engine.points[i];
        page->showDriftOf(int(i));
        const double scale = page->chart()->yScale();
        const QList<QPointF> found = page->chart()->seriesPoints(QStringLiteral("as found"));
        REQUIRE(found.size() == int(point.asFound.size()));
        for (std::size_t k = 0; k < point.asFound.size(); ++k) {
            CHECK(found[int(k)].x() ==
                  Approx(double(point.asFound[k].date.time_since_epoch().count())));
            CHECK(found[int(k)].y() == Approx(point.asFound[k].error * scale));
        }
        const QList<QPointF> limit = page->chart()->seriesPoints(QStringLiteral("+limit"));
        REQUIRE(limit.size() == 2);
        CHECK(limit[0].y() == Approx(point.permissibleError * scale));
        const QList<QPointF> fitted = page->chart()->seriesPoints(QStringLiteral("fitted"));
        if (point.drift && point.drift->significant) {
            REQUIRE(fitted.size() == 2);
            CHECK(fitted[0].y() == Approx(point.line->errorAtFrom * scale));
            CHECK(fitted[1].y() == Approx(point.line->errorAtTo * scale));
            const QList<QPointF> projected =
                page->chart()->seriesPoints(QStringLiteral("projected"));
            if (!projected.isEmpty()) {
                const auto end = mw::gui::driftChartEnd(point);
                CHECK(projected.back().y() == Approx(mw::fittedErrorOn(*point.line, end) * scale));
            }
            CHECK(page->driftSummary()->text().contains(QStringLiteral("per year")));
        } else {
            CHECK(fitted.isEmpty()); // no trend drawn where the engine finds none
        }
    }
    // The overview: every point as a percentage of its own limit.
    page->showDriftOf(std::nullopt);
    const QList<QPointF> first = page->chart()->seriesPoints(QStringLiteral("as found 1"));
    REQUIRE(first.size() == int(engine.points[0].asFound.size()));
    CHECK(first[0].y() ==
          Approx(engine.points[0].asFound[0].error / engine.points[0].permissibleError * 100.0));
    CHECK(page->chart()->seriesPoints(QStringLiteral("+limit"))[0].y() == Approx(100.0));
}

TEST_CASE("an amended record keeps the original readable and links the two") {
    mwtest::DemoWindow lab("tess", "demo-tech");
    HistoryPage* page = lab.window.history();
    const std::int64_t meter = idOf(lab, "CFM-203");
    REQUIRE(page->showInstrument(meter));
    const std::int64_t original =
        page->calibrations()->item(0, HistoryPage::Started)->data(Qt::UserRole).toLongLong();
    REQUIRE(page->selectSession(original));
    REQUIRE(page->amendButton()->isEnabled());
    QString message;
    CHECK_FALSE(page->amendSelected(QStringLiteral("  "), &message)); // a reason is required
    CHECK(message.contains(QStringLiteral("reason is required")));
    const auto revision = page->amendSelected(
        QStringLiteral("Certificate number of the standard mistyped"), &message);
    REQUIRE(revision);
    CHECK(page->calibrations()->rowCount() ==
          int(mw::storage::SessionRepository(lab.workbook()).historyOf(meter).size()));
    CHECK(page->selectedSession() == *revision);
    CHECK(page->recordLine()->text().contains(QStringLiteral("mistyped")));

    // Submitted by the technician, approved by the reviewer: the original is superseded.
    QString error;
    REQUIRE(lab.window.openCalibration(*revision, &error));
    REQUIRE(mw::storage::SessionRepository(lab.workbook()).find(*revision)->state ==
            SessionState::Draft);
    mw::storage::SessionRepository(lab.workbook()).submit(*revision, mw::gui::currentTime());
    REQUIRE(lab.window.signIn(QStringLiteral("rowan"), QStringLiteral("demo-review")));
    mw::gui::ReviewPage* review = lab.window.review();
    review->reload();
    REQUIRE(review->openSession(*revision));
    REQUIRE(review->approve(QStringLiteral("demo-review"), &message));

    REQUIRE(page->showInstrument(meter));
    REQUIRE(page->selectSession(original));
    CHECK(page->calibrations()
              ->item(page->calibrations()->currentRow(), HistoryPage::State)
              ->text()
              .contains(QStringLiteral("superseded by rev. 2")));
    CHECK(page->recordLine()->text().contains(QStringLiteral("Superseded")));
    CHECK(page->successorButton()->isVisibleTo(page));
    QTest::mouseClick(page->successorButton(), Qt::LeftButton);
    CHECK(page->selectedSession() == *revision);
    CHECK(mw::storage::SessionRepository(lab.workbook()).find(original)->state ==
          SessionState::Superseded);
}

TEST_CASE("the recommended interval is adopted by an administrator, audited") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    HistoryPage* page = lab.window.history();
    const std::int64_t meter = idOf(lab, "CFM-203");
    REQUIRE(page->showInstrument(meter));
    const mw::InstrumentHistory engine = engineHistory(lab, meter);
    REQUIRE(engine.interval.recommendation);
    const int recommended = engine.interval.recommendation->recommendedDays;
    CHECK(page->intervalText()->text().contains(QString::number(recommended)));
    CHECK(page->intervalSteps()->rowCount() == int(engine.interval.recommendation->steps.size()));
    CHECK_FALSE(page->adoptButton()->isEnabled()); // a reviewer does not set intervals
    QString message;
    CHECK_FALSE(page->adoptRecommendation(&message));

    REQUIRE(lab.window.signIn(QStringLiteral("morgan"), QStringLiteral("demo-admin")));
    REQUIRE(page->showInstrument(meter));
    REQUIRE(page->adoptButton()->isEnabled());
    REQUIRE(page->adoptRecommendation(&message));
    CHECK(mw::storage::InstrumentRepository(lab.workbook()).find(meter)->interval_days ==
          recommended);
    QSqlQuery audit(lab.workbook().database());
    REQUIRE(audit.exec(
        QStringLiteral(
            "SELECT new_values, user_id FROM audit_log WHERE table_name = 'instruments' AND "
            "action = 'update' AND row_id = %1 ORDER BY id DESC LIMIT 1")
            .arg(meter)));
    REQUIRE(audit.next());
    CHECK(audit.value(0).toString().contains(QString::number(recommended)));
    CHECK(audit.value(1).toLongLong() == lab.workspace().user()->id);
}
