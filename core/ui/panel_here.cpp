// Screen "Here": where we are, entered once for every screen (altitude, a station barometer
// reading, or QNH + temperature; the atmosphere model visible), and the pressure here by the
// chosen model with the other beside it.
#include "ui/panels.hpp"

#include "model/atmosphere.hpp"
#include "model/expected_spo2.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/situation.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

void draw_where(AppState& state) {
  using namespace units;
  Situation& s = state.situation;
  heading("Where: pressure from");
  const char* sources[] = {"By altitude", "Barometer", "QNH"};
  int source = static_cast<int>(s.source);
  if (choice_row(state, "source", sources, 3, &source)) s.source = static_cast<PressureSource>(source);

  if (s.source != PressureSource::Station) {
    edit_quantity(state, situation_altitude_field(state, "Altitude"), s.altitude);
  }
  if (s.source == PressureSource::Station) {
    edit_quantity(state,
                  air_pressure_field(state, "Barometer reading (station, not QNH)", "station",
                                     hectopascals(150), hectopascals(1100)),
                  s.station_reading);
  }
  if (s.source == PressureSource::Qnh) {
    edit_quantity(state, air_pressure_field(state, "QNH (sea-level pressure)", "qnh",
                                            hectopascals(900), hectopascals(1100)),
                  s.qnh);
    toggle_row(state, "qnh-temperature", "Standard lapse", "Air temperature known",
               &s.qnh_temperature_known);
    if (s.qnh_temperature_known) {
      edit_quantity(state, temperature_field(state, "Air temperature here", "air-temperature", -60, 50),
                    s.air_temperature);
    }
  }

  heading("Atmosphere model");
  const char* models[] = {"West 1996", "ISA"};
  int model_index = state.settings.model == atmosphere::Model::West1996 ? 0 : 1;
  if (choice_row(state, "model", models, 2, &model_index)) {
    state.settings.model = model_index == 0 ? atmosphere::Model::West1996 : atmosphere::Model::Isa;
  }
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("West 1996 fits high mountains at low latitude (the medical default); ISA is "
                      "the aviation standard. High latitude or winter: enter a barometer reading.");
  ImGui::PopTextWrapPos();
}

void draw_pressure(AppState& state) {
  using namespace units;
  const UnitChoice& u = state.settings.units;
  const Situation& s = state.situation;
  heading("Pressure here");
  Result<Pressure> pb = situation_pressure(state);
  std::string label = "Barometric pressure";
  if (s.source == PressureSource::Altitude) {
    label += " (" + std::string(atmosphere::model_name(state.settings.model)) + ")";
  } else {
    label += s.source == PressureSource::Station ? " (barometer)" : " (QNH)";
  }
  if (pb) result_value(state, label.c_str(), pressure_text(pb.value(), u));
  else result_error(state, label.c_str(), pb.error().message);

  if (s.source == PressureSource::Altitude) {
    atmosphere::Model other = state.settings.model == atmosphere::Model::Isa
                                  ? atmosphere::Model::West1996
                                  : atmosphere::Model::Isa;
    Result<Pressure> other_pb = atmosphere::pressure_at(s.altitude, other);
    std::string other_label = std::string(atmosphere::model_name(other)) + " for comparison";
    // No altitude entered: no comparison either (a made-up place gives no number at all).
    std::string other_text = !pb ? "\xE2\x80\x94" : other_pb ? pressure_text(other_pb.value(), u) : "outside model range";
    result_value(state, other_label.c_str(), other_text, false);
  } else {
    // The altitude this pressure corresponds to, so a medic can sanity-check the reading.
    Result<Length> altitude = atmosphere::altitude_at(pb ? pb.value() : Pressure{}, state.settings.model);
    std::string text = pb && altitude ? altitude_with_unit(altitude.value(), u) : "\xE2\x80\x94";
    std::string alt_label = "Pressure altitude (" + std::string(atmosphere::model_name(state.settings.model)) + ")";
    result_value(state, alt_label.c_str(), text, false);
  }
}

// Oxygen here for the situation's casualty (air or the device's FiO2): the cascade's middle
// path, with PAO2's soft range from the expected PaCO2 band.
void draw_oxygen_here(AppState& state) {
  const UnitChoice& u = state.settings.units;
  heading(state.situation.on_oxygen ? "Oxygen here (on oxygen, see Casualty)" : "Oxygen here (breathing air)");
  Result<expected_spo2::Expectation> e = situation_expectation(state);
  if (!e) {
    result_error(state, "Inspired PO2 (PiO2)", e.error().message);
    return;
  }
  const cascade::Cascade& k = e->cascade;
  result_value(state, "Inspired PO2 (PiO2)", gas_pressure_text(k.inspired, u));
  result_value(state, "Alveolar PO2 (PAO2), expected",
               gas_pressure_range_text(k.lowest.alveolar, k.highest.alveolar, u), false);
  result_value(state, "Arterial PO2 (PaO2), expected",
               gas_pressure_range_text(k.lowest.arterial, k.highest.arterial, u), false);
  result_value(state, "PaCO2, expected", gas_pressure_text(k.middle.paco2, u), false);
}

}  // namespace

void draw_here_panel(AppState& state, Platform&) {
  draw_where(state);
  draw_pressure(state);
  draw_oxygen_here(state);
  caution_line(state);
}

}  // namespace firn::ui
