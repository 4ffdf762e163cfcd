// The range designer on the demo workbook, driven by keys: its numbers against the `calc`
// commands run on the same inputs, a bad entry marked with the parser's reason and no result,
// the chart against the engine's curve, and "use for this range" saving an audited change to a
// draft instrument while refusing one that approved records rest on.
#include "app/gui/designer/range_designer_view.h"

#include "app/gui/designer/component_panels.h"
#include "app/gui/designer/dc_panels.h"
#include "app/gui/designer/range_use_box.h"
#include "app/gui/designer/rectifier_chart.h"
#include "app/gui/designer/rectifier_panel.h"
#include "app/gui/workspace.h"
#include "core/circuits/rectifier_design.h"
#include "core/circuits/scale_error_curve.h"
#include "storage/audit_repository.h"
#include "storage/instrument_repository.h"
#include "storage/lab_repository.h"

#include "support/approx.h"
#include "support/cli_process.h"
#include "tests/support/demo_window.h"

#include <catch2/catch.hpp>

#include <QComboBox>
#include <QJsonArray>
#include <QLabel>
#include <QLineEdit>
#include <QLineSeries>
#include <QPushButton>
#include <QSignalSpy>
#include <QTableWidget>
#include <QTest>

using mw::gui::RangeDesignerView;
using mwtest::args;
using mwtest::relative;
using mwtest::calc::runJson;
using Panel = RangeDesignerView::Panel;

namespace {

// Replaces what the entry holds by `text`, key by key, as a person does.
void type(QWidget& view, const char* name, const QString& text) {
    auto* line = view.findChild<QLineEdit*>(QLatin1String(name));
    INFO("entry " << name);
    REQUIRE(line != nullptr);
    line->setFocus();
    QTest::keyClick(line, Qt::Key_A, Qt::ControlModifier);
    QTest::keyClick(line, Qt::Key_Delete);
    QTest::keyClicks(line, text);
}

// Chooses the entry of a box whose text starts with `text`, with the arrow keys.
void pick(QWidget& view, const char* name, const QString& text) {
    auto* box = view.findChild<QComboBox*>(QLatin1String(name));
    REQUIRE(box != nullptr);
    box->setFocus();
    QTest::keyClick(box, Qt::Key_Home);
    for (int i = 0; i < box->count() && !box->currentText().startsWith(text); ++i) {
        QTest::keyClick(box, Qt::Key_Down);
    }
    REQUIRE(box->currentText().startsWith(text));
}

double number(const QJsonObject& json, const char* key) {
    INFO("key " << key);
    REQUIRE(json.value(QLatin1String(key)).isDouble());
    return json.value(QLatin1String(key)).toDouble();
}

// The rectifier panel with a circuit chosen and typed.
void designRectifier(RangeDesignerView& view, const char* kind, const char* diode,
                     const char* celsius, const char* range) {
    view.showPanel(Panel::Rectifier);
    pick(view, "rectifier_kind", QString::fromUtf8(kind));
    pick(view, "rectifier_diode", QString::fromUtf8(diode));
    type(view, "rectifier_temperature", QString::fromUtf8(celsius));
    type(view, "rectifier_range", QString::fromUtf8(range));
}

void press(QPushButton* button) {
    button->setFocus();
    QTest::keyClick(button, Qt::Key_Space);
}

struct Designer : mwtest::DemoWindow {
    RangeDesignerView view{workspace()};
    explicit Designer(const char* login = "morgan", const char* password = "demo-admin")
        : DemoWindow(login, password) {
        view.resize(1280, 760);
        view.show();
        type(view, "movement_amps_fs", QStringLiteral("50 µA"));
        type(view, "movement_ohms", QStringLiteral("1k2"));
    }
};

// Same value: the designer and the command call the same engine functions, and JSON carries
// doubles to the last digit.
constexpr double kSame = 1e-12;

} // namespace

TEST_CASE("the DC multiplier, chain, shunt and Ayrton taps equal the calc commands'") {
    Designer designer;
    type(designer.view, "dc_range", QStringLiteral("15"));
    const QJsonObject dc = runJson(args(
        {"multiplier", "--rectifier", "none", "--ifs", "50uA", "--rm", "1k2", "--range", "15V"}));
    const mw::gui::ResultList* voltmeter = designer.view.dcPanel()->results();
    CHECK(*voltmeter->value("multiplier") == relative(number(dc, "multiplier_ohm"), kSame));
    CHECK(*voltmeter->value("standard") == relative(number(dc, "nearest_standard_ohm"), kSame));
    CHECK(*voltmeter->value("dissipation") == relative(number(dc, "dissipation_w"), kSame));
    // The chain's sections: common practice, (V_i − V_i−1) / I_fs above the first range.
    type(designer.view, "dc_ranges", QStringLiteral("1; 10; 100 V"));
    QTableWidget* chain = designer.view.dcPanel()->chain();
    REQUIRE(chain->rowCount() == 3);
    CHECK(chain->item(2, 2)->data(Qt::UserRole).toDouble() == relative(90.0 / 50e-6, kSame));

    designer.view.showPanel(Panel::Ammeter);
    type(designer.view, "shunt_range", QStringLiteral("2 A"));
    type(designer.view, "shunt_swamp", QStringLiteral("1k"));
    const QJsonObject shunt =
        runJson(args({"shunt", "--ifs", "50uA", "--rm", "1k2", "--range", "2A", "--swamp", "1k"}));
    const mw::gui::ResultList* results = designer.view.ammeterPanel()->results();
    CHECK(*results->value("shunt") == relative(number(shunt, "shunt_ohm"), kSame));
    CHECK(*results->value("meter_resistance") ==
          relative(number(shunt, "meter_resistance_ohm"), kSame));
    CHECK(*results->value("burden") == relative(number(shunt, "burden_v"), kSame));
    CHECK(*results->value("dissipation") == relative(number(shunt, "dissipation_w"), kSame));
    CHECK(*results->value("drift") == relative(number(shunt, "span_drift_percent_per_10k"), kSame));

    type(designer.view, "ayrton_ranges", QStringLiteral("10 mA; 100 mA; 1 A"));
    const QJsonObject ayrton =
        runJson(args({"ayrton", "--ifs", "50uA", "--rm", "1k2", "--ranges", "10mA,100mA,1A"}));
    QTableWidget* taps = designer.view.ammeterPanel()->taps();
    REQUIRE(taps->rowCount() == 3);
    for (int k = 0; k < 3; ++k) {
        CHECK(taps->item(k, 1)->data(Qt::UserRole).toDouble() ==
              relative(ayrton.value(QStringLiteral("taps_ohm")).toArray().at(k).toDouble(), kSame));
    }
}

TEST_CASE("the rectifier multiplier equals calc multiplier's for the same diodes and temperature") {
    Designer designer;
    designRectifier(designer.view, "half", "germanium", "40 °C", "15 V");
    const QJsonObject json =
        runJson(args({"multiplier", "--rectifier", "half", "--diode", "germanium", "--temp", "40C",
                      "--ifs", "50uA", "--rm", "1k2", "--range", "15V"}));
    const mw::gui::ResultList* results = designer.view.rectifierPanel()->results();
    CHECK(*results->value("multiplier") == relative(number(json, "multiplier_ohm"), kSame));
    CHECK(*results->value("ideal_multiplier") ==
          relative(number(json, "multiplier_ideal_ohm"), kSame));
    CHECK(*results->value("sensitivity") ==
          relative(number(json, "sensitivity_ohm_per_volt"), kSame));
    CHECK(*results->value("effective_sensitivity") ==
          relative(number(json, "effective_sensitivity_ohm_per_volt"), kSame));
    CHECK(*results->value("input_resistance") ==
          relative(number(json, "input_resistance_ohm"), kSame));
    CHECK(*results->value("dissipation") == relative(number(json, "dissipation_w"), kSame));
}

TEST_CASE("waveform, coil temperature and preferred value equal the calc commands'") {
    Designer designer;
    designer.view.showPanel(Panel::Waveform);
    pick(designer.view, "waveform_shape", QStringLiteral("triangle"));
    type(designer.view, "waveform_rms", QStringLiteral("2 V"));
    const QJsonObject wave = runJson(args({"waveform", "--waveform", "triangle", "--rms", "2V"}));
    const mw::gui::ResultList* waveform = designer.view.waveformPanel()->results();
    CHECK(*waveform->value("reading") == relative(number(wave, "reading_v"), kSame));
    CHECK(*waveform->value("error") == relative(number(wave, "error_percent"), kSame));
    pick(designer.view, "waveform_shape", QStringLiteral("sampled"));
    type(designer.view, "waveform_samples", QStringLiteral("1; 1; -1; -1"));
    // A sampled square: its form factor is 1, so the meter reads π/(2√2) high (common practice:
    // +11.07 %).
    CHECK(*waveform->value("error") == mwtest::absolute(11.07, 0.005));

    designer.view.showPanel(Panel::CoilTemperature);
    const QJsonObject coil = runJson(
        args({"temperature", "--rm", "2k", "--rm-at", "20C", "--ref", "23C", "--temp", "40C",
              "--target", "0.5%", "--from", "10C", "--to", "40C", "--swamp-tempco", "15ppm/K"}));
    const mw::gui::ResultList* temperature = designer.view.temperaturePanel()->results();
    CHECK(*temperature->value("span_error") == relative(number(coil, "span_error_percent"), kSame));
    CHECK(*temperature->value("swamp") == relative(number(coil, "swamp_ohm"), kSame));

    designer.view.showPanel(Panel::ESeries);
    type(designer.view, "eseries_value", QStringLiteral("299k"));
    type(designer.view, "eseries_current", QStringLiteral("1 mA"));
    const QJsonObject part = runJson(args({"eseries", "--value", "299k", "--current", "1mA"}));
    const mw::gui::ResultList* eseries = designer.view.eseriesPanel()->results();
    CHECK(*eseries->value("not_above") == relative(number(part, "nearest_not_above_ohm"), kSame));
    CHECK(*eseries->value("trim") == relative(number(part, "trim_ohm"), kSame));
    CHECK(*eseries->value("dissipation") == relative(number(part, "dissipation_w"), kSame));
    // 0.3 W at full scale in a 0.25 W part: the rating flag says so in words.
    CHECK(part.value(QStringLiteral("exceeds_rating")).toBool());
    CHECK(eseries->text("rating").contains(QStringLiteral("over its rating")));
}

TEST_CASE("a bad entry is marked with the parser's reason, kept as typed, and gives no result") {
    Designer designer;
    type(designer.view, "dc_range", QStringLiteral("15 Q"));
    auto* line = designer.view.findChild<QLineEdit*>(QStringLiteral("dc_range"));
    CHECK(line->text() == QStringLiteral("15 Q"));
    QString parser;
    try {
        mw::parseValue("15 Q", mw::Unit::Volt);
    } catch (const mw::QuantityError& error) {
        parser = QString::fromUtf8(error.what());
    }
    REQUIRE_FALSE(parser.isEmpty());
    const auto* reason = designer.view.findChild<QLabel*>(QStringLiteral("reason_dc_range"));
    CHECK(reason->isVisibleTo(&designer.view));
    CHECK(reason->text() == QStringLiteral("✖ ") + parser);
    CHECK_FALSE(line->actions().isEmpty()); // the warning shape in the field
    CHECK_FALSE(designer.view.dcPanel()->results()->value("multiplier"));
    CHECK(designer.view.dcPanel()->problem().contains(QStringLiteral("No result")));
    CHECK_FALSE(designer.view.useBox()->useButton()->isEnabled());
    // A value the parser reads but the engine refuses: below the movement's own drop.
    type(designer.view, "dc_range", QStringLiteral("50 mV"));
    CHECK(reason->text().contains(QStringLiteral("full-scale drop")));
    CHECK_FALSE(designer.view.dcPanel()->results()->value("multiplier"));
    type(designer.view, "dc_range", QStringLiteral("15"));
    CHECK(reason->text().isEmpty());
    CHECK(designer.view.dcPanel()->results()->value("multiplier"));

    // The diodes' model holds from −55 °C to 150 °C; the reason says so beside the field.
    designer.view.showPanel(Panel::Rectifier);
    type(designer.view, "rectifier_temperature", QStringLiteral("400 °C"));
    CHECK(designer.view.findChild<QLabel*>(QStringLiteral("reason_rectifier_temperature"))
              ->text()
              .contains(QStringLiteral("150")));
    CHECK_FALSE(designer.view.rectifierPanel()->results()->value("multiplier"));
    CHECK(designer.view.rectifierPanel()->chart()->diodeSeries()->count() == 0);
}

TEST_CASE("with the lab's decimal comma, values are typed with a comma") {
    mwtest::DemoWindow lab("morgan", "demo-admin");
    mw::storage::LabRepository labs(lab.workbook());
    mw::Lab settings = labs.load().value_or(mw::Lab{});
    settings.decimal_comma = true;
    labs.save(settings);
    RangeDesignerView view(lab.workspace());
    type(view, "movement_amps_fs", QStringLiteral("50 µA"));
    type(view, "movement_ohms", QStringLiteral("1,2 k"));
    type(view, "dc_range", QStringLiteral("2,5"));
    // Common practice: R_s = V / I_fs − R_m = 2.5 V / 50 µA − 1.2 kΩ = 48.8 kΩ.
    CHECK(*view.dcPanel()->results()->value("multiplier") == relative(48800.0, 1e-12));
    // Values taken from the register are written as the lab types them, so they read back.
    REQUIRE(view.useBox()->choose(QStringLiteral("CFM-404"), QStringLiteral("30 V~")));
    press(view.findChild<QPushButton*>(QStringLiteral("use_take")));
    CHECK(view.findChild<QLineEdit*>(QStringLiteral("movement_amps_fs"))->text().contains(u','));
    CHECK(view.rectifierPanel()->problem().isEmpty());
    CHECK(view.rectifierPanel()->results()->value("multiplier"));
}

TEST_CASE("the chart draws the engine's scale error curve beside the ideal-diode line") {
    Designer designer;
    designRectifier(designer.view, "bridge", "silicon", "0 °C", "5 V");
    mw::RectifierCircuit circuit;
    circuit.rectifier = mw::Rectifier::Bridge;
    circuit.movement_amps_fs = 50e-6;
    circuit.movement_ohms = 1200.0;
    const mw::RectifierMeter meter(circuit, mw::diodePreset(mw::DiodePreset::SmallSignalSilicon),
                                   0.0);
    const mw::ScaleErrorCurve curve = mw::rectifierScaleErrorCurve(meter, 5.0);
    const mw::gui::RectifierCurveChart* chart = designer.view.rectifierPanel()->chart();
    const QList<QPointF> diodes = chart->diodeSeries()->points();
    const QList<QPointF> ideal = chart->idealSeries()->points();
    REQUIRE(diodes.size() == qsizetype(curve.fractions.size()));
    REQUIRE(ideal.size() == qsizetype(curve.fractions.size()));
    for (std::size_t i = 0; i < curve.fractions.size(); ++i) {
        const auto at = qsizetype(i);
        CHECK(diodes[at].x() == 100.0 * curve.fractions[i]);
        CHECK(diodes[at].y() == curve.error_percent[i]);
        CHECK(ideal[at].y() == curve.ideal_error_percent[i]);
    }
    CHECK(chart->diodeSeries()->name().contains(QStringLiteral("silicon")));
}

TEST_CASE("use for this range saves an audited change to a draft instrument") {
    Designer designer;
    mw::storage::InstrumentRepository instruments(designer.workbook());
    mw::Instrument meter;
    meter.asset_tag = "CFM-601";
    meter.description = "AC voltmeter, 0-15 V, bridge rectifier";
    meter.serial = "NEW-0001";
    meter.kind = mw::InstrumentKind::BridgeAcVoltmeter;
    meter.movement = {50e-6, 1200.0};
    meter.accuracy_class = 2.5;
    mw::RangeSpec range;
    range.label = "15 V";
    range.full_scale = 15.0;
    range.nominal_ohms = 250e3;
    range.signal = mw::SignalType::Bridge;
    range.diode = mw::DiodePreset::SmallSignalSilicon;
    meter.ranges = {range};
    instruments.add(meter);
    emit designer.workspace().notifier()->registerChanged();

    QSignalSpy registerChanged(designer.workspace().notifier(),
                               &mw::gui::ChangeNotifier::registerChanged);
    QSignalSpy saved(&designer.view, &RangeDesignerView::resistorSaved);
    REQUIRE(designer.view.useBox()->choose(QStringLiteral("CFM-601"), QStringLiteral("15 V")));
    // Before its values are taken, the design (10 V DC) does not fit the range.
    CHECK_FALSE(designer.view.useBox()->useButton()->isEnabled());
    press(designer.view.findChild<QPushButton*>(QStringLiteral("use_take")));
    CHECK(designer.view.currentPanel() == designer.view.rectifierPanel());
    const double designed = *designer.view.rectifierPanel()->results()->value("multiplier");
    const std::size_t auditBefore = mw::storage::AuditRepository(designer.workbook())
                                        .entries(QStringLiteral("instrument_ranges"))
                                        .size();
    REQUIRE(designer.view.useBox()->useButton()->isEnabled());
    press(designer.view.useBox()->useButton());
    INFO(designer.view.useBox()->message().toStdString());
    CHECK(designer.view.useBox()->message().startsWith(QStringLiteral("✔")));
    const auto stored = instruments.findByTag(QStringLiteral("CFM-601"));
    REQUIRE(stored);
    CHECK(*stored->ranges[0].nominal_ohms == relative(designed, 1e-12));
    const auto audit = mw::storage::AuditRepository(designer.workbook())
                           .entries(QStringLiteral("instrument_ranges"));
    REQUIRE(audit.size() == auditBefore + 1);
    CHECK(audit.back().action == QStringLiteral("update"));
    CHECK(audit.back().row_id == stored->ranges[0].id);
    CHECK(audit.back().user_id == designer.workspace().user()->id);
    CHECK(registerChanged.count() == 1);
    REQUIRE(saved.count() == 1);
    CHECK(saved.at(0).at(0).toLongLong() == stored->id);
}

TEST_CASE("use for this range is refused for an approved meter and for a technician") {
    Designer designer;
    mw::storage::InstrumentRepository instruments(designer.workbook());
    const auto before = instruments.findByTag(QStringLiteral("CFM-101"));
    REQUIRE(before);
    REQUIRE(designer.view.useBox()->choose(QStringLiteral("CFM-101"),
                                           QString::fromStdString(before->ranges[0].label)));
    press(designer.view.findChild<QPushButton*>(QStringLiteral("use_take")));
    REQUIRE(designer.view.dcPanel()->results()->value("multiplier"));
    CHECK_FALSE(designer.view.useBox()->useButton()->isEnabled());
    CHECK_FALSE(designer.view.useBox()->use());
    CHECK(
        designer.view.useBox()->message().contains(QStringLiteral("approved calibration records")));
    CHECK(instruments.findByTag(QStringLiteral("CFM-101"))->ranges == before->ranges);

    REQUIRE(designer.window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech")));
    CHECK_FALSE(designer.view.useBox()->use());
    CHECK(designer.view.useBox()->message().contains(QStringLiteral("administrator")));
}

TEST_CASE("the window's Designer page is the designer, and the register follows a saved value") {
    mwtest::DemoWindow lab("morgan", "demo-admin");
    lab.window.showPage(mw::gui::MainWindow::Page::Designer);
    mw::gui::RangeDesignerView* view = lab.window.designer();
    REQUIRE(view != nullptr);
    CHECK(view->isVisibleTo(&lab.window));
    CHECK(lab.window.designer() == view); // built once
}
