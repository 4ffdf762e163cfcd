// About box: version, what the program is for, and the safety notice.
#pragma once

#include <QDialog>

namespace mw::gui {

class AboutDialog : public QDialog {
    Q_OBJECT
public:
    explicit AboutDialog(QWidget* parent = nullptr);
};

} // namespace mw::gui
