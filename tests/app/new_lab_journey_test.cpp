// A new lab from nothing: `meterwright new` writes the workbook with its first administrator,
// and from then on everything is done in the window — the administrator adds a meter, a
// reference standard and a technician, and the technician starts a calibration on the bench —
// without the command line again.
#include "app/gui/admin/instrument_editor.h"
#include "app/gui/admin/people_dialog.h"
#include "app/gui/admin/range_table.h"
#include "app/gui/admin/standard_editor.h"
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/workspace.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "support/cli_process.h"
#include "tests/support/keyboard.h"

#include <catch2/catch.hpp>

#include <QLineEdit>
#include <QTableWidget>
#include <QTemporaryDir>
#include <QTest>

namespace {

void type(QWidget& parent, const char* name, const QString& text) {
    REQUIRE(mwtest::typeIntoField(parent, name, text));
}

} // namespace

TEST_CASE("a new lab adds a meter, a standard and a technician and starts a calibration") {
    mw::gui::initResources();
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.meterwright"));
    const mwtest::CliResult made = mwtest::runMeterwrightWithInput(
        {QStringLiteral("new"), path, QStringLiteral("--lab"),
         QStringLiteral("Invented Meter Shop"), QStringLiteral("--admin"), QStringLiteral("ada"),
         QStringLiteral("--name"), QStringLiteral("Ada Invented")},
        "first-secret\nfirst-secret\n");
    INFO("stderr: " << made.err.toStdString());
    REQUIRE(made.exitCode == 0);

    mw::gui::MainWindow window;
    QString error;
    REQUIRE(window.openWorkbook(path, &error));
    REQUIRE(window.signIn(QStringLiteral("ada"), QStringLiteral("first-secret")));
    window.workspace().waitForBackgroundWork();
    mw::storage::Workbook& workbook = *window.workbook();

    // The meter: a 10 V range on a 1 mA / 100 Ω movement, multiplier 9.9 kΩ.
    mw::gui::InstrumentEditor meterEditor(window.workspace(), std::nullopt);
    meterEditor.show();
    type(meterEditor, "asset_tag", QStringLiteral("NL-001"));
    type(meterEditor, "description", QStringLiteral("Panel voltmeter, 0-10 V DC"));
    type(meterEditor, "serial", QStringLiteral("NL-S-1"));
    type(meterEditor, "location", QStringLiteral("Front bench"));
    type(meterEditor, "movement_amps_fs", QStringLiteral("1mA"));
    type(meterEditor, "movement_ohms", QStringLiteral("100"));
    mw::gui::RangeTable* ranges = meterEditor.ranges();
    ranges->item(0, mw::gui::RangeTable::Label)->setText(QStringLiteral("10 V"));
    ranges->item(0, mw::gui::RangeTable::FullScale)->setText(QStringLiteral("10"));
    ranges->item(0, mw::gui::RangeTable::Resistor)->setText(QStringLiteral("9k9"));
    INFO(meterEditor.problems().join(QLatin1Char('\n')).toStdString());
    REQUIRE(meterEditor.save());
    const auto meter =
        mw::storage::InstrumentRepository(workbook).findByTag(QStringLiteral("NL-001"));
    REQUIRE(meter);

    // The reference standard: a calibrator with a 20 V range.
    mw::gui::StandardEditor standardEditor(window.workspace(), std::nullopt,
                                           mw::gui::StandardEditor::Mode::New);
    type(standardEditor, "standardTag", QStringLiteral("NL-STD-1"));
    type(standardEditor, "standardDescription", QStringLiteral("DC voltage calibrator"));
    type(standardEditor, "certificateNumber", QStringLiteral("EXT-NL-0001/2026"));
    QTableWidget* spans = standardEditor.ranges();
    spans->item(0, 0)->setText(QStringLiteral("20 V DC"));
    spans->item(0, 3)->setText(QStringLiteral("20"));
    spans->item(0, 4)->setText(QStringLiteral("0.005%rdg+0.001%rng"));
    INFO(standardEditor.problems().join(QLatin1Char('\n')).toStdString());
    REQUIRE(standardEditor.save());
    const auto standard =
        mw::storage::StandardRepository(workbook).findByTag(QStringLiteral("NL-STD-1"));
    REQUIRE(standard);

    // The technician.
    mw::gui::PeopleDialog people(window.workspace());
    REQUIRE(people.addPerson(QStringLiteral("ned"), QStringLiteral("Ned Invented"),
                             mw::Role::Technician, QStringLiteral("ned-secret-1")));

    // The technician signs in and starts the calibration on the bench.
    REQUIRE(window.signIn(QStringLiteral("ned"), QStringLiteral("ned-secret-1")));
    mw::gui::SessionSetup setup;
    setup.ranges = {meter->ranges.front().id};
    setup.phases = mw::PhasePlan::AsFound;
    setup.standards = {{standard->id, "", {}, ""}};
    setup.method = "Calibrator set to each test point.";
    REQUIRE(window.startCalibration(meter->id, setup, &error));
    const auto session =
        mw::storage::SessionRepository(workbook).find(*window.bench()->sessionId());
    REQUIRE(session);
    CHECK(session->state == mw::SessionState::Draft);
    CHECK(session->technician_id == window.workspace().user()->id);
    CHECK(window.bench()->bench()->editable());
    CHECK(window.bench()->gridModel()->rowCount() > 0); // the default plan, ready to type
}
