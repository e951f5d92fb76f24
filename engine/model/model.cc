#include "engine/model/model.h"

#include <algorithm>
#include <cctype>
#include <string_view>
#include <unordered_map>
#include <unordered_set>

#include "engine/eval/arithmetic.h"
#include "engine/eval/dimension_check.h"
#include "engine/eval/math_functions.h"
#include "engine/units/unit_parser.h"
#include "engine/units/unit_table.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

const Unit* unitAsWritten(const Expr& e) {
  const Expr* x = withoutParensOrSigns(&e);
  return x->kind == ExprKind::Number ? x->unit.get() : nullptr;
}

Unit undeclaredDisplayUnit(const Expr& formula, const Dimension& dim, const UnitPreferences& prefs,
                           const std::vector<FunctionDecl>& library) {
  if (const Unit* written = unitAsWritten(formula)) return *written;
  const Expr* x = withoutParens(&formula);
  if (x->kind == ExprKind::Call && !findMathFunction(x->text)) {
    for (const FunctionDecl& f : library) {
      if (f.name != x->text) continue;
      Unit natural;
      UnitError err;
      // The library's tests keep every result unit parsable and of the result's dimension.
      if (!f.result_unit.empty() && parseUnit(std::string(f.result_unit) + (f.result_per_revolution ? "/rev" : ""), &natural, &err) &&
          natural.dim == dim)
        return prefs.choose(dim, &natural);
      break;
    }
  }
  return prefs.choose(dim);
}

Dimension quantityDimension(const Dimension& formula_dim) {
  return workOrPower(formula_dim) ? formula_dim.withoutAngle() : formula_dim;  // N*m*rad/s is W
}

std::string tooLongMessage(const std::string& what, size_t length) {
  return what + " is too long to compile (" + std::to_string(length) +
         " characters once units are folded in, at most " + std::to_string(kMaxProgramLength) +
         "); split it into named steps";
}

bool fitsDeclaredUnit(const Quantity& q, const Expr& formula, const NodeDims& formula_dims, const Sheet& sheet,
                      const SourceFile& sheet_file, const Dimension& dim, Diagnostics* diags) {
  const UnitFit fit = fitUnit(dim, q.display->dim);
  if (fit == UnitFit::Incompatible) {
    diags->error(sheet_file, q.unit_begin, q.unit_end,
                 "`" + q.name + "` is declared in [" + q.unit_written + "], " + q.display->dim.describe() +
                     ", but its formula gives " + dim.describe());
    return false;
  }
  if (fit == UnitFit::AngleWarning) {
    // Showing the value would put a number off by 2*pi on the page
    // (a lead per revolution shown in plain mm, rpm*lead in m/s): refuse,
    // and say how to write it.
    std::string msg = "`" + q.name + "` is declared in [" + q.unit_written + "], " +
                      q.display->dim.describe() + ", but its formula gives " + dim.describe() +
                      ": they differ by an angle, so the number shown would be off by 2*pi";
    // The same fix as the undeclared path gives (dimension_check): for a
    // computed lead, thread_lead or `/ 1 [rev]`; for a literal, [mm/rev].
    const std::string why = strayAngleWarning(q.name, dim, formula, formula_dims, sheet);
    if (!why.empty())
      msg += "; " + why.substr(why.find("): ") + 3);
    else if (dim.exponent(Base::Angle) < 0)
      msg += "; declare it per revolution, as in [mm/rev], or write `1 [rev]` where a plain 2*pi stands";
    else
      msg += "; declare the unit with its angle, as in [rpm] or [rad/s]";
    diags->error(sheet_file, q.unit_begin, q.unit_end, msg);
    return false;
  }
  return true;
}

std::unique_ptr<const Model> Model::build(Sheet sheet, Diagnostics* diags,
                                          const std::vector<FunctionDecl>& library) {
  std::unique_ptr<Model> m(new Model());
  m->owned_ = std::make_unique<Sheet>(std::move(sheet));
  m->sheet_ = m->owned_.get();
  m->library_ = &library;
  m->run(diags);
  return m;
}

std::unique_ptr<const Model> Model::borrow(const Sheet* sheet, Diagnostics* diags,
                                           const std::vector<FunctionDecl>& library) {
  std::unique_ptr<Model> m(new Model());
  m->sheet_ = sheet;
  m->library_ = &library;
  m->run(diags);
  return m;
}

void Model::run(Diagnostics* diags) {
  const size_t n = sheet_->quantities.size();
  slots_.resize(n);
  checks_.resize(sheet_->checks.size());
  dims_.assign(n, Dimension());
  known_.assign(n, 0);
  unresolved_.assign(n, 0);
  temperatures_.assign(n, TemperatureKind::Unknown);
  exprs_.reserve(n);
  for (const Quantity& q : sheet_->quantities) exprs_.push_back(q.expr.get());
  // The side table of the nodes' dimensions: one slice per formula and check side.
  dims_at_.reserve(n + 2 * sheet_->checks.size() + 1);
  uint32_t at = 0;
  dims_at_.push_back(at);
  for (const Expr* e : exprs_) dims_at_.push_back(at += e ? nodeCount(*e) : 0);
  for (const Check& c : sheet_->checks) {
    dims_at_.push_back(at += nodeCount(*c.lhs));
    dims_at_.push_back(at += nodeCount(*c.rhs));
  }
  node_dims_.assign(at, Dimension());
  resolveNames(diags);
  orderAndFindCycles(diags);
  checkDimensions(diags);
  checkChecks(diags);
  compile(diags);
}

Slot Model::find(const std::string& name) const {
  const int i = sheet_->find(name);
  return i < 0 ? Slot() : Slot(static_cast<uint32_t>(i));
}

namespace {
// The names a formula written in `scope` (an instance, or -1 for the main
// sheet) can read, as it writes them: an instance's own without its prefix.
std::vector<std::string> quantityNames(const Sheet& sheet, int scope) {
  std::vector<std::string> names;
  if (scope < 0) {
    names.reserve(sheet.quantities.size());
    for (const Quantity& q : sheet.quantities) names.push_back(q.name);
    return names;
  }
  const std::string prefix = sheet.instances[static_cast<size_t>(scope)].name + ".";
  for (const Quantity& q : sheet.quantities)
    if (q.name.compare(0, prefix.size(), prefix) == 0) names.push_back(q.name.substr(prefix.size()));
  return names;
}

// The diagnostics of one formula inside an instance carry the `use` line that
// brought it in; the main sheet's go straight through.
class NotedDiagnostics {
 public:
  // `site`: the quantity or check the problems are found in, for the trail to
  // flag a warning at its step (a template's lines are shared by its instances).
  NotedDiagnostics(Diagnostics* diags, const Sheet& sheet, int instance, DiagnosticSite site = {})
      : diags_(diags), sheet_(sheet), instance_(instance), site_(site) {}
  ~NotedDiagnostics() {
    if (local_.list().empty()) return;
    const std::string note = sheet_.instanceNote(instance_);
    for (Diagnostic d : local_.list()) {
      d.message += note;
      if (d.site.quantity < 0 && d.site.check < 0) d.site = site_;
      diags_->add(std::move(d));
    }
  }
  NotedDiagnostics(const NotedDiagnostics&) = delete;
  NotedDiagnostics& operator=(const NotedDiagnostics&) = delete;
  Diagnostics* get() { return instance_ < 0 ? diags_ : &local_; }

 private:
  Diagnostics* diags_;
  const Sheet& sheet_;
  int instance_;
  DiagnosticSite site_;
  Diagnostics local_;
};

bool isLibraryFunction(const std::vector<FunctionDecl>& library, const std::string& name) {
  for (const FunctionDecl& d : library)
    if (d.name == name) return true;
  return false;
}

}  // namespace

std::string unknownNameMessage(const std::string& name, const std::vector<std::string>& names,
                               const std::vector<FunctionDecl>& library) {
  std::string msg = "unknown name `" + name + "`";
  auto near = nearestWords(name, names);
  if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
  if (findUnit(name)) {
    msg += " (`" + name + "` is a unit: a unit follows a number, as in `2 " + name +
           "`, and a compound unit goes in brackets, as in `3 [mm/" + name + "]`)";
  } else if (findMathFunction(name) || isLibraryFunction(library, name)) {
    msg += " (`" + name + "` is a function: call it as `" + name + "(...)`)";
  } else if (near.empty()) {
    msg += "; define it with `" + name + " = ...`";
  }
  return msg;
}

namespace {
bool hasCall(const Expr& e) {
  if (e.kind == ExprKind::Call) return true;
  for (const ExprPtr& a : e.args)
    if (hasCall(*a)) return true;
  return false;
}
}  // namespace

namespace {
// The names the main sheet's failed lines set out to define (`F = 3000 lbs`,
// `F [lbs] = 3000`, `param F [lbs]`): the error is on that line, so a formula
// or check that reads one says nothing more about it.
std::unordered_set<std::string> failedDefinitions(const Sheet& sheet) {
  std::unordered_set<std::string> failed;
  auto isName = [](char c, bool first) {
    return std::isalpha(static_cast<unsigned char>(c)) || (!first && (std::isdigit(static_cast<unsigned char>(c)) || c == '_'));
  };
  for (const Statement& st : sheet.statements) {
    if (st.kind != Statement::Invalid || !sheet.file) continue;
    const std::string_view line = sheet.file->lineText(st.line);
    size_t p = line.find_first_not_of(" \t");
    auto word = [&]() {
      const size_t b = p;
      if (p >= line.size() || !isName(line[p], true)) return std::string();
      while (p < line.size() && isName(line[p], false)) ++p;
      return std::string(line.substr(b, p - b));
    };
    auto skipBlanks = [&]() {
      while (p < line.size() && (line[p] == ' ' || line[p] == '\t')) ++p;
    };
    if (p == std::string_view::npos) continue;
    std::string name = word();
    skipBlanks();
    if (name == "param") {
      name = word();
      skipBlanks();
      if (!name.empty()) failed.insert(name);
      continue;
    }
    if (!name.empty() && p < line.size() && (line[p] == '=' || line[p] == '[')) failed.insert(name);
  }
  return failed;
}

// A name read from an instance whose template has errors (`inst.F`): those
// errors are reported at the template, once per use, and nothing of it is
// expanded, so the reader says nothing more. Such an instance is the one
// whose template is not among the sheet's files: the loader lists a template
// only once it expands it (engine/template/template_loader.cc).
bool inFailedInstance(const Sheet& sheet, const std::string& name) {
  for (const Instance& inst : sheet.instances) {
    if (name.size() <= inst.name.size() || name.compare(0, inst.name.size(), inst.name) != 0 ||
        name[inst.name.size()] != '.')
      continue;
    const bool expanded = std::any_of(sheet.files.begin(), sheet.files.end(),
                                      [&](const SheetFile& f) { return f.path == inst.path; });
    if (!expanded) return true;
  }
  return false;
}
}  // namespace

void Model::resolveNames(Diagnostics* diags) {
  const int n = static_cast<int>(sheet_->quantities.size());
  const std::unordered_set<std::string> failed = failedDefinitions(*sheet_);
  graph_ = std::make_unique<DependencyGraph>(n);
  // Suggestions cost a pass over every name: built on the first unknown name,
  // kept per distinct name, and given for the first few dozen names only, so
  // a sheet full of unknown names still reports in linear time.
  // Per scope (the main sheet, or an instance), as the scope writes them.
  std::unordered_map<int, std::vector<std::string>> names;
  std::unordered_map<std::string, std::string> messages;
  const std::vector<std::string> no_names;
  // A formula written in an instance names its own quantities without the
  // instance's prefix: so does the message, and its suggestions.
  auto unknown = [&](const SourceFile& file, const Expr& e, int scope) {
    const std::string key = std::to_string(scope) + '\n' + e.text;
    auto it = messages.find(key);
    if (it == messages.end()) {
      auto scope_names = names.find(scope);
      if (scope_names == names.end()) scope_names = names.emplace(scope, quantityNames(*sheet_, scope)).first;
      const std::string local = sheet_->localName(scope, e.text);
      it = messages
               .emplace(key, unknownNameMessage(local, messages.size() < 50 ? scope_names->second : no_names,
                                                *library_))
               .first;
    }
    NotedDiagnostics noted(diags, *sheet_, scope);
    noted.get()->error(file, e.begin, e.end, it->second);
  };
  for (int i = 0; i < n; ++i) {
    const Quantity& q = sheet_->quantities[i];
    if (!q.expr) {  // a required parameter: a given value once bound
      slots_[i].input = true;
      continue;
    }
    bool any_name = false;
    forEachName(*q.expr, [&](const Expr& e) {
      any_name = true;
      const int j = sheet_->find(e.text);
      if (j < 0) {
        if ((q.expr_instance >= 0 || !failed.count(e.text)) && !inFailedInstance(*sheet_, e.text))
          unknown(sheet_->exprFile(i), e, q.expr_instance);
        unresolved_[i] = 1;
      } else {
        graph_->addUse(i, j);
      }
    });
    slots_[i].input = !any_name && !hasCall(*q.expr);
  }
  graph_->finish();
  for (size_t k = 0; k < sheet_->checks.size(); ++k) {
    const Check& c = sheet_->checks[k];
    for (const Expr* side : {c.lhs.get(), c.rhs.get()}) {
      forEachName(*side, [&](const Expr& e) {
        if (sheet_->find(e.text) < 0 && (c.instance >= 0 || !failed.count(e.text)) &&
            !inFailedInstance(*sheet_, e.text))
          unknown(sheet_->checkFile(k), e, c.instance);
      });
    }
  }
}

void Model::orderAndFindCycles(Diagnostics* diags) {
  std::vector<std::vector<int>> cycles;
  const std::vector<int> order = graph_->order(&cycles);
  order_.reserve(order.size());
  rank_.assign(sheet_->quantities.size(), static_cast<uint32_t>(sheet_->quantities.size()));
  for (int i : order) {
    rank_[i] = static_cast<uint32_t>(order_.size());
    order_.push_back(Slot(static_cast<uint32_t>(i)));
  }
  for (const std::vector<int>& cycle : cycles) {
    const Quantity& first = sheet_->quantities[cycle[0]];
    std::string loop;
    for (int v : cycle) loop += sheet_->quantities[v].name + " -> ";
    loop += first.name;
    std::string msg;
    if (cycle.size() == 1) {
      msg = "`" + first.name + "` uses itself: " + loop + "; a quantity cannot depend on its own value";
    } else {
      msg = "a cycle: " + loop + " (" + std::to_string(cycle.size()) +
            " quantities depend on each other; each needs the others' values first)";
    }
    NotedDiagnostics noted(diags, *sheet_, first.instance);
    noted.get()->error(sheet_->quantityFile(static_cast<size_t>(cycle[0])), first.name_begin, first.name_end,
                       msg);
  }
}

void Model::checkDimensions(Diagnostics* diags) {
  // The check's findings go to the model's own table (formulaDims); the tree is only read.
  for (Slot slot : order_) {
    const uint32_t i = slot.index();
    const Quantity& q = sheet_->quantities[i];
    SlotInfo& s = slots_[i];
    // A formula that names something undefined (reported already) is still
    // checked, so an unknown function in it shows in the same run; it gets no
    // dimension, which keeps it and its users quiet.
    if (!q.expr) {
      // A required parameter: its unit is its dimension; its value comes from
      // a binding or --set (an error otherwise, reported by whoever runs it).
      s.dim = quantityDimension(q.display->dim);
      s.has_dim = true;
      s.declared = true;
      s.display = q.display.get();
      dims_[i] = s.dim;
      known_[i] = 1;
      continue;
    }
    const DiagnosticSite site{static_cast<int>(i), -1};
    NotedDiagnostics formula_diags(diags, *sheet_, q.expr_instance, site);
    DimensionChecker checker(sheet_->exprFile(i), formula_diags.get(), *sheet_, dims_, known_, *library_,
                             &temperatures_);
    const NodeDims formula_dims = formulaDims(slot);
    TemperatureKind temperature;
    const bool consistent = checker.check(*q.expr, dimsSlice(i), formula_dims.size(), &temperature);
    temperatures_[i] = temperature;
    if (!consistent || unresolved_[i]) continue;
    s.dim = quantityDimension(formula_dims.of(*q.expr));
    if (q.bound && !bindingFits(i, s.dim, formula_diags.get())) continue;
    s.has_dim = true;
    dims_[i] = s.dim;
    known_[i] = 1;
    NotedDiagnostics own_diags(diags, *sheet_, q.instance, site);
    if (q.display) {
      s.declared = true;
      s.display = q.display.get();
      if (!fitsDeclaredUnit(q, *q.expr, formula_dims, *sheet_, sheet_->quantityFile(i), s.dim,
                            own_diags.get())) {
        known_[i] = 0;
        s.has_dim = false;
      }
    } else {
      s.display = intern(undeclaredDisplayUnit(*q.expr, s.dim, sheet_->units, *library_));
      const std::string w = strayAngleWarning(q.name, s.dim, *q.expr, formula_dims, *sheet_);
      if (!w.empty()) own_diags.get()->warning(sheet_->quantityFile(i), q.name_begin, q.name_end, w, site);
    }
  }
}

bool Model::bindingFits(uint32_t i, const Dimension& dim, Diagnostics* diags) const {
  const Quantity& q = sheet_->quantities[i];
  const Instance& inst = sheet_->instances[static_cast<size_t>(q.instance)];
  const std::string param = sheet_->localName(q.instance, q.name);
  std::string wanted;
  if (q.display) {
    const UnitFit fit = fitUnit(dim, q.display->dim);
    if (fit == UnitFit::Exact || fit == UnitFit::AngleDropped) return true;
    wanted = "declared in [" + q.unit_written + "], " + q.display->dim.describe();
  } else {
    if (!q.param_dim || *q.param_dim == dim) return true;
    wanted = q.param_dim->describe() + " (the dimension of its default)";
  }
  diags->error(sheet_->exprFile(i), q.expr->begin, q.expr->end,
               "the binding of `" + param + "` in the instance `" + inst.name + "` gives " + dim.describe() +
                   ", but the parameter `" + param + "` of " + inst.path + " is " + wanted);
  return false;
}

void Model::checkChecks(Diagnostics* diags) {
  for (size_t k = 0; k < sheet_->checks.size(); ++k) {
    const Check& c = sheet_->checks[k];
    CheckInfo& s = checks_[k];
    bool unknown = false;
    for (const Expr* side : {c.lhs.get(), c.rhs.get()})
      forEachName(*side, [&](const Expr& e) { unknown |= sheet_->find(e.text) < 0; });
    if (unknown) continue;
    NotedDiagnostics noted(diags, *sheet_, c.instance, DiagnosticSite{-1, static_cast<int>(k)});
    const SourceFile& file = sheet_->checkFile(k);
    DimensionChecker checker(file, noted.get(), *sheet_, dims_, known_, *library_, &temperatures_);
    const NodeDims lhs = checkDims(k, 0), rhs = checkDims(k, 1);
    const size_t f = slots_.size() + 2 * k;
    TemperatureKind unused;
    if (!checker.check(*c.lhs, dimsSlice(f), lhs.size(), &unused) ||
        !checker.check(*c.rhs, dimsSlice(f + 1), rhs.size(), &unused))
      continue;
    const Dimension& lhs_dim = lhs.of(*c.lhs);
    const Dimension& rhs_dim = rhs.of(*c.rhs);
    bool incompatible;
    const std::string warning = compareForSum(lhs_dim, rhs_dim, &incompatible);
    const uint32_t op_end = c.op_begin + static_cast<uint32_t>(std::string(comparisonText(c.op)).size());
    if (incompatible) {
      noted.get()->error(
          file, c.op_begin, op_end,
          "the check `" + c.name + "` compares " + lhs_dim.describe() + " with " + rhs_dim.describe());
      continue;
    }
    if (!warning.empty())
      noted.get()->warning(file, c.op_begin, op_end, "the check `" + c.name + "` " + warning);
    s.has_dim = true;
    s.dim = lhs_dim;
    // Show both sides in the unit of the quantity (or literal) the check names first.
    const Unit* unit = nullptr;
    for (const Expr* side : {c.lhs.get(), c.rhs.get()}) {
      const Expr* x = withoutParensOrSigns(side);
      if (x->kind == ExprKind::Name && slots_[sheet_->find(x->text)].has_dim) {
        unit = slots_[sheet_->find(x->text)].display;
        break;
      }
      if (!unit && x->kind == ExprKind::Number && x->unit) unit = x->unit.get();
    }
    s.display = unit && fitUnit(s.dim, unit->dim) != UnitFit::Incompatible ? *unit : sheet_->units.choose(s.dim);
  }
}

const Unit& noUnit() {
  static const Unit none;
  return none;
}

// A unit is the same unit when its text is (the table spells each one way);
// the rest is compared too, so that a unit made another way is kept apart.
const Unit* Model::intern(Unit unit) {
  const auto it = unit_by_text_.find(unit.text);
  if (it != unit_by_text_.end()) {
    const Unit& u = *it->second;
    if (u.factor == unit.factor && u.offset == unit.offset && u.dim == unit.dim) return &u;
  }
  units_.push_back(std::move(unit));
  unit_by_text_.emplace(units_.back().text, &units_.back());
  return &units_.back();
}

void Model::compile(Diagnostics* diags) {
  for (Slot slot : order_) {
    SlotInfo& s = slots_[slot.index()];
    if (!s.has_dim) continue;
    const Quantity& q = sheet_->quantities[slot.index()];
    if (!q.expr) continue;  // a required parameter: no formula of its own
    Program p = compileProgram(*q.expr, formulaDims(slot), *sheet_, *library_);
    if (p.text.size() > kMaxProgramLength) {
      NotedDiagnostics noted(diags, *sheet_, q.expr_instance);
      noted.get()->error(sheet_->exprFile(slot.index()), q.expr->begin, q.expr->end,
                         tooLongMessage("`" + q.name + "`", p.text.size()));
      continue;
    }
    s.formula = std::move(p);
  }
  for (size_t k = 0; k < sheet_->checks.size(); ++k) {
    CheckInfo& s = checks_[k];
    if (!s.has_dim) continue;
    const Check& c = sheet_->checks[k];
    s.lhs = compileProgram(*c.lhs, checkDims(k, 0), *sheet_, *library_);
    s.rhs = compileProgram(*c.rhs, checkDims(k, 1), *sheet_, *library_);
    bool fits = true;
    for (const auto& side : {std::make_pair(&s.lhs, c.lhs.get()), std::make_pair(&s.rhs, c.rhs.get())}) {
      if (side.first->text.size() <= kMaxProgramLength) continue;
      // The same limit as a formula's, said the same way (not "not a finite number").
      NotedDiagnostics noted(diags, *sheet_, c.instance);
      noted.get()->error(sheet_->checkFile(k), side.second->begin, side.second->end,
                         tooLongMessage("a side of the check `" + c.name + "`", side.first->text.size()));
      fits = false;
    }
    if (!fits) {
      s.lhs = Program();
      s.rhs = Program();
      continue;
    }
    s.compiled = true;
    for (const Program* p : {&s.lhs, &s.rhs})
      for (int j : p->inputs) {
        const Slot r(static_cast<uint32_t>(j));
        if (std::find(s.reads.begin(), s.reads.end(), r) == s.reads.end()) s.reads.push_back(r);
      }
  }
}

std::vector<Slot> Model::downstream(const std::vector<Slot>& slots) const {
  std::vector<char> in(slots_.size(), 0);
  std::vector<Slot> cone;
  std::vector<int> stack;
  for (Slot s : slots) {
    if (in[s.index()]) continue;
    in[s.index()] = 1;
    stack.push_back(static_cast<int>(s.index()));
    while (!stack.empty()) {  // iterative: a 100k-long chain cannot overflow the stack
      const int i = stack.back();
      stack.pop_back();
      cone.push_back(Slot(static_cast<uint32_t>(i)));
      for (int u : graph_->usedBy(i))
        if (!in[u]) in[u] = 1, stack.push_back(u);
    }
  }
  std::sort(cone.begin(), cone.end(), [&](Slot a, Slot b) { return rank_[a.index()] < rank_[b.index()]; });
  return cone;
}

size_t Model::compiledBytes() const {
  size_t bytes = slots_.capacity() * sizeof(SlotInfo) + checks_.capacity() * sizeof(CheckInfo);
  auto program = [](const Program& p) {
    return p.text.capacity() + p.inputs.capacity() * sizeof(int) + p.calls.capacity() * sizeof(LibraryCall);
  };
  for (const SlotInfo& s : slots_) bytes += program(s.formula);
  for (const Unit& u : units_) bytes += sizeof(Unit) + u.text.capacity();
  for (const CheckInfo& c : checks_)
    bytes += program(c.lhs) + program(c.rhs) + c.reads.capacity() * sizeof(Slot);
  bytes += order_.capacity() * sizeof(Slot) + rank_.capacity() * sizeof(uint32_t);
  bytes += dims_.capacity() * sizeof(Dimension) + known_.capacity() + unresolved_.capacity();
  bytes += temperatures_.capacity() * sizeof(TemperatureKind) + node_dims_.capacity() * sizeof(Dimension) +
           dims_at_.capacity() * sizeof(uint32_t);
  bytes += sizeof(DependencyGraph) + graph_->bytes();
  return bytes;
}

bool checkOverModel(const Model& m, const SourceFile& file, const Expr& expr, Diagnostics* diags,
                    TreeDims* dims) {
  bool unknown = false;
  std::vector<std::string> names;  // built on the first unknown name only
  forEachName(expr, [&](const Expr& x) {
    if (m.find(x.text).valid()) return;
    if (names.empty())
      for (const Quantity& q : m.sheet().quantities) names.push_back(q.name);
    diags->error(file, x.begin, x.end, unknownNameMessage(x.text, names, m.library()));
    unknown = true;
  });
  if (unknown) return false;
  DimensionChecker checker(file, diags, m.sheet(), m.dims(), m.known(), m.library(), &m.temperatures());
  return checker.check(expr, dims);
}

}  // namespace calctrail
