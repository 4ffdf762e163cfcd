// Copying a designed multiplier or shunt into an instrument's range.
#include "app/gui/designer/range_use_box.h"

#include "app/gui/workspace.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"

#include <QComboBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QLabel>
#include <QPushButton>

#include <cmath>

namespace mw::gui {
namespace {

// Values typed and stored go through decimal text, so "the same" allows for the last digits.
bool same(double a, double b) {
    return std::fabs(a - b) <= 1e-9 * std::max(std::fabs(a), std::fabs(b));
}

QString signalWords(SignalType signal) {
    switch (signal) {
    case SignalType::Dc:
        return QObject::tr("DC");
    case SignalType::HalfWave:
        return QObject::tr("half-wave rectifier");
    case SignalType::Bridge:
        return QObject::tr("bridge rectifier");
    }
    return {};
}

QString movementWords(const Movement& movement) {
    return QObject::tr("%1, %2").arg(engineering(movement.amps_fs, Unit::Ampere, 4),
                                     engineering(movement.ohms_coil, Unit::Ohm, 4));
}

QString frozenReason(const Instrument& meter) {
    return QObject::tr("approved calibration records rest on %1, so its specification stays as "
                       "they recorded it; a meter rebuilt to a new design is registered as a new "
                       "instrument, and a record that was wrong is amended")
        .arg(QString::fromStdString(meter.asset_tag));
}

} // namespace

RangeUseBox::RangeUseBox(Workspace& workspace, QWidget* parent)
    : QGroupBox(tr("Use for this range"), parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("rangeUseBox"));
    auto* form = new QFormLayout(this);
    instrument_ = new QComboBox(this);
    instrument_->setObjectName(QStringLiteral("use_instrument"));
    instrument_->setMinimumContentsLength(28);
    instrument_->setSizeAdjustPolicy(QComboBox::AdjustToMinimumContentsLengthWithIcon);
    range_ = new QComboBox(this);
    range_->setObjectName(QStringLiteral("use_range"));
    form->addRow(tr("Instrument:"), instrument_);
    auto* rangeRow = new QHBoxLayout;
    rangeRow->addWidget(range_, 1);
    take_ = new QPushButton(tr("&Take its values"), this);
    take_->setObjectName(QStringLiteral("use_take"));
    take_->setToolTip(tr("Design with this instrument's movement and this range's full scale"));
    rangeRow->addWidget(take_);
    form->addRow(tr("Range:"), rangeRow);
    designedLine_ = new QLabel(this);
    designedLine_->setObjectName(QStringLiteral("use_designed"));
    designedLine_->setWordWrap(true);
    form->addRow(tr("Designed:"), designedLine_);
    use_ = new QPushButton(tr("&Use for this range"), this);
    use_->setObjectName(QStringLiteral("use_button"));
    form->addRow(QString(), use_);
    message_ = new QLabel(this);
    message_->setObjectName(QStringLiteral("use_message"));
    message_->setWordWrap(true);
    form->addRow(message_);
    connect(instrument_, &QComboBox::currentIndexChanged, this, [this] {
        savedNote_.clear();
        fillRanges();
        showState();
    });
    connect(range_, &QComboBox::currentIndexChanged, this, [this] {
        savedNote_.clear();
        showState();
    });
    connect(use_, &QPushButton::clicked, this, &RangeUseBox::use);
    connect(take_, &QPushButton::clicked, this, [this] {
        if (instrument() != nullptr && range() != nullptr) {
            emit rangeTaken(*instrument(), *range());
        }
    });
    reload();
}

void RangeUseBox::reload() {
    const QString tag = instrument_->currentData().toString();
    const QString label = range_->currentData().toString();
    instruments_.clear();
    if (workspace_.isOpen()) {
        try {
            instruments_ = storage::InstrumentRepository(*workspace_.workbook()).all();
        } catch (const std::exception& error) {
            message_->setText(
                tr("✖ The register cannot be read: %1").arg(QString::fromUtf8(error.what())));
        }
    }
    {
        const QSignalBlocker quiet(instrument_);
        instrument_->clear();
        for (const Instrument& meter : instruments_) {
            const QString id = QString::fromStdString(meter.asset_tag);
            instrument_->addItem(
                QStringLiteral("%1 — %2").arg(id, QString::fromStdString(meter.description)), id);
        }
        instrument_->setCurrentIndex(std::max(0, instrument_->findData(tag)));
    }
    fillRanges();
    {
        const QSignalBlocker quiet(range_); // the same choice, read again: not a new one
        range_->setCurrentIndex(std::max(0, range_->findData(label)));
    }
    showState();
}

bool RangeUseBox::choose(const QString& assetTag, const QString& rangeLabel) {
    const int meter = instrument_->findData(assetTag);
    if (meter < 0) {
        return false;
    }
    instrument_->setCurrentIndex(meter);
    const int row = range_->findData(rangeLabel);
    if (row < 0) {
        return false;
    }
    range_->setCurrentIndex(row);
    return true;
}

void RangeUseBox::fillRanges() {
    const QSignalBlocker quiet(range_);
    range_->clear();
    frozen_ = false;
    if (const Instrument* meter = instrument()) {
        try {
            frozen_ =
                storage::SessionRepository(*workspace_.workbook()).hasApprovedRecords(meter->id);
        } catch (const std::exception&) {
            frozen_ = false; // asked again, with the reason, when the value is saved
        }
        for (const RangeSpec& r : meter->ranges) {
            const QString label = QString::fromStdString(r.label);
            range_->addItem(
                r.nominal_ohms
                    ? tr("%1 (now %2)").arg(label, engineering(*r.nominal_ohms, Unit::Ohm))
                    : tr("%1 (bare movement)").arg(label),
                label);
        }
    }
}

const Instrument* RangeUseBox::instrument() const {
    const int index = instrument_->currentIndex();
    return index >= 0 && index < int(instruments_.size()) ? &instruments_[std::size_t(index)]
                                                          : nullptr;
}

const RangeSpec* RangeUseBox::range() const {
    const Instrument* meter = instrument();
    const int index = range_->currentIndex();
    return meter != nullptr && index >= 0 && index < int(meter->ranges.size())
               ? &meter->ranges[std::size_t(index)]
               : nullptr;
}

void RangeUseBox::setDesigned(std::optional<DesignedValue> designed) {
    if (!designed || !designed_ || designed->ohms != designed_->ohms) {
        savedNote_.clear();
    }
    designed_ = std::move(designed);
    showState();
}

QString RangeUseBox::refusal() const {
    if (!workspace_.can(Capability::Administer)) {
        return tr("only a signed-in administrator changes the register");
    }
    if (!designed_) {
        return tr("this panel has no multiplier or shunt designed");
    }
    const Instrument* meter = instrument();
    const RangeSpec* r = range();
    if (meter == nullptr || r == nullptr) {
        return tr("choose an instrument and one of its ranges");
    }
    if (frozen_) {
        return frozenReason(*meter);
    }
    if (designed_->unit != r->unit) {
        return designed_->isShunt ? tr("a shunt belongs in a current range, and %1 is a voltage "
                                       "range")
                                        .arg(QString::fromStdString(r->label))
                                  : tr("a multiplier belongs in a voltage range, and %1 is a "
                                       "current range")
                                        .arg(QString::fromStdString(r->label));
    }
    if (!same(designed_->full_scale, r->full_scale)) {
        return tr("it was designed for %1 full scale and the range reads %2 full scale")
            .arg(engineering(designed_->full_scale, r->unit, 4),
                 engineering(r->full_scale, r->unit, 4));
    }
    if (!same(designed_->movement.amps_fs, meter->movement.amps_fs) ||
        !same(designed_->movement.ohms_coil, meter->movement.ohms_coil)) {
        return tr("it was designed for a %1 movement and %2 has a %3 movement")
            .arg(movementWords(designed_->movement), QString::fromStdString(meter->asset_tag),
                 movementWords(meter->movement));
    }
    if (r->signal && *r->signal != designed_->signal) {
        return tr("it was designed for a %1 range and %2 is a %3 range")
            .arg(signalWords(designed_->signal), QString::fromStdString(r->label),
                 signalWords(*r->signal));
    }
    return {};
}

void RangeUseBox::showState() {
    designedLine_->setText(
        designed_ ? tr("%1 for %2").arg(engineering(designed_->ohms, Unit::Ohm, 6), designed_->what)
                  : tr("nothing on this panel"));
    const QString why = refusal();
    use_->setEnabled(why.isEmpty());
    use_->setToolTip(why);
    take_->setEnabled(range() != nullptr);
    message_->setText(why.isEmpty() ? savedNote_ : tr("⚠ Not available: %1.").arg(why));
}

bool RangeUseBox::use() {
    const QString why = refusal();
    if (!why.isEmpty()) {
        message_->setText(tr("✖ Not saved: %1.").arg(why));
        return false;
    }
    Instrument changed = *instrument();
    const std::size_t index = std::size_t(range_->currentIndex());
    try {
        storage::Workbook& workbook = *workspace_.workbook();
        // Checked again here: a record may have been approved since the meter was chosen.
        if (storage::SessionRepository(workbook).hasApprovedRecords(changed.id)) {
            frozen_ = true;
            message_->setText(tr("✖ Not saved: %1.").arg(frozenReason(changed)));
            return false;
        }
        const std::optional<double> before = changed.ranges[index].nominal_ohms;
        changed.ranges[index].nominal_ohms = designed_->ohms;
        storage::InstrumentRepository(workbook).update(changed);
        const QString label = QString::fromStdString(changed.ranges[index].label);
        const QString note =
            tr("✔ Saved: %1 in range %2 of %3 (was %4); the audit log keeps the change.")
                .arg(engineering(designed_->ohms, Unit::Ohm, 6), label,
                     QString::fromStdString(changed.asset_tag),
                     before ? engineering(*before, Unit::Ohm, 6) : tr("the bare movement"));
        const qint64 instrumentId = changed.id;
        const qint64 rangeId = changed.ranges[index].id;
        reload();
        savedNote_ = note; // stays while the same value and range are shown
        showState();
        emit saved(instrumentId, rangeId);
        return true;
    } catch (const std::exception& error) {
        message_->setText(tr("✖ Not saved: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

QString RangeUseBox::message() const {
    return message_->text();
}

} // namespace mw::gui
