// Screen "Curve": the oxygen–haemoglobin dissociation curve (Severinghaus 1979), the standard
// curve and the casualty's shifted one (alkalosis of altitude from the cascade, field P50 for
// acute / acclimatised), with the casualty's point: the measured SpO2, or the expected middle.
#include "ui/panels.hpp"

#include "model/dissociation.hpp"
#include "model/expected_spo2.hpp"
#include "ui/format.hpp"
#include "ui/plot.hpp"
#include "ui/situation.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;

std::vector<PlotPoint> sample(const dissociation::Curve& curve) {
  std::vector<PlotPoint> points;
  for (double po2 = 0; po2 <= 120.0; po2 += 2.0) {
    points.push_back({po2, curve.saturation(mmhg(po2)).in(percent)});
  }
  return points;
}

}  // namespace

void draw_curve_panel(AppState& state, Platform&) {
  const UnitChoice& u = state.settings.units;
  heading("Oxygen\xE2\x80\x93haemoglobin dissociation (Severinghaus 1979)");
  Result<expected_spo2::Expectation> e = situation_expectation(state);
  if (!e) {
    result_error(state.display, "Casualty's curve", e.error().message);
    caution_line(state);
    return;
  }
  const cascade::CascadePath& mid = e->cascade.middle;
  dissociation::CurveShift shift;
  shift.ph = mid.acid_base.ph;
  shift.base_excess_mmol_l = mid.acid_base.base_excess_mmol_l;
  shift.p50 = expected_spo2::field_p50(situation_acclimatisation(state));
  Result<dissociation::Curve> shifted = dissociation::make_curve(shift);
  dissociation::Curve standard = dissociation::Curve::standard();

  bool measured = state.situation.spo2_measured;
  Fraction spo2 = measured ? state.situation.spo2 : e->band.mid;
  std::string summary = shifted ? "P50 " + gas_pressure_text(shifted->p50(), u) + " shifted, standard " +
                                      gas_pressure_text(standard.p50(), u)
                                : "standard curve only";
  Plot plot = begin_plot(state.display, "Dissociation curve", summary, 16.0f,
                         {0, 120, 0, 100, 20, 20, "PO2, mmHg", "saturation, %"});
  plot_line(plot, sample(standard), plot_colour(state.display, PlotColour::Dim), 0.1f);
  if (shifted) plot_line(plot, sample(shifted.value()), plot_colour(state.display, PlotColour::Accent), 0.18f);
  if (shifted) {
    double po2 = shifted->po2_for(spo2).in(mmhg);
    plot_point(plot, {po2, spo2.in(percent)}, plot_colour(state.display, PlotColour::Danger),
               (measured ? "measured " : "expected ") + percent_text(spo2));
  }
  plot_legend({{plot_colour(state.display, PlotColour::Accent), "casualty's curve (altitude shift)"},
                      {plot_colour(state.display, PlotColour::Dim), "standard curve (37 \xC2\xB0" "C, pH 7.40)"}});
  time_unknown_note(state);

  if (!shifted) {
    message_line(shifted.error().message, true);
  } else {
    std::string label = measured ? "PaO2 implied by the measured SpO2" : "PaO2 at the expected SpO2";
    result_value(state.display, label.c_str(), gas_pressure_text(shifted->po2_for(spo2), u));
    result_value(state.display, "Same SpO2 on the standard curve", gas_pressure_text(standard.po2_for(spo2), u), false);
    result_value(state.display, "P50 shifted / standard",
                 gas_pressure_text(shifted->p50(), u) + " / " + gas_pressure_text(standard.p50(), u), false);
    result_value(state.display, "pH (expected, compensated)", shown_number(mid.acid_base.ph, 2), false);
  }
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextDisabled("%s", "On the steep part of the curve a small fall in PaO2 costs a lot of "
                      "saturation; oximeters are unreliable below 80 %.");
  ImGui::PopTextWrapPos();
  caution_line(state);
}

}  // namespace firn::ui
