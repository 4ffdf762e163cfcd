// The audit log: every write to a record table leaves who, when, what, old and new values.
#include "storage/audit_repository.h"

#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QJsonDocument>
#include <QJsonObject>

using mw::storage::AuditRepository;

TEST_CASE("every write is audited with its user and values", "[audit]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    AuditRepository audit(*workbook);
    // Seeding: 3 users, 1 instrument + 2 ranges, 1 standard + 1 spec row.
    CHECK(audit.count() == 8);
    const auto users = audit.entries(QStringLiteral("users"));
    REQUIRE(users.size() == 3);
    CHECK(users[0].action == QStringLiteral("insert"));
    CHECK(users[0].newValues.isEmpty()); // the row itself holds what was inserted
    mw::storage::UserRepository(*workbook).setPassword(seed.technician.id, QStringLiteral("n"));
    const auto change = audit.entries(QStringLiteral("users"), seed.technician.id);
    REQUIRE(change.size() == 2);
    CHECK(change[1].newValues.contains(QStringLiteral("\"login\":\"tess\"")));
    CHECK_FALSE(change[1].oldValues.contains(QStringLiteral("argon2"))); // never the hash
    CHECK_FALSE(change[1].newValues.contains(QStringLiteral("argon2")));
    CHECK(QDateTime::fromString(users[0].at, Qt::ISODateWithMs).isValid());

    workbook->setActor(seed.technician.id);
    mw::storage::SessionRepository sessions(*workbook);
    mw::CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    mw::Reading changed = session.readings[4];
    changed.indicated = 6.5;
    sessions.putReading(session.id, changed);
    const auto readings = audit.entries(QStringLiteral("readings"));
    REQUIRE(readings.size() == session.readings.size() + 1);
    const auto& update = readings.back();
    CHECK(update.action == QStringLiteral("update"));
    CHECK(update.user_id == seed.technician.id);
    const QJsonObject before = QJsonDocument::fromJson(update.oldValues.toUtf8()).object();
    const QJsonObject after = QJsonDocument::fromJson(update.newValues.toUtf8()).object();
    CHECK(before.value(QStringLiteral("indicated")).toDouble() == *session.readings[4].indicated);
    CHECK(after.value(QStringLiteral("indicated")).toDouble() == 6.5);
    // A reading has no id of its own: its entries are filed under its session.
    CHECK(update.row_id == session.id);
    CHECK(audit.entries(QStringLiteral("readings"), session.id).size() ==
          session.readings.size() + 1);
    CHECK(before.value(QStringLiteral("point_index")).toInt() == changed.point_index);
    CHECK(before.value(QStringLiteral("direction")).toString() == QStringLiteral("up"));

    workbook->setActor(seed.reviewer.id);
    sessions.submit(session.id, mwtest::at(2025, 3, 5));
    mw::CalibrationSession extra = mwtest::draft(seed);
    sessions.create(extra);
    sessions.removeDraft(extra.id);
    const auto deletes = audit.entries(QStringLiteral("calibration_sessions"));
    REQUIRE(deletes.size() == 4); // create, submit, create, delete
    CHECK(deletes[1].action == QStringLiteral("update"));
    CHECK(deletes[1].user_id == seed.reviewer.id);
    CHECK(deletes[3].action == QStringLiteral("delete"));
    CHECK(deletes[3].newValues.isEmpty());
}
