// Plots drawn with ImDrawList (no plotting library is packaged): axes with round ticks, lines,
// filled bands, points, reference lines. Coordinates are data units; sizes in em.
#pragma once

#include <imgui.h>

#include <string>
#include <vector>

#include "ui/theme.hpp"

namespace firn::ui {

struct PlotPoint {
  double x, y;
};

struct PlotAxes {
  double x0, x1, y0, y1;
  double x_tick, y_tick;  // spacing of labelled grid lines
  std::string x_label, y_label;
};

// The drawing area of one plot for this frame.
struct Plot {
  ImDrawList* draw = nullptr;
  ImVec2 min, max;  // data area in screen pixels
  PlotAxes axes;
  ImVec2 at(double x, double y) const;
};

enum class PlotColour { Text, Dim, Accent, Warning, Danger, Grid };
ImU32 plot_colour(const DisplayMetrics& display, PlotColour colour, float alpha = 1.0f);

// Reserves `height_em` of the current column and draws frame, grid and tick labels. `label` is
// the test-hook name; `summary` the text recorded with it (what the plot shows, in words).
Plot begin_plot(const DisplayMetrics& display, const char* label, const std::string& summary,
                float height_em, const PlotAxes& axes);

void plot_line(const Plot& plot, const std::vector<PlotPoint>& points, ImU32 colour,
               float thickness_em = 0.15f);
// Fills between `lower` and `upper` (same x samples).
void plot_band(const Plot& plot, const std::vector<PlotPoint>& lower,
               const std::vector<PlotPoint>& upper, ImU32 colour);
void plot_point(const Plot& plot, PlotPoint p, ImU32 colour, const std::string& label = {},
                float radius_em = 0.4f);
// Where a horizontal line's label goes: above it at the right end, or below it at the left
// (where a curve falling to the right leaves room).
enum class LineLabel { AboveRight, BelowLeft };
void plot_hline(const Plot& plot, double y, ImU32 colour, const std::string& label = {},
                LineLabel place = LineLabel::AboveRight);
void plot_vline(const Plot& plot, double x, ImU32 colour, const std::string& label = {});
void plot_text(const Plot& plot, PlotPoint p, ImU32 colour, const std::string& text);
// A legend row: coloured swatch + text, one per entry, under the plot.
void plot_legend(const std::vector<std::pair<ImU32, std::string>>& entries);

}  // namespace firn::ui
