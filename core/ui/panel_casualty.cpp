// Screen "Casualty": who the casualty is (measured SpO2, acute or acclimatised, air or oxygen
// by device and flow), the SpO2 band a healthy lowlander would show here, where the measured
// value sits against it (the gap), and the cautions: oximeter error below 80 %, hypoxaemia out of
// proportion (HAPE suspicion). Plot: the expected band against altitude with the measured point.
#include "ui/panels.hpp"

#include <algorithm>

#include "model/atmosphere.hpp"
#include "model/expected_spo2.hpp"
#include "model/supplemental_oxygen.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/plot.hpp"
#include "ui/situation.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;
namespace o2 = supplemental_oxygen;

std::string band_text(const expected_spo2::Band& band) {
  return shown_number(band.low.in(percent), 0) + "\xE2\x80\x93" + shown_number(band.high.in(percent), 0) + " %";
}

void draw_who(AppState& state) {
  Situation& s = state.situation;
  heading("Casualty");
  toggle_row(state, "spo2-known", "No SpO2 reading", "SpO2 measured", &s.spo2_measured);
  if (s.spo2_measured) {
    edit_quantity(state, percent_field("Measured SpO2", "spo2", "SpO2", 30, 100), s.spo2);
  }
  toggle_row(state, "exposure", "Acute (hours\xE2\x80\x93" "2 days)", "Acclimatised", &s.acclimatised);
  toggle_row(state, "breathing", "Room air", "On oxygen", &s.on_oxygen);
  if (s.on_oxygen) {
    const char* devices[] = {"Cannula", "Mask", "Non-rebreather"};
    if (choice_row(state, "device", devices, 3, &s.oxygen_device)) {
      // Keep the flow inside the new device's range rather than showing an error at once.
      o2::FlowRange range = o2::valid_flows(situation_device(state));
      s.oxygen_flow = std::clamp(s.oxygen_flow, range.low, range.high);
    }
    o2::FlowRange range = o2::valid_flows(situation_device(state));
    QuantityField<VolumeFlowDimension> f = flow_field("Oxygen flow", "o2-flow", range.high.in(litres_per_minute));
    f.low = range.low;
    edit_quantity(state, f, s.oxygen_flow);
  }
}

void draw_band_plot(const AppState& state, const expected_spo2::Band& here_band) {
  const UnitChoice& u = state.settings.units;
  bool feet = u.altitude == UnitChoice::Altitude::Feet;
  const Unit<LengthDimension>& unit = feet ? units::feet : metres;
  Result<Fraction> fio2 = situation_fio2(state);
  std::vector<PlotPoint> low, high;
  for (double m = 0; m <= 7000; m += 250) {
    Result<Pressure> pb = atmosphere::pressure_at(metres(m), state.settings.model);
    if (!pb || !fio2) continue;
    Result<expected_spo2::Expectation> e = expected_spo2::expected(pb.value(), situation_exposure(state), fio2.value());
    if (!e) continue;
    low.push_back({metres(m).in(unit), e->band.low.in(percent)});
    high.push_back({metres(m).in(unit), e->band.high.in(percent)});
  }
  Result<Length> altitude = situation_altitude(state);
  std::string summary = "expected band " + band_text(here_band);
  Plot plot = begin_plot(state, "Expected SpO2 plot", summary, 13.0f,
                         {0, metres(7000).in(unit), 50, 100, feet ? 5000.0 : 1000.0, 10,
                          "altitude, " + std::string(unit.symbol), "SpO2, %"});
  plot_band(plot, low, high, plot_colour(state, PlotColour::Accent, 0.35f));
  plot_line(plot, low, plot_colour(state, PlotColour::Accent), 0.08f);
  plot_line(plot, high, plot_colour(state, PlotColour::Accent), 0.08f);
  plot_hline(plot, 80, plot_colour(state, PlotColour::Dim), "unreliable below 80 %",
             LineLabel::BelowLeft);
  if (altitude) {
    double x = altitude->in(unit);
    plot_vline(plot, x, plot_colour(state, PlotColour::Dim));
    if (state.situation.spo2_measured) {
      plot_point(plot, {x, state.situation.spo2.in(percent)}, plot_colour(state, PlotColour::Danger),
                 "measured " + percent_text(state.situation.spo2));
    }
  }
}

}  // namespace

void draw_casualty_panel(AppState& state, Platform&) {
  draw_who(state);
  const Situation& s = state.situation;
  heading("Expected for a healthy lowlander here");
  Result<expected_spo2::Expectation> expectation = situation_expectation(state);
  if (!expectation) {
    result_error(state, "Expected SpO2", expectation.error().message);
    caution_line(state);
    return;
  }
  const expected_spo2::Band& band = expectation->band;
  result_value(state, "Expected SpO2", band_text(band));
  result_value(state, "Middle of the band", percent_text(band.mid), false);
  if (s.on_oxygen) {
    Result<Fraction> fio2 = situation_fio2(state);
    result_value(state, "FiO2 (rule of thumb)", fio2 ? percent_text(fio2.value()) : "\xE2\x80\x94", false);
    ImGui::PushTextWrapPos(0.0f);
    ImGui::TextDisabled("%s", std::string(o2::kRuleOfThumbNote).c_str());
    ImGui::PopTextWrapPos();
  }
  if (expectation->extrapolated) {
    message_line(state, "Beyond the altitudes the field data cover: the band is extrapolated.", true);
  }

  if (s.spo2_measured) {
    Result<expected_spo2::Assessment> a = expected_spo2::assess(s.spo2, band);
    if (a) {
      std::string position;
      switch (a->position) {
        case expected_spo2::Position::WellBelow: position = "Well below the band"; break;
        case expected_spo2::Position::Below: position = "Below the band (within oximeter error)"; break;
        case expected_spo2::Position::Within: position = "Within the band"; break;
        case expected_spo2::Position::Above: position = "Above the band"; break;
      }
      result_value(state, "Measured vs expected", position);
      std::string gap = a->gap_points == 0.0 ? "0 points"
                                             : (a->gap_points > 0 ? "+" : "\xE2\x88\x92") +
                                                   shown_number(std::abs(a->gap_points), 0) + " points";
      result_value(state, "Gap to the band", gap, false);
      if (a->hape_suspected) {
        message_line(state, "Hypoxaemia out of proportion to altitude: consider HAPE. Check signs, "
                            "give oxygen, descend.", true);
      }
      for (std::string_view c : a->cautions) message_line(state, std::string(c), true);
    } else {
      message_line(state, a.error().message, true);
    }
  } else {
    message_line(state, "Enter the measured SpO2 to compare it with the band.");
  }
  if (!s.on_oxygen) {
    Result<Pressure> pb = situation_pressure(state);
    Result<o2::FlowForTarget> flow =
        pb ? o2::lowest_flow_for_target(pb.value(), situation_exposure(state), situation_device(state))
           : Result<o2::FlowForTarget>(pb.error());
    std::string label = "Flow for SpO2 > 90 % (" + std::string(o2::device_name(situation_device(state))) + ")";
    std::string text = !flow ? std::string("\xE2\x80\x94")
                       : flow->reached_on_air ? std::string("reached on air")
                       : flow->reachable      ? flow_text(flow->flow)
                                              : "not reached (max " + flow_text(flow->flow) + ")";
    result_value(state, label.c_str(), text, false);
  }
  draw_band_plot(state, band);
  caution_line(state);
}

}  // namespace firn::ui
