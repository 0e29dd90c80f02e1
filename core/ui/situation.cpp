#include "ui/situation.hpp"

#include <imgui.h>

#include <cmath>

#include "model/atmosphere.hpp"
#include "ui/format.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

using namespace units;

Result<Pressure> situation_pressure(const AppState& state) {
  const Situation& s = state.situation;
  // No altitude typed yet: no pressure, so no screen shows a verdict for a made-up place.
  if (s.source != PressureSource::Station && !s.altitude_entered) {
    return Error{"No altitude entered yet: enter it on the Here screen (map, GPS or altimeter)."};
  }
  switch (s.source) {
    case PressureSource::Station: return atmosphere::pressure_from_station_reading(s.station_reading);
    case PressureSource::Qnh:
      if (s.qnh_temperature_known) {
        return atmosphere::pressure_from_qnh(s.altitude, s.qnh, s.air_temperature,
                                             atmosphere::TemperatureAt::Station);
      }
      return atmosphere::pressure_from_qnh(s.altitude, s.qnh);
    case PressureSource::Altitude: break;
  }
  return atmosphere::pressure_at(s.altitude, state.settings.model, situation_latitude_month(state));
}

std::optional<atmosphere::LatitudeMonth> situation_latitude_month(const AppState& state) {
  const Situation& s = state.situation;
  if (s.source != PressureSource::Altitude || !s.latitude_month_known) return std::nullopt;
  Result<atmosphere::LatitudeMonth> where = atmosphere::make_latitude_month(s.latitude_deg, s.month);
  if (!where) return std::nullopt;
  return where.value();
}

namespace {
constexpr const char* kMonthNames[] = {"January", "February", "March",     "April",
                                       "May",     "June",     "July",      "August",
                                       "September", "October", "November", "December"};
}  // namespace

std::string month_name(int month) {
  if (month < 1 || month > 12) return "\xE2\x80\x94";
  return kMonthNames[month - 1];
}

std::string situation_pressure_source(const AppState& state) {
  std::optional<atmosphere::LatitudeMonth> where = situation_latitude_month(state);
  if (!where) return std::string(atmosphere::model_name(state.settings.model));
  double lat = where->latitude_deg;
  return std::string(atmosphere::latitude_month_model_name()) + ", " +
         format_number(std::fabs(lat), 1) + "\xC2\xB0" + (lat < 0 ? " S" : " N") + ", " +
         month_name(where->month);
}

Result<Length> situation_altitude(const AppState& state) {
  if (state.situation.source != PressureSource::Station) {
    if (!state.situation.altitude_entered) return situation_pressure(state).error();
    return state.situation.altitude;
  }
  Result<Pressure> pb = situation_pressure(state);
  if (!pb) return pb.error();
  return atmosphere::altitude_at(pb.value(), state.settings.model);
}

std::string situation_summary(const AppState& state) {
  const Situation& s = state.situation;
  const UnitChoice& u = state.settings.units;
  std::string text;
  Result<Length> altitude = situation_altitude(state);
  Result<Pressure> pb = situation_pressure(state);
  if (s.source == PressureSource::Station) text += "barometer ";
  if (s.source != PressureSource::Station && !s.altitude_entered) {
    text += "no altitude yet";  // no pressure either: nothing to show beside it
  } else {
    text += altitude ? altitude_with_unit(altitude.value(), u) : std::string("\xE2\x80\x94");
    text += " \xC2\xB7 ";
    text += pb ? pressure_text(pb.value(), u) : std::string("\xE2\x80\x94");
    if (s.source == PressureSource::Altitude) text += " (" + situation_pressure_source(state) + ")";
    if (s.source == PressureSource::Qnh) text += " (QNH)";
  }
  text += " \xC2\xB7 ";
  text += s.spo2_measured ? "SpO2 " + percent_text(s.spo2) : std::string("no SpO2");
  text += " \xC2\xB7 " + (s.time_at_altitude_entered ? time_at_altitude_text(s.time_at_altitude)
                                                    : std::string("time here not entered"));
  if (s.on_oxygen) {
    text += " \xC2\xB7 on O2 " + (s.oxygen_flow_entered ? flow_text(s.oxygen_flow) : std::string("(flow not entered)"));
  } else {
    text += " \xC2\xB7 air";
  }
  return text;
}

void draw_situation_strip(AppState& state) {
  std::string text = situation_summary(state);
  float height = std::max(touch_target(state.display), ImGui::GetFrameHeight());
  ImGui::PushStyleVar(ImGuiStyleVar_ButtonTextAlign, ImVec2(0.0f, 0.5f));
  // Wraps on a narrow phone: a clipped summary would hide the altitude a medic must check.
  float width = ImGui::GetContentRegionAvail().x;
  ImVec2 size = ImGui::CalcTextSize(text.c_str(), nullptr, false, width - 2 * ImGui::GetStyle().FramePadding.x);
  height = std::max(height, size.y + 2 * ImGui::GetStyle().FramePadding.y);
  ImGui::PushID("situation-strip");
  ImVec2 pos = ImGui::GetCursorScreenPos();
  bool pressed = tap_button("##situation", ImVec2(width, height));
  ImGui::PopID();
  ImGui::PopStyleVar();
  ImGui::GetWindowDrawList()->AddText(
      ImGui::GetFont(), ImGui::GetFontSize(),
      ImVec2(pos.x + ImGui::GetStyle().FramePadding.x, pos.y + (height - size.y) * 0.5f),
      ImGui::GetColorU32(ImGuiCol_Text), text.c_str(), nullptr,
      width - 2 * ImGui::GetStyle().FramePadding.x);
  test_hook::item_text("Situation", text);
  if (pressed) state.screen = Screen::Here;
}

}  // namespace firn::ui

namespace firn::ui {

cascade::Acclimatisation situation_acclimatisation(const AppState& state) {
  return situation_known_acclimatisation(state).value_or(cascade::acclimatisation_of(cascade::Exposure::Acute));
}

std::optional<cascade::Acclimatisation> situation_known_acclimatisation(const AppState& state) {
  if (!state.situation.time_at_altitude_entered) return std::nullopt;
  Result<cascade::Acclimatisation> a = cascade::acclimatisation_after(state.situation.time_at_altitude);
  return a ? std::optional(a.value()) : std::nullopt;
}

void time_unknown_note(const AppState& state) {
  if (state.situation.time_at_altitude_entered) return;
  message_line("Time at this altitude not entered: figures are a newcomer's (on arrival, the least "
               "oxygen).");
}

cascade::Exposure situation_exposure(const AppState& state) {
  return situation_acclimatisation(state).share >= 1.0 ? cascade::Exposure::Acclimatised
                                                       : cascade::Exposure::Acute;
}

std::string time_at_altitude_text(units::Duration time) {
  double h = time.in(units::hours);
  if (h <= 0.0) return "acute (on arrival)";
  if (h < 48.0) return shown_number(h, 0) + " h at altitude";
  return shown_number(time.in(units::days), 1) + " d at altitude";
}

supplemental_oxygen::Device situation_device(const AppState& state) {
  switch (state.situation.oxygen_device) {
    case 1: return supplemental_oxygen::Device::SimpleMask;
    case 2: return supplemental_oxygen::Device::NonRebreather;
    default: break;
  }
  return supplemental_oxygen::Device::NasalCannula;
}

supplemental_oxygen::Breathing situation_breathing(const AppState& state) {
  return state.situation.distress ? supplemental_oxygen::Breathing::Distress
                                  : supplemental_oxygen::Breathing::Rest;
}

Result<units::Fraction> situation_fio2(const AppState& state, std::optional<cascade::Acclimatisation> at) {
  if (!state.situation.on_oxygen) return cascade::dry_air_fio2();
  if (!state.situation.oxygen_flow_entered) return Error{std::string(kEnterOxygenFlow)};
  Result<units::Pressure> pb = situation_pressure(state);
  if (!pb) return pb.error();
  Result<supplemental_oxygen::DeliveredFio2> d = supplemental_oxygen::delivered_fio2_at(
      situation_device(state), state.situation.oxygen_flow, pb.value(),
      at.value_or(situation_acclimatisation(state)), situation_breathing(state));
  if (!d) return d.error();
  return d->fio2;
}

Result<expected_spo2::Expectation> situation_expectation(const AppState& state,
                                                         std::optional<cascade::Acclimatisation> at) {
  Result<units::Pressure> pb = situation_pressure(state);
  if (!pb) return pb.error();
  Result<units::Fraction> fio2 = situation_fio2(state, at);
  if (!fio2) return fio2.error();
  return expected_spo2::expected(pb.value(), at.value_or(situation_acclimatisation(state)), fio2.value());
}

}  // namespace firn::ui
