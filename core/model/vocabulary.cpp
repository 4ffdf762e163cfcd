// Stable text forms of the shared enumerations.
#include "core/model/vocabulary.h"

#include <array>
#include <utility>

namespace mw {
namespace {

template <typename Enum, std::size_t N>
using Words = std::array<std::pair<Enum, std::string_view>, N>;

constexpr Words<InstrumentKind, 5> kInstrumentKinds{{
    {InstrumentKind::DcVoltmeter, "dc-voltmeter"},
    {InstrumentKind::DcAmmeter, "dc-ammeter"},
    {InstrumentKind::HalfWaveAcVoltmeter, "half-wave-ac-voltmeter"},
    {InstrumentKind::BridgeAcVoltmeter, "bridge-ac-voltmeter"},
    {InstrumentKind::MultiRange, "multi-range"},
}};
constexpr Words<ScaleType, 4> kScaleTypes{{
    {ScaleType::ZeroAtEnd, "zero-at-end"},
    {ScaleType::ZeroInside, "zero-inside"},
    {ScaleType::NoZero, "no-zero"},
    {ScaleType::NonLinear, "non-linear"},
}};
constexpr Words<SignalType, 3> kSignalTypes{{
    {SignalType::Dc, "dc"},
    {SignalType::HalfWave, "half-wave"},
    {SignalType::Bridge, "bridge"},
}};
constexpr Words<SignalKind, 2> kSignalKinds{{{SignalKind::Dc, "dc"}, {SignalKind::Ac, "ac"}}};
constexpr Words<Direction, 2> kDirections{{{Direction::Up, "up"}, {Direction::Down, "down"}}};
constexpr Words<Phase, 2> kPhases{{{Phase::AsFound, "as-found"}, {Phase::AsLeft, "as-left"}}};
constexpr Words<PhasePlan, 3> kPhasePlans{{
    {PhasePlan::AsFound, "as-found"},
    {PhasePlan::AsLeft, "as-left"},
    {PhasePlan::AsFoundAndAsLeft, "both"},
}};
constexpr Words<SessionState, 5> kSessionStates{{
    {SessionState::Draft, "draft"},
    {SessionState::Submitted, "submitted"},
    {SessionState::Returned, "returned"},
    {SessionState::Approved, "approved"},
    {SessionState::Superseded, "superseded"},
}};
constexpr Words<Role, 3> kRoles{{
    {Role::Technician, "technician"},
    {Role::Reviewer, "reviewer"},
    {Role::Administrator, "administrator"},
}};
constexpr Words<InstrumentStatus, 3> kStatuses{{
    {InstrumentStatus::InService, "in-service"},
    {InstrumentStatus::OutOfService, "out-of-service"},
    {InstrumentStatus::Retired, "retired"},
}};
constexpr Words<DecisionRule, 3> kRules{{
    {DecisionRule::SimpleAcceptance, "simple"},
    {DecisionRule::GuardedAcceptance, "guarded"},
    {DecisionRule::GuardedBinary, "guarded-binary"},
}};
constexpr Words<Outcome, 4> kOutcomes{{
    {Outcome::Pass, "pass"},
    {Outcome::ConditionalPass, "conditional-pass"},
    {Outcome::ConditionalFail, "conditional-fail"},
    {Outcome::Fail, "fail"},
}};

template <typename Enum, std::size_t N>
std::string_view lookup(const Words<Enum, N>& words, Enum value) {
    for (const auto& [candidate, text] : words) {
        if (candidate == value) {
            return text;
        }
    }
    return "?";
}

template <typename Enum, std::size_t N>
std::optional<Enum> reverseLookup(const Words<Enum, N>& words, std::string_view text) {
    for (const auto& [candidate, word] : words) {
        if (word == text) {
            return candidate;
        }
    }
    return std::nullopt;
}

} // namespace

std::string_view toText(InstrumentKind value) {
    return lookup(kInstrumentKinds, value);
}
std::string_view toText(ScaleType value) {
    return lookup(kScaleTypes, value);
}
std::string_view toText(SignalType value) {
    return lookup(kSignalTypes, value);
}
std::string_view toText(SignalKind value) {
    return lookup(kSignalKinds, value);
}
std::string_view toText(Direction value) {
    return lookup(kDirections, value);
}
std::string_view toText(Phase value) {
    return lookup(kPhases, value);
}
std::string_view toText(PhasePlan value) {
    return lookup(kPhasePlans, value);
}
std::string_view toText(SessionState value) {
    return lookup(kSessionStates, value);
}
std::string_view toText(Role value) {
    return lookup(kRoles, value);
}
std::string_view toText(InstrumentStatus value) {
    return lookup(kStatuses, value);
}
std::string_view toText(DecisionRule value) {
    return lookup(kRules, value);
}
std::string_view toText(Outcome value) {
    return lookup(kOutcomes, value);
}

template <>
std::optional<InstrumentKind> fromText(std::string_view text) {
    return reverseLookup(kInstrumentKinds, text);
}
template <>
std::optional<ScaleType> fromText(std::string_view text) {
    return reverseLookup(kScaleTypes, text);
}
template <>
std::optional<SignalType> fromText(std::string_view text) {
    return reverseLookup(kSignalTypes, text);
}
template <>
std::optional<SignalKind> fromText(std::string_view text) {
    return reverseLookup(kSignalKinds, text);
}
template <>
std::optional<Direction> fromText(std::string_view text) {
    return reverseLookup(kDirections, text);
}
template <>
std::optional<Phase> fromText(std::string_view text) {
    return reverseLookup(kPhases, text);
}
template <>
std::optional<PhasePlan> fromText(std::string_view text) {
    return reverseLookup(kPhasePlans, text);
}
template <>
std::optional<SessionState> fromText(std::string_view text) {
    return reverseLookup(kSessionStates, text);
}
template <>
std::optional<Role> fromText(std::string_view text) {
    return reverseLookup(kRoles, text);
}
template <>
std::optional<InstrumentStatus> fromText(std::string_view text) {
    return reverseLookup(kStatuses, text);
}
template <>
std::optional<DecisionRule> fromText(std::string_view text) {
    return reverseLookup(kRules, text);
}
template <>
std::optional<Outcome> fromText(std::string_view text) {
    return reverseLookup(kOutcomes, text);
}

std::string_view displayName(InstrumentKind value) {
    switch (value) {
    case InstrumentKind::DcVoltmeter:
        return "DC voltmeter";
    case InstrumentKind::DcAmmeter:
        return "DC ammeter";
    case InstrumentKind::HalfWaveAcVoltmeter:
        return "AC voltmeter, half-wave rectifier";
    case InstrumentKind::BridgeAcVoltmeter:
        return "AC voltmeter, bridge rectifier";
    case InstrumentKind::MultiRange:
        return "Multi-range meter";
    }
    return "?";
}

std::string_view displayName(ScaleType value) {
    switch (value) {
    case ScaleType::ZeroAtEnd:
        return "Zero at one end";
    case ScaleType::ZeroInside:
        return "Zero inside the scale";
    case ScaleType::NoZero:
        return "No zero on the scale";
    case ScaleType::NonLinear:
        return "Strongly non-linear scale";
    }
    return "?";
}

std::string_view displayName(SignalType value) {
    switch (value) {
    case SignalType::Dc:
        return "DC";
    case SignalType::HalfWave:
        return "AC, half-wave rectifier";
    case SignalType::Bridge:
        return "AC, bridge rectifier";
    }
    return "?";
}

std::string_view displayName(SignalKind value) {
    return value == SignalKind::Dc ? "DC" : "AC";
}

SignalKind kindOf(SignalType signal) {
    return signal == SignalType::Dc ? SignalKind::Dc : SignalKind::Ac;
}

std::string_view displayName(Phase value) {
    return value == Phase::AsFound ? "As-found" : "As-left";
}

std::string_view displayName(PhasePlan value) {
    switch (value) {
    case PhasePlan::AsFound:
        return "As-found only";
    case PhasePlan::AsLeft:
        return "As-left only";
    case PhasePlan::AsFoundAndAsLeft:
        return "As-found and as-left";
    }
    return "?";
}

std::vector<Phase> phasesOf(PhasePlan plan) {
    switch (plan) {
    case PhasePlan::AsFound:
        return {Phase::AsFound};
    case PhasePlan::AsLeft:
        return {Phase::AsLeft};
    case PhasePlan::AsFoundAndAsLeft:
        break;
    }
    return {Phase::AsFound, Phase::AsLeft};
}

std::string_view displayName(SessionState value) {
    switch (value) {
    case SessionState::Draft:
        return "Draft";
    case SessionState::Submitted:
        return "Awaiting review";
    case SessionState::Returned:
        return "Returned to technician";
    case SessionState::Approved:
        return "Approved";
    case SessionState::Superseded:
        return "Superseded by amendment";
    }
    return "?";
}

std::string_view displayName(Outcome value) {
    switch (value) {
    case Outcome::Pass:
        return "Pass";
    case Outcome::ConditionalPass:
        return "Conditional pass";
    case Outcome::ConditionalFail:
        return "Conditional fail";
    case Outcome::Fail:
        return "Fail";
    }
    return "?";
}

// The names ILAC G8:09/2019 gives its rules in 4.2.1 to 4.2.3.
std::string_view displayName(DecisionRule value) {
    switch (value) {
    case DecisionRule::SimpleAcceptance:
        return "Binary statement for simple acceptance (ILAC G8:09/2019 4.2.1)";
    case DecisionRule::GuardedBinary:
        return "Binary statement with guard band (ILAC G8:09/2019 4.2.2)";
    case DecisionRule::GuardedAcceptance:
        return "Non-binary statement with guard band (ILAC G8:09/2019 4.2.3)";
    }
    return "?";
}

std::string_view displayName(InstrumentStatus value) {
    switch (value) {
    case InstrumentStatus::InService:
        return "In service";
    case InstrumentStatus::OutOfService:
        return "Out of service";
    case InstrumentStatus::Retired:
        return "Retired";
    }
    return "?";
}

std::string_view displayName(Role value) {
    switch (value) {
    case Role::Technician:
        return "Technician";
    case Role::Reviewer:
        return "Reviewer";
    case Role::Administrator:
        return "Administrator";
    }
    return "?";
}

} // namespace mw
