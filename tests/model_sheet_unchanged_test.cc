// Issue 10: building a Model never writes into the parse tree, and a model
// evaluated with different Inputs gives each answer and then the first again.
// Every demo worksheet and every template of the library, templates expanded.
#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <cstring>
#include <filesystem>
#include <string>
#include <vector>

#include "engine/model/evaluate.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_loader.h"
#include "engine/util/sha256.h"
#include "test_support.h"

using namespace calctrail;

namespace {

std::string bits(double v) {
  uint64_t b;
  std::memcpy(&b, &v, sizeof b);
  return std::to_string(b);
}

void dumpDim(const Dimension& d, std::string* out) {
  for (int b = 0; b < Dimension::kBases; ++b) *out += std::to_string(d.exponent(static_cast<Base>(b))) + ",";
}

void dumpUnit(const Unit& u, std::string* out) {
  *out += "unit{" + bits(u.factor) + " " + bits(u.offset) + " " + u.text + " ";
  dumpDim(u.dim, out);
  *out += "}";
}

// Every member of every node, in preorder.
void dumpExpr(const Expr* e, std::string* out) {
  if (!e) {
    *out += "null;";
    return;
  }
  *out += "(" + std::to_string(static_cast<int>(e->kind)) + " #" + std::to_string(e->id) + " " +
          std::to_string(e->begin) + "-" + std::to_string(e->end) + " '" + e->text + "' " + bits(e->number);
  if (e->unit) {
    dumpUnit(*e->unit, out);
    *out += "[" + e->unit->written + "]";
  }
  for (const ExprPtr& a : e->args) dumpExpr(a.get(), out);
  *out += ")";
}

// A deep dump of everything the parser and the template loader put in a Sheet.
std::string dumpSheet(const Sheet& s) {
  std::string out;
  for (const Statement& st : s.statements)
    out += "st " + std::to_string(st.kind) + " " + std::to_string(st.line) + " " + std::to_string(st.index) +
           " '" + st.text() + "' '" + st.key() + "'\n";
  for (const Quantity& q : s.quantities) {
    out += "q " + q.name + " " + std::to_string(q.name_begin) + "-" + std::to_string(q.name_end) + " [" +
           q.unit_written + "] " + std::to_string(q.unit_begin) + "-" + std::to_string(q.unit_end) + " ";
    if (q.display) dumpUnit(*q.display, &out);
    dumpExpr(q.expr.get(), &out);
    out += " '" + q.description + "' '" + q.section + "' " + q.overrideText() + " " + q.overrideCase() + " " +
           std::to_string(q.line) + std::to_string(q.overridden) + std::to_string(q.param) +
           std::to_string(q.required) + std::to_string(q.bound) + " " + std::to_string(q.instance) + " " +
           std::to_string(q.expr_instance) + " ";
    if (q.param_dim) dumpDim(*q.param_dim, &out);
    out += std::string(q.file ? q.file->path() : "-") + " " + (q.expr_file ? q.expr_file->path() : "-") + "\n";
  }
  for (const Check& c : s.checks) {
    out += "c " + c.name + " " + std::to_string(static_cast<int>(c.op)) + " " + std::to_string(c.op_begin) + " ";
    dumpExpr(c.lhs.get(), &out);
    dumpExpr(c.rhs.get(), &out);
    out += " '" + c.description + "' '" + c.section + "' " + std::to_string(c.line) + " " +
           std::to_string(c.instance) + "\n";
  }
  for (const LoadCase& lc : s.cases) {
    out += "case " + lc.name + " '" + lc.description + "'";
    for (const CaseReplacement& r : lc.replacements) {
      out += " " + r.name + "=";
      dumpExpr(r.expr.get(), &out);
    }
    out += "\n";
  }
  for (const SheetStudy& st : s.studies) {
    out += "study " + st.name + " " + st.vary.name;
    for (const ExprPtr& v : st.values) dumpExpr(v.get(), &out);
    out += "\n";
  }
  for (const Use& u : s.uses) {
    out += "use " + u.path + " " + u.instance;
    for (const UseBinding& b : u.bindings) {
      out += " " + b.param + "=";
      dumpExpr(b.expr.get(), &out);
    }
    out += "\n";
  }
  for (const Instance& i : s.instances) out += "instance " + i.name + " " + i.path + "\n";
  return out;
}

struct Demo {
  std::string path;
  Sheet sheet;
};

Sheet load(const std::string& path, Diagnostics* diags) {
  const std::string bytes = test::readFile(path);
  Sheet sheet = parseSheet(std::make_shared<SourceFile>(path, bytes), diags);
  TemplateCache cache;
  expandTemplates(&sheet, path, sha256Hex(bytes), diskSource(), &cache, diags);
  return sheet;
}

std::vector<std::string> demoPaths() {
  std::vector<std::string> paths;
  for (const char* dir : {"worksheets", "worksheets/templates"})
    for (const auto& entry : std::filesystem::directory_iterator(test::repoPath(dir)))
      if (entry.path().extension() == ".calc") paths.push_back(entry.path().string());
  std::sort(paths.begin(), paths.end());
  return paths;
}

bool sameBits(const std::vector<double>& a, const std::vector<double>& b) {
  return a.size() == b.size() && std::memcmp(a.data(), b.data(), a.size() * sizeof(double)) == 0;
}

}  // namespace

TEST_CASE("model: building never changes the sheet, on every demo and template", "[model][immutable]") {
  const std::vector<std::string> paths = demoPaths();
  REQUIRE(paths.size() > 10);
  for (const std::string& path : paths) {
    INFO(path);
    Diagnostics diags;
    Sheet sheet = load(path, &diags);
    const std::string before = dumpSheet(sheet);
    REQUIRE(before.find("(") != std::string::npos);  // it has formulas to compare
    {
      // Borrowed: the caller's sheet, read in place.
      auto m = Model::borrow(&sheet, &diags);
      CHECK(dumpSheet(sheet) == before);
      if (!diags.hasErrors()) {
        const Inputs nominal(*m);
        (void)evaluate(*m, nominal);
        CHECK(dumpSheet(sheet) == before);
      }
    }
    // Owned: the model's copy reads the same as the sheet before it was built.
    Diagnostics again;
    auto owned = Model::build(load(path, &again), &again);
    CHECK(dumpSheet(owned->sheet()) == before);
  }
}

TEST_CASE("model: every demo evaluated with its inputs changed, then as written again", "[model][inputs]") {
  for (const std::string& path : demoPaths()) {
    INFO(path);
    Diagnostics diags;
    auto m = Model::build(load(path, &diags), &diags);
    if (diags.hasErrors()) continue;  // a template with required parameters has no values alone
    const Inputs nominal(*m);
    const Results first = evaluate(*m, nominal);
    Inputs changed(*m);
    int bound = 0;
    for (Slot s : m->order()) {
      // Every given value at 1.05 times itself (whole numbers stay whole: a count of starts).
      if (!m->slot(s).input || !first.ok(s)) continue;
      const double v = first.value(s);
      if (v == 0 || v == std::floor(v)) continue;
      changed.bind(s, v * 1.05);
      ++bound;
    }
    if (bound == 0) continue;
    const Results second = evaluate(*m, changed);
    const Results third = evaluate(*m, nominal);
    CHECK_FALSE(sameBits(first.values, second.values));
    CHECK(sameBits(first.values, third.values));
    REQUIRE(first.checks.size() == third.checks.size());
    for (size_t k = 0; k < first.checks.size(); ++k) {
      CHECK(first.checks[k].ok == third.checks[k].ok);
      CHECK(first.checks[k].passed == third.checks[k].passed);
      CHECK(std::memcmp(&first.checks[k].lhs, &third.checks[k].lhs, sizeof(double)) == 0);
    }
    CHECK(first.faults.size() == third.faults.size());
    // The second answer is the one the changed inputs give, not a leftover of the first.
    const Results fresh = evaluate(*m, changed);
    CHECK(sameBits(second.values, fresh.values));
  }
}

TEST_CASE("expr parser: every tree of the demos is numbered 0..n-1 in preorder", "[model][immutable]") {
  for (const std::string& path : demoPaths()) {
    INFO(path);
    Diagnostics diags;
    const Sheet sheet = load(path, &diags);
    auto numbered = [](const Expr& root) {
      uint32_t next = 0;
      bool ok = true;
      std::vector<const Expr*> stack{&root};
      while (!stack.empty()) {
        const Expr* e = stack.back();
        stack.pop_back();
        ok &= e->id == next++;
        for (size_t i = e->args.size(); i-- > 0;) stack.push_back(e->args[i].get());
      }
      return ok && nodeCount(root) == next;
    };
    for (const Quantity& q : sheet.quantities)
      if (q.expr) CHECK(numbered(*q.expr));
    for (const Check& c : sheet.checks) {
      CHECK(numbered(*c.lhs));
      CHECK(numbered(*c.rhs));
    }
  }
}
