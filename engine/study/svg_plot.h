// A line plot in SVG, for sweeps: one panel per result, sharing the x axis,
// each panel with one line per series; x ranges where a check fails shaded,
// and points where one fails marked with a ring. Plain SVG 1.1, no script,
// no external fonts, the same bytes for the same data.
#pragma once

#include <string>
#include <utility>
#include <vector>

namespace calctrail {

struct PlotLine {
  /// The legend text ("n_motor = 1450 rpm"); empty for a panel's only line.
  std::string label;
  /// The points, in the order drawn; a non-finite y breaks the line.
  std::vector<double> x, y;
  /// Per point: some check fails there (drawn as a ring).
  std::vector<char> fails;
};

struct PlotPanel {
  /// The y axis label with its unit ("P_motor [kW]").
  std::string y_label;
  std::vector<PlotLine> lines;
};

struct LinePlot {
  /// Above the panels.
  std::string title;
  /// Below the x axis, under the last panel ("m_load [kg]").
  std::string x_label;
  std::vector<PlotPanel> panels;
  /// x ranges shaded in every panel (where a check fails), and their legend text.
  std::vector<std::pair<double, double>> shaded;
  std::string shaded_label;
  /// Logarithmic x axis.
  bool log_x = false;
};

std::string renderSvg(const LinePlot& plot);

// Up to about `count` round tick values covering [lo, hi] (steps of 1, 2 or 5 times a power of ten).
std::vector<double> niceTicks(double lo, double hi, int count);

}  // namespace calctrail
