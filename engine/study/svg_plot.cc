#include "engine/study/svg_plot.h"

#include <algorithm>
#include <cmath>
#include <iterator>

#include <fmt/format.h>

#include "engine/report/number_format.h"
#include "engine/report/xml_escape.h"

namespace calctrail {

namespace {

constexpr double kWidth = 720, kLeft = 80, kRight = 160, kTop = 40, kPanel = 220, kGap = 50, kBottom = 50;
const char* const kColours[] = {"#1f77b4", "#ff7f0e", "#2ca02c", "#9467bd", "#8c564b",
                                "#e377c2", "#7f7f7f", "#bcbd22", "#17becf", "#d62728"};

std::string tick(double v) {
  return formatNumber(v, 3);
}

struct Axis {
  double lo = 0, hi = 1;
  bool log = false;
  double map(double v, double a, double b) const {  // v to pixels between a and b
    const double t =
        log ? (std::log10(v) - std::log10(lo)) / (std::log10(hi) - std::log10(lo)) : (v - lo) / (hi - lo);
    return a + (b - a) * t;
  }
};

void fitAxis(Axis* axis) {
  if (!(axis->hi > axis->lo)) {  // one value, or none
    const double pad = axis->lo == 0 ? 1 : std::fabs(axis->lo) * 0.05;
    axis->lo -= pad;
    axis->hi += pad;
  }
}

}  // namespace

std::vector<double> niceTicks(double lo, double hi, int count) {
  std::vector<double> out;
  if (!(hi > lo) || !std::isfinite(lo) || !std::isfinite(hi)) return out;
  const double raw = (hi - lo) / std::max(1, count);
  const double mag = std::pow(10.0, std::floor(std::log10(raw)));
  double step = mag;
  for (double m : {1.0, 2.0, 5.0, 10.0})
    if (m * mag >= raw) {
      step = m * mag;
      break;
    }
  for (double v = std::ceil(lo / step) * step; v <= hi + step * 1e-9; v += step)
    out.push_back(std::fabs(v) < step * 1e-9 ? 0.0 : v);
  return out;
}

std::string renderSvg(const LinePlot& plot) {
  fmt::memory_buffer out;
  auto it = std::back_inserter(out);
  const double plot_w = kWidth - kLeft - kRight;
  const double n = static_cast<double>(std::max<size_t>(1, plot.panels.size()));
  const double height = kTop + n * kPanel + (n - 1) * kGap + kBottom;
  fmt::format_to(it,
                 "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{}\" height=\"{}\" viewBox=\"0 0 {} {}\" "
                 "font-family=\"sans-serif\" font-size=\"12\">\n",
                 kWidth, height, kWidth, height);
  fmt::format_to(it, "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n");
  fmt::format_to(it, "<text x=\"{}\" y=\"22\" font-size=\"14\">{}</text>\n", kLeft, escapeXml(plot.title));

  Axis x;
  x.log = plot.log_x;
  bool any = false;
  for (const PlotPanel& p : plot.panels)
    for (const PlotLine& l : p.lines)
      for (double v : l.x) {
        if (!std::isfinite(v) || (x.log && v <= 0)) continue;
        x.lo = any ? std::min(x.lo, v) : v;
        x.hi = any ? std::max(x.hi, v) : v;
        any = true;
      }
  fitAxis(&x);
  const double x0 = kLeft, x1 = kLeft + plot_w;

  for (size_t pi = 0; pi < plot.panels.size(); ++pi) {
    const PlotPanel& panel = plot.panels[pi];
    const double top = kTop + static_cast<double>(pi) * (kPanel + kGap), bottom = top + kPanel;
    Axis y;
    bool seen = false;
    for (const PlotLine& l : panel.lines)
      for (double v : l.y) {
        if (!std::isfinite(v)) continue;
        y.lo = seen ? std::min(y.lo, v) : v;
        y.hi = seen ? std::max(y.hi, v) : v;
        seen = true;
      }
    fitAxis(&y);
    const std::vector<double> yt = niceTicks(y.lo, y.hi, 5);
    if (!yt.empty()) {  // the axis from tick to tick, so the grid lines frame it
      y.lo = std::min(y.lo, yt.front());
      y.hi = std::max(y.hi, yt.back());
    }
    for (const auto& [a, b] : plot.shaded) {
      const double l = x.map(std::max(a, x.lo), x0, x1), r = x.map(std::min(b, x.hi), x0, x1);
      fmt::format_to(it,
                     "<rect x=\"{:.2f}\" y=\"{:.2f}\" width=\"{:.2f}\" height=\"{:.2f}\" fill=\"#d62728\" "
                     "fill-opacity=\"0.15\"/>\n",
                     l, top, std::max(0.0, r - l), kPanel);
    }
    fmt::format_to(it,
                   "<rect x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\" fill=\"none\" stroke=\"black\"/>\n",
                   x0, top, plot_w, kPanel);
    for (double v : yt) {
      const double py = y.map(v, bottom, top);
      fmt::format_to(it, "<line x1=\"{}\" y1=\"{:.2f}\" x2=\"{}\" y2=\"{:.2f}\" stroke=\"#dddddd\"/>\n", x0,
                     py, x1, py);
      fmt::format_to(it, "<text x=\"{}\" y=\"{:.2f}\" text-anchor=\"end\">{}</text>\n", x0 - 6, py + 4,
                     escapeXml(tick(v)));
    }
    std::vector<double> xt;
    if (x.log) {
      for (double d = std::pow(10.0, std::floor(std::log10(x.lo))); d <= x.hi * (1 + 1e-9); d *= 10)
        for (double m : {1.0, 2.0, 5.0})
          if (m * d >= x.lo * (1 - 1e-9) && m * d <= x.hi * (1 + 1e-9)) xt.push_back(m * d);
    } else {
      xt = niceTicks(x.lo, x.hi, 6);
    }
    for (double v : xt) {
      const double px = x.map(v, x0, x1);
      fmt::format_to(it, "<line x1=\"{:.2f}\" y1=\"{}\" x2=\"{:.2f}\" y2=\"{}\" stroke=\"#dddddd\"/>\n", px,
                     top, px, bottom);
      fmt::format_to(it, "<text x=\"{:.2f}\" y=\"{}\" text-anchor=\"middle\">{}</text>\n", px, bottom + 16,
                     escapeXml(tick(v)));
    }
    fmt::format_to(it,
                   "<text x=\"{}\" y=\"{:.2f}\" text-anchor=\"middle\" transform=\"rotate(-90 {} {:.2f})\">{}"
                   "</text>\n",
                   18, (top + bottom) / 2, 18, (top + bottom) / 2, escapeXml(panel.y_label));
    for (size_t li = 0; li < panel.lines.size(); ++li) {
      const PlotLine& line = panel.lines[li];
      const char* colour = kColours[li % std::size(kColours)];
      std::string path;
      bool pen = false;
      for (size_t k = 0; k < line.x.size(); ++k) {
        if (!std::isfinite(line.y[k]) || !std::isfinite(line.x[k]) || (x.log && line.x[k] <= 0)) {
          pen = false;
          continue;
        }
        path += fmt::format("{}{:.2f},{:.2f} ", pen ? "L" : "M", x.map(line.x[k], x0, x1),
                            y.map(line.y[k], bottom, top));
        pen = true;
      }
      fmt::format_to(it, "<path d=\"{}\" fill=\"none\" stroke=\"{}\" stroke-width=\"1.5\"/>\n", path, colour);
      for (size_t k = 0; k < line.x.size(); ++k) {
        if (k >= line.fails.size() || !line.fails[k] || !std::isfinite(line.y[k])) continue;
        fmt::format_to(it,
                       "<circle cx=\"{:.2f}\" cy=\"{:.2f}\" r=\"3.5\" fill=\"none\" stroke=\"#d62728\"/>\n",
                       x.map(line.x[k], x0, x1), y.map(line.y[k], bottom, top));
      }
      if (!line.label.empty()) {
        const double ly = top + 14 + 16 * static_cast<double>(li);
        fmt::format_to(
            it, "<line x1=\"{}\" y1=\"{:.2f}\" x2=\"{}\" y2=\"{:.2f}\" stroke=\"{}\" stroke-width=\"2\"/>\n",
            x1 + 10, ly - 4, x1 + 28, ly - 4, colour);
        fmt::format_to(it, "<text x=\"{}\" y=\"{:.2f}\">{}</text>\n", x1 + 32, ly, escapeXml(line.label));
      }
    }
    if (pi + 1 == plot.panels.size())
      fmt::format_to(it, "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">{}</text>\n", (x0 + x1) / 2,
                     bottom + 36, escapeXml(plot.x_label));
  }
  if (!plot.shaded_label.empty())
    fmt::format_to(it, "<text x=\"{}\" y=\"{}\" fill=\"#d62728\">{}</text>\n", kLeft + 300, 22,
                   escapeXml(plot.shaded_label));
  fmt::format_to(it, "</svg>\n");
  return fmt::to_string(out);
}

}  // namespace calctrail
