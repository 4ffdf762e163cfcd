// The register's filter and sort: text (tag, description, location, kind), kind, location, due
// state and last outcome; columns sort by what they mean (dates as dates, outcomes worst first).
#pragma once

#include <QSortFilterProxyModel>

#include <optional>

namespace mw::gui {

class RegisterFilter : public QSortFilterProxyModel {
    Q_OBJECT
public:
    // What the due filter can ask for; NeedsAttention is overdue or never calibrated.
    enum class DueChoice { Any, NeedsAttention, DueSoon, InDate, Retired };

    explicit RegisterFilter(QObject* parent = nullptr);

    void setText(const QString& text);
    void setKind(std::optional<int> kind);
    void setLocation(const QString& location); // empty: any
    void setDue(DueChoice due);
    // nullopt: any; -1: never approved; else an Outcome value.
    void setOutcome(std::optional<int> outcome);

protected:
    bool filterAcceptsRow(int sourceRow, const QModelIndex& sourceParent) const override;

private:
    QString text_;
    std::optional<int> kind_;
    QString location_;
    DueChoice due_ = DueChoice::Any;
    std::optional<int> outcome_;
};

} // namespace mw::gui
