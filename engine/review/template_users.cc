#include "engine/review/template_users.h"

#include <algorithm>
#include <map>
#include <memory>
#include <set>
#include <vector>

#include "engine/calculation.h"
#include "engine/review/annotated_sheet.h"
#include "engine/review/git_source.h"
#include "engine/sheet/control_chars.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_cache.h"
#include "engine/template/template_path.h"

namespace calctrail {

namespace {

// Templates nest at most 32 deep (engine/template/template_loader.cc); users are looked for as far.
constexpr int kMaxUserDepth = 32;

// The files of `base`, with one file's content replaced: the version of the
// template that textconv was given, wherever the loader reads it.
class OverlaySource final : public FileSource {
 public:
  OverlaySource(const FileSource& base, std::string path, const std::string& bytes)
      : base_(base), path_(std::move(path)), bytes_(bytes) {}
  bool read(const std::string& path, std::string* bytes, std::string* error) const override {
    if (normalizePath(path) != path_) return base_.read(path, bytes, error);
    *bytes = bytes_;
    return true;
  }
  bool realPath(const std::string& path, std::string* real) const override {
    return base_.realPath(path, real);
  }
  std::string id() const override { return "overlay " + base_.id(); }

 private:
  const FileSource& base_;
  std::string path_;
  const std::string& bytes_;
};

// Where the files of `origin` are read: the work tree from its top, or the
// revision from the root. `rel` is a path from the top of the work tree.
struct Tree {
  const SheetOrigin& origin;
  const FileSource& source;
  std::string key(const std::string& rel) const {
    return origin.kind == SheetOrigin::WorkTree ? normalizePath(origin.top + "/" + rel) : rel;
  }
};

std::string baseName(const std::string& path) {
  const size_t slash = path.find_last_of('/');
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

std::string regexQuoted(const std::string& s) {
  std::string out;
  for (char c : s) {
    if (std::string(".[]()*+?{}|^$\\").find(c) != std::string::npos) out += '\\';
    out += c;
  }
  return out;
}

// Tracked `.calc` files with a `use` line naming a file called one of
// `names`, from the top of the work tree, at the origin's revision.
// *stopped set when git was stopped at its limits or could not be run with them.
std::vector<std::string> filesNaming(const SheetOrigin& origin, const std::set<std::string>& names,
                                     bool* stopped) {
  std::vector<std::string> args = {"-C", origin.top, "grep", "-l", "-z", "-I", "-E"};
  for (const std::string& name : names) {
    args.push_back("-e");
    args.push_back("^[[:space:]]*use[[:space:]].*" + regexQuoted(name));
  }
  if (origin.kind == SheetOrigin::Revision) {
    if (origin.rev.empty())
      args.push_back("--cached");
    else
      args.push_back(origin.rev);
  }
  args.push_back("--");
  args.push_back("*.calc");
  const ProcessResult r = runGit(args);
  std::vector<std::string> files;
  if (r.timed_out || r.output_too_large || !r.started) *stopped = true;
  if (r.status != 0) return files;  // 1: none
  const std::string prefix =
      origin.kind == SheetOrigin::Revision && !origin.rev.empty() ? origin.rev + ":" : "";
  for (size_t begin = 0; begin < r.out.size();) {
    size_t end = r.out.find('\0', begin);
    if (end == std::string::npos) end = r.out.size();
    std::string path = r.out.substr(begin, end - begin);
    if (path.rfind(prefix, 0) == 0) files.push_back(path.substr(prefix.size()));
    begin = end + 1;
  }
  return files;
}

// Every tracked sheet that uses `target` directly or through other
// templates, with its bytes, sorted by path; `target` itself left out.
std::map<std::string, std::string> usersOf(const Tree& tree, const std::string& target, bool* stopped) {
  std::map<std::string, std::string> users;
  std::set<std::string> frontier = {target};
  for (int depth = 0; depth < kMaxUserDepth && !frontier.empty(); ++depth) {
    std::set<std::string> names;
    for (const std::string& f : frontier) names.insert(baseName(f));
    std::set<std::string> next;
    for (const std::string& candidate : filesNaming(tree.origin, names, stopped)) {
      if (candidate == target || users.count(candidate)) continue;
      std::string bytes, error;
      if (!tree.source.read(tree.key(candidate), &bytes, &error)) continue;
      Diagnostics ignored;
      const Sheet sheet = parseSheet(std::make_shared<SourceFile>(candidate, bytes), &ignored);
      for (const Use& use : sheet.uses)
        if (frontier.count(joinPath(parentPath(candidate), use.path))) {
          next.insert(candidate);
          users.emplace(candidate, std::move(bytes));
          break;
        }
    }
    frontier = std::move(next);
  }
  return users;
}

std::string firstError(const Calculation& calc) {
  for (const Diagnostic& d : calc.diags.list())
    if (d.severity == Severity::Error) return withoutControlChars(d.message);
  return "";
}

// The lines of one using sheet: what the template reaches in it.
std::string userLines(const Calculation& calc, const std::string& user, const std::string& target,
                      int digits) {
  const std::string head = std::string(kAnnotationMark) + " " + withoutControlChars(user) + ": ";
  // A template between: on its own, its required parameters have no values;
  // the sheets that use it are listed for themselves.
  const bool between = std::any_of(calc.sheet.quantities.begin(), calc.sheet.quantities.end(),
                                   [](const Quantity& q) { return q.required && q.instance < 0; });
  if (calc.hasErrors() && between)
    return head + "a template with required parameters, through the sheets using it\n";
  if (calc.hasErrors()) {
    const int n = calc.diags.errorCount();
    return head + std::to_string(n) + (n == 1 ? " error" : " errors") +
           ", nothing calculated: " + firstError(calc) + "\n";
  }
  std::vector<Slot> from;
  for (const Instance& inst : calc.sheet.instances)
    if (joinPath(parentPath(user), inst.path) == target)
      for (int q : inst.quantities) from.push_back(Slot(static_cast<uint32_t>(q)));
  std::vector<bool> reached(calc.sheet.quantities.size(), false);
  std::vector<std::string> lines;
  for (Slot slot : calc.model->downstream(from)) {  // in evaluation order: as a trail reads
    reached[slot.index()] = true;
    const QuantityView s = calc.quantity(slot.index());
    // Given values are in the template's own lines, or the sheet's bindings.
    if (!s.input && s.ok)
      lines.push_back(calc.sheet.quantities[slot.index()].name + " = " +
                      annotatedValue(s.si, s.display, digits));
  }
  for (size_t k = 0; k < calc.sheet.checks.size(); ++k) {
    const auto& reads = calc.model->checks()[k].reads;
    if (calc.checkResult(k).ok &&
        std::any_of(reads.begin(), reads.end(), [&](Slot s) { return reached[s.index()]; }))
      lines.push_back(annotatedCheck(calc.sheet.checks[k], calc.check(k), digits));
  }
  if (lines.empty()) return head + "no result depends on it\n";
  std::string out;
  for (size_t k = 0; k < lines.size() && k < kMaxUserResults; ++k) out += head + lines[k] + "\n";
  if (lines.size() > kMaxUserResults)
    out += head + "and " + std::to_string(lines.size() - kMaxUserResults) + " more\n";
  return out;
}

}  // namespace

std::string templateUsersBlock(const SheetOrigin& origin, const std::string& bytes, int digits) {
  if (origin.kind != SheetOrigin::WorkTree && origin.kind != SheetOrigin::Revision) return "";
  std::unique_ptr<FileSource> revision;
  if (origin.kind == SheetOrigin::Revision) revision = std::make_unique<GitRevisionSource>(origin.rev, false);
  const Tree tree{origin, revision ? *revision : diskSource()};
  const std::string target = normalizePath(origin.path);
  bool stopped = false;
  const std::map<std::string, std::string> users = usersOf(tree, target, &stopped);
  const std::string mark = std::string(kAnnotationMark) + " ";
  if (stopped)
    return mark +
           "calctrail: the sheets using it were not looked up: git was stopped at its limits "
           "(CALCTRAIL_GIT_TIMEOUT, docs/limits.md)\n";
  if (users.empty()) return "";
  const OverlaySource overlay(tree.source, tree.key(target), bytes);
  TemplateCache cache;  // each template read once for all the users
  std::string out = mark + "calctrail: used by " + std::to_string(users.size()) +
                    (users.size() == 1 ? " sheet" : " sheets") + "; their results with this version of " +
                    withoutControlChars(baseName(target)) + ":\n";
  size_t listed = 0;
  for (const auto& [user, sheet_bytes] : users) {
    if (listed++ == kMaxTemplateUsers) break;
    CalcOptions options;
    options.templates = &cache;
    options.source = &overlay;
    options.source_path = tree.key(user);
    const auto calc = Calculation::fromText(user, sheet_bytes, options);
    out += userLines(*calc, user, target, digits);
  }
  if (users.size() > kMaxTemplateUsers)
    out += mark + "and " + std::to_string(users.size() - kMaxTemplateUsers) + " more sheets\n";
  return out;
}

}  // namespace calctrail
