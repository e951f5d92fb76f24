#include "engine/report/json_renderer.h"

#include "engine/util/json_writer.h"

namespace calctrail {

std::string renderJson(const Calculation& calc, const Trail& t) {
  JsonWriter w;
  w.beginObject();
  w.key("schema").value(kJsonSchemaVersion);
  w.key("file").value(t.path);
  w.key("sha256").value(t.sha256);
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
  for (const TrailStep& s : t.steps) {
    const QuantityState& q = calc.quantities[s.index];
    const Quantity& src = calc.sheet.quantities[s.index];
    w.beginObject();
    w.key("name").value(s.name);
    w.key("value").value(q.display.fromSI(q.si));
    // The contract: the declared display unit as written, else the engine's choice.
    w.key("unit").value(q.declared ? src.unit_written : s.unit);
    w.key("si").value(q.si);
    w.key("si_unit").value(q.dim.siSymbol());
    w.key("dimension").value(s.dimension);
    w.key("formula").value(s.formula);
    w.key("substituted").value(s.substituted);
    w.key("result").value(s.result);
    w.key("description").value(s.description);
    w.key("section").value(s.section);
    w.key("input").value(s.input);
    w.key("unit_declared").value(q.declared);
    w.key("overridden").value(s.overridden);
    w.key("line").value(src.line);
    // Where the value comes from: given in the worksheet, set on the command
    // line, calculated, or calculated with the cited library methods.
    std::string source = s.overridden ? "set on the command line" : s.input ? "given" : "calculated";
    for (const TrailCall& c : s.calls) source += "; " + c.name + ": " + c.source;
    w.key("source").value(source);
    w.key("functions").beginArray();
    for (const TrailCall& c : s.calls) {
      w.beginObject();
      w.key("name").value(c.name);
      w.key("call").value(c.signature);
      w.key("formula").value(c.formula);
      w.key("formula_is_expression").value(c.formula_is_expression);
      w.key("arguments").value(c.arguments);
      w.key("substituted").value(c.substituted);
      w.key("result").value(c.result);
      w.key("source").value(c.source);
      w.key("caution").value(c.caution);
      w.endObject();
    }
    w.endArray();
    w.endObject();
  }
  w.endArray();
  w.key("checks").beginArray();
  for (const TrailCheck& c : t.checks) {
    const CheckState& s = calc.checks[c.index];
    w.beginObject();
    w.key("name").value(c.name);
    w.key("passed").value(c.passed);
    w.key("condition").value(c.condition);
    w.key("op").value(c.op);
    w.key("lhs").value(s.display.fromSI(s.lhs));
    w.key("rhs").value(s.display.fromSI(s.rhs));
    w.key("unit").value(s.display.text);
    w.key("lhs_text").value(c.lhs);
    w.key("rhs_text").value(c.rhs);
    w.key("lhs_si").value(s.lhs);
    w.key("rhs_si").value(s.rhs);
    w.key("description").value(c.description);
    w.key("section").value(c.section);
    w.key("line").value(calc.sheet.checks[c.index].line);
    w.endObject();
  }
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
  return w.str();
}

}  // namespace calctrail
