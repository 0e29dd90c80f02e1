// Screen "Teaching": for the training room. One altitude control (sea level to the highest
// summit: drag, ±, arrow keys or a landmark) drives the oxygen cascade PB → PiO2 → PAO2 → PaO2 →
// SaO2 for an acute and an acclimatised lowlander side by side, and their points on the
// dissociation curve. Independent of the situation, so an
// instructor can sweep without touching the casualty's figures.
#include "ui/panels.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>

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

// The charts' heights in em: on a phone their own (the page scrolls); side by side, shared out of
// the height left on screen, never below what keeps their axes readable.
struct ChartHeights {
  float cascade = 12.0f, saturation = 8.0f, curve = 13.0f;
};
ChartHeights fit_charts(float available_em) {
  float spacing = ImGui::GetStyle().ItemSpacing.y / em();
  // Under the two charts: the spacing after each, the legend's two rows, a margin.
  float beside = available_em - 2.0f * spacing - 2.0f * (1.0f + spacing) - 0.5f;
  ChartHeights h;
  h.cascade = std::clamp(beside * 0.6f, 7.0f, 12.0f);
  h.saturation = std::clamp(beside * 0.4f, 5.5f, 8.0f);
  h.curve = std::clamp(available_em - 0.5f, 7.0f, 13.0f);
  return h;
}

struct Landmark {
  const char* name;
  double metres;
};
// Sea level, two places of the demo team's fictional valley (Tarn Hut LZ, Varn Col) and the
// highest summit: heights a class can picture.
constexpr Landmark kLandmarks[] = {{"Sea level", 0.0},
                                   {"Tarn Hut", 3850.0},
                                   {"Varn Col", 4950.0},
                                   {"Everest", TeachingInputs::kTopM}};

void set_teaching_altitude(AppState& state, double m) {
  state.teaching.altitude = metres(std::clamp(m, 0.0, TeachingInputs::kTopM));
}

// Ticks under the slider's track where the landmarks are.
void landmark_ticks(const AppState& state, float grab) {
  ImVec2 lo = ImGui::GetItemRectMin(), hi = ImGui::GetItemRectMax();
  float pad = ImGui::GetStyle().GrabRounding + 2.0f;  // ImGui keeps the grab 2 px off the frame
  float x0 = lo.x + pad + grab * 0.5f, x1 = hi.x - pad - grab * 0.5f;
  ImDrawList* draw = ImGui::GetWindowDrawList();
  for (const Landmark& l : kLandmarks) {
    float x = x0 + (x1 - x0) * static_cast<float>(l.metres / TeachingInputs::kTopM);
    draw->AddLine(ImVec2(x, hi.y - 0.5f * em()), ImVec2(x, hi.y), plot_colour(state.display, PlotColour::Text), 2.0f);
  }
}

// Whether the bands at the teaching altitude lie beyond the field data (either exposure). Asked
// before the slider is drawn, so the tag beside the altitude never lags the panel's figures.
bool extrapolated_at(const AppState& state) {
  Result<Pressure> pb = atmosphere::pressure_at(state.teaching.altitude, state.settings.model);
  if (!pb) return false;
  for (cascade::Exposure exposure : {cascade::Exposure::Acute, cascade::Exposure::Acclimatised}) {
    Result<expected_spo2::Expectation> e = expected_spo2::expected(pb.value(), exposure);
    if (e && e->extrapolated) return true;
  }
  return false;
}

// The landmarks as buttons (a tap jumps there): four across, or two rows of two where four
// would shrink their names (the controls column on a projector).
void landmark_buttons(AppState& state) {
  constexpr int count = static_cast<int>(std::size(kLandmarks));
  float spacing = ImGui::GetStyle().ItemSpacing.x;
  float available = ImGui::GetContentRegionAvail().x;
  int per_row = count;
  for (const Landmark& l : kLandmarks) {
    if (label_fit_scale(l.name, (available - spacing * (count - 1)) / count) < 0.9f) per_row = 2;
  }
  float width = (available - spacing * (per_row - 1)) / per_row;
  float height = std::max(touch_target(state.display), ImGui::GetFrameHeight());
  ImGui::PushID("landmarks");
  for (int i = 0; i < count; ++i) {
    if (i % per_row != 0) ImGui::SameLine();
    if (fitted_button(kLandmarks[i].name, ImVec2(width, height))) {
      set_teaching_altitude(state, kLandmarks[i].metres);
    }
    test_hook::item(kLandmarks[i].name);
  }
  ImGui::PopID();
}

// A slider as tall as a touch target, its grab as wide as a thumb; Left/Right keys move 50 m,
// Page Up/Down 500 m (a projector remote or a laptop in the training room).
void altitude_slider(AppState& state) {
  TeachingInputs& t = state.teaching;
  float value = static_cast<float>(t.slider_metres.value_or(t.altitude.in(metres)));
  float grab = 2.5f * em();
  ImGui::PushStyleVar(ImGuiStyleVar_FramePadding,
                      ImVec2(ImGui::GetStyle().FramePadding.x, std::max(ImGui::GetStyle().FramePadding.y,
                                                                       (touch_target(state.display) - em()) * 0.5f)));
  ImGui::PushStyleVar(ImGuiStyleVar_GrabMinSize, grab);
  // The altitude is written above the slider: on the track the thumb-wide grab would hide it.
  std::string shown = altitude_with_unit(state.teaching.altitude, state.settings.units);
  if (state.display.font_large) ImGui::PushFont(state.display.font_large);
  ImGui::TextUnformatted(shown.c_str());
  if (state.display.font_large) ImGui::PopFont();
  if (extrapolated_at(state)) {  // beside the number the class is looking at, or under it
    float end = ImGui::GetItemRectMax().x + ImGui::GetStyle().ItemSpacing.x +
                ImGui::CalcTextSize("extrapolated").x;
    if (end <= ImGui::GetWindowPos().x + ImGui::GetContentRegionMax().x) ImGui::SameLine();  // the column's edge
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::GetStyleColorVec4(ImGuiCol_PlotHistogram));
    ImGui::TextUnformatted("extrapolated");
    ImGui::PopStyleColor();
    test_hook::item("Teaching extrapolated");
  }
  ImGui::SetNextItemWidth(-1.0f);
  ImGui::SliderFloat("##teach-altitude", &value, 0.0f, static_cast<float>(TeachingInputs::kTopM), "",
                     ImGuiSliderFlags_AlwaysClamp | ImGuiSliderFlags_NoInput |
                         ImGuiSliderFlags_NoRoundToFormat);
  // 50 m steps read cleanly; the top is the summit itself, not 8,850 m.
  auto stepped = [](double m) {
    return m >= TeachingInputs::kTopM - 25.0 ? TeachingInputs::kTopM : std::round(m / 50.0) * 50.0;
  };
  // A thumb that scrolls the page from the slider must not move the altitude: ImGui sets the
  // grab on the press, so the figures follow only a sideways slide, or a tap once released.
  if (ImGui::IsItemActive()) {
    t.slider_metres = value;
    ImVec2 moved = ImGui::GetMouseDragDelta(ImGuiMouseButton_Left, 0.0f);
    if (std::fabs(moved.x) > tap_slop() && std::fabs(moved.x) >= std::fabs(moved.y)) {
      set_teaching_altitude(state, stepped(value));
    }
  } else if (t.slider_metres) {
    if (!state.press_scrolling) set_teaching_altitude(state, stepped(*t.slider_metres));
    t.slider_metres.reset();
  }
  ImGui::PopStyleVar(2);
  landmark_ticks(state, grab);
  test_hook::item_text("Teaching altitude", shown);

  if (!state.keypad.open) {
    double now = state.teaching.altitude.in(metres);
    auto pressed = [](ImGuiKey_ key) { return ImGui::IsKeyPressed(ImGui::GetKeyIndex(key)); };
    if (pressed(ImGuiKey_LeftArrow)) set_teaching_altitude(state, std::ceil(now / 50.0) * 50.0 - 50.0);
    if (pressed(ImGuiKey_RightArrow)) set_teaching_altitude(state, std::floor(now / 50.0) * 50.0 + 50.0);
    if (pressed(ImGuiKey_PageDown)) set_teaching_altitude(state, now - 500.0);
    if (pressed(ImGuiKey_PageUp)) set_teaching_altitude(state, now + 500.0);
  }
  landmark_buttons(state);
}

// Two bars (acute, acclimatised) at `stage` with their values on top.
void draw_bar_pair(const AppState& state, const Plot& plot, int stage, const double (&values)[2],
                   const ImU32 (&colours)[2]) {
  for (int c = 0; c < 2; ++c) {
    double x0 = stage + 0.12 + c * 0.38, x1 = x0 + 0.36;
    plot.draw->AddRectFilled(plot.at(x0, 0), plot.at(x1, values[c]), colours[c]);
    std::string t = shown_number(values[c], 0);
    ImVec2 top = plot.at((x0 + x1) * 0.5, values[c]);
    float tw = ImGui::CalcTextSize(t.c_str()).x;
    plot.draw->AddText(ImVec2(top.x - tw * 0.5f, top.y - 1.2f * em()), plot_colour(state.display, PlotColour::Text), t.c_str());
  }
}

void stage_labels(const AppState& state, const Plot& plot, const char* const* names, int count) {
  for (int stage = 0; stage < count; ++stage) {
    ImVec2 label_at = plot.at(stage + 0.5, 0);
    float tw = ImGui::CalcTextSize(names[stage]).x;
    plot.draw->AddText(ImVec2(label_at.x - tw * 0.5f, label_at.y + 0.3f * em()),
                       plot_colour(state.display, PlotColour::Text), names[stage]);
  }
}

// Pressures on a mmHg axis, and SaO2 in a small chart of its own with a 0–100 % axis: a
// percentage drawn against mmHg would read as a pressure.
void draw_cascade_chart(const AppState& state, const Column (&columns)[2], Pressure pb,
                        const ChartHeights& heights) {
  const UnitChoice& u = state.settings.units;
  ImU32 colours[2] = {plot_colour(state.display, PlotColour::Danger), plot_colour(state.display, PlotColour::Accent)};
  double pressures[3][2] = {};
  double saturation[2] = {};
  for (int c = 0; c < 2; ++c) {
    if (!columns[c].expectation) continue;
    const cascade::Cascade& k = columns[c].expectation->cascade;
    pressures[0][c] = k.inspired.in(mmhg);
    pressures[1][c] = k.middle.alveolar.in(mmhg);
    pressures[2][c] = k.middle.arterial.in(mmhg);
    saturation[c] = columns[c].expectation->band.mid.in(percent);
  }
  Plot plot = begin_plot(state.display, "Cascade chart", "PB " + gas_pressure_text(pb, u), heights.cascade,
                         {0, 3, 0, 160, 0, 20, "", "PO2, mmHg"});
  const char* stages[] = {"PiO2", "PAO2", "PaO2"};
  stage_labels(state, plot, stages, 3);
  for (int stage = 0; stage < 3; ++stage) draw_bar_pair(state, plot, stage, pressures[stage], colours);

  std::string summary = "SaO2 acute " + shown_number(saturation[0], 0) + " %, acclimatised " +
                        shown_number(saturation[1], 0) + " %";
  Plot sat = begin_plot(state.display, "Saturation chart", summary, heights.saturation, {0, 1, 0, 100, 0, 25, "", "SaO2, %"});
  const char* sat_stage[] = {"SaO2"};
  stage_labels(state, sat, sat_stage, 1);
  draw_bar_pair(state, sat, 0, saturation, colours);
  plot_legend({{colours[0], "acute (first hours\xE2\x80\x93" "2 days)"}, {colours[1], "acclimatised"}});
}

void draw_curve(const AppState& state, const Column (&columns)[2], float height_em) {
  Plot plot = begin_plot(state.display, "Teaching curve", "points on the dissociation curve", height_em,
                         {0, 120, 0, 100, 20, 20, "PO2, mmHg", "saturation, %"});
  dissociation::Curve standard = dissociation::Curve::standard();
  std::vector<PlotPoint> line;
  for (double po2 = 0; po2 <= 120; po2 += 2) line.push_back({po2, standard.saturation(mmhg(po2)).in(percent)});
  plot_line(plot, line, plot_colour(state.display, PlotColour::Dim), 0.12f);
  ImU32 colours[2] = {plot_colour(state.display, PlotColour::Danger), plot_colour(state.display, PlotColour::Accent)};
  for (int c = 0; c < 2; ++c) {
    if (!columns[c].expectation) continue;
    const cascade::CascadePath& mid = columns[c].expectation->cascade.middle;
    // Acute label below its point, acclimatised above: the two points sit close together.
    plot_point(plot, {mid.arterial.in(mmhg), mid.sao2.in(percent)}, colours[c], c == 1 ? columns[c].name : "");
    if (c == 0) plot_text(plot, {mid.arterial.in(mmhg) + 2, mid.sao2.in(percent) - 4}, colours[c], columns[c].name);
  }
}

// What the figures rest on: a column the model cannot give, extrapolation.
void draw_column_notes(AppState& state, const Column (&columns)[2]) {
  const UnitChoice& u = state.settings.units;
  for (const Column& c : columns) {
    if (!c.expectation) message_line(std::string(c.name) + ": " + c.expectation.error().message, true);
  }
  bool extrapolated = std::any_of(std::begin(columns), std::end(columns), [](const Column& c) {
    return c.expectation && c.expectation->extrapolated;
  });
  if (extrapolated) {
    message_line("Extrapolated: the field data behind these bands stop at " +
                            altitude_with_unit(metres(expected_spo2::kFieldDataTopM), u) + ".", true);
  }
}

// Each exposure's cascade in one line of text.
void draw_cascade_lines(AppState& state, const Column (&columns)[2]) {
  const UnitChoice& u = state.settings.units;
  for (const Column& c : columns) {
    if (!c.expectation) continue;
    const cascade::CascadePath& mid = c.expectation->cascade.middle;
    std::string label = std::string("Cascade, ") + c.name;
    result_value(state.display, label.c_str(),
                 "PiO2 " + gas_pressure_text(c.expectation->cascade.inspired, u) + " \xE2\x86\x92 PAO2 " +
                     gas_pressure_text(mid.alveolar, u) + " \xE2\x86\x92 PaO2 " + gas_pressure_text(mid.arterial, u) +
                     " \xE2\x86\x92 SaO2 " + percent_text(c.expectation->band.mid),
                 false);
  }
}

}  // namespace

void draw_teaching_panel(AppState& state, Platform&) {
  const UnitChoice& u = state.settings.units;
  heading("Teaching: sweep the altitude");
  // Wide (projector, laptop): controls, cascade and curve in three columns, the charts sized to
  // the height left, so the slider and every chart show at once without scrolling.
  bool wide = ImGui::GetContentRegionAvail().x > 44.0f * em();
  if (wide) {
    ImGui::BeginTable("teaching", 3);
    ImGui::TableSetupColumn("controls", ImGuiTableColumnFlags_WidthStretch, 0.3f);
    ImGui::TableSetupColumn("cascade", ImGuiTableColumnFlags_WidthStretch, 0.35f);
    ImGui::TableSetupColumn("curve", ImGuiTableColumnFlags_WidthStretch, 0.35f);
    ImGui::TableNextColumn();
  }
  float chart_height_em = ImGui::GetContentRegionAvail().y / em();  // from the row's top
  altitude_slider(state);
  QuantityField<LengthDimension> f = altitude_field(state, "Altitude (teaching)", "teach-altitude");
  f.low = metres(0);
  f.high = metres(TeachingInputs::kTopM);
  edit_quantity(state, f, state.teaching.altitude);

  atmosphere::Model model = state.settings.model;
  Result<Pressure> pb = atmosphere::pressure_at(state.teaching.altitude, model);
  if (!pb) {
    result_error(state.display, "PB (teaching)", pb.error().message);
    if (wide) ImGui::EndTable();
    return;
  }
  std::string pb_label = "PB (" + std::string(atmosphere::model_name(model)) + ")";
  result_value(state.display, pb_label.c_str(), gas_pressure_text(pb.value(), u) + " = " + pressure_text(pb.value(), u));
  Column columns[2] = {
      {"acute", expected_spo2::expected(pb.value(), cascade::Exposure::Acute)},
      {"acclimatised", expected_spo2::expected(pb.value(), cascade::Exposure::Acclimatised)}};
  draw_column_notes(state, columns);
  if (wide) draw_cascade_lines(state, columns);  // beside the charts; on a phone, after them

  ChartHeights heights = wide ? fit_charts(chart_height_em) : ChartHeights{};
  if (wide) ImGui::TableNextColumn();
  draw_cascade_chart(state, columns, pb.value(), heights);
  if (wide) ImGui::TableNextColumn();
  draw_curve(state, columns, heights.curve);
  if (wide) ImGui::EndTable();
  if (!wide) draw_cascade_lines(state, columns);
  caution_line(state);
}

}  // namespace firn::ui
