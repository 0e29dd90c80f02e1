#include "ui/plot.hpp"

#include <algorithm>
#include <cmath>

#include "ui/test_hook.hpp"
#include "ui/theme.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

ImVec2 Plot::at(double x, double y) const {
  double fx = (x - axes.x0) / (axes.x1 - axes.x0);
  double fy = (y - axes.y0) / (axes.y1 - axes.y0);
  fx = std::clamp(fx, -0.05, 1.05);  // keep stray values near the frame, never far off-screen
  fy = std::clamp(fy, -0.05, 1.05);
  return ImVec2(min.x + static_cast<float>(fx) * (max.x - min.x),
                max.y - static_cast<float>(fy) * (max.y - min.y));
}

ImU32 plot_colour(const DisplayMetrics& display, PlotColour colour, float alpha) {
  const Palette& p = *display.colours;
  ImVec4 c = p.text;
  switch (colour) {
    case PlotColour::Text: c = p.text; break;
    case PlotColour::Dim: c = p.text_dim; break;
    case PlotColour::Accent: c = p.accent; break;
    case PlotColour::Warning: c = p.warning; break;
    case PlotColour::Danger: c = p.danger; break;
    case PlotColour::Grid: c = p.border; break;
  }
  c.w = alpha;
  return ImGui::ColorConvertFloat4ToU32(c);
}

namespace {
std::string tick_text(double value, double step) {
  int decimals = step >= 1.0 ? 0 : step >= 0.1 ? 1 : 2;
  return shown_number(value, decimals);
}
}  // namespace

Plot begin_plot(const DisplayMetrics& display, const char* label, const std::string& summary,
                float height_em, const PlotAxes& axes) {
  Plot plot;
  plot.axes = axes;
  plot.draw = ImGui::GetWindowDrawList();
  float width = ImGui::GetContentRegionAvail().x;
  ImVec2 origin = ImGui::GetCursorScreenPos();
  float height = height_em * em();
  ImGui::Dummy(ImVec2(width, height));
  test_hook::item_text(label, summary);

  float left = 3.2f * em(), bottom = 2.6f * em(), top = 1.4f * em(), right = 0.8f * em();
  plot.min = ImVec2(origin.x + left, origin.y + top);
  plot.max = ImVec2(origin.x + width - right, origin.y + height - bottom);
  ImU32 grid = plot_colour(display, PlotColour::Grid, 0.6f);
  ImU32 text = plot_colour(display, PlotColour::Dim);
  ImDrawList* d = plot.draw;
  d->AddRect(plot.min, plot.max, plot_colour(display, PlotColour::Grid), 0.0f, 0, 1.0f * display.pixel_ratio);
  // Grid lines on multiples of the tick: round numbers a medic can read off.
  if (axes.x_tick > 0) {
    // On a narrow phone every grid line stays, but only every n-th gets a number, so that
    // numbers never run into each other or off the right edge.
    float widest = std::max(ImGui::CalcTextSize(tick_text(axes.x0, axes.x_tick).c_str()).x,
                            ImGui::CalcTextSize(tick_text(axes.x1, axes.x_tick).c_str()).x);
    float spacing = (plot.max.x - plot.min.x) * static_cast<float>(axes.x_tick / (axes.x1 - axes.x0));
    int every = std::max(1, static_cast<int>(std::ceil((widest + 0.6f * em()) / std::max(spacing, 1.0f))));
    int index = 0;
    for (double x = std::ceil(axes.x0 / axes.x_tick) * axes.x_tick; x <= axes.x1 + 1e-9;
         x += axes.x_tick, ++index) {
      ImVec2 p = plot.at(x, axes.y0);
      d->AddLine(ImVec2(p.x, plot.min.y), ImVec2(p.x, plot.max.y), grid);
      if (index % every != 0) continue;
      std::string t = tick_text(x, axes.x_tick);
      float tw = ImGui::CalcTextSize(t.c_str()).x;
      float tx = std::min(p.x - tw * 0.5f, origin.x + width - tw);
      d->AddText(ImVec2(tx, plot.max.y + 0.2f * em()), text, t.c_str());
    }
  }
  if (axes.y_tick > 0) {
    // Likewise up the side: a short chart (side by side on a projector) numbers every n-th line.
    float spacing = (plot.max.y - plot.min.y) * static_cast<float>(axes.y_tick / (axes.y1 - axes.y0));
    int every = std::max(1, static_cast<int>(std::ceil(1.1f * em() / std::max(spacing, 1.0f))));
    // A divisor of the line count, so the top line keeps its number (0, 50, 100; not 0, 75).
    int lines = static_cast<int>(std::lround((axes.y1 - axes.y0) / axes.y_tick));
    while (lines > 0 && every < lines && lines % every != 0) ++every;
    int index = 0;
    for (double y = std::ceil(axes.y0 / axes.y_tick) * axes.y_tick; y <= axes.y1 + 1e-9;
         y += axes.y_tick, ++index) {
      ImVec2 p = plot.at(axes.x0, y);
      d->AddLine(ImVec2(plot.min.x, p.y), ImVec2(plot.max.x, p.y), grid);
      if (index % every != 0) continue;
      std::string t = tick_text(y, axes.y_tick);
      float tw = ImGui::CalcTextSize(t.c_str()).x;
      d->AddText(ImVec2(plot.min.x - tw - 0.3f * em(), p.y - 0.5f * em()), text, t.c_str());
    }
  }
  float xw = ImGui::CalcTextSize(axes.x_label.c_str()).x;
  d->AddText(ImVec2((plot.min.x + plot.max.x - xw) * 0.5f, plot.max.y + 1.3f * em()), text,
             axes.x_label.c_str());
  d->AddText(ImVec2(origin.x, origin.y), text, axes.y_label.c_str());
  return plot;
}

void plot_line(const Plot& plot, const std::vector<PlotPoint>& points, ImU32 colour,
               float thickness_em) {
  if (points.size() < 2) return;
  std::vector<ImVec2> screen;
  screen.reserve(points.size());
  for (const PlotPoint& p : points) {
    if (std::isfinite(p.x) && std::isfinite(p.y)) screen.push_back(plot.at(p.x, p.y));
  }
  plot.draw->PushClipRect(plot.min, plot.max, true);
  plot.draw->AddPolyline(screen.data(), static_cast<int>(screen.size()), colour, 0,
                         std::max(1.0f, thickness_em * em()));
  plot.draw->PopClipRect();
}

void plot_band(const Plot& plot, const std::vector<PlotPoint>& lower,
               const std::vector<PlotPoint>& upper, ImU32 colour) {
  size_t n = std::min(lower.size(), upper.size());
  plot.draw->PushClipRect(plot.min, plot.max, true);
  // Quads per sample pair: AddConvexPolyFill needs convex shapes and a band is not.
  for (size_t i = 1; i < n; ++i) {
    ImVec2 quad[4] = {plot.at(lower[i - 1].x, lower[i - 1].y), plot.at(lower[i].x, lower[i].y),
                      plot.at(upper[i].x, upper[i].y), plot.at(upper[i - 1].x, upper[i - 1].y)};
    plot.draw->AddConvexPolyFilled(quad, 4, colour);
  }
  plot.draw->PopClipRect();
}

void plot_point(const Plot& plot, PlotPoint p, ImU32 colour, const std::string& label,
                float radius_em) {
  if (!std::isfinite(p.x) || !std::isfinite(p.y)) return;
  ImVec2 c = plot.at(p.x, p.y);
  plot.draw->AddCircleFilled(c, radius_em * em(), colour);
  plot.draw->AddCircle(c, radius_em * em() + 1.0f, ImGui::GetColorU32(ImGuiCol_WindowBg), 0, 2.0f);
  if (!label.empty()) {
    float tw = ImGui::CalcTextSize(label.c_str()).x;
    float x = c.x + 0.6f * em();
    if (x + tw > plot.max.x) x = c.x - 0.6f * em() - tw;  // keep the label inside the plot
    plot.draw->AddText(ImVec2(x, c.y - 1.2f * em()), colour, label.c_str());
  }
}

void plot_hline(const Plot& plot, double y, ImU32 colour, const std::string& label,
                LineLabel place) {
  ImVec2 p = plot.at(plot.axes.x0, y);
  plot.draw->AddLine(ImVec2(plot.min.x, p.y), ImVec2(plot.max.x, p.y), colour, 0.12f * em());
  if (label.empty()) return;
  float tw = ImGui::CalcTextSize(label.c_str()).x;
  ImVec2 at = place == LineLabel::AboveRight
                  ? ImVec2(plot.max.x - tw - 0.3f * em(), p.y - 1.1f * em())
                  : ImVec2(plot.min.x + 0.3f * em(), p.y + 0.2f * em());
  plot.draw->AddText(at, colour, label.c_str());
}

void plot_vline(const Plot& plot, double x, ImU32 colour, const std::string& label) {
  ImVec2 p = plot.at(x, plot.axes.y0);
  plot.draw->AddLine(ImVec2(p.x, plot.min.y), ImVec2(p.x, plot.max.y), colour, 0.1f * em());
  if (label.empty()) return;
  float tw = ImGui::CalcTextSize(label.c_str()).x;
  float text_x = p.x + 0.2f * em();
  if (text_x + tw > plot.max.x) text_x = p.x - 0.2f * em() - tw;  // near the right edge: left of the line
  plot.draw->AddText(ImVec2(text_x, plot.min.y), colour, label.c_str());
}

void plot_text(const Plot& plot, PlotPoint p, ImU32 colour, const std::string& text) {
  ImVec2 at = plot.at(p.x, p.y);
  at.x = std::min(at.x, plot.max.x - ImGui::CalcTextSize(text.c_str()).x);  // never past the right edge
  plot.draw->AddText(at, colour, text.c_str());
}

void plot_legend(const std::vector<std::pair<ImU32, std::string>>& entries) {
  for (size_t i = 0; i < entries.size(); ++i) {
    ImVec2 pos = ImGui::GetCursorScreenPos();
    float s = 0.8f * em();
    ImGui::GetWindowDrawList()->AddRectFilled(ImVec2(pos.x, pos.y + 0.3f * em()),
                                              ImVec2(pos.x + s, pos.y + 0.3f * em() + s),
                                              entries[i].first);
    ImGui::Dummy(ImVec2(s, s));
    ImGui::SameLine();
    ImGui::TextUnformatted(entries[i].second.c_str());
  }
}

}  // namespace firn::ui
