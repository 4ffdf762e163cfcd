// The instrument editor on the demo workbook: a new meter typed field by field, each bad value
// refused with its reason beside the field and nothing saved; an approved meter's frozen fields
// read-only with the reason while the rest stays editable; only an administrator saves.
#include "app/gui/admin/instrument_editor.h"
#include "app/gui/admin/range_table.h"
#include "app/gui/main_window.h"
#include "app/gui/workspace.h"
#include "storage/audit_repository.h"
#include "storage/instrument_repository.h"

#include "tests/support/demo_window.h"

#include <catch2/catch.hpp>

#include <QComboBox>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QTemporaryDir>
#include <QTest>

#include <chrono>

using mw::gui::InstrumentEditor;
using mw::gui::RangeTable;

namespace {

struct Lab : mwtest::DemoWindow {
    using DemoWindow::DemoWindow;
    mw::storage::InstrumentRepository instruments() {
        return mw::storage::InstrumentRepository(workbook());
    }
};

void type(InstrumentEditor& editor, const char* field, const QString& text) {
    auto* line = editor.findChild<QLineEdit*>(QLatin1String(field));
    REQUIRE(line != nullptr);
    line->clear();
    line->setFocus();
    QTest::keyClicks(line, text);
}

QString reason(const InstrumentEditor& editor, const char* field) {
    auto* label = editor.findChild<QLabel*>(QStringLiteral("reason_") + QLatin1String(field));
    REQUIRE(label != nullptr);
    return label->text();
}

void setCell(RangeTable* table, int row, int column, const QString& text) {
    table->item(row, column)->setText(text);
}

} // namespace

TEST_CASE("a new meter is typed, each bad value refused beside its field, then saved") {
    Lab lab("morgan", "demo-admin");
    InstrumentEditor editor(lab.window.workspace(), std::nullopt);
    editor.show();
    type(editor, "asset_tag", QStringLiteral("CFM-601"));
    type(editor, "description", QStringLiteral("Panel voltmeter, 0-15 V DC"));
    type(editor, "serial", QStringLiteral("NEW-0001"));
    type(editor, "location", QStringLiteral("Bench 2 test rack"));
    type(editor, "movement_amps_fs", QStringLiteral("1mA"));
    type(editor, "movement_ohms", QStringLiteral("100"));
    // A class not in the IEC 60051-2 series.
    auto* accuracy = editor.findChild<QComboBox*>(QStringLiteral("accuracy_class"));
    REQUIRE(accuracy != nullptr);
    accuracy->setCurrentText(QStringLiteral("1.2"));
    CHECK(reason(editor, "accuracy_class").contains(QStringLiteral("not in the series")));
    accuracy->setCurrentText(QStringLiteral("1.5"));
    CHECK(reason(editor, "accuracy_class").isEmpty());
    // A unit the field does not take.
    type(editor, "movement_ohms", QStringLiteral("100 V"));
    CHECK_FALSE(reason(editor, "movement_ohms").isEmpty());
    type(editor, "movement_ohms", QStringLiteral("100"));

    RangeTable* ranges = editor.ranges();
    REQUIRE(ranges->rowCount() == 1);
    setCell(ranges, 0, RangeTable::Label, QStringLiteral("15 V"));
    // Below the movement's own drop, I_fs·R_m = 1 mA × 100 Ω = 100 mV: impossible.
    setCell(ranges, 0, RangeTable::FullScale, QStringLiteral("50 mV"));
    CHECK(reason(editor, "ranges").contains(QStringLiteral("full-scale drop")));
    CHECK_FALSE(editor.save());
    CHECK_FALSE(lab.instruments().findByTag(QStringLiteral("CFM-601")));
    setCell(ranges, 0, RangeTable::FullScale, QStringLiteral("15"));
    setCell(ranges, 0, RangeTable::Resistor, QStringLiteral("14k9"));
    // The designed multiplier, R = V/I_fs − R_m = 14.9 kΩ (common practice), is shown beside.
    CHECK(ranges->item(0, RangeTable::Designed)->text().contains(QStringLiteral("14.900 kΩ")));
    CHECK(ranges->item(0, RangeTable::Designed)->toolTip().contains(QStringLiteral("V/I_fs")));
    INFO(editor.problems().join(QLatin1Char('\n')).toStdString());
    CHECK(editor.problems().isEmpty());
    REQUIRE(editor.save());
    const auto saved = lab.instruments().findByTag(QStringLiteral("CFM-601"));
    REQUIRE(saved);
    CHECK(saved->movement.amps_fs == Approx(1e-3));
    CHECK(saved->accuracy_class == 1.5);
    REQUIRE(saved->ranges.size() == 1);
    CHECK(saved->ranges[0].full_scale == 15.0);
    CHECK(saved->ranges[0].nominal_ohms == Approx(14900.0));
    CHECK(editor.savedId() == saved->id);
}

TEST_CASE("an approved meter's frozen fields are read-only with the reason; the rest is saved") {
    Lab lab("morgan", "demo-admin");
    const auto meter = lab.instruments().findByTag(QStringLiteral("CFM-101"));
    InstrumentEditor editor(lab.window.workspace(), meter);
    CHECK(editor.frozen());
    auto* tag = editor.findChild<QLineEdit*>(QStringLiteral("asset_tag"));
    CHECK_FALSE(tag->isEnabled());
    CHECK(tag->toolTip().contains(QStringLiteral("new instrument")));
    CHECK(editor.findChild<QLabel*>(QStringLiteral("frozenNote"))->isVisibleTo(&editor));
    CHECK_FALSE(editor.ranges()->item(0, RangeTable::FullScale)->flags() & Qt::ItemIsEditable);
    type(editor, "location", QStringLiteral("Shelf C"));
    REQUIRE(editor.save());
    CHECK(lab.instruments().findByTag(QStringLiteral("CFM-101"))->location == "Shelf C");
}

TEST_CASE("only an administrator saves the register") {
    Lab lab("tess", "demo-tech");
    const auto meter = lab.instruments().findByTag(QStringLiteral("CFM-101"));
    InstrumentEditor editor(lab.window.workspace(), meter);
    type(editor, "location", QStringLiteral("Shelf D"));
    CHECK_FALSE(editor.save());
    CHECK(editor.message().contains(QStringLiteral("administrator")));
    CHECK(lab.instruments().findByTag(QStringLiteral("CFM-101"))->location != "Shelf D");
}
