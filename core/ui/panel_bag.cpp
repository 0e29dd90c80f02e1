// Screen "Bag": the portable hyperbaric chamber at the situation's pressure — the model's verdict
// first (ok with the limiting descent, or flush more), the pressure- and oxygen-equivalent
// altitudes (same atmosphere model inverted), the gas inside with a fresh-air flush and the
// team's pump, the casualty's gas exchange, the time in the bag, and an altitude ladder.
#include "ui/panels.hpp"

#include <algorithm>
#include <cmath>

#include "model/hyperbaric_bag.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/plot.hpp"
#include "ui/situation.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;
namespace bag = hyperbaric_bag;

// In the Settings' pressure unit (one name per unit on every screen); psi on the keypad too,
// since many bags are marked in psi.
QuantityField<GaugePressureDimension> bag_gauge_field(const AppState& state) {
  int index = static_cast<int>(state.settings.units.pressure);
  constexpr int decimals[] = {0, 0, 1, 2};  // a gauge of a few hundred hPa: coarser than air
  std::vector<const Unit<PressureDimension>*> units(kPressureUnits.begin(), kPressureUnits.end());
  units.push_back(&psi);
  return {"Bag pressure (gauge)", "bag-gauge", "bag gauge pressure", units, index,
          bag::kGaugeRange.low, bag::kGaugeRange.high, {10.0, 5.0, 1.0, 0.2, 0.1}, decimals[index]};
}

QuantityField<VolumeFlowDimension> gas_exchange_field(const char* label, const char* id,
                                                      const char* what, double low, double high) {
  return {label, id, what, {&litres_per_minute}, 0, litres_per_minute(low),
          litres_per_minute(high), {0.05}, 2};
}

// An equivalent altitude rounded up, as the verdict rounds it: less descent claimed, and the
// figure reads the same in the verdict, the results and the ladder.
std::string equivalent_text(Length altitude, const UnitChoice& u) {
  const Unit<LengthDimension>& unit = chosen_unit(kAltitudeUnits, u.altitude);
  return altitude_with_unit(from_reading<LengthDimension>(unit, bag::altitude_rounded_up(altitude, unit)), u);
}

std::string gauge_text(GaugePressure gauge, const UnitChoice& u) {
  return pressure_text(gauge, u) + " (" + shown_number(gauge.in(psi), 2) + " psi)";
}

void draw_ladder(const AppState& state, const bag::BagResult& r) {
  const UnitChoice& u = state.settings.units;
  const Unit<LengthDimension>& unit = chosen_unit(kAltitudeUnits, u.altitude);
  bool feet = &unit == &units::feet;
  double ambient = r.ambient_altitude.in(unit);
  double highest = std::max(ambient, r.equivalent_altitude ? r.equivalent_altitude->in(unit) : 0.0);
  double top = std::max(1000.0, std::ceil((highest + (feet ? 2000 : 600)) / (feet ? 2000 : 500)) * (feet ? 2000 : 500));
  std::string summary = "ambient " + altitude_with_unit(r.ambient_altitude, u) +
                        (state.bag.flush_entered ? " to equivalent " : " to, by pressure alone, ") +
                        (r.equivalent_altitude ? equivalent_text(*r.equivalent_altitude, u) : "below sea level");
  Plot plot = begin_plot(state.display, "Altitude ladder", summary, 14.0f,
                         {0, 1, 0, top, 0, feet ? 2000.0 : 1000.0, "", std::string("altitude, ") + std::string(unit.symbol)});
  ImU32 here = plot_colour(state.display, PlotColour::Danger);
  ImU32 inside = plot_colour(state.display, PlotColour::Accent);
  ImU32 dim = plot_colour(state.display, PlotColour::Dim);
  plot_hline(plot, ambient, here, "outside " + altitude_with_unit(r.ambient_altitude, u));
  // The figure that does not limit, thin and labelled, so both are visible.
  const std::optional<Length>& other = r.limited_by == bag::Limit::Oxygen ? r.pressure_equivalent_altitude
                                                                          : r.oxygen_equivalent_altitude;
  if (other && r.equivalent_altitude && std::fabs(other->in(unit) - r.equivalent_altitude->in(unit)) > 1.0) {
    std::string what = r.limited_by == bag::Limit::Oxygen ? "pressure alone " : "oxygen alone ";
    plot_hline(plot, other->in(unit), dim, what + equivalent_text(*other, u), LineLabel::BelowLeft);
  }
  if (!r.equivalent_altitude) return;
  double equivalent = r.equivalent_altitude->in(unit);
  // Without a flush only the pressure is known: never labelled as what the casualty gets.
  const char* what = state.bag.flush_entered ? "in the bag " : "pressure alone ";
  plot_hline(plot, equivalent, inside, what + equivalent_text(*r.equivalent_altitude, u));
  // The arrow only for the descent the verdict stands behind.
  if (r.verdict != bag::Verdict::Ok || !r.descent_equivalent) return;
  ImVec2 from = plot.at(0.3, ambient), to = plot.at(0.3, equivalent);
  plot.draw->AddLine(from, to, inside, 0.25f * em());
  float h = 0.6f * em();
  plot.draw->AddTriangleFilled(ImVec2(to.x - h, to.y - h), ImVec2(to.x + h, to.y - h), ImVec2(to.x, to.y + 0.2f * h), inside);
}

// The verdict, then the two equivalent altitudes and the fire caution.
void draw_verdict(AppState& state, const bag::BagResult& r) {
  const UnitChoice& u = state.settings.units;
  const Unit<LengthDimension>& unit = chosen_unit(kAltitudeUnits, u.altitude);
  bool ok = r.verdict == bag::Verdict::Ok;
  if (!state.bag.flush_entered) {
    // The model says "flush more" without a flush; nobody has said how fast the team pumps yet.
    verdict_line(state.display, Tone::Neutral,
                 "Enter the fresh-air flush (how fast the team pumps): the oxygen and CO2 inside depend on it");
  } else {
    verdict_line(state.display, ok ? Tone::Good : Tone::Danger, bag::verdict_text(r, unit));
    if (!ok) message_line(bag::flush_more_reason(r), true);
  }
  result_value(state.display, "Pressure-equivalent altitude",
               r.pressure_equivalent_altitude ? equivalent_text(*r.pressure_equivalent_altitude, u)
                                              : "below sea level", false);
  std::string by_oxygen = r.oxygen_equivalent_altitude ? equivalent_text(*r.oxygen_equivalent_altitude, u)
                          : r.gas                      ? "outside the model"
                                                       : "enter a flush";
  result_value(state.display, "Oxygen-equivalent altitude", by_oxygen, false);
  if (r.fire_risk) verdict_line(state.display, Tone::Caution, bag::fire_caution_text(r));
}

// Gas inside, the flush the verdict needs, and the team's pump.
void draw_gas(AppState& state, const bag::BagResult& r, const bag::Settings& s) {
  heading("Gas in the bag");
  if (r.gas) {
    // Not emphasised: the verdict above is the headline.
    result_value(state.display, "CO2 inside (steady state)", percent_text(r.gas->co2, 1), false);
    result_value(state.display, "O2 inside (steady state)", percent_text(r.gas->o2, 1), false);
    result_value(state.display, "Bag time constant", duration_text(r.gas->time_constant), false);
  } else {
    message_line("Enter a flush flow to see CO2 and O2 inside.");
  }
  std::string needed = "\xE2\x80\x94";
  if (r.required_flush) {
    needed = shown_number(std::ceil(r.required_flush->in(litres_per_minute)), 0) + " L/min";
    if (r.required_flush_strokes_per_minute) {
      needed += ", " + shown_number(std::ceil(*r.required_flush_strokes_per_minute), 0) + " strokes/min";
    }
  }
  // The smallest flush for OK: CO2 within the limit and the oxygen inside at least outside air.
  result_value(state.display, "Flush needed", needed, false);
  if (r.gas && r.gas->strokes_per_minute) {
    result_value(state.display, "Pump strokes at this flush",
                 shown_number(std::ceil(*r.gas->strokes_per_minute), 0) + " strokes/min", false);
  }
  message_line("Team pump " + shown_number(s.stroke_volume->in(litres), 2) +
                          " L a stroke, CO2 limit " + percent_text(s.co2_limit, 1) +
                          " (team profile, Team screen).");
}

void draw_casualty_fields(AppState& state) {
  BagInputs& in = state.bag;
  heading("Casualty and bag gas");
  edit_quantity(state, gas_exchange_field("Casualty CO2 output (VCO2)", "bag-vco2", "VCO2",
                                          bag::min_vco2_lpm, bag::max_vco2_lpm), in.vco2);
  edit_quantity(state, gas_exchange_field("Casualty O2 uptake (VO2)", "bag-vo2", "VO2",
                                          bag::min_vo2_lpm, bag::max_vo2_lpm), in.vo2);
  message_line("At rest about " + shown_number(bag::rest_vco2_lpm, 2) + " and " +
                          shown_number(bag::rest_vo2_lpm, 2) +
                          " L/min (typical resting figures); shivering or distress several times more.");
  edit_quantity(state, temperature_field(state, "Gas temperature in the bag", "bag-chamber",
                                         bag::kChamberTemperatureRange),
                in.chamber_temperature);
}

// Common practice (domain brief): sessions of 1–2 h, then reassess; descent stays the goal.
void session_reminder(Duration time_in_bag) {
  double in_bag_min = time_in_bag.in(minutes);
  std::string session = in_bag_min < 60.0   ? "Reassess at 60 min (" + duration_text(minutes(60.0 - in_bag_min)) + " to go)."
                        : in_bag_min <= 120.0 ? "Within the common 1\xE2\x80\x93" "2 h session: reassess now."
                                              : "Longer than the common 2 h session: reassess, plan descent.";
  message_line(session, in_bag_min > 120.0);
}

void draw_time_in_bag(AppState& state, const bag::BagResult& r) {
  heading("Time in the bag");
  if (!state.bag.time_entered) {
    message_line("Enter the time in the bag for the session reminder.");
  } else {
    session_reminder(state.bag.time_in_bag);
  }
  for (const std::string& note : r.notes) {
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("%s", note.c_str());
    ImGui::PopTextWrapPos();
  }
}

}  // namespace

void draw_bag_panel(AppState& state, Platform&) {
  const UnitChoice& u = state.settings.units;
  BagInputs& in = state.bag;
  heading("Hyperbaric bag");
  edit_quantity(state, bag_gauge_field(state), in.gauge);
  QuantityField<VolumeFlowDimension> flush = flow_field("Fresh-air flush (inside)", "bag-flush", bag::max_flush_lpm);
  flush.entered = &in.flush_entered;
  edit_quantity(state, flush, in.flush);
  QuantityField<DurationDimension> time = duration_field("Time in the bag so far", "bag-time", 0, BagInputs::kMaxTimeMin);
  time.entered = &in.time_entered;
  edit_quantity(state, time, in.time_in_bag);

  const team_profile::BagSetup& team = state.team.profile.bag;
  bag::Settings settings;
  settings.gauge = in.gauge;
  if (in.flush_entered && in.flush.in(litres_per_minute) > 0.0) settings.flush = in.flush;
  settings.vco2_stpd = in.vco2;
  settings.vo2_stpd = in.vo2;
  settings.chamber_temperature = in.chamber_temperature;
  settings.co2_limit = team.co2_limit;
  settings.stroke_volume = team.pump_stroke_volume;
  settings.where = situation_latitude_month(state);  // the same atmosphere both ways
  Result<bag::BagResult> result = Error{""};
  if (state.situation.source == PressureSource::Altitude) {
    // An altitude nobody entered gives no figure and no verdict (situation_altitude says so).
    Result<Length> here = situation_altitude(state);
    result = here ? bag::bag_at_altitude(here.value(), state.settings.model, settings)
                  : Result<bag::BagResult>(here.error());
  } else {
    Result<Pressure> pb = situation_pressure(state);
    result = pb ? bag::bag_at_pressure(pb.value(), state.settings.model, settings) : Result<bag::BagResult>(pb.error());
  }
  if (!result) {
    result_error(state.display, "Equivalent altitude", result.error().message);
    draw_casualty_fields(state);
    caution_line(state);
    return;
  }
  const bag::BagResult& r = result.value();
  draw_verdict(state, r);
  result_value(state.display, "Pressure inside", pressure_text(r.inside_pressure, u) + ", gauge " + gauge_text(in.gauge, u), false);
  result_value(state.display, "PiO2 outside \xE2\x86\x92 inside",
               gas_pressure_text(r.pio2_ambient, u) + " \xE2\x86\x92 " +
                   (in.flush_entered ? gas_pressure_text(r.pio2_inside, u) : std::string("enter a flush")),
               false);
  draw_ladder(state, r);
  draw_gas(state, r, settings);
  draw_casualty_fields(state);
  draw_time_in_bag(state, r);
  caution_line(state);
}

}  // namespace firn::ui
