// The situation as the models need it: barometric pressure from whichever source the user
// chose, and a one-line summary every screen shows at its top (tap it to change the situation).
#pragma once

#include <optional>
#include <string>
#include <string_view>

#include "model/expected_spo2.hpp"
#include "model/latitude_month.hpp"
#include "model/result.hpp"
#include "model/supplemental_oxygen.hpp"
#include "model/units.hpp"
#include "ui/app_state.hpp"

namespace firn::ui {

// PB here: from the altitude (chosen model, or NRLMSISE-00 for a latitude and month), the station
// barometer, or QNH (+ temperature).
Result<units::Pressure> situation_pressure(const AppState& state);
// The latitude and month in use: only with the altitude source and when entered.
std::optional<atmosphere::LatitudeMonth> situation_latitude_month(const AppState& state);
// "NRLMSISE-00, 60° N, January" or the model's name: what the altitude-source pressure comes from.
std::string situation_pressure_source(const AppState& state);
// "January"; "—" outside 1…12.
std::string month_name(int month);
// Altitude implied by PB with the chosen model (for a barometer reading), or the entered one.
Result<units::Length> situation_altitude(const AppState& state);

// "3000 m · 701 hPa (West 1996) · SpO2 88 % · acute · air"
std::string situation_summary(const AppState& state);

// The summary as a full-width button; tapping it opens the Here screen.
void draw_situation_strip(AppState& state);

// Where on the acclimatisation time course the casualty is (from the time at altitude), for
// figures: on arrival while the time is not entered (the least oxygen, as the route plan assumes).
cascade::Acclimatisation situation_acclimatisation(const AppState& state);
// For the SpO2 verdict: none while the time is not entered (casualty_spo2 then judges both ends).
std::optional<cascade::Acclimatisation> situation_known_acclimatisation(const AppState& state);
// Under the figures while the time is not entered: what they assume meanwhile.
void time_unknown_note(const AppState& state);
// The nearer preset, for screens that show only the two ends: acclimatised only at share 1.
cascade::Exposure situation_exposure(const AppState& state);
// "acute (on arrival)", "36 h at altitude", "2.5 d at altitude".
std::string time_at_altitude_text(units::Duration time);
supplemental_oxygen::Device situation_device(const AppState& state);
supplemental_oxygen::Breathing situation_breathing(const AppState& state);
// FiO2 the casualty breathes: dry air, or what the device gives at its flow here (gas expansion
// and this breathing: supplemental_oxygen::delivered_fio2_at), the same FiO2 the verdict uses.
// On oxygen with no flow entered there is no FiO2: every figure on oxygen says this instead.
inline constexpr std::string_view kEnterOxygenFlow = "enter the oxygen flow (Casualty screen)";
// `at` another point of acclimatisation than the situation's.
Result<units::Fraction> situation_fio2(const AppState& state,
                                       std::optional<cascade::Acclimatisation> at = std::nullopt);
// Healthy-lowlander expectation for the situation (pressure, exposure, FiO2).
Result<expected_spo2::Expectation> situation_expectation(
    const AppState& state, std::optional<cascade::Acclimatisation> at = std::nullopt);

}  // namespace firn::ui
