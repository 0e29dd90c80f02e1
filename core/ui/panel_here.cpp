// Screen "Here": where we are, entered once for every screen (altitude, optionally with latitude
// and month; a station barometer reading, cross-checked against a known altitude; or QNH +
// temperature), and the pressure here by the chosen model with the other beside it.
#include "ui/panels.hpp"

#include <algorithm>
#include <cmath>

#include "model/atmosphere.hpp"
#include "model/latitude_month.hpp"
#include "model/expected_spo2.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/situation.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

// Latitude as a number with a N/S toggle on the keypad (a typed minus also means south); ±
// move it 1° away from or towards the equator.
void edit_latitude(AppState& state, double& latitude_deg) {
  int south = latitude_deg < 0 ? 1 : 0;
  double size = std::fabs(latitude_deg);
  FieldSpec spec{.label = "Latitude",
                 .id = "latitude",
                 .shown = shown_number(size, 1) + (south ? " \xC2\xB0S" : " \xC2\xB0N"),
                 .edit_text = format_number(size, 4),
                 .unit_symbols = {"\xC2\xB0N", "\xC2\xB0S"},
                 .unit_index = south,
                 .hint = "0\xE2\x80\x93" "90 \xC2\xB0N or \xC2\xB0S"};
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::None) return;
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<double> number = units::parse_number(event.text, "latitude");
    if (number && !in_range(std::fabs(number.value()), 0.0, atmosphere::kLatitudeHighDeg)) {
      number = range_error("latitude", 0, atmosphere::kLatitudeHighDeg, "\xC2\xB0 N or S", number.value());
    }
    if (!number) {
      state.field_errors["latitude"] = number.error().message;
      return;
    }
    bool typed_south = event.unit_index == 1 || number.value() < 0;
    latitude_deg = typed_south ? -std::fabs(number.value()) : std::fabs(number.value());
  } else {
    size = std::clamp(size + (event.kind == FieldEvent::Kind::Plus ? 1.0 : -1.0), 0.0,
                      atmosphere::kLatitudeHighDeg);
    latitude_deg = south ? -size : size;
  }
  state.field_errors.erase("latitude");
}

// Month by name; ± step through the year, the keypad takes 1…12.
void edit_month(AppState& state, int& month) {
  FieldSpec spec{.label = "Month",
                 .id = "month",
                 .shown = month_name(month),
                 .edit_text = std::to_string(month),
                 .hint = "1\xE2\x80\x93" "12 (1 = January)"};
  FieldEvent event = keypad_field(state, spec);
  if (event.kind == FieldEvent::Kind::None) return;
  if (event.kind == FieldEvent::Kind::Commit) {
    Result<double> number = units::parse_number(event.text, "month");
    Result<atmosphere::LatitudeMonth> where =
        number ? atmosphere::make_latitude_month(0.0, number.value())
               : Result<atmosphere::LatitudeMonth>(number.error());
    if (!where) {
      state.field_errors["month"] = where.error().message;
      return;
    }
    month = where->month;
  } else {
    month = (month - 1 + (event.kind == FieldEvent::Kind::Plus ? 1 : 11)) % 12 + 1;
  }
  state.field_errors.erase("month");
}

void draw_latitude_month(AppState& state) {
  Situation& s = state.situation;
  toggle_row(state.display, "latitude-month", "Model only", "Latitude + month", &s.latitude_month_known);
  if (!s.latitude_month_known) return;
  edit_latitude(state, s.latitude_deg);
  edit_month(state, s.month);
}

void draw_where(AppState& state) {
  using namespace units;
  Situation& s = state.situation;
  heading("How we know the pressure");
  const char* sources[] = {"Map altitude", "Barometer", "Sea-level report"};
  int source = static_cast<int>(s.source);
  if (choice_row(state.display, "source", sources, 3, &source)) s.source = static_cast<PressureSource>(source);

  if (s.source != PressureSource::Station) {
    edit_quantity(state, situation_altitude_field(state, "Altitude"), s.altitude);
  }
  if (s.source == PressureSource::Altitude) draw_latitude_month(state);
  if (s.source == PressureSource::Station) {
    edit_quantity(state,
                  air_pressure_field(state, "Barometer reading here (not sea-level)", "station",
                                     atmosphere::kStationReadingRange.low,
                                     atmosphere::kStationReadingRange.high),
                  s.station_reading);
    toggle_row(state.display, "station-altitude", "Altitude unknown", "Altitude known",
               &s.station_altitude_known);
    if (s.station_altitude_known) {
      edit_quantity(state, altitude_field(state, "Altitude (to check the reading)", "altitude"),
                    s.altitude);
    }
  }
  if (s.source == PressureSource::Qnh) {
    edit_quantity(state, air_pressure_field(state, "Sea-level pressure reported (QNH)", "qnh",
                                            atmosphere::kQnhRange.low, atmosphere::kQnhRange.high),
                  s.qnh);
    toggle_row(state.display, "qnh-temperature", "Temperature unknown", "Temperature known",
               &s.qnh_temperature_known);
    if (s.qnh_temperature_known) {
      edit_quantity(state, temperature_field(state, "Air temperature here", "air-temperature",
                                             atmosphere::kAirTemperatureRange),
                    s.air_temperature);
    }
  }

  heading("Atmosphere model");
  const char* models[] = {"West 1996", "ISA"};
  int model_index = state.settings.model == atmosphere::Model::West1996 ? 0 : 1;
  if (choice_row(state.display, "model", models, 2, &model_index)) {
    state.settings.model = model_index == 0 ? atmosphere::Model::West1996 : atmosphere::Model::Isa;
  }
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("West 1996 fits high mountains at low latitude (the medical default); ISA is "
                      "the aviation standard. High latitude or winter: give latitude + month "
                      "(NRLMSISE-00), or better, a barometer reading.");
  ImGui::PopTextWrapPos();
}

// The barometer reading against the altitude the user knows (atmosphere::check_station_reading).
void draw_station_check(AppState& state) {
  const Situation& s = state.situation;
  Result<atmosphere::StationCheck> check =
      atmosphere::check_station_reading(s.station_reading, s.altitude, state.settings.model);
  if (!check) {
    verdict_line(state.display, Tone::Neutral, "Reading not checked: " + check.error().message);
    return;
  }
  Tone tone = Tone::Good;
  if (check->verdict == atmosphere::ReadingCheck::LooksLikeSeaLevel) tone = Tone::Danger;
  if (check->verdict == atmosphere::ReadingCheck::Mismatch) tone = Tone::Caution;
  verdict_line(state.display, tone, check->message);
}

void draw_pressure(AppState& state) {
  using namespace units;
  const UnitChoice& u = state.settings.units;
  const Situation& s = state.situation;
  heading("Pressure here");
  Result<Pressure> pb = situation_pressure(state);
  std::string label = "Barometric pressure";
  if (s.source == PressureSource::Altitude) {
    // The place and month are in the fields just above: the label names the model only (fits a phone).
    label += situation_latitude_month(state)
                 ? " (" + std::string(atmosphere::latitude_month_model_name()) + ")"
                 : " (" + std::string(atmosphere::model_name(state.settings.model)) + ")";
  } else {
    label += s.source == PressureSource::Station ? " (barometer)" : " (sea-level report)";
  }
  if (pb) result_value(state.display, label.c_str(), pressure_text(pb.value(), u));
  else result_error(state.display, label.c_str(), pb.error().message);

  if (s.source == PressureSource::Altitude) {
    atmosphere::Model other = state.settings.model == atmosphere::Model::Isa
                                  ? atmosphere::Model::West1996
                                  : atmosphere::Model::Isa;
    if (situation_latitude_month(state)) other = state.settings.model;
    Result<Pressure> other_pb = atmosphere::pressure_at(s.altitude, other);
    std::string other_label = std::string(atmosphere::model_name(other)) + " for comparison";
    // No altitude entered: no comparison either (a made-up place gives no number at all).
    std::string other_text = !pb ? "\xE2\x80\x94" : other_pb ? pressure_text(other_pb.value(), u) : "outside model range";
    result_value(state.display, other_label.c_str(), other_text, false);
  } else {
    // The altitude this pressure corresponds to, so a medic can sanity-check the reading.
    Result<Length> altitude = atmosphere::altitude_at(pb ? pb.value() : Pressure{}, state.settings.model);
    std::string text = pb && altitude ? altitude_with_unit(altitude.value(), u) : "\xE2\x80\x94";
    std::string alt_label = "Matching altitude (" + std::string(atmosphere::model_name(state.settings.model)) + ")";
    result_value(state.display, alt_label.c_str(), text, false);
  }
  if (s.source == PressureSource::Station && s.station_altitude_known) draw_station_check(state);
  if (s.source == PressureSource::Qnh && s.qnh_temperature_known) {
    Result<atmosphere::QnhWithTemperature> q = atmosphere::qnh_with_temperature(
        s.altitude, s.qnh, s.air_temperature, atmosphere::TemperatureAt::Station);
    if (q) {
      result_value(state.display, "Without the temperature", pressure_text(q->standard_lapse, u), false);
      message_line(q->note, true);
    }
  }
}

// Oxygen here for the situation's casualty (air or the device's FiO2): the cascade's middle
// path, with PAO2's soft range from the expected PaCO2 band.
void draw_oxygen_here(AppState& state) {
  const UnitChoice& u = state.settings.units;
  heading(state.situation.on_oxygen ? "Oxygen here (on oxygen, see Casualty)" : "Oxygen here (breathing air)");
  Result<expected_spo2::Expectation> e = situation_expectation(state);
  if (!e) {
    result_error(state.display, "Inspired PO2 (PiO2)", e.error().message);
    return;
  }
  const cascade::Cascade& k = e->cascade;
  result_value(state.display, "Inspired PO2 (PiO2)", gas_pressure_text(k.inspired, u));
  result_value(state.display, "Alveolar PO2 (PAO2), expected",
               gas_pressure_range_text(k.lowest.alveolar, k.highest.alveolar, u), false);
  result_value(state.display, "Arterial PO2 (PaO2), expected",
               gas_pressure_range_text(k.lowest.arterial, k.highest.arterial, u), false);
  result_value(state.display, "PaCO2, expected", gas_pressure_text(k.middle.paco2, u), false);
  time_unknown_note(state);
}

}  // namespace

void draw_here_panel(AppState& state, Platform&) {
  draw_where(state);
  draw_pressure(state);
  draw_oxygen_here(state);
  caution_line(state);
}

}  // namespace firn::ui
