// Waveform, coil temperature and preferred-value panels of the range designer.
#include "app/gui/designer/component_panels.h"

#include "core/circuits/coil_temperature.h"
#include "core/circuits/eseries.h"
#include "core/circuits/waveform.h"

#include <QComboBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QVBoxLayout>

#include <stdexcept>

namespace mw::gui {
namespace {

// Entries on the left, results and the status line on the right.
QFormLayout* columns(DesignerPanel* panel, const QString& title, ResultList* results,
                     QLabel* status) {
    auto* layout = new QHBoxLayout(panel);
    auto* entries = new QGroupBox(title, panel);
    auto* form = new QFormLayout(entries);
    layout->addWidget(entries, 1);
    auto* shown = new QGroupBox(QObject::tr("Results"), panel);
    auto* right = new QVBoxLayout(shown);
    right->addWidget(results);
    right->addWidget(status);
    right->addStretch();
    layout->addWidget(shown, 1);
    return form;
}

} // namespace

WaveformPanel::WaveformPanel(QWidget* parent)
    : DesignerPanel(nullptr, parent) {
    setObjectName(QStringLiteral("waveformPanel"));
    results_ = new ResultList(this);
    QFormLayout* form = columns(this,
                                tr("Waveform on an average-responding meter scaled in rms "
                                   "of a sine"),
                                results_, statusLine());
    shape_ = new QComboBox(this);
    shape_->setObjectName(QStringLiteral("waveform_shape"));
    shape_->addItem(tr("square"), int(WaveShape::Square));
    shape_->addItem(tr("triangle"), int(WaveShape::Triangle));
    shape_->addItem(tr("sine"), int(WaveShape::Sine));
    shape_->addItem(tr("sampled (one period)"), int(WaveShape::Sampled));
    form->addRow(tr("Shape:"), shape_);
    rectification_ = new QComboBox(this);
    rectification_->setObjectName(QStringLiteral("waveform_rectifier"));
    rectification_->addItem(tr("bridge (full-wave)"), int(Rectification::FullWave));
    rectification_->addItem(tr("half-wave"), int(Rectification::HalfWave));
    form->addRow(tr("Meter's rectifier:"), rectification_);
    rms_ = addField(form, QStringLiteral("waveform_rms"), tr("True rms:"), Unit::Volt,
                    QStringLiteral("1 V"));
    samples_ = addField(form, QStringLiteral("waveform_samples"), tr("Samples (separated by ;):"),
                        Unit::Volt, QStringLiteral("0; 0.7; 1; 0.7; 0; -0.7; -1; -0.7"));
    results_->addRow("rms", tr("True rms:"));
    results_->addRow("average", tr("Rectified average:"));
    results_->addRow("form_factor", tr("Form factor:"));
    results_->addRow("reading", tr("The meter reads:"));
    results_->addRow("error", tr("Error of the reading:"));
    for (QComboBox* box : {shape_, rectification_}) {
        connect(box, &QComboBox::currentIndexChanged, this, &WaveformPanel::recompute);
    }
}

void WaveformPanel::recompute() {
    const auto shape = WaveShape(shape_->currentData().toInt());
    const bool sampled = shape == WaveShape::Sampled;
    rms_->setEnabled(!sampled);
    samples_->setEnabled(sampled);
    std::optional<Waveform> wave;
    if (sampled) {
        if (const auto samples = samples_->values()) {
            if (samples->size() < 2) {
                samples_->refuse(tr("one period needs at least 2 samples"));
            } else {
                wave = Waveform::sampled(*samples);
            }
        }
    } else if (const auto rms = rms_->value()) {
        if (*rms <= 0.0) {
            rms_->refuse(tr("the rms value must be above 0 V"));
        } else {
            wave = Waveform::withRms(shape, *rms);
        }
    }
    if (!wave || !(wave->rectifiedAverage() > 0.0)) {
        if (wave) {
            samples_->refuse(tr("the samples are all zero"));
        }
        noResult(results_);
        return;
    }
    const AverageRespondingReading reading =
        averageRespondingReading(*wave, Rectification(rectification_->currentData().toInt()));
    results_->set("rms", wave->rms(), Unit::Volt);
    results_->set("average", wave->rectifiedAverage(), Unit::Volt);
    results_->set("form_factor", wave->formFactor(),
                  QString::fromStdString(formatPlain(wave->formFactor())));
    results_->set("reading", reading.indicated_volts, Unit::Volt);
    results_->set("error", reading.error_percent, Unit::Percent, 3);
    finish(QString());
}

CoilTemperaturePanel::CoilTemperaturePanel(QWidget* parent)
    : DesignerPanel(nullptr, parent) {
    setObjectName(QStringLiteral("coilTemperaturePanel"));
    results_ = new ResultList(this);
    QFormLayout* form =
        columns(this, tr("Copper coil (IEC 60028: 0.00393 /K at 20 °C) and swamping resistor"),
                results_, statusLine());
    coil_ = addField(form, QStringLiteral("coil_ohms"), tr("Coil resistance measured:"), Unit::Ohm,
                     QStringLiteral("2k"));
    coilAt_ = addField(form, QStringLiteral("coil_at"), tr("… at:"), Unit::DegreeCelsius,
                       QStringLiteral("20 °C"));
    reference_ = addField(form, QStringLiteral("coil_reference"), tr("Adjusted at:"),
                          Unit::DegreeCelsius, QStringLiteral("23 °C"));
    working_ = addField(form, QStringLiteral("coil_working"), tr("Working temperature:"),
                        Unit::DegreeCelsius, QStringLiteral("40 °C"));
    series_ = addField(form, QStringLiteral("coil_series"), tr("Low-tempco resistance in series:"),
                       Unit::Ohm, QStringLiteral("0"));
    target_ = addField(form, QStringLiteral("swamp_target"), tr("Largest span error allowed:"),
                       Unit::Percent, QStringLiteral("0.5 %"));
    from_ = addField(form, QStringLiteral("swamp_from"), tr("Working range from:"),
                     Unit::DegreeCelsius, QStringLiteral("10 °C"));
    to_ = addField(form, QStringLiteral("swamp_to"), tr("… to:"), Unit::DegreeCelsius,
                   QStringLiteral("40 °C"));
    swampTempco_ = addField(form, QStringLiteral("swamp_tempco"), tr("Swamping resistor's tempco:"),
                            Unit::PerKelvin, QStringLiteral("15 ppm/K"));
    results_->addRow("coil_20", tr("Coil at 20 °C:"));
    results_->addRow("coil_working", tr("Coil at the working temperature:"));
    results_->addRow("span_error", tr("Span error there:"));
    results_->addRow("swamp", tr("Swamping resistor needed:"));
}

void CoilTemperaturePanel::recompute() {
    std::vector<std::optional<double>> read;
    for (QuantityField* field :
         {coil_, coilAt_, reference_, working_, series_, target_, from_, to_, swampTempco_}) {
        read.push_back(field->value());
    }
    for (const auto& value : read) {
        if (!value) {
            noResult(results_);
            return;
        }
    }
    QuantityField* blamed = coilAt_;
    try {
        const double ohms20 = copperResistanceAt20_ohm(*read[0], *read[1]);
        blamed = working_;
        CoilCircuit circuit;
        circuit.ohms_coil_20C = ohms20;
        circuit.series = {*read[4], 0.0};
        const double error = spanError(circuit, *read[3], *read[2]);
        results_->set("coil_20", ohms20, Unit::Ohm);
        results_->set("coil_working", copperResistance_ohm(ohms20, *read[3]), Unit::Ohm);
        results_->set("span_error", 100.0 * error,
                      tr("%1 against %2")
                          .arg(engineering(100.0 * error, Unit::Percent, 3),
                               engineering(*read[2], Unit::DegreeCelsius, 3)));
        blamed = target_;
        SwampRequest request;
        request.ohms_coil_20C = ohms20;
        request.celsius_ref = *read[2];
        request.celsius_min = *read[6];
        request.celsius_max = *read[7];
        request.error_limit_fraction = *read[5] / 100.0;
        request.swamp_tempco_per_K = *read[8];
        const SwampDesign design = designSwamp(request);
        results_->set("swamp", design.ohms_swamp_20C,
                      tr("%1 (worst %2 at %3)")
                          .arg(engineering(design.ohms_swamp_20C, Unit::Ohm),
                               engineering(100.0 * design.worst_error_fraction, Unit::Percent, 3),
                               engineering(design.celsius_worst, Unit::DegreeCelsius, 3)));
        finish(QString());
    } catch (const std::exception& error) {
        noResult(results_, blamed, QString::fromUtf8(error.what()));
    }
}

ESeriesPanel::ESeriesPanel(QWidget* parent)
    : DesignerPanel(nullptr, parent) {
    setObjectName(QStringLiteral("eseriesPanel"));
    results_ = new ResultList(this);
    QFormLayout* form = columns(this, tr("Preferred value (IEC 60063), trim and dissipation"),
                                results_, statusLine());
    ohms_ = addField(form, QStringLiteral("eseries_value"), tr("Computed resistance:"), Unit::Ohm,
                     QStringLiteral("198k"));
    series_ = new QComboBox(this);
    series_->setObjectName(QStringLiteral("eseries_series"));
    for (ESeries s :
         {ESeries::E6, ESeries::E12, ESeries::E24, ESeries::E48, ESeries::E96, ESeries::E192}) {
        series_->addItem(QString::fromUtf8(toText(s).data()), int(s));
    }
    series_->setCurrentIndex(series_->findData(int(ESeries::E96)));
    form->addRow(tr("Series:"), series_);
    amps_ = addField(form, QStringLiteral("eseries_current"), tr("Current at full scale:"),
                     Unit::Ampere, QStringLiteral("50 µA"));
    rating_ = addField(form, QStringLiteral("eseries_rating"), tr("Power rating:"), Unit::Watt,
                       QStringLiteral("0.25 W"));
    voltageRating_ = addField(form, QStringLiteral("eseries_voltage_rating"),
                              tr("Working-voltage rating:"), Unit::Volt, QStringLiteral("250 V"));
    results_->addRow("not_above", tr("Nearest not above:"));
    results_->addRow("nearest", tr("Nearest:"));
    results_->addRow("trim", tr("Trim in series:"));
    results_->addRow("dissipation", tr("Dissipation:"));
    results_->addRow("voltage", tr("Voltage across it at 120 %:"));
    results_->addRow("rating", tr("Rating:"));
    connect(series_, &QComboBox::currentIndexChanged, this, &ESeriesPanel::recompute);
}

void ESeriesPanel::recompute() {
    const auto ohms = ohms_->value();
    const auto amps = amps_->value();
    const auto rating = rating_->value();
    const auto volts = voltageRating_->value();
    if (!ohms || !amps || !rating || !volts) {
        noResult(results_);
        return;
    }
    try {
        const auto series = ESeries(series_->currentData().toInt());
        const ResistorChoice choice = chooseResistor(*ohms, series);
        results_->set("not_above", choice.ohms_standard, Unit::Ohm, 3);
        results_->set("nearest", nearestStandard(*ohms, series), Unit::Ohm, 3);
        if (choice.trimPractical) {
            results_->set(
                "trim", choice.ohms_trim,
                tr("%1 (trimmer %2 covers the %3 tolerance)")
                    .arg(engineering(choice.ohms_trim, Unit::Ohm),
                         engineering(choice.ohms_trimmer, Unit::Ohm, 2),
                         engineering(100.0 * eseriesTolerance(series), Unit::Percent, 2)));
        } else {
            results_->setText("trim", QString::fromStdString(choice.trimNote));
        }
        const Dissipation heat = dissipation(*ohms, *amps, *rating, kTypicalDerating, *volts);
        results_->set("dissipation", heat.watts_fs,
                      tr("%1 at full scale, %2 at 120 %")
                          .arg(engineering(heat.watts_fs, Unit::Watt),
                               engineering(heat.watts_overrange, Unit::Watt)));
        results_->set("voltage", heat.volts_overrange, Unit::Volt);
        const auto caution = ratingCaution(heat, "the part");
        results_->setText("rating", caution ? ratingFlag(heat) + QStringLiteral(": ") +
                                                  QString::fromStdString(*caution)
                                            : ratingFlag(heat));
        finish(QString());
    } catch (const std::exception& error) {
        noResult(results_, ohms_, QString::fromUtf8(error.what()));
    }
}

} // namespace mw::gui
