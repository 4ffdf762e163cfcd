// Two fields for choosing a password (typed twice, never shown) with the reason beside them
// while it cannot be accepted; shared by every dialog that sets one.
#pragma once

#include <QWidget>

class QFormLayout;
class QLabel;
class QLineEdit;

namespace mw::gui {

class PasswordFields : public QObject {
    Q_OBJECT
public:
    // Adds the two rows (and the reason line) to `form`.
    PasswordFields(QFormLayout* form, QWidget* parent);

    QString password() const;
    // Empty when the password may be chosen; else why not.
    QString problem() const;
    void clear();
    QLineEdit* first() const { return first_; }
    QLineEdit* second() const { return second_; }

signals:
    void changed();

private:
    void update();

    QLineEdit* first_ = nullptr;
    QLineEdit* second_ = nullptr;
    QLabel* reason_ = nullptr;
};

} // namespace mw::gui
