// Reference standards in the window, on the demo workbook: the overdue shunt shown as not usable
// (words and a shape); a new standard typed and saved; bad specifications refused with their
// reasons; a recalibration recorded with a new certificate while the records made with the old
// one keep it.
#include "app/gui/admin/standard_editor.h"
#include "app/gui/admin/standards_page.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "tests/support/demo_window.h"
#include "tests/support/keyboard.h"

#include <catch2/catch.hpp>

#include <QDateEdit>
#include <QLineEdit>
#include <QTableWidget>
#include <QTest>

using mw::gui::StandardEditor;

namespace {

void type(QWidget& parent, const char* name, const QString& text) {
    REQUIRE(mwtest::typeIntoField(parent, name, text));
}

void setRange(StandardEditor& editor, int row, const QString& label, const QString& fullScale,
              const QString& spec) {
    QTableWidget* ranges = editor.ranges();
    ranges->item(row, 0)->setText(label);
    ranges->item(row, 3)->setText(fullScale);
    ranges->item(row, 4)->setText(spec);
}

} // namespace

TEST_CASE("the standards page marks the overdue standard as not usable") {
    mwtest::DemoWindow lab("tess", "demo-tech");
    mw::gui::StandardsPage* page = lab.window.standards();
    lab.window.showPage(mw::gui::MainWindow::Page::Standards);
    REQUIRE(page->list()->rowCount() == 4);
    int overdue = 0;
    for (int row = 0; row < page->list()->rowCount(); ++row) {
        QTableWidgetItem* state = page->list()->item(row, 5);
        if (state->text().contains(QStringLiteral("Not usable"))) {
            ++overdue;
            CHECK(page->list()->item(row, 0)->text() == QStringLiteral("CFS-03"));
            CHECK_FALSE(state->icon().isNull()); // a shape, not colour alone
        }
    }
    CHECK(overdue == 1); // the demo's shunt ran out 23 days ago
    REQUIRE(page->selectByTag(QStringLiteral("CFS-01")));
    CHECK(page->ranges()->rowCount() == 11);
    CHECK(page->ranges()->item(0, 3)->text().contains(QStringLiteral("%rdg")));
}

TEST_CASE("a new standard is saved; bad ranges are refused with their reasons") {
    mwtest::DemoWindow lab("morgan", "demo-admin");
    StandardEditor editor(lab.workspace(), std::nullopt, StandardEditor::Mode::New);
    type(editor, "standardTag", QStringLiteral("CFS-05"));
    type(editor, "standardDescription", QStringLiteral("Decade resistance box"));
    type(editor, "certificateNumber", QStringLiteral("EXT-RB-0099/2026-101"));
    setRange(editor, 0, QStringLiteral("20 V DC"), QStringLiteral("20"), QStringLiteral("lots"));
    CHECK(editor.problems().join(QLatin1Char(' ')).contains(QStringLiteral("specification")));
    CHECK_FALSE(editor.save());
    setRange(editor, 0, QStringLiteral("20 V DC"), QStringLiteral("20 A"),
             QStringLiteral("0.004%rdg+0.0008%rng"));
    CHECK(editor.problems().join(QLatin1Char(' ')).contains(QStringLiteral("full scale")));
    setRange(editor, 0, QStringLiteral("20 V DC"), QStringLiteral("20"),
             QStringLiteral("0.004%rdg+0.0008%rng+5uV"));
    editor.addRange(mw::Unit::Ohm);
    setRange(editor, 1, QStringLiteral("1 kohm"), QStringLiteral("1k"),
             QStringLiteral("U=10mohm,k=2,dof=30"));
    INFO(editor.problems().join(QLatin1Char('\n')).toStdString());
    CHECK(editor.problems().isEmpty());
    REQUIRE(editor.save());
    const auto saved =
        mw::storage::StandardRepository(lab.workbook()).findByTag(QStringLiteral("CFS-05"));
    REQUIRE(saved);
    REQUIRE(saved->specs.size() == 2);
    CHECK(saved->specs[0].floor == Approx(5e-6));
    CHECK(*saved->specs[1].certificate_expanded_uncertainty == Approx(10e-3));
    CHECK(*saved->specs[1].degrees_of_freedom == 30.0);
}

TEST_CASE("a recalibration records a new certificate; old records keep the old one") {
    mwtest::DemoWindow lab("morgan", "demo-admin");
    mw::storage::StandardRepository standards(lab.workbook());
    const auto before = standards.findByTag(QStringLiteral("CFS-01"));
    StandardEditor editor(lab.workspace(), before, StandardEditor::Mode::Recalibrate);
    CHECK(editor.findChild<QLineEdit*>(QStringLiteral("certificateNumber"))->text().isEmpty());
    type(editor, "certificateNumber", QString::fromStdString(before->certificate_number));
    CHECK(editor.problems().join(QLatin1Char(' ')).contains(QStringLiteral("new certificate")));
    type(editor, "certificateNumber", QStringLiteral("EXT-CAL-0412/2027-001"));
    REQUIRE(editor.save());
    const auto after = standards.findByTag(QStringLiteral("CFS-01"));
    CHECK(after->certificate_number == "EXT-CAL-0412/2027-001");
    CHECK(after->due_date > before->due_date);
    // Every approved record that used the calibrator still names the certificate it had.
    int kept = 0;
    for (const mw::CalibrationSession& session :
         mw::storage::SessionRepository(lab.workbook()).withState(mw::SessionState::Approved)) {
        for (const mw::StandardUse& use : session.standards) {
            if (use.standard_id == before->id) {
                CHECK(use.certificate_number != "EXT-CAL-0412/2027-001");
                ++kept;
            }
        }
    }
    CHECK(kept > 0);
}
