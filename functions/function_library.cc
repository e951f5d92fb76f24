#include "functions/function_library.h"

#include <cctype>
#include <functional>
#include <iterator>
#include <string>
#include <unordered_map>

namespace calctrail {

namespace {

struct Library {
  std::vector<FunctionDecl> decls;
  std::vector<FunctionGroup> groups;
  // The declarations by name, for findFunction: a worksheet's calls are
  // looked up a few hundred times a run, a scan compared every name.
  std::unordered_map<std::string_view, const FunctionDecl*> by_name;
};

const Library& library() {
  static const Library lib = [] {
    Library l;
    l.decls.reserve(128);  // room for every declaration: none is moved while the library grows
    using Adder = fn::GroupText (*)(std::vector<FunctionDecl>&);
    const Adder adders[] = {fn::addThreads, fn::addPowerScrews, fn::addCollars, fn::addStresses,
                            fn::addColumns, fn::addBallScrews,  fn::addGears,   fn::addMotors,
                            fn::addServo};
    l.groups.reserve(std::size(adders));
    for (Adder add : adders) {
      FunctionGroup g;
      g.first = l.decls.size();
      const fn::GroupText text = add(l.decls);
      g.title = text.title;
      g.intro = text.intro;
      g.count = l.decls.size() - g.first;
      l.groups.push_back(std::move(g));
    }
    l.by_name.reserve(l.decls.size());
    for (const FunctionDecl& d : l.decls) l.by_name.emplace(d.name, &d);
    return l;
  }();
  return lib;
}

}  // namespace

const std::vector<FunctionDecl>& functionLibrary() { return library().decls; }

const std::vector<FunctionGroup>& functionGroups() { return library().groups; }

const FunctionDecl* findFunction(std::string_view name) {
  const auto& by_name = library().by_name;
  const auto it = by_name.find(name);
  return it == by_name.end() ? nullptr : it->second;
}

std::string FunctionDecl::argName(int k) const {
  const int fixed = static_cast<int>(args.size());
  if (k < fixed || repeat == 0) return std::string(args[static_cast<size_t>(k)].name);
  // The declared name of the group's last repetition, split into stem and number.
  const std::string_view last = argAt(k).name;
  size_t digits = last.size();
  while (digits > 0 && std::isdigit(static_cast<unsigned char>(last[digits - 1]))) --digits;
  const int number = digits < last.size() ? std::stoi(std::string(last.substr(digits))) : 1;
  return std::string(last.substr(0, digits)) + std::to_string(number + 1 + (k - fixed) / repeat);
}

const FunctionGroup* groupOf(const FunctionDecl& decl) {
  const std::vector<FunctionDecl>& all = functionLibrary();
  const std::less<const FunctionDecl*> before;  // total order, unlike a raw <
  if (all.empty() || before(&decl, &all.front()) || before(&all.back(), &decl)) return nullptr;
  const std::size_t index = static_cast<std::size_t>(&decl - &all.front());
  for (const FunctionGroup& g : functionGroups())
    if (index >= g.first && index < g.first + g.count) return &g;
  return nullptr;
}

}  // namespace calctrail
