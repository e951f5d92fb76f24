#include "engine/report/json_renderer.h"

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
  w.key("source").value(c.source);
  w.key("caution").value(c.caution);
  w.endObject();
}

void writeStep(JsonWriter& w, const TrailStep& s) {
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
  w.key("source").value(s.origin);
  w.key("functions").beginArray();
  for (const TrailCall& c : s.calls) writeCall(w, c);
  w.endArray();
  w.endObject();
}

void writeCheck(JsonWriter& w, const TrailCheck& c) {
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
  w.key("description").value(c.description);
  w.key("section").value(c.section);
  w.key("line").value(c.line);
  w.endObject();
}

void writeInstance(JsonWriter& w, const Trail& t, const TrailInstance& i) {
  w.beginObject();
  w.key("name").value(i.name);
  w.key("template").value(i.path);
  w.key("title").value(i.title);
  w.key("parameters").beginArray();
  for (const TrailInstanceParam& p : i.params) {
    const TrailStep& s = t.steps[static_cast<size_t>(p.step)];
    w.beginObject();
    w.key("name").value(p.name);
    w.key("quantity").value(s.name);
    w.key("binding").value(p.binding);
    w.key("value").value(s.result.value);
    w.key("unit").value(s.unit_written);
    w.key("si").value(s.result.si);
    w.endObject();
  }
  w.endArray();
  w.endObject();
}

}  // namespace

void renderJson(const Trail& t, fmt::memory_buffer& out) {
  JsonWriter w(out);
  w.beginObject();
  w.key("schema").value(kJsonSchemaVersion);
  w.key("file").value(t.path);
  w.key("sha256").value(t.sha256);
  w.key("files").beginArray();  // the sheet, then each template: the hashes that identify the numbers
  for (const TrailFile& f : t.files) {
    w.beginObject();
    w.key("path").value(f.path);
    w.key("sha256").value(f.sha256);
    w.endObject();
  }
  w.endArray();
  w.key("instances").beginArray();
  for (const TrailInstance& i : t.instances) writeInstance(w, t, i);
  w.endArray();
  w.key("generator").value(std::string("calctrail ") + CALCTRAIL_VERSION);
  w.key("digits").value(t.digits);
  w.key("title").value(t.title);
  w.key("metadata").beginObject();
  for (const auto& [k, v] : t.meta) w.key(k).value(v);
  w.endObject();
  w.key("inputs").beginArray();
  for (const TrailStep& s : t.steps)
    if (s.input) w.value(s.name);
  w.endArray();
  w.key("quantities").beginArray();
  for (const TrailStep& s : t.steps) writeStep(w, s);
  w.endArray();
  w.key("checks").beginArray();
  for (const TrailCheck& c : t.checks) writeCheck(w, c);
  w.endArray();
  w.key("summary").beginObject();
  w.key("checks_passed").value(t.passed);
  w.key("checks_failed").value(t.failed);
  w.endObject();
  w.key("warnings").beginArray();
  for (const std::string& s : t.warnings) w.value(s);
  w.endArray();
  w.key("cautions").beginArray();
  for (const std::string& s : t.cautions) w.value(s);
  w.endArray();
  w.endObject();
}

std::string renderJson(const Trail& t) {
  fmt::memory_buffer out;
  renderJson(t, out);
  return fmt::to_string(out);
}

std::string renderJson(const Calculation&, const Trail& t) { return renderJson(t); }

}  // namespace calctrail
