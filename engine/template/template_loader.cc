#include "engine/template/template_loader.h"

#include <algorithm>

#include "engine/template/template_path.h"
#include "engine/util/edit_distance.h"

namespace calctrail {

namespace {

// Every name in `e` gets `prefix`: a template's `F` is the instance's `left.F`.
// `stack` is the walk's own, kept by the caller from one tree to the next.
void qualifyNames(Expr* e, const std::string& prefix, std::vector<Expr*>* stack) {
  if (prefix.empty()) return;
  stack->assign(1, e);
  while (!stack->empty()) {  // iterative, as every walk here
    Expr* x = stack->back();
    stack->pop_back();
    if (x->kind == ExprKind::Name) x->text.insert(0, prefix);
    for (ExprPtr& a : x->args) stack->push_back(a.get());
  }
}

ExprPtr qualifiedCopy(const Expr& e, const std::string& prefix, std::vector<Expr*>* stack) {
  ExprPtr copy = cloneExpr(e);
  qualifyNames(copy.get(), prefix, stack);
  return copy;
}

// Room for `more` elements in `v`, grown by doubling as push_back would, so
// that each instance's quantities and checks are added without regrowing
// the vector on the way.
template <class T>
void reserveMore(std::vector<T>* v, size_t more) {
  if (v->size() + more > v->capacity()) v->reserve(std::max(v->size() + more, 2 * v->capacity()));
}

std::string baseName(const std::string& path) {
  const size_t slash = path.rfind('/');
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

// Templates nest at most this deep: a chain longer than any real machine
// needs, and a bound on the recursion below.
constexpr int kMaxDepth = 32;

// The file whose `use` lines are being expanded.
struct Using {
  const Sheet* sheet;
  std::shared_ptr<SourceFile> file;
  std::string read_path;  // as the source reads it
  std::string rel_dir;    // its folder, relative to the main sheet's
  std::string prefix;     // "" for the main sheet, "drive." inside the instance `drive`
  int instance;           // -1 for the main sheet
  int depth;
};

class Expander {
 public:
  Expander(Sheet* out, const FileSource& source, TemplateCache* cache, Diagnostics* diags)
      : out_(out), source_(source), cache_(cache), diags_(diags) {}

  void run(const std::string& main_path, const std::string& main_sha256) {
    out_->files.push_back({baseName(main_path), main_sha256});
    chain_.push_back(normalizePath(main_path));
    chain_names_.push_back(baseName(main_path));
    expandUses({out_, out_->file, normalizePath(main_path), "", "", -1, 0});
  }

 private:
  void error(const Using& u, uint32_t begin, uint32_t end, const std::string& message) {
    diags_->error(*u.file, begin, end, message + out_->instanceNote(u.instance));
  }

  void expandUses(const Using& u) {
    for (size_t k = 0; k < u.sheet->uses.size(); ++k) expandUse(u, u.sheet->uses[k], static_cast<int>(k));
  }

  void expandUse(const Using& u, const Use& use, int use_index) {
    if (isAbsolutePath(use.path)) {
      error(u, use.path_begin, use.path_end,
            "`" + use.path +
                "` is an absolute path: a worksheet must calculate on a colleague's checkout "
                "too; write the path relative to this file, as in `templates/screw.calc`");
      return;
    }
    std::string read = joinPath(parentPath(u.read_path), use.path);
    if (read.empty()) read = ".";  // `use . as x`: the folder itself, which is no template
    const std::string rel = joinPath(u.rel_dir, use.path);
    auto looped = std::find(chain_.begin(), chain_.end(), read);
    if (looped != chain_.end()) {
      std::string loop;
      for (auto it = looped; it != chain_.end(); ++it)
        loop += chain_names_[static_cast<size_t>(it - chain_.begin())] + " -> ";
      error(u, use.path_begin, use.path_end,
            "a template that uses itself: " + loop + rel +
                " (uses form a cycle; a template cannot be part of "
                "itself)");
      return;
    }
    if (u.depth >= kMaxDepth) {
      error(u, use.path_begin, use.path_end,
            "templates nest more than " + std::to_string(kMaxDepth) + " deep here; flatten the chain");
      return;
    }
    std::string why;
    const TemplateFile* t = cache_->get(source_, read, &why);
    if (!t) {
      error(u, use.path_begin, use.path_end,
            "cannot read the template `" + use.path + "` (tried " + read + "): " + why);
      return;
    }
    if (!withinTree(u, use)) return;
    const std::string name = u.prefix + use.instance;
    const int index = static_cast<int>(out_->instances.size());
    {
      Instance inst;
      inst.name = name;
      inst.path = rel;
      inst.title = t->sheet.meta.get("title");
      inst.parent = u.instance;
      inst.use_index = u.instance < 0 ? use_index : -1;
      inst.line = use.line;
      const SourcePos at = u.file->position(use.instance_begin);
      inst.context = "in the instance `" + name + "` used at " + u.file->path() + ":" +
                     std::to_string(at.line) + ":" + std::to_string(at.column);
      if (u.instance >= 0) inst.context += ", " + out_->instances[u.instance].context;
      out_->instances.push_back(std::move(inst));
    }
    if (t->diags.hasErrors()) {
      // The template's own text is wrong: say so once per use, and expand nothing of it.
      for (Diagnostic d : t->diags.list()) {
        d.message += out_->instanceNote(index);
        diags_->add(std::move(d));
      }
      return;
    }
    if (std::none_of(out_->files.begin(), out_->files.end(),
                     [&](const SheetFile& f) { return f.path == rel; }))
      out_->files.push_back({rel, t->sha256});
    const Sheet& ts = t->sheet;
    std::vector<const UseBinding*> binding_of(ts.quantities.size(), nullptr);
    for (const UseBinding& b : use.bindings) {
      const int j = ts.find(b.param);
      if (j >= 0 && ts.quantities[j].param) {
        binding_of[static_cast<size_t>(j)] = &b;
        continue;
      }
      std::vector<std::string> params;
      for (const Quantity& q : ts.quantities)
        if (q.param) params.push_back(q.name);
      std::string msg = "`" + b.param + "` is not a parameter of " + rel;
      if (params.empty())
        msg += ", which has none (a parameter is declared with `param NAME [UNIT]`)";
      else
        msg += "; its parameters are " + quotedList(params);
      const auto near = nearestWords(b.param, params);
      if (!near.empty()) msg += "; did you mean " + quotedList(near) + "?";
      error(u, b.name_begin, b.name_end, msg);
    }
    const std::string own_prefix = name + ".";
    reserveMore(&out_->quantities, ts.quantities.size());
    reserveMore(&out_->checks, ts.checks.size());
    for (size_t j = 0; j < ts.quantities.size(); ++j) {
      const Quantity& tq = ts.quantities[j];
      Quantity q;
      q.name = own_prefix + tq.name;
      q.name_begin = tq.name_begin;
      q.name_end = tq.name_end;
      q.unit_written = tq.unit_written;
      q.unit_begin = tq.unit_begin;
      q.unit_end = tq.unit_end;
      q.display = tq.display;
      q.description = tq.description;
      q.line = tq.line;
      q.section = tq.section;
      q.param = tq.param;
      q.required = tq.required;
      q.instance = index;
      q.expr_instance = index;
      q.file = ts.file;
      const UseBinding* b = binding_of[j];
      InstanceParam param;
      if (b) {
        q.expr = qualifiedCopy(*b->expr, u.prefix, &walk_);
        q.bound = true;
        q.required = false;
        q.expr_file = u.file;
        q.expr_instance = u.instance;
        if (!tq.display) {
          q.param_dim = t->param_dims[j];
          if (!q.param_dim)
            error(u, b->name_begin, b->name_end,
                  "the parameter `" + tq.name +
                      "` has no dimension to bind to: its default fails the "
                      "dimension check (run " +
                      rel + " on its own to see why)");
        }
        const std::string& text = u.file->bytes();
        param.binding = text.substr(b->expr->begin, b->expr->end - b->expr->begin);
      } else if (tq.required) {
        error(u, use.instance_begin, use.instance_end,
              "the instance `" + use.instance + "` needs a value for the parameter `" + tq.name + "` [" +
                  tq.unit_written + "] of " + rel + ", which has no default: add `with " + tq.name +
                  " = ...`");
      } else {
        q.expr = qualifiedCopy(*tq.expr, own_prefix, &walk_);
      }
      const int qi = static_cast<int>(out_->quantities.size());
      if (out_->find(q.name) >= 0) {
        error(u, use.instance_begin, use.instance_end,
              "the instance `" + use.instance + "` defines `" + q.name + "`, which the sheet has already");
        continue;
      }
      out_->index.insert(q.name, qi);
      out_->instances[index].quantities.push_back(qi);
      if (tq.param) {
        param.quantity = qi;
        out_->instances[index].params.push_back(std::move(param));
      }
      out_->quantities.push_back(std::move(q));
    }
    for (const Check& tc : ts.checks) {
      Check c;
      c.name = own_prefix + tc.name;
      c.name_begin = tc.name_begin;
      c.name_end = tc.name_end;
      c.lhs = qualifiedCopy(*tc.lhs, own_prefix, &walk_);
      c.rhs = qualifiedCopy(*tc.rhs, own_prefix, &walk_);
      c.op = tc.op;
      c.op_begin = tc.op_begin;
      c.description = tc.description;
      c.line = tc.line;
      c.section = tc.section;
      c.instance = index;
      c.file = ts.file;
      out_->instances[index].checks.push_back(static_cast<int>(out_->checks.size()));
      out_->checks.push_back(std::move(c));
    }
    chain_.push_back(read);
    chain_names_.push_back(rel);
    expandUses({&ts, ts.file, read, parentPath(rel), own_prefix, index, u.depth + 1});
    chain_.pop_back();
    chain_names_.pop_back();
  }

  // A path leaves the folder of the file that writes it only by its own
  // leading `../`; a symbolic link that leads further is refused.
  bool withinTree(const Using& u, const Use& use) {
    const std::string here = parentPath(u.read_path);
    std::string up;
    for (int k = leadingParents(use.path); k > 0; --k) up += "../";
    std::string root = joinPath(here, up);
    if (root.empty()) root = ".";
    std::string real_root, real_target;
    if (!source_.realPath(root, &real_root)) return true;  // no links to follow (a git revision)
    if (!source_.realPath(joinPath(here, use.path), &real_target)) return true;
    if (insideFolder(real_target, real_root)) return true;
    error(u, use.path_begin, use.path_end,
          "the template `" + use.path + "` is reached through a symbolic link that leads out of the folder " +
              "the path names (" + root + "), to " + real_target +
              "; write the path to the file itself, with `../` where it leaves the folder");
    return false;
  }

  Sheet* out_;
  const FileSource& source_;
  TemplateCache* cache_;
  Diagnostics* diags_;
  std::vector<std::string> chain_;        // read paths of the files being expanded, the main sheet first
  std::vector<std::string> chain_names_;  // the same, as the cycle message names them
  std::vector<Expr*> walk_;               // qualifyNames' stack
};

}  // namespace

void expandTemplates(Sheet* sheet, const std::string& main_path, const std::string& main_sha256,
                     const FileSource& source, TemplateCache* cache, Diagnostics* diags) {
  Expander(sheet, source, cache, diags).run(main_path, main_sha256);
}

}  // namespace calctrail
