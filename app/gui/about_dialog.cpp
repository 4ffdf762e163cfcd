// About box: version, purpose and the safety notice.
#include "app/gui/about_dialog.h"

#include "app/gui/safety_notice.h"

#include <QDialogButtonBox>
#include <QGroupBox>
#include <QIcon>
#include <QLabel>
#include <QVBoxLayout>

namespace mw::gui {

AboutDialog::AboutDialog(QWidget* parent)
    : QDialog(parent) {
    setWindowTitle(tr("About Meterwright"));
    setObjectName(QStringLiteral("aboutDialog"));

    auto* layout = new QVBoxLayout(this);
    auto* heading = new QLabel(
        tr("<h2>Meterwright %1</h2>"
           "<p>Calibration workbook for analog moving-coil instruments: multiplier and shunt "
           "design, as-found and as-left readings, conformity with uncertainty and a stated "
           "decision rule, review, records and history.</p>")
            .arg(QStringLiteral(MW_VERSION)),
        this);
    heading->setWordWrap(true);
    heading->setObjectName(QStringLiteral("aboutHeading"));
    layout->addWidget(heading);

    auto* safetyBox = new QGroupBox(safetyNoticeTitle(), this);
    auto* safetyLayout = new QHBoxLayout(safetyBox);
    auto* safetyIcon = new QLabel(safetyBox);
    safetyIcon->setPixmap(QIcon(QStringLiteral(":/icons/caution.svg")).pixmap(40, 40));
    safetyIcon->setAlignment(Qt::AlignTop);
    auto* safetyText = new QLabel(safetyNoticeText(), safetyBox);
    safetyText->setWordWrap(true);
    safetyText->setObjectName(QStringLiteral("aboutSafetyText"));
    safetyLayout->addWidget(safetyIcon);
    safetyLayout->addWidget(safetyText, 1);
    layout->addWidget(safetyBox);

    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Close, this);
    connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
    layout->addWidget(buttons);
    resize(520, 360);
}

} // namespace mw::gui
