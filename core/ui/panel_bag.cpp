// Screen "Bag": the portable hyperbaric chamber at the situation's pressure — equivalent
// altitude (same atmosphere model inverted), gas inside with a fresh-air flush, the time in the
// bag against the common session length, and an altitude ladder from ambient to equivalent.
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

QuantityField<PressureDimension> bag_gauge_field(const AppState& state) {
  // Bags are labelled in psi or mbar; hPa for those who think in weather units.
  int index = state.settings.units.cylinder == UnitChoice::CylinderPressure::Psi ? 0 : 1;
  return {"Bag pressure (gauge)", "bag-gauge", "bag gauge pressure", {&psi, &millibar, &hectopascals},
          index, millibar(0), millibar(bag::max_gauge_mbar), {0.1, 10.0, 10.0}, index == 0 ? 1 : 0};
}

void draw_ladder(const AppState& state, const bag::BagResult& r) {
  const UnitChoice& u = state.settings.units;
  bool feet = u.altitude == UnitChoice::Altitude::Feet;
  const Unit<LengthDimension>& unit = feet ? units::feet : metres;
  double ambient = r.ambient_altitude.in(unit);
  double equivalent = r.equivalent_altitude ? r.equivalent_altitude->in(unit) : 0.0;
  double top = std::max(1000.0, std::ceil((ambient + (feet ? 2000 : 600)) / (feet ? 2000 : 500)) * (feet ? 2000 : 500));
  std::string summary = "ambient " + altitude_with_unit(r.ambient_altitude, u) + " to equivalent " +
                        (r.equivalent_altitude ? altitude_with_unit(*r.equivalent_altitude, u) : "below sea level");
  Plot plot = begin_plot(state, "Altitude ladder", summary, 14.0f,
                         {0, 1, 0, top, 0, feet ? 2000.0 : 1000.0, "", std::string("altitude, ") + std::string(unit.symbol)});
  ImU32 here = plot_colour(state, PlotColour::Danger);
  ImU32 inside = plot_colour(state, PlotColour::Accent);
  plot_hline(plot, ambient, here, "outside " + altitude_with_unit(r.ambient_altitude, u));
  if (r.equivalent_altitude) {
    plot_hline(plot, equivalent, inside, "in the bag " + altitude_with_unit(*r.equivalent_altitude, u));
    // The arrow: the descent the bag buys.
    ImVec2 from = plot.at(0.3, ambient), to = plot.at(0.3, equivalent);
    plot.draw->AddLine(from, to, inside, 0.25f * em());
    float h = 0.6f * em();
    plot.draw->AddTriangleFilled(ImVec2(to.x - h, to.y - h), ImVec2(to.x + h, to.y - h), ImVec2(to.x, to.y + 0.2f * h), inside);
  }
}

}  // namespace

void draw_bag_panel(AppState& state, Platform&) {
  const UnitChoice& u = state.settings.units;
  BagInputs& in = state.bag;
  heading("Hyperbaric bag");
  edit_quantity(state, bag_gauge_field(state), in.gauge);
  edit_quantity(state, flow_field("Fresh-air flush (inside)", "bag-flush", bag::max_flush_lpm), in.flush);
  edit_quantity(state, duration_field("Time in the bag so far", "bag-time", 0, 600), in.time_in_bag);

  bag::Settings settings;
  settings.gauge = in.gauge;
  if (in.flush.in(litres_per_minute) > 0.0) settings.flush = in.flush;
  Result<bag::BagResult> result = Error{""};
  if (state.situation.source == PressureSource::Altitude) {
    result = bag::bag_at_altitude(state.situation.altitude, state.settings.model, settings);
  } else {
    Result<Pressure> pb = situation_pressure(state);
    result = pb ? bag::bag_at_pressure(pb.value(), state.settings.model, settings) : Result<bag::BagResult>(pb.error());
  }
  if (!result) {
    result_error(state, "Equivalent altitude", result.error().message);
    caution_line(state);
    return;
  }
  const bag::BagResult& r = result.value();
  result_value(state, "Equivalent altitude",
               r.equivalent_altitude ? altitude_with_unit(*r.equivalent_altitude, u) : "below sea level");
  result_value(state, "Descent equivalent",
               r.descent_equivalent ? altitude_with_unit(*r.descent_equivalent, u) : "\xE2\x80\x94", false);
  result_value(state, "Pressure inside", pressure_text(r.inside_pressure, u), false);
  result_value(state, "PiO2 outside \xE2\x86\x92 inside",
               gas_pressure_text(r.pio2_ambient, u) + " \xE2\x86\x92 " + gas_pressure_text(r.pio2_inside, u), false);
  draw_ladder(state, r);

  heading("Gas in the bag");
  if (r.gas) {
    result_value(state, "CO2 inside (steady state)", percent_text(r.gas->co2, 2));
    result_value(state, "O2 inside (steady state)", percent_text(r.gas->o2, 1), false);
    result_value(state, "Bag time constant", duration_text(r.gas->time_constant), false);
    if (r.gas->co2 > units::percent(1.0)) {
      message_line(state, "CO2 above 1 %: pump faster (at least " + flow_text(r.min_flush) + ").", true);
    }
  } else {
    message_line(state, "Enter a flush flow to see CO2 and O2 inside.");
  }
  result_value(state, "Minimum flush for CO2 below 1 %", flow_text(r.min_flush), false);

  heading("Time in the bag");
  double in_bag_min = in.time_in_bag.in(minutes);
  // Common practice (domain brief): sessions of 1–2 h, then reassess; descent stays the goal.
  std::string session = in_bag_min < 60.0   ? "Reassess at 60 min (" + duration_text(minutes(60.0 - in_bag_min)) + " to go)."
                        : in_bag_min <= 120.0 ? "Within the common 1\xE2\x80\x93" "2 h session: reassess now."
                                              : "Longer than the common 2 h session: reassess, plan descent.";
  message_line(state, session, in_bag_min > 120.0);
  for (const std::string& note : r.notes) {
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("%s", note.c_str());
    ImGui::PopTextWrapPos();
  }
  caution_line(state);
}

}  // namespace firn::ui
