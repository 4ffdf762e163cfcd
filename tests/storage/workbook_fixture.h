// Shared fixture for storage tests: a workbook in a temporary folder, a few invented records
// (users, an instrument, a standard) and raw SQL on the file behind the repositories' back.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"
#include "core/model/user.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"

#include <QCryptographicHash>
#include <QFile>
#include <QSqlDatabase>
#include <QSqlError>
#include <QSqlQuery>
#include <QTemporaryDir>

#include <chrono>
#include <map>
#include <memory>

namespace mwtest {

using namespace std::chrono;

// A UTC timestamp from a calendar date and an hour (invented dates for demo records).
inline mw::Timestamp at(int y, unsigned m, unsigned d, int hour = 9) {
    return mw::Timestamp{sys_days{year{y} / month{m} / day{d}}} + hours{hour};
}

inline sys_days date(int y, unsigned m, unsigned d) {
    return sys_days{year{y} / month{m} / day{d}};
}

struct TempWorkbook {
    QTemporaryDir dir;
    QString path() const { return dir.filePath(QStringLiteral("lab.mwb")); }
    std::unique_ptr<mw::storage::Workbook> open(mw::storage::OpenOptions options = {}) const {
        options.createIfMissing = true;
        return std::make_unique<mw::storage::Workbook>(path(), options);
    }
};

// Runs one statement on its own connection, like someone using the sqlite3 shell. Returns
// SQLite's error text, empty on success.
inline QString rawExec(const QString& path, const QString& statement) {
    static int counter = 0;
    const QString name = QStringLiteral("raw-%1").arg(++counter);
    QString error;
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        if (!db.open()) {
            error = db.lastError().text();
        } else {
            QSqlQuery(db).exec(QStringLiteral("PRAGMA foreign_keys = ON"));
            QSqlQuery query(db);
            if (!query.exec(statement)) {
                error = query.lastError().databaseText();
                if (error.isEmpty()) {
                    error = query.lastError().text();
                }
            }
        }
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
    return error;
}

// The first column of every row a query on the file gives, as text (read on its own connection).
inline QStringList rawValues(const QString& path, const char* query) {
    static int counter = 0;
    const QString name = QStringLiteral("raw-values-%1").arg(++counter);
    QStringList values;
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        if (db.open()) {
            QSqlQuery q(db);
            q.exec(QString::fromUtf8(query));
            while (q.next()) {
                values << q.value(0).toString();
            }
        }
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
    return values;
}

// Drops every trigger, as a person editing the file with the sqlite3 shell could.
inline void dropAllTriggers(const QString& path) {
    const QString name = QStringLiteral("raw-drop");
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        db.open();
        QSqlQuery list(db);
        list.exec(QStringLiteral("SELECT name FROM sqlite_master WHERE type = 'trigger'"));
        QStringList names;
        while (list.next()) {
            names << list.value(0).toString();
        }
        list.finish();
        for (const QString& trigger : names) {
            QSqlQuery(db).exec(QStringLiteral("DROP TRIGGER %1").arg(trigger));
        }
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
}

inline QByteArray fileHash(const QString& path) {
    QFile file(path);
    file.open(QIODevice::ReadOnly);
    return QCryptographicHash::hash(file.readAll(), QCryptographicHash::Sha256);
}

struct Seed {
    mw::User technician;
    mw::User reviewer;
    mw::User admin;
    mw::Instrument instrument;
    mw::ReferenceStandard standard;
};

inline mw::Instrument demoInstrument(const std::string& tag = "VM-001") {
    mw::Instrument i;
    i.asset_tag = tag;
    i.description = "Panel voltmeter, two ranges";
    i.manufacturer = "Invented Instruments";
    i.model = "PV-2";
    i.serial = "S/N 4711";
    i.kind = mw::InstrumentKind::MultiRange;
    i.movement = mw::Movement{50e-6, 1200.0};
    i.ranges = {
        {0, "10 V", mw::Unit::Volt, 0.0, 10.0, 198800.0, std::nullopt, mw::SignalType::Dc,
         std::nullopt},
        {0, "1 mA", mw::Unit::Ampere, 0.0, 1e-3, 63.157894736842, 1e-3, mw::SignalType::Dc,
         std::nullopt},
    };
    i.scale_type = mw::ScaleType::ZeroAtEnd;
    i.scale_divisions = 50;
    i.accuracy_class = 1.5;
    i.interval_days = 365;
    i.location = "Bench 2";
    i.owner = "Workshop";
    i.status = mw::InstrumentStatus::InService;
    return i;
}

inline Seed seed(mw::storage::Workbook& workbook) {
    Seed s;
    mw::storage::UserRepository users(workbook);
    s.technician = {0, "tess", "Tess Bench", mw::Role::Technician, true};
    s.reviewer = {0, "rory", "Rory Review", mw::Role::Reviewer, true};
    s.admin = {0, "ada", "Ada Admin", mw::Role::Administrator, true};
    users.add(s.technician, QStringLiteral("tess-pass"));
    users.add(s.reviewer, QStringLiteral("rory-pass"));
    users.add(s.admin, QStringLiteral("ada-pass"));
    s.instrument = demoInstrument();
    mw::storage::InstrumentRepository(workbook).add(s.instrument);
    s.standard.asset_tag = "STD-01";
    s.standard.description = "Multifunction calibrator";
    s.standard.certificate_number = "CERT-2024-117";
    s.standard.due_date = date(2025, 6, 30);
    s.standard.specs = {{"20 V DC", mw::Unit::Volt, 20.0, 0.005, 0.001, 2e-5, std::nullopt, 2.0,
                         std::nullopt, mw::SignalKind::Dc}};
    mw::storage::StandardRepository(workbook).add(s.standard);
    return s;
}

// A draft of the seeded instrument with a few readings, a resistor check and a note.
inline mw::CalibrationSession draft(const Seed& s, mw::Timestamp started = at(2025, 3, 4)) {
    mw::CalibrationSession c;
    c.instrument_id = s.instrument.id;
    c.technician_id = s.technician.id;
    c.started_at = started;
    c.finished_at = started + hours{2};
    c.environment = {23.4, 45.0};
    c.method = "Comparison with calibrator, 5 points up and down";
    c.standards = {{s.standard.id, "", {}, ""}};
    c.decision_rule = mw::DecisionRule::GuardedAcceptance;
    c.guard_factor = 1.0;
    const std::int64_t volts = s.instrument.ranges[0].id;
    for (int point = 0; point < 5; ++point) {
        const double applied = 2.0 * (point + 1);
        c.readings.push_back({volts, point, mw::Direction::Up, mw::Phase::AsFound, 1,
                              mw::Unit::Volt, applied, applied + 0.05});
        c.readings.push_back({volts, point, mw::Direction::Down, mw::Phase::AsFound, 1,
                              mw::Unit::Volt, applied, applied - 0.03});
    }
    c.resistor_checks = {{0, volts, "R1 multiplier", 198800.0, 198650.0, 0.1}};
    c.adjustments = {{0, started + hours{1}, "Zero set with the mechanical adjuster"}};
    return c;
}

// The approval key of user `userId`, opened with `password` (issued at its first use). Kept per
// workbook file and user, since each opening costs an Argon2id derivation; a kept key no
// longer in use in that file (retired, or another file at the same path) is opened again.
inline const mw::storage::ApprovalSigner& signer(mw::storage::Workbook& workbook,
                                                 std::int64_t userId, const QString& password) {
    static std::map<std::pair<QString, std::int64_t>, mw::storage::ApprovalSigner> opened;
    const auto key = std::make_pair(workbook.path(), userId);
    const auto found = opened.find(key);
    if (found != opened.end()) {
        QSqlQuery q(workbook.database());
        q.prepare(QStringLiteral("SELECT public_key FROM signing_keys WHERE id = ? AND retired_at "
                                 "IS NULL"));
        q.addBindValue(qint64(found->second.keyId));
        if (q.exec() && q.next() && q.value(0).toByteArray() == found->second.publicKey) {
            return found->second;
        }
        opened.erase(found);
    }
    auto signer = mw::storage::unlockApprovalKey(workbook, userId, password, at(2000, 1, 1));
    return opened.emplace(key, std::move(signer)).first->second;
}

// The approval key of a user made by seed(), whose password is their login and "-pass".
inline const mw::storage::ApprovalSigner& signer(mw::storage::Workbook& workbook,
                                                 const mw::User& user) {
    return signer(workbook, user.id, QString::fromStdString(user.login) + QStringLiteral("-pass"));
}

} // namespace mwtest
