#include "engine/report/json_renderer.h"

#include <cmath>

#include "engine/study/study_render.h"
#include "engine/util/json_writer.h"

namespace calctrail {

namespace {

void writeCall(JsonWriter& w, const TrailCall& c) {
  w.beginObject();
  w.key("name").value(c.name);
  w.key("call").value(c.signature);
  w.key("formula").value(c.formula);
  w.key("formula_is_expression").value(c.formula_is_expression);
  w.key("arguments").value(lineText(c.arguments));
  w.key("substituted").value(lineText(c.substituted));
  w.key("result").value(c.result ? valueText(*c.result) : "");
  w.key("row").value(c.row);
  w.key("source").value(c.source);
  w.key("caution").value(c.caution);
  w.endObject();
}

// "cases": {"nominal": {...}, "overload": {...}}: the contract's fields per case.
void writeStepCases(JsonWriter& w, const Trail& t, const TrailStep& s) {
  w.key("varies").value(s.varies);
  w.key("cases").beginObject();
  for (size_t k = 0; k < s.cases.size(); ++k) {
    const TrailCaseValue& v = s.cases[k];
    w.key(t.cases[k].name).beginObject();
    w.key("value");
    if (v.ok)
      w.value(v.value.value);
    else
      w.null();
    w.key("unit").value(s.unit_written);
    w.key("si");
    if (v.ok)
      w.value(v.value.si);
    else
      w.null();
    w.key("formula").value(v.formula);
    w.key("result").value(v.ok ? valueText(v.value) : "");
    w.key("description").value(s.description);
    w.key("ok").value(v.ok);
    w.key("replaced").value(v.replaced);
    w.endObject();
  }
  w.endObject();
}

void writeCheckCases(JsonWriter& w, const Trail& t, const TrailCheck& c) {
  w.key("governing");
  if (c.governing >= 0)
    w.value(t.cases[c.governing].name);
  else
    w.null();
  w.key("cases").beginObject();
  for (size_t k = 0; k < c.cases.size(); ++k) {
    const TrailCaseCheck& r = c.cases[k];
    w.key(t.cases[k].name).beginObject();
    w.key("passed").value(r.passed);
    w.key("ok").value(r.ok);
    w.key("lhs").value(r.lhs.value);
    w.key("rhs").value(r.rhs.value);
    w.key("unit").value(c.unit);
    w.key("lhs_text").value(r.ok ? valueText(r.lhs) : "");
    w.key("rhs_text").value(r.ok ? valueText(r.rhs) : "");
    w.key("lhs_si").value(r.lhs.si);
    w.key("rhs_si").value(r.rhs.si);
    w.key("margin");
    if (r.ok)
      w.value(r.margin.value);
    else
      w.null();
    w.key("margin_si");
    if (r.ok)
      w.value(r.margin.si);
    else
      w.null();
    w.key("governing").value(static_cast<int>(k) == c.governing);
    w.endObject();
  }
  w.endObject();
}

void writeCase(JsonWriter& w, const TrailCase& c) {
  w.beginObject();
  w.key("name").value(c.name);
  w.key("description").value(c.description);
  w.key("line").value(c.line);
  w.key("replacements").value(c.replacements);
  w.key("ok").value(c.ok);
  w.key("checks_passed").value(c.passed);
  w.key("checks_failed").value(c.failed);
  w.key("errors").beginArray();
  for (const std::string& e : c.errors) w.value(e);
  w.endArray();
  w.endObject();
}

// The file a step's or check's `line` is in: the sheet, or its instance's template.
const std::string& lineFile(const Trail& t, int instance) {
  return instance < 0 ? t.path : t.instances[static_cast<size_t>(instance)].path;
}

void writeStep(JsonWriter& w, const Trail& t, const TrailStep& s) {
  w.beginObject();
  w.key("name").value(s.name);
  w.key("value").value(s.result.value);
  w.key("unit").value(s.unit_written);
  w.key("si").value(s.result.si);
  w.key("si_unit").value(s.si_unit);
  w.key("dimension").value(s.dimension);
  w.key("formula").value(s.formula);
  w.key("substituted").value(lineText(s.substituted));
  w.key("result").value(s.ok ? valueText(s.result) : "");
  w.key("description").value(s.description);
  w.key("section").value(s.section);
  w.key("input").value(s.input);
  w.key("unit_declared").value(s.unit_declared);
  w.key("overridden").value(s.overridden);
  w.key("line").value(s.line);
  w.key("file").value(lineFile(t, s.instance));
  w.key("source").value(s.origin);
  w.key("functions").beginArray();
  for (const TrailCall& c : s.calls) writeCall(w, c);
  w.endArray();
  w.key("warnings").beginArray();
  for (const std::string& m : s.warnings) w.value(m);
  w.endArray();
  if (!t.cases.empty()) writeStepCases(w, t, s);
  w.endObject();
}

void writeCheck(JsonWriter& w, const Trail& t, const TrailCheck& c) {
  w.beginObject();
  w.key("name").value(c.name);
  w.key("passed").value(c.passed);
  w.key("condition").value(c.condition);
  w.key("op").value(c.op);
  w.key("lhs").value(c.lhs.value);
  w.key("rhs").value(c.rhs.value);
  w.key("unit").value(c.unit);
  w.key("lhs_text").value(c.ok ? valueText(c.lhs) : "");
  w.key("rhs_text").value(c.ok ? valueText(c.rhs) : "");
  w.key("lhs_si").value(c.lhs.si);
  w.key("rhs_si").value(c.rhs.si);
  // How close the check is (trail.h): demand / capacity, above 1 fails;
  // null where a side is not above zero, and the margin, below 0 fails.
  if (c.utilisation) w.key("utilisation").value(*c.utilisation);
  else w.key("utilisation").null();
  w.key("margin").value(c.margin.value);
  w.key("margin_si").value(c.margin.si);
  w.key("measure").value(c.measure);
  w.key("description").value(c.description);
  w.key("section").value(c.section);
  w.key("line").value(c.line);
  w.key("file").value(lineFile(t, c.instance));
  w.key("warnings").beginArray();
  for (const std::string& m : c.warnings) w.value(m);
  w.endArray();
  if (!t.cases.empty()) writeCheckCases(w, t, c);
  w.endObject();
}

void writeInstance(JsonWriter& w, const TrailInstance& i) {
  w.beginObject();
  w.key("name").value(i.name);
  w.key("template").value(i.path);
  w.key("title").value(i.title);
  w.key("parameters").beginArray();
  for (const TrailInstanceParam& p : i.params) {
    w.beginObject();
    w.key("name").value(p.name);
    w.key("quantity").value(p.quantity);
    w.key("binding").value(p.binding);
    w.key("value").value(p.result.value);
    w.key("unit").value(p.unit_written);
    w.key("si").value(p.result.si);
    w.endObject();
  }
  w.endArray();
  w.endObject();
}

// {"value": .., "unit": "mm", "si": ..}; null value and si for no value.
// The worksheet's studies: a sweep's points with the fields of `calctrail
// sweep --format json`, a capacity's answer with those of `solve`, a pick's with those of `pick`.
void writeStudies(JsonWriter& w, const Trail& t) {
  w.key("studies").beginArray();
  for (const TrailStudy& st : t.studies) {
    w.beginObject();
    w.key("name").value(st.name);
    w.key("kind").value(st.kind);
    w.key("line").value(st.line);
    w.key("statement").value(st.statement);
    w.key("description").value(st.description);
    w.key("summary").value(st.summary);
    if (st.kind == "capacity") {
      w.key("solved").value(st.solved);
      w.key("value");
      if (st.solved) w.value(st.value.value); else w.null();
      w.key("unit").value(st.value.unit);
      w.key("si");
      if (st.solved) w.value(st.value.si); else w.null();
      w.key("limiting_check");
      if (st.limiting_check.empty()) w.null(); else w.value(st.limiting_check);
      w.key("warnings").beginArray();
      for (const std::string& e : st.errors) w.value(e);
      w.endArray();
      w.endObject();
      continue;
    }
    if (st.kind == "pick") {
      w.key("chosen");
      if (st.chosen >= 0) writeStudyQuantity(w, st.tried[static_cast<size_t>(st.chosen)].value, st.pick_unit);
      else w.null();
      w.key("tried").beginArray();
      for (const PickCandidate& c : st.tried) {
        w.beginObject();
        writePickCandidateMembers(w, c, st.pick_unit);
        w.endObject();
      }
      w.endArray();
      w.endObject();
      continue;
    }
    const SweepTable& tb = st.table;
    w.key("vary").beginArray();
    for (const SweepColumn& c : tb.vary) w.value(c.name);
    w.endArray();
    w.key("show").beginArray();
    for (const SweepColumn& c : tb.show) w.value(c.name);
    w.endArray();
    w.key("check_names").beginArray();
    for (const std::string& c : tb.checks) w.value(c);
    w.endArray();
    w.key("points").beginArray();
    for (size_t p = 0; p < tb.size(); ++p) {
      w.beginObject();
      writeSweepPointMembers(w, tb, p);
      w.endObject();
    }
    w.endArray();
    w.endObject();
  }
  w.endArray();
}

}  // namespace

void renderJson(const Trail& t, ReportSink& sink) {
  fmt::memory_buffer& out = sink.buffer();
  JsonWriter w(out);
  w.beginObject();
  w.key("schema").value(kJsonSchemaVersion);
  w.key("file").value(t.path);
  w.key("sha256").value(t.sha256);
  w.key("generator").value(t.generator);
  // The --set replacements of this run: when there is one, the numbers are
  // the file's AS MODIFIED, and `sha256` identifies the file alone.
  w.key("modified_by").beginArray();
  for (const TrailReplacement& r : t.modified_by) {
    w.beginObject();
    w.key("name").value(r.name);
    w.key("value").value(r.value);
    w.key("line").value(r.line);
    w.endObject();
  }
  w.endArray();
  w.key("modified_notice").value(modifiedNotice(t));
  w.key("files").beginArray();  // the sheet, then each template: the hashes that identify the numbers
  for (const TrailFile& f : t.files) {
    w.beginObject();
    w.key("path").value(f.path);
    w.key("sha256").value(f.sha256);
    w.endObject();
  }
  w.endArray();
  w.key("instances").beginArray();
  for (const TrailInstance& i : t.instances) writeInstance(w, i);
  w.endArray();
  w.key("digits").value(t.digits);
  w.key("title").value(t.title);
  // The load cases appear only in a worksheet that has some (or with --case),
  // so the JSON of one without is what it always was.
  if (!t.shown_case.empty()) w.key("case").value(t.shown_case);
  w.key("metadata").beginObject();
  for (const auto& [k, v] : t.meta) w.key(k).value(v);
  w.endObject();
  w.key("inputs").beginArray();
  for (size_t i = 0; i < t.steps.size(); ++i)
    if (t.steps.isInput(i)) w.value(t.steps.name(i));
  w.endArray();
  w.key("quantities").beginArray();
  for (const TrailStep& s : t.steps) {
    writeStep(w, t, s);
    sink.checkpoint();
  }
  w.endArray();
  w.key("checks").beginArray();
  for (const TrailCheck& c : t.checks) writeCheck(w, t, c);
  w.endArray();
  if (!t.cases.empty()) {
    w.key("cases").beginArray();
    for (const TrailCase& c : t.cases) writeCase(w, c);
    w.endArray();
  }
  if (!t.studies.empty()) writeStudies(w, t);
  w.key("summary").beginObject();
  w.key("checks_passed").value(t.passed);
  w.key("checks_failed").value(t.failed);
  w.key("verdict").value(verdictSentence(t));
  w.key("warnings").value(static_cast<int>(t.warnings.size()));
  w.key("warnings_at_steps").value(t.warnings_at_steps);
  if (!t.cases.empty()) {
    w.key("checks_failed_in_cases").value(t.failed_in_cases);
    w.key("cases_failed").value(t.cases_failed);
  }
  w.endObject();
  w.key("warnings").beginArray();
  for (const std::string& s : t.warnings) w.value(s);
  w.endArray();
  w.key("cautions").beginArray();
  for (const std::string& s : t.cautions) w.value(s);
  w.endArray();
  w.key("caution_ids").beginArray();
  for (const std::string& s : t.caution_ids) w.value(s);
  w.endArray();
  w.key("library_functions").beginArray();
  for (const TrailFunction& f : t.functions) {
    w.beginObject();
    w.key("name").value(f.name);
    w.key("call").value(f.signature);
    w.key("method").value(f.method);
    w.key("limits").value(f.limits);
    w.key("source").value(f.source);
    w.key("verification").value(f.verification);
    w.key("used_by").beginArray();
    for (const std::string& u : f.used_by) w.value(u);
    w.endArray();
    w.endObject();
  }
  w.endArray();
  w.key("sign_off").value(signOffStatement(t));
  w.endObject();
}

std::string renderJson(const Trail& t) {
  ReportSink sink;
  renderJson(t, sink);
  return sink.text();
}

std::string renderJson(const Calculation&, const Trail& t) { return renderJson(t); }

}  // namespace calctrail
