#include "functions/function_library.h"

#include <array>
#include <cctype>
#include <cstdint>
#include <functional>
#include <iterator>
#include <stdexcept>
#include <string>

namespace calctrail {

namespace {

struct Library {
  std::vector<FunctionDecl> decls;
  std::vector<FunctionGroup> groups;
  // The declarations by name, for findFunction (a worksheet's calls are
  // looked up a few hundred times a run): an open-addressing hash table at
  // most half full, so that a lookup is one hash and about one compare.
  std::array<const FunctionDecl*, 256> by_name{};
};

// FNV-1a: a few instructions a character, and no collisions to speak of among
// the library's names.
std::size_t slotOf(std::string_view name) {
  std::uint32_t h = 2166136261u;
  for (const char c : name) h = (h ^ static_cast<unsigned char>(c)) * 16777619u;
  return h;
}

constexpr std::size_t kSlotMask = 255;  // by_name.size() - 1

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
    if (l.decls.size() * 2 > l.by_name.size()) throw std::logic_error("the drive library outgrew its name table");
    for (const FunctionDecl& d : l.decls) {
      std::size_t k = slotOf(d.name) & kSlotMask;
      while (l.by_name[k]) k = (k + 1) & kSlotMask;
      l.by_name[k] = &d;
    }
    return l;
  }();
  return lib;
}

}  // namespace

const std::vector<FunctionDecl>& functionLibrary() { return library().decls; }

const std::vector<FunctionGroup>& functionGroups() { return library().groups; }

const FunctionDecl* findFunction(std::string_view name) {
  const auto& by_name = library().by_name;
  for (std::size_t k = slotOf(name) & kSlotMask; by_name[k]; k = (k + 1) & kSlotMask)
    if (by_name[k]->name == name) return by_name[k];
  return nullptr;
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
