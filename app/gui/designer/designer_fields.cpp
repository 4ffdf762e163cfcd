// Entries and result rows of the range designer.
#include "app/gui/designer/designer_fields.h"

#include "app/gui/status_icons.h"

#include <QAction>
#include <QFormLayout>
#include <QLabel>
#include <QLineEdit>
#include <QVBoxLayout>

namespace mw::gui {

QString engineering(double value, Unit unit, int digits) {
    return QString::fromStdString(formatEngineering(value, digits, unit));
}

QuantityField::QuantityField(const QString& name, Unit unit, const QString& text, QWidget* parent)
    : QWidget(parent)
    , line_(new QLineEdit(text, this))
    , reason_(new QLabel(this))
    , unit_(unit) {
    setObjectName(QStringLiteral("designer_") + name);
    line_->setObjectName(name);
    reason_->setObjectName(QStringLiteral("reason_") + name);
    reason_->setWordWrap(true);
    reason_->hide();
    mark_ = new QAction(warningIcon(palette()), QString(), this);
    auto* layout = new QVBoxLayout(this);
    layout->setContentsMargins(0, 0, 0, 0);
    layout->setSpacing(1);
    layout->addWidget(line_);
    layout->addWidget(reason_);
    connect(line_, &QLineEdit::textChanged, this, &QuantityField::edited);
}

QString QuantityField::text() const {
    return line_->text();
}

bool QuantityField::isEmpty() const {
    return line_->text().trimmed().isEmpty();
}

std::optional<double> QuantityField::value(bool optional) {
    clearMark();
    if (optional && isEmpty()) {
        return std::nullopt;
    }
    try {
        ParseOptions options;
        options.decimalComma = decimalComma_;
        return parseValue(line_->text().trimmed().toStdString(), unit_, options);
    } catch (const QuantityError& error) {
        refuse(QString::fromUtf8(error.what()));
        return std::nullopt;
    }
}

std::optional<std::vector<double>> QuantityField::values() {
    clearMark();
    const QString separators = decimalComma_ ? QStringLiteral(";") : QStringLiteral(";,");
    QStringList items;
    QString item;
    for (const QChar c : line_->text()) {
        if (separators.contains(c)) {
            items << item;
            item.clear();
        } else {
            item += c;
        }
    }
    items << item;
    std::vector<double> values;
    ParseOptions options;
    options.decimalComma = decimalComma_;
    for (int i = 0; i < items.size(); ++i) {
        try {
            values.push_back(parseValue(items[i].trimmed().toStdString(), unit_, options));
        } catch (const QuantityError& error) {
            refuse(tr("item %1 \"%2\": %3")
                       .arg(i + 1)
                       .arg(items[i].trimmed(), QString::fromUtf8(error.what())));
            return std::nullopt;
        }
    }
    return values;
}

void QuantityField::setValue(double value) {
    QString text = engineering(value, unit_, 6);
    if (decimalComma_) {
        text.replace(QLatin1Char('.'), QLatin1Char(','));
    }
    line_->setText(text);
}

void QuantityField::refuse(const QString& reason) {
    reason_->setText(tr("✖ %1").arg(reason));
    reason_->show();
    line_->setToolTip(reason);
    if (!line_->actions().contains(mark_)) {
        line_->addAction(mark_, QLineEdit::TrailingPosition);
    }
}

QString QuantityField::reason() const {
    return reason_->text();
}

void QuantityField::clearMark() {
    reason_->clear();
    reason_->hide();
    line_->setToolTip(QString());
    line_->removeAction(mark_);
}

ResultList::ResultList(QWidget* parent)
    : QWidget(parent)
    , form_(new QFormLayout(this)) {
    form_->setContentsMargins(0, 0, 0, 0);
}

void ResultList::addRow(const char* key, const QString& label) {
    auto* value = new QLabel(QStringLiteral("—"), this);
    value->setObjectName(QStringLiteral("result_") + QLatin1String(key));
    value->setTextInteractionFlags(Qt::TextSelectableByMouse);
    value->setWordWrap(true);
    form_->addRow(label, value);
    values_[key] = value;
}

void ResultList::set(const char* key, double value, Unit unit, int digits) {
    QLabel* label = values_.at(key);
    label->setText(engineering(value, unit, digits));
    label->setProperty("value", value);
}

void ResultList::setText(const char* key, const QString& text) {
    QLabel* label = values_.at(key);
    label->setText(text);
    label->setProperty("value", QVariant());
}

void ResultList::set(const char* key, double value, const QString& text) {
    QLabel* label = values_.at(key);
    label->setText(text);
    label->setProperty("value", value);
}

void ResultList::clear() {
    for (auto& [key, label] : values_) {
        label->setText(QStringLiteral("—"));
        label->setProperty("value", QVariant());
    }
}

std::optional<double> ResultList::value(const char* key) const {
    const QVariant value = values_.at(key)->property("value");
    return value.isValid() ? std::optional<double>(value.toDouble()) : std::nullopt;
}

QString ResultList::text(const char* key) const {
    return values_.at(key)->text();
}

} // namespace mw::gui
