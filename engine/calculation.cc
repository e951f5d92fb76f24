#include "engine/calculation.h"

#include <algorithm>

#include "engine/model/evaluate.h"
#include "engine/study/sheet_study.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/util/edit_distance.h"
#include "engine/template/template_loader.h"
#include "engine/util/sha256.h"

namespace calctrail {

std::unique_ptr<Calculation> Calculation::fromFile(const std::string& path, const CalcOptions& options) {
  std::string bytes, error;
  if (!readFile(path, &bytes, &error)) {
    auto calc = std::make_unique<Calculation>();
    calc->path = path;
    calc->diags.error(path, error);
    return calc;
  }
  return fromText(path, std::move(bytes), options);
}

std::unique_ptr<Calculation> Calculation::fromText(const std::string& display_path, std::string bytes,
                                                   const CalcOptions& options) {
  auto calc = std::make_unique<Calculation>();
  calc->path = display_path;
  calc->sha256 = sha256Hex(bytes);
  calc->run(std::make_shared<SourceFile>(display_path, std::move(bytes)), options);
  return calc;
}

bool Calculation::allChecksPass() const { return failedChecks() == 0; }

bool Calculation::caseErrors() const {
  for (const CaseRun& c : cases)
    if (c.errors.hasErrors()) return true;
  return false;
}

int Calculation::failedChecks() const {
  int n = 0;
  for (size_t k = 0; k < checkCount(); ++k) n += checkResult(k).ok && !checkResult(k).passed;
  return n;
}

void Calculation::run(std::shared_ptr<SourceFile> file, const CalcOptions& options) {
  sheet = parseSheet(std::move(file), &diags);
  TemplateCache own_cache;
  expandTemplates(&sheet, options.source_path.empty() ? path : options.source_path, sha256,
                  options.source ? *options.source : diskSource(),
                  options.templates ? options.templates : &own_cache, &diags);
  model = Model::borrow(&sheet, &diags);
  bindShownCase(options.case_name);
  inputs = std::make_unique<Inputs>(*model, shown_layer_.get());
  for (const std::string& set : options.sets) inputs->set(set, &diags);
  bindCases(!options.case_name.empty());
  // A template run on its own: a parameter without a default needs --set.
  // (An instance's is reported at its `use` line.)
  for (size_t i = 0; i < sheet.quantities.size(); ++i) {
    const Quantity& q = sheet.quantities[i];
    if (!q.required || q.instance >= 0 || inputs->find(Slot(static_cast<uint32_t>(i)))) continue;
    diags.error(*sheet.file, q.name_begin, q.name_end,
                "the parameter `" + q.name + "` has no default: give it a value with --set \"" + q.name +
                    "=...\", or use this worksheet as a template (`use ... with " + q.name + " = ...`)");
  }
  // The worksheet's study lines name inputs, values and results of this model.
  if (!diags.hasErrors()) {
    std::vector<ResolvedStudy> studies;
    resolveSheetStudies(*model, *inputs, sheet, &diags, &studies);
  }
  if (!diags.hasErrors()) {
    Evaluation evaluation(*model);  // one context: the cases re-use the nominal's programs
    results = evaluation.evaluate(*inputs);
    for (const Fault& f : results.faults) diags.error(*f.file, f.begin, f.end, f.message + instanceNote(f));
    // A warning is flagged at the step it was raised in: its position alone
    // cannot tell one instance of a template from another.
    for (const Fault& w : results.warnings)
      diags.warning(*w.file, w.begin, w.end, w.message + instanceNote(w), siteOf(w));
    evaluateCases(&evaluation);
  }
  showReplacements();
  diags.sort();
}

// Inside an instance, a fault (or a warning) names the `use` line that
// brought it in, as every diagnostic in a template does; a --set text is
// the run's own and names none.
std::string Calculation::instanceNote(const Fault& f) const {
  if (f.site == Fault::Site::Quantity && f.file == &sheet.exprFile(f.index))
    return sheet.instanceNote(sheet.quantities[f.index].expr_instance);
  if (f.site == Fault::Site::Check && f.file == &sheet.checkFile(f.index))
    return sheet.instanceNote(sheet.checks[f.index].instance);
  return "";
}

DiagnosticSite Calculation::siteOf(const Fault& f) {
  DiagnosticSite site;
  (f.site == Fault::Site::Quantity ? site.quantity : site.check) = static_cast<int>(f.index);
  return site;
}

// --case NAME: that case's replacements become the layer under --set, so
// the run is the worksheet as if written with them.
void Calculation::bindShownCase(const std::string& shown) {
  if (shown.empty() || shown == kNominalCase) return;
  const int k = sheet.findCase(shown);
  if (k < 0) {
    std::vector<std::string> names = {kNominalCase};
    for (const LoadCase& c : sheet.cases) names.push_back(c.name);
    std::string msg = "--case: the worksheet has no case `" + shown + "`";
    auto near = nearestWords(shown, names);
    if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
    std::string all;
    for (const std::string& n : names) all += (all.empty() ? "`" : ", `") + n + "`";
    msg += " (its cases: " + all + ")";
    diags.error(path, msg);
    return;
  }
  shown_case = shown;
  shown_layer_ = std::make_unique<Inputs>(*model);
  for (const CaseReplacement& r : sheet.cases[k].replacements)
    shown_layer_->replace(r.name, r.name_begin, r.name_end, *r.expr, sheet.file, &diags,
                          "case `" + shown + "`");
}

// Each case as its own layer over --set; a replacement --set hides is
// checked all the same, in a layer of its own. Every case line is checked
// (names, dimensions) with --case too, where only the shown one runs.
void Calculation::bindCases(bool alone) {
  for (const LoadCase& c : sheet.cases) {
    if (c.name == shown_case) continue;  // bound by bindShownCase
    const std::string who = "case `" + c.name + "`";
    CaseRun run;
    run.def = &c;
    run.inputs = std::make_unique<Inputs>(*model, inputs.get());
    Inputs hidden(*model);
    for (const CaseReplacement& r : c.replacements) {
      const Slot slot = model->find(r.name);
      Inputs* layer = alone || (slot.valid() && inputs->find(slot)) ? &hidden : run.inputs.get();
      layer->replace(r.name, r.name_begin, r.name_end, *r.expr, sheet.file, &diags, who);
    }
    if (!alone) cases.push_back(std::move(run));
  }
}

// Each case over the nominal's results: only the cone of its replacements is re-run.
void Calculation::evaluateCases(Evaluation* evaluation) {
  if (!results.faults.empty()) return;  // the worksheet has errors: its own first
  for (CaseRun& c : cases) {
    c.results = results;
    evaluation->evaluateCone(*c.inputs, &c.results);
    const std::string who = "case `" + c.def->name + "`";
    for (const Fault& f : c.results.faults) c.errors.error(*f.file, f.begin, f.end, who + ": " + f.message);
    c.errors.sort();
    // A warning only this case raises (a friction value out of range in the
    // dry case) is the run's warning too, named with its case: never silent.
    for (const Fault& w : c.results.warnings) {
      const bool nominal = std::any_of(results.warnings.begin(), results.warnings.end(), [&](const Fault& n) {
        return n.site == w.site && n.index == w.index && n.message == w.message;
      });
      if (!nominal)
        diags.warning(*w.file, w.begin, w.end, who + ": " + w.message + instanceNote(w), siteOf(w));
    }
  }
}

namespace {
bool readsNothing(const Expr& e) {
  if (e.kind == ExprKind::Name || e.kind == ExprKind::Call) return false;
  for (const ExprPtr& a : e.args)
    if (!readsNothing(*a)) return false;
  return true;
}
}  // namespace

NodeDims Calculation::exprDims(size_t i) const {
  const Slot slot(static_cast<uint32_t>(i));
  if (const Binding* b = inputs ? inputs->find(slot) : nullptr; b && b->expr) return b->dims.view();
  return model->formulaDims(slot);
}

const Calculation::ShownReplacement* Calculation::shownReplacement(size_t i) const {
  if (replaced_.empty()) return nullptr;  // the common case: no --set
  const Slot slot = slotOf(i);
  auto it = std::lower_bound(replaced_.begin(), replaced_.end(), slot,
                             [](const ShownReplacement& r, Slot s) { return r.slot < s; });
  return it != replaced_.end() && it->slot == slot ? &*it : nullptr;
}

const Unit& Calculation::display(size_t i) const {
  const ShownReplacement* r = shownReplacement(i);
  return r ? r->display : *model->slot(slotOf(i)).display;
}

bool Calculation::isInput(size_t i) const {
  const ShownReplacement* r = shownReplacement(i);
  return r ? r->input : model->slot(slotOf(i)).input;
}

QuantityView Calculation::quantity(size_t i) const {
  const SlotInfo& info = model->slot(slotOf(i));
  return QuantityView{info.dim, info.has_dim, display(i), info.declared, isInput(i), ok(i), si(i)};
}

const CheckResult& Calculation::checkResult(size_t k) const {
  static const CheckResult not_evaluated;
  if (results.values.empty() || !model->checks()[k].has_dim) return not_evaluated;
  return results.checks[k];
}

CheckView Calculation::check(size_t k) const {
  const CheckInfo& info = model->checks()[k];
  const CheckResult& r = checkResult(k);
  return CheckView{r.ok, r.lhs, r.rhs, r.passed, info.dim, info.display};
}

const std::vector<Slot>& Calculation::order() const {
  static const std::vector<Slot> none;
  if (!model) return none;
  return inputs && inputs->readsSlots() ? inputs->order() : model->order();
}

// Shows each --set formula (and the shown case's) where the sheet's stood,
// keeping the model's tree alive, and notes what the replacement changes.
void Calculation::showReplacements() {
  if (!model) return;
  const Model& m = *model;
  std::vector<const Binding*> shown;
  for (const Inputs* layer = inputs.get(); layer; layer = layer->parent())
    for (const Binding& b : layer->own())
      if (b.expr && inputs->find(b.slot) == &b) shown.push_back(&b);
  replaced_.reserve(shown.size());
  for (const Binding* bp : shown) {
    const Binding& b = *bp;
    const SlotInfo& info = m.slot(b.slot);
    Quantity& q = sheet.quantities[b.slot.index()];
    ShownReplacement r;
    r.slot = b.slot;
    r.model_expr = std::move(q.expr);
    q.expr = cloneExpr(*b.expr);
    q.overridden = true;
    q.override_by.reset(new QuantityOverride{b.text, b.file == sheet.file ? shown_case : std::string(),
                                             std::const_pointer_cast<SourceFile>(b.file)});
    r.input = readsNothing(*q.expr);
    r.display = !info.declared && info.has_dim
                    ? undeclaredDisplayUnit(*q.expr, info.dim, m.sheet().units, m.library())
                    : *info.display;
    replaced_.push_back(std::move(r));
  }
  std::sort(replaced_.begin(), replaced_.end(),
            [](const ShownReplacement& a, const ShownReplacement& b) { return a.slot < b.slot; });
}

}  // namespace calctrail
