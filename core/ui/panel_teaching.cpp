// Screen "Teaching": for the training room. One altitude control (0–8000 m, drag or ±) drives
// the oxygen cascade PB → PiO2 → PAO2 → PaO2 → SaO2 for an acute and an acclimatised lowlander
// side by side, and their points on the dissociation curve. Independent of the situation, so an
// instructor can sweep without touching the casualty's figures.
#include "ui/panels.hpp"

#include <imgui.h>

#include <algorithm>

#include "model/atmosphere.hpp"
#include "model/dissociation.hpp"
#include "model/expected_spo2.hpp"
#include "ui/fields.hpp"
#include "ui/format.hpp"
#include "ui/plot.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;

struct Column {
  const char* name;
  Result<expected_spo2::Expectation> expectation;
};

// A slider as tall as a touch target, its grab as wide as a thumb.
void altitude_slider(AppState& state) {
  float value = static_cast<float>(state.teaching.altitude.in(metres));
  ImGui::PushStyleVar(ImGuiStyleVar_FramePadding,
                      ImVec2(ImGui::GetStyle().FramePadding.x, std::max(ImGui::GetStyle().FramePadding.y,
                                                                       (touch_target(state) - em()) * 0.5f)));
  ImGui::PushStyleVar(ImGuiStyleVar_GrabMinSize, 2.5f * em());
  ImGui::SetNextItemWidth(-1.0f);
  std::string shown = altitude_with_unit(state.teaching.altitude, state.settings.units);
  if (ImGui::SliderFloat("##teach-altitude", &value, 0.0f, 8000.0f, shown.c_str(),
                         ImGuiSliderFlags_AlwaysClamp | ImGuiSliderFlags_NoInput)) {
    state.teaching.altitude = metres(std::round(value / 50.0f) * 50.0);  // 50 m steps read cleanly
  }
  ImGui::PopStyleVar(2);
  test_hook::item_text("Teaching altitude", shown);
}

void draw_cascade_chart(const AppState& state, const Column (&columns)[2], Pressure pb) {
  const UnitChoice& u = state.settings.units;
  Plot plot = begin_plot(state, "Cascade chart",
                         "PB " + gas_pressure_text(pb, u), 15.0f,
                         {0, 4, 0, 160, 0, 20, "", "mmHg (SaO2: %)"});
  const char* stages[] = {"PiO2", "PAO2", "PaO2", "SaO2 %"};
  ImU32 colours[2] = {plot_colour(state, PlotColour::Danger), plot_colour(state, PlotColour::Accent)};
  for (int stage = 0; stage < 4; ++stage) {
    ImVec2 label_at = plot.at(stage + 0.5, 0);
    float tw = ImGui::CalcTextSize(stages[stage]).x;
    plot.draw->AddText(ImVec2(label_at.x - tw * 0.5f, label_at.y + 0.3f * em()),
                       plot_colour(state, PlotColour::Text), stages[stage]);
  }
  for (int c = 0; c < 2; ++c) {
    if (!columns[c].expectation) continue;
    const cascade::Cascade& k = columns[c].expectation->cascade;
    // SaO2 plotted on the same 0–160 scale as percent (×1.6): read the number on the bar.
    double values[4] = {k.inspired.in(mmhg), k.middle.alveolar.in(mmhg), k.middle.arterial.in(mmhg),
                        columns[c].expectation->band.mid.in(percent)};
    for (int stage = 0; stage < 4; ++stage) {
      double x0 = stage + 0.12 + c * 0.38, x1 = x0 + 0.36;
      double y = stage == 3 ? values[stage] * 1.6 : values[stage];
      plot.draw->AddRectFilled(plot.at(x0, 0), plot.at(x1, y), colours[c]);
      std::string t = shown_number(values[stage], 0);
      ImVec2 top = plot.at((x0 + x1) * 0.5, y);
      float tw = ImGui::CalcTextSize(t.c_str()).x;
      plot.draw->AddText(ImVec2(top.x - tw * 0.5f, top.y - 1.2f * em()), plot_colour(state, PlotColour::Text), t.c_str());
    }
  }
  plot_legend(state, {{colours[0], "acute (first hours\xE2\x80\x93" "2 days)"}, {colours[1], "acclimatised"}});
}

void draw_curve(const AppState& state, const Column (&columns)[2]) {
  Plot plot = begin_plot(state, "Teaching curve", "points on the dissociation curve", 13.0f,
                         {0, 120, 0, 100, 20, 20, "PO2, mmHg", "saturation, %"});
  dissociation::Curve standard = dissociation::Curve::standard();
  std::vector<PlotPoint> line;
  for (double po2 = 0; po2 <= 120; po2 += 2) line.push_back({po2, standard.saturation(mmhg(po2)).in(percent)});
  plot_line(plot, line, plot_colour(state, PlotColour::Dim), 0.12f);
  ImU32 colours[2] = {plot_colour(state, PlotColour::Danger), plot_colour(state, PlotColour::Accent)};
  for (int c = 0; c < 2; ++c) {
    if (!columns[c].expectation) continue;
    const cascade::CascadePath& mid = columns[c].expectation->cascade.middle;
    // Acute label below its point, acclimatised above: the two points sit close together.
    plot_point(plot, {mid.arterial.in(mmhg), mid.sao2.in(percent)}, colours[c], c == 1 ? columns[c].name : "");
    if (c == 0) plot_text(plot, {mid.arterial.in(mmhg) + 2, mid.sao2.in(percent) - 4}, colours[c], columns[c].name);
  }
}

}  // namespace

void draw_teaching_panel(AppState& state, Platform&) {
  const UnitChoice& u = state.settings.units;
  heading("Teaching: sweep the altitude");
  altitude_slider(state);
  QuantityField<LengthDimension> f = altitude_field(state, "Altitude (teaching)", "teach-altitude");
  f.low = metres(0);
  f.high = metres(8000);
  edit_quantity(state, f, state.teaching.altitude);

  atmosphere::Model model = state.settings.model;
  Result<Pressure> pb = atmosphere::pressure_at(state.teaching.altitude, model);
  if (!pb) {
    result_error(state, "PB (teaching)", pb.error().message);
    return;
  }
  std::string pb_label = "PB (" + std::string(atmosphere::model_name(model)) + ")";
  result_value(state, pb_label.c_str(), gas_pressure_text(pb.value(), u) + " = " + pressure_text(pb.value(), u));
  Column columns[2] = {
      {"acute", expected_spo2::expected(pb.value(), cascade::Exposure::Acute)},
      {"acclimatised", expected_spo2::expected(pb.value(), cascade::Exposure::Acclimatised)}};
  for (const Column& c : columns) {
    if (!c.expectation) message_line(state, std::string(c.name) + ": " + c.expectation.error().message, true);
  }
  // Wide screens (projector): chart and curve side by side.
  bool side_by_side = ImGui::GetContentRegionAvail().x > 50.0f * em();
  if (side_by_side) {
    ImGui::BeginTable("teaching", 2);
    ImGui::TableNextColumn();
  }
  draw_cascade_chart(state, columns, pb.value());
  if (side_by_side) ImGui::TableNextColumn();
  draw_curve(state, columns);
  if (side_by_side) ImGui::EndTable();
  for (const Column& c : columns) {
    if (!c.expectation) continue;
    const cascade::CascadePath& mid = c.expectation->cascade.middle;
    std::string label = std::string("Cascade, ") + c.name;
    result_value(state, label.c_str(),
                 "PiO2 " + gas_pressure_text(c.expectation->cascade.inspired, u) + " \xE2\x86\x92 PAO2 " +
                     gas_pressure_text(mid.alveolar, u) + " \xE2\x86\x92 PaO2 " + gas_pressure_text(mid.arterial, u) +
                     " \xE2\x86\x92 SaO2 " + percent_text(c.expectation->band.mid),
                 false);
  }
  caution_line(state);
}

}  // namespace firn::ui
