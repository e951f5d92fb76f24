#include "engine/study/study_render.h"

#include <algorithm>
#include <cmath>
#include <iterator>
#include <map>

#include <fmt/format.h>

#include "engine/report/number_format.h"
#include "engine/study/series.h"
#include "engine/study/svg_plot.h"
#include "engine/util/json_writer.h"
#include "engine/util/text_width.h"

namespace calctrail {

namespace {

std::string shown(double si, const Unit& u, int digits) {
  return std::isfinite(si) ? formatQuantity(si, u, digits) : std::string("(no value)");
}

std::string header(const std::string& name, const Unit& u) {
  return u.text == "1" ? name : name + " [" + u.text + "]";
}

// {"value": .., "unit": "mm", "si": ..}
void quantity(JsonWriter& w, double si, const Unit& u) {
  w.beginObject();
  w.key("value").value(u.fromSI(si));
  w.key("unit").value(u.text);
  w.key("si").value(si);
  w.endObject();
}

void sourceJson(JsonWriter& w, const std::string& study, const std::string& path, const std::string& sha,
                const std::vector<std::string>& sets) {
  w.key("study").value(study);
  w.key("sheet").beginObject();
  w.key("path").value(path);
  w.key("sha256").value(sha);
  w.endObject();
  w.key("set").beginArray();
  for (const std::string& s : sets) w.value(s);
  w.endArray();
}

std::string sourceText(const std::string& path, const std::string& sha,
                       const std::vector<std::string>& sets) {
  std::string s = path + " (SHA-256 " + sha + ")\n";
  if (!sets.empty()) {
    s += "CHANGED BY --set for this run (the hash alone does not identify these numbers):";
    for (const std::string& x : sets) s += " \"" + x + "\"";
    s += "\n";
  }
  return s;
}

std::string stateText(signed char s) {
  return s < 0 ? "-" : s ? "pass" : "FAIL";
}

// A table of cells: columns right-aligned where `right` says, two spaces apart.
std::string table(const std::vector<std::vector<std::string>>& rows, const std::vector<char>& right) {
  std::vector<size_t> width;  // in columns on the screen: N·m is 3 wide, 4 bytes
  for (const auto& r : rows)
    for (size_t c = 0; c < r.size(); ++c) {
      if (width.size() <= c) width.push_back(0);
      width[c] = std::max(width[c], static_cast<size_t>(displayWidth(r[c])));
    }
  fmt::memory_buffer out;
  auto it = std::back_inserter(out);
  for (const auto& r : rows) {
    std::string line;
    for (size_t c = 0; c < r.size(); ++c) {
      const std::string pad(width[c] - static_cast<size_t>(displayWidth(r[c])), ' ');
      line += "  " + (c < right.size() && right[c] ? pad + r[c] : r[c] + pad);
    }
    while (!line.empty() && line.back() == ' ') line.pop_back();
    fmt::format_to(it, "{}\n", line);
  }
  return fmt::to_string(out);
}

std::string csvCell(const std::string& s) {
  if (s.find_first_of(",\"\n") == std::string::npos) return s;
  std::string q = "\"";
  for (char c : s) q += c == '"' ? std::string("\"\"") : std::string(1, c);
  return q + "\"";
}

std::string pointName(const SweepTable& t, size_t p, int digits) {
  std::string s;
  for (size_t j = 0; j < t.vary.size(); ++j)
    s += (j ? ", " : "") + t.vary[j].name + " = " + shown(t.input(p, j), t.vary[j].unit, digits);
  return s;
}

}  // namespace

void writeStudyQuantity(JsonWriter& w, double si, const Unit& u) { quantity(w, si, u); }

void writeSweepPointMembers(JsonWriter& w, const SweepTable& t, size_t p) {
  w.key("inputs").beginObject();
  for (size_t j = 0; j < t.vary.size(); ++j) {
    w.key(t.vary[j].name);
    quantity(w, t.input(p, j), t.vary[j].unit);
  }
  w.endObject();
  w.key("results").beginObject();
  for (size_t j = 0; j < t.show.size(); ++j) {
    w.key(t.show[j].name);
    quantity(w, t.result(p, j), t.show[j].unit);
  }
  w.endObject();
  w.key("checks").beginObject();
  for (size_t k = 0; k < t.checks.size(); ++k) {
    w.key(t.checks[k]);
    if (t.check(p, k) < 0)
      w.null();
    else
      w.value(t.check(p, k) == 1);
  }
  w.endObject();
  w.key("error");
  if (t.failed(p))
    w.value(t.faults[p].message);
  else
    w.null();
}

void writePickCandidateMembers(JsonWriter& w, const PickCandidate& c, const Unit& u) {
  w.key("value").value(u.fromSI(c.value));
  w.key("unit").value(u.text);
  w.key("si").value(c.value);
  w.key("passed").value(c.passed);
  w.key("failed").beginArray();
  for (const std::string& f : c.failed) w.value(f);
  w.endArray();
  w.key("error");
  if (c.error.empty())
    w.null();
  else
    w.value(c.error);
}

std::string sourceLines(const StudySource& src) {
  return sourceText(src.path, src.sha256, src.sets);
}

// ---------------------------------------------------------------------------
// Sweep

std::string renderSweepText(const SweepTable& t, int digits) {
  std::string out = "Sweep of " + sourceText(t.sheet_path, t.sheet_sha256, t.sets);
  std::string what;
  for (size_t j = 0; j < t.vary.size(); ++j)
    what += (j ? " by " : "") + t.vary[j].name + " (" + std::to_string(t.grid[j]) + " values)";
  out += fmt::format("{} point{}: {}", t.totalPoints(), t.totalPoints() == 1 ? "" : "s", what);
  if (t.shards > 1) out += fmt::format("; shard {} of {}: {} points", t.shard, t.shards, t.size());
  out += "\n\n";
  std::vector<std::vector<std::string>> rows(1);
  std::vector<char> right;
  for (const SweepColumn& c : t.vary) rows[0].push_back(header(c.name, c.unit)), right.push_back(1);
  for (const SweepColumn& c : t.show) rows[0].push_back(header(c.name, c.unit)), right.push_back(1);
  for (const std::string& c : t.checks) rows[0].push_back(c), right.push_back(0);
  std::vector<int> fails(t.checks.size(), 0);
  int failing_points = 0;
  for (size_t p = 0; p < t.size(); ++p) {
    std::vector<std::string> r;
    for (size_t j = 0; j < t.vary.size(); ++j)
      r.push_back(formatNumber(t.vary[j].unit.fromSI(t.input(p, j)), digits));
    for (size_t j = 0; j < t.show.size(); ++j) {
      const double v = t.result(p, j);
      r.push_back(std::isfinite(v) ? formatNumber(t.show[j].unit.fromSI(v), digits) : "-");
    }
    bool any = false;
    for (size_t k = 0; k < t.checks.size(); ++k) {
      r.push_back(stateText(t.check(p, k)));
      if (t.check(p, k) == 0) ++fails[k], any = true;
    }
    failing_points += any;
    rows.push_back(std::move(r));
  }
  out += table(rows, right);
  std::string failed;
  for (size_t k = 0; k < t.checks.size(); ++k)
    if (fails[k]) failed += fmt::format("{}{} ({})", failed.empty() ? "" : ", ", t.checks[k], fails[k]);
  out += "\n";
  if (failed.empty())
    out += "Every check passes at every point calculated.\n";
  else
    out += fmt::format("A check fails at {} of {} points: {}.\n", failing_points, t.size(), failed);
  for (size_t p = 0; p < t.size(); ++p)
    if (t.failed(p)) out += "At " + pointName(t, p, digits) + ": error: " + t.faults[p].message + "\n";
  return out;
}

std::string renderSweepCsv(const SweepTable& t) {
  std::string out;
  std::vector<std::string> head;
  for (const SweepColumn& c : t.vary) head.push_back(header(c.name, c.unit));
  for (const SweepColumn& c : t.show) head.push_back(header(c.name, c.unit));
  for (const std::string& c : t.checks) head.push_back(c);
  head.push_back("error");
  for (size_t i = 0; i < head.size(); ++i) out += (i ? "," : "") + csvCell(head[i]);
  out += "\n";
  for (size_t p = 0; p < t.size(); ++p) {
    std::string line;
    for (size_t j = 0; j < t.vary.size(); ++j)
      line += formatExact(t.vary[j].unit.fromSI(t.input(p, j))) + ",";
    for (size_t j = 0; j < t.show.size(); ++j) {
      const double v = t.result(p, j);
      line += (std::isfinite(v) ? formatExact(t.show[j].unit.fromSI(v)) : std::string()) + ",";
    }
    for (size_t k = 0; k < t.checks.size(); ++k) {
      const signed char s = t.check(p, k);
      line += std::string(s < 0 ? "" : s ? "pass" : "fail") + ",";
    }
    line += csvCell(t.faults[p].message);
    out += line + "\n";
  }
  return out;
}

std::string renderSweepJson(const SweepTable& t) {
  JsonWriter w;
  w.beginObject();
  sourceJson(w, "sweep", t.sheet_path, t.sheet_sha256, t.sets);
  w.key("vary").beginArray();
  for (const SweepColumn& c : t.vary) w.value(c.name);
  w.endArray();
  w.key("show").beginArray();
  for (const SweepColumn& c : t.show) w.value(c.name);
  w.endArray();
  // Enough to read the table back (sweep --merge): each column's unit exactly.
  w.key("units").beginObject();
  for (const auto* cols : {&t.vary, &t.show})
    for (const SweepColumn& c : *cols) {
      w.key(c.name).beginObject();
      w.key("unit").value(c.unit.text);
      w.key("factor").value(c.unit.factor);
      w.key("offset").value(c.unit.offset);
      w.endObject();
    }
  w.endObject();
  w.key("grid").beginArray();
  for (uint64_t g : t.grid) w.value(static_cast<double>(g));
  w.endArray();
  w.key("log").value(t.log);
  w.key("check_names").beginArray();
  for (const std::string& c : t.checks) w.value(c);
  w.endArray();
  w.key("shard").beginObject();
  w.key("k").value(t.shard);
  w.key("n").value(t.shards);
  w.endObject();
  w.key("total_points").value(static_cast<double>(t.totalPoints()));
  w.key("points").beginArray();
  for (size_t p = 0; p < t.size(); ++p) {
    w.beginObject();
    w.key("index").value(static_cast<double>(t.index[p]));
    writeSweepPointMembers(w, t, p);
    w.endObject();
  }
  w.endArray();
  w.endObject();
  return w.str();
}

std::string renderSweepSvg(const SweepTable& t) { return renderSvg(sweepPlot(t)); }

LinePlot sweepPlot(const SweepTable& t) {
  LinePlot plot;
  plot.title = "Sweep of " + t.sheet_path + (t.sets.empty() ? "" : " (changed by --set)");
  plot.x_label = header(t.vary[0].name, t.vary[0].unit);
  plot.log_x = t.log;
  const uint64_t n2 = t.vary.size() > 1 ? t.grid[1] : 1;
  // Points per line: one line, or one per value of the second input (its index in the grid).
  std::map<uint64_t, std::vector<size_t>> lines;
  for (size_t p = 0; p < t.size(); ++p) lines[t.index[p] % n2].push_back(p);
  auto failsAt = [&](size_t p) {
    for (size_t k = 0; k < t.checks.size(); ++k)
      if (t.check(p, k) == 0) return true;
    return false;
  };
  for (size_t j = 0; j < t.show.size(); ++j) {
    PlotPanel panel;
    panel.y_label = header(t.show[j].name, t.show[j].unit);
    for (const auto& [key, points] : lines) {
      PlotLine line;
      if (t.vary.size() > 1)
        line.label = t.vary[1].name + " = " + formatQuantity(t.input(points[0], 1), t.vary[1].unit, 4);
      std::vector<size_t> order = points;
      std::stable_sort(order.begin(), order.end(),
                       [&](size_t a, size_t b) { return t.input(a, 0) < t.input(b, 0); });
      for (size_t p : order) {
        line.x.push_back(t.vary[0].unit.fromSI(t.input(p, 0)));
        const double v = t.result(p, j);
        line.y.push_back(std::isfinite(v) ? t.show[j].unit.fromSI(v) : NAN);
        line.fails.push_back(failsAt(p));
      }
      panel.lines.push_back(std::move(line));
    }
    plot.panels.push_back(std::move(panel));
  }
  std::vector<std::string> failing;
  for (size_t k = 0; k < t.checks.size(); ++k)
    for (size_t p = 0; p < t.size(); ++p)
      if (t.check(p, k) == 0) {
        failing.push_back(t.checks[k]);
        break;
      }
  if (t.vary.size() == 1 && !plot.panels.empty()) {
    // Shade from halfway to the neighbour before to halfway to the one after, for each failing point.
    const PlotLine& l = plot.panels[0].lines[0];
    for (size_t k = 0; k < l.x.size(); ++k) {
      if (!l.fails[k]) continue;
      const double a = k ? (l.x[k - 1] + l.x[k]) / 2 : l.x[k],
                   b = k + 1 < l.x.size() ? (l.x[k] + l.x[k + 1]) / 2 : l.x[k];
      if (!plot.shaded.empty() && plot.shaded.back().second >= a)
        plot.shaded.back().second = b;
      else
        plot.shaded.push_back({a, b});
    }
  }
  if (!failing.empty()) {
    std::string names;
    for (const std::string& f : failing) names += (names.empty() ? "" : ", ") + f;
    plot.shaded_label =
        std::string(t.vary.size() == 1 ? "shaded" : "ringed") + ": a check fails (" + names + ")";
  }
  return plot;
}

// ---------------------------------------------------------------------------
// Solve

namespace {

std::string checksLine(const Model& m, const Results& r) {
  std::string failed;
  for (size_t k = 0; k < r.checks.size(); ++k)
    if (!r.checks[k].passed) failed += (failed.empty() ? "" : ", ") + m.sheet().checks[k].name;
  return failed.empty() ? "every check passes" : "a check fails: " + failed;
}

std::string joined(const std::vector<std::string>& v) {
  std::string s;
  for (const std::string& x : v) s += (s.empty() ? "" : ", ") + x;
  return s.empty() ? "none" : s;
}

const char* modeName(SolveMode m) {
  return m == SolveMode::Target ? "target" : m == SolveMode::CapacityMax ? "capacity_max" : "capacity_min";
}

}  // namespace

std::string renderSolveText(const StudySource& src, const Model& m, const SolveSpec& spec,
                            const SolveOutcome& out, int digits) {
  const Unit& u = spec.input.unit;
  const std::string& x = spec.input.name;
  std::string s = "Solve " + sourceLines(src) + "\n";
  const std::string bracket = shown(spec.lo, u, digits) + " and " + shown(spec.hi, u, digits);
  if (spec.mode == SolveMode::Target) {
    s += x + " between " + bracket + " such that " + spec.lhs.text + " = " + spec.rhs.text + ":\n";
    if (out.status == SolveStatus::NotReached) {
      s += "  not reached in the bracket: at " + x + " = " + shown(spec.lo, u, digits) + ", " +
           spec.lhs.text + " = " + shown(out.lhs_at_lo, spec.lhs.display, digits) + "; at " + x + " = " +
           shown(spec.hi, u, digits) + ", " + spec.lhs.text + " = " +
           shown(out.lhs_at_hi, spec.lhs.display, digits) + " (target " +
           shown(out.rhs_at_lo, spec.lhs.display, digits) + ")\n";
    } else if (out.status == SolveStatus::Solved) {
      s += "  " + x + " = " + shown(out.value, u, digits) + "  (" + spec.lhs.text + " = " +
           shown(out.lhs, spec.lhs.display, digits) + "; TOMS 748, " + std::to_string(out.evaluations) +
           " evaluations, last bracket " +
           fmt::format("{:.1e}", (out.bracket_hi - out.bracket_lo) / std::fabs(out.value)) +
           " of the value wide)\n";
      s += "  at this value " + checksLine(m, out.results) + "\n";
    }
  } else {
    const bool max = spec.mode == SolveMode::CapacityMax;
    s += std::string("The ") + (max ? "largest " : "smallest ") + x + " between " + bracket +
         " for which every check passes:\n";
    if (out.status == SolveStatus::NotReached) {
      s += "  none: every value sampled fails a check (at " + shown(spec.lo, u, digits) + ": " +
           joined(out.failing_lo) + "; at " + shown(spec.hi, u, digits) + ": " + joined(out.failing_hi) +
           ")\n";
    } else if (out.status == SolveStatus::Solved) {
      s += "  " + x + " = " + shown(out.value, u, digits);
      if (out.limiting_check.empty())
        s += ", the end of the bracket: no check limits it there (widen the bracket to find the limit)\n";
      else
        s += ", limited by the check `" + out.limiting_check + "` (it fails just " +
             (max ? "above" : "below") + ")\n";
    }
  }
  for (const std::string& w : out.warnings) s += "warning: " + w + "\n";
  return s;
}

std::string renderSolveJson(const StudySource& src, const Model& m, const SolveSpec& spec,
                            const SolveOutcome& out) {
  JsonWriter w;
  const Unit& u = spec.input.unit;
  w.beginObject();
  sourceJson(w, "solve", src.path, src.sha256, src.sets);
  w.key("vary").value(spec.input.name);
  w.key("mode").value(modeName(spec.mode));
  if (spec.mode == SolveMode::Target) {
    w.key("target").beginObject();
    w.key("lhs").value(spec.lhs.text);
    w.key("rhs").value(spec.rhs.text);
    w.endObject();
  }
  w.key("bracket").beginObject();
  w.key("lo");
  quantity(w, spec.lo, u);
  w.key("hi");
  quantity(w, spec.hi, u);
  w.endObject();
  const bool solved = out.status == SolveStatus::Solved;
  w.key("solved").value(solved);
  if (solved) {
    w.key("value").value(u.fromSI(out.value));
    w.key("unit").value(u.text);
    w.key("si").value(out.value);
  } else {
    w.key("value").null();
    w.key("unit").value(u.text);
    w.key("si").null();
  }
  w.key("limiting_check");
  if (solved && !out.limiting_check.empty())
    w.value(out.limiting_check);
  else
    w.null();
  if (solved) {
    w.key("root_bracket_si").beginArray().value(out.bracket_lo).value(out.bracket_hi).endArray();
    if (spec.mode == SolveMode::Target) {
      w.key("lhs");
      quantity(w, out.lhs, spec.lhs.display);
      w.key("rhs");
      quantity(w, out.rhs, spec.lhs.display);
    }
    w.key("checks").beginObject();
    for (size_t k = 0; k < out.results.checks.size(); ++k)
      w.key(m.sheet().checks[k].name).value(out.results.checks[k].passed);
    w.endObject();
  } else if (out.status == SolveStatus::NotReached) {
    if (spec.mode == SolveMode::Target) {
      w.key("at_lo").beginObject();
      w.key("lhs");
      quantity(w, out.lhs_at_lo, spec.lhs.display);
      w.key("rhs");
      quantity(w, out.rhs_at_lo, spec.lhs.display);
      w.endObject();
      w.key("at_hi").beginObject();
      w.key("lhs");
      quantity(w, out.lhs_at_hi, spec.lhs.display);
      w.key("rhs");
      quantity(w, out.rhs_at_hi, spec.lhs.display);
      w.endObject();
    } else {
      w.key("failing_at_lo").beginArray();
      for (const std::string& c : out.failing_lo) w.value(c);
      w.endArray();
      w.key("failing_at_hi").beginArray();
      for (const std::string& c : out.failing_hi) w.value(c);
      w.endArray();
    }
  }
  w.key("evaluations").value(out.evaluations);
  w.key("warnings").beginArray();
  for (const std::string& x : out.warnings) w.value(x);
  w.endArray();
  w.endObject();
  return w.str();
}

// ---------------------------------------------------------------------------
// Sensitivity

namespace {

const char* direction(const InputSensitivity& s) {
  if (!s.ok || s.elasticity == 0) return "none";
  return s.elasticity > 0 ? "increase" : "decrease";
}

std::string percent(double change) {
  return fmt::format("{:+.0f} %", change * 100);
}

}  // namespace

std::string renderSensitivityText(const StudySource& src, const Model& m, const SensitivityOutcome& out,
                                  int digits) {
  const Quantity& q = m.quantity(out.of);
  const Unit& u = *m.slot(out.of).display;
  std::string s = "Sensitivity " + sourceLines(src) + "\n";
  s += "of " + q.name + " = " + shown(out.value, u, digits) + " to the " + std::to_string(out.inputs.size()) +
       " given values it depends on, largest effect first.\n" + "Elasticity: the % change of " + q.name +
       " for a 1 % change of the input (central differences).\n\n";
  std::vector<std::vector<std::string>> rows;
  rows.push_back(
      {"input", "value", "elasticity", "to raise " + q.name, "checks that change state within +-10 %"});
  for (const InputSensitivity& in : out.inputs) {
    std::string flips;
    for (const SensitivityFlip& f : in.flips)
      flips += (flips.empty() ? "" : "; ") + f.check + (f.passes ? " passes" : " fails") + " at " +
               percent(f.change);
    if (in.fails_at != 0)
      flips += (flips.empty() ? "" : "; ") + std::string("no value at ") + percent(in.fails_at);
    if (!in.ok) flips = in.error + (flips.empty() ? "" : "; " + flips);
    rows.push_back({in.name, shown(in.value, *m.slot(in.slot).display, digits),
                    in.ok ? fmt::format("{:+.4f}", in.elasticity) : "-",
                    in.ok && in.elasticity != 0 ? std::string(direction(in)) + " " + in.name : "-",
                    flips.empty() ? "none" : flips});
  }
  s += table(rows, {0, 1, 1, 0, 0});
  return s;
}

std::string renderSensitivityJson(const StudySource& src, const Model& m, const SensitivityOutcome& out) {
  JsonWriter w;
  w.beginObject();
  sourceJson(w, "sensitivity", src.path, src.sha256, src.sets);
  w.key("of").value(m.quantity(out.of).name);
  w.key("value");
  quantity(w, out.value, *m.slot(out.of).display);
  w.key("inputs").beginArray();
  for (const InputSensitivity& in : out.inputs) {
    w.beginObject();
    w.key("name").value(in.name);
    w.key("elasticity");
    if (in.ok)
      w.value(in.elasticity);
    else
      w.null();
    w.key("raises").value(direction(in));
    w.key("value");
    quantity(w, in.value, *m.slot(in.slot).display);
    w.key("error");
    if (in.ok)
      w.null();
    else
      w.value(in.error);
    w.key("flips").beginArray();
    for (const SensitivityFlip& f : in.flips) {
      w.beginObject();
      w.key("check").value(f.check);
      w.key("change").value(f.change);
      w.key("passes").value(f.passes);
      w.endObject();
    }
    w.endArray();
    w.key("no_value_at");
    if (in.fails_at != 0)
      w.value(in.fails_at);
    else
      w.null();
    w.endObject();
  }
  w.endArray();
  w.endObject();
  return w.str();
}

// ---------------------------------------------------------------------------
// Pick

std::string renderPickText(const StudySource& src, const PickSpec& spec, const PickOutcome& out, int digits) {
  const Unit& u = spec.input.unit;
  std::string s = "Pick " + sourceLines(src) + "\n";
  const StudySeries* series = findSeries(spec.from);
  s += spec.input.name + " from " +
       (series ? spec.from + " (" + series->description + ")" : "the values given") + ": the " +
       (spec.by ? "one with the least " + spec.by->text : std::string("smallest")) +
       " for which every check passes.\n";
  if (out.chosen >= 0)
    s += "  chosen: " + spec.input.name + " = " +
         shown(out.tried[static_cast<size_t>(out.chosen)].value, u, digits) + "\n";
  else
    s += "  none of the " + std::to_string(out.tried.size()) + " candidates passes every check\n";
  s += "\n";
  std::vector<std::vector<std::string>> rows;
  rows.push_back({spec.input.name});
  if (spec.by) rows[0].push_back(spec.by->text);
  rows[0].push_back("result");
  for (size_t i = 0; i < out.tried.size(); ++i) {
    const PickCandidate& c = out.tried[i];
    std::string r = !c.error.empty() ? "error: " + c.error
                    : c.passed       ? "passes"
                                     : "fails: " + joined(c.failed);
    if (static_cast<int>(i) == out.chosen) r += "  <- chosen";
    std::vector<std::string> row{shown(c.value, u, digits)};
    if (spec.by) row.push_back(std::isfinite(c.by) ? shown(c.by, spec.by->display, digits) : "-");
    row.push_back(r);
    rows.push_back(row);
  }
  s += table(rows, {1, static_cast<char>(spec.by ? 1 : 0), 0});
  return s;
}

std::string renderPickJson(const StudySource& src, const PickSpec& spec, const PickOutcome& out) {
  JsonWriter w;
  const Unit& u = spec.input.unit;
  w.beginObject();
  sourceJson(w, "pick", src.path, src.sha256, src.sets);
  w.key("vary").value(spec.input.name);
  w.key("from").value(spec.from);
  w.key("by");
  if (spec.by)
    w.value(spec.by->text);
  else
    w.null();
  w.key("chosen");
  if (out.chosen >= 0)
    quantity(w, out.tried[static_cast<size_t>(out.chosen)].value, u);
  else
    w.null();
  w.key("tried").beginArray();
  for (const PickCandidate& c : out.tried) {
    w.beginObject();
    writePickCandidateMembers(w, c, u);
    if (spec.by) {
      w.key("by");
      if (std::isfinite(c.by))
        quantity(w, c.by, spec.by->display);
      else
        w.null();
    }
    w.endObject();
  }
  w.endArray();
  w.endObject();
  return w.str();
}

}  // namespace calctrail
