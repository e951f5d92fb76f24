#include "engine/study/sweep_merge.h"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "engine/study/json_reader.h"

namespace calctrail {

namespace {

bool fail(std::string* error, const std::string& why) {
  *error = why;
  return false;
}

const JsonValue* member(const JsonValue& v, const char* key, JsonValue::Type type) {
  const JsonValue* m = v.find(key);
  return m && m->type == type ? m : nullptr;
}

bool names(const JsonValue& doc, const char* key, std::vector<std::string>* out) {
  const JsonValue* a = member(doc, key, JsonValue::Array);
  if (!a) return false;
  for (const JsonValue& v : a->array) {
    if (v.type != JsonValue::String) return false;
    out->push_back(v.string);
  }
  return true;
}

bool wholeNumber(const JsonValue* v, uint64_t* out) {
  if (!v || v->type != JsonValue::Number || !(v->number >= 0) || v->number != std::floor(v->number) ||
      v->number > 9e15)
    return false;
  *out = static_cast<uint64_t>(v->number);
  return true;
}

bool sameColumns(const std::vector<SweepColumn>& a, const std::vector<SweepColumn>& b) {
  if (a.size() != b.size()) return false;
  for (size_t i = 0; i < a.size(); ++i)
    if (a[i].name != b[i].name || a[i].unit.text != b[i].unit.text || a[i].unit.factor != b[i].unit.factor ||
        a[i].unit.offset != b[i].unit.offset)
      return false;
  return true;
}

}  // namespace

bool readSweepJson(const std::string& text, SweepTable* t, std::string* error) {
  JsonValue doc;
  if (!parseJsonText(text, &doc, error)) return false;
  const JsonValue* study = member(doc, "study", JsonValue::String);
  if (!study || study->string != "sweep")
    return fail(error, "not the JSON of a sweep (no \"study\": \"sweep\")");
  *t = SweepTable();
  const JsonValue* sheet = member(doc, "sheet", JsonValue::Object);
  const JsonValue* path = sheet ? member(*sheet, "path", JsonValue::String) : nullptr;
  const JsonValue* sha = sheet ? member(*sheet, "sha256", JsonValue::String) : nullptr;
  if (!path || !sha) return fail(error, "the sweep names no worksheet (\"sheet\": {\"path\", \"sha256\"})");
  t->sheet_path = path->string;
  t->sheet_sha256 = sha->string;
  std::vector<std::string> vary, show;
  if (!names(doc, "set", &t->sets) || !names(doc, "vary", &vary) || !names(doc, "show", &show) ||
      !names(doc, "check_names", &t->checks))
    return fail(error, "\"set\", \"vary\", \"show\" and \"check_names\" must be lists of names");
  const JsonValue* units = member(doc, "units", JsonValue::Object);
  if (!units) return fail(error, "the sweep has no \"units\"");
  auto column = [&](const std::string& name, SweepColumn* c) {
    const JsonValue* u = units->find(name);
    const JsonValue* text_ = u ? member(*u, "unit", JsonValue::String) : nullptr;
    const JsonValue* factor = u ? member(*u, "factor", JsonValue::Number) : nullptr;
    const JsonValue* offset = u ? member(*u, "offset", JsonValue::Number) : nullptr;
    if (!text_ || !factor || !offset || !(factor->number != 0)) return false;
    c->name = name;
    c->unit.text = text_->string;
    c->unit.factor = factor->number;
    c->unit.offset = offset->number;
    return true;
  };
  for (const std::string& n : vary) {
    t->vary.emplace_back();
    if (!column(n, &t->vary.back())) return fail(error, "no unit for `" + n + "` in \"units\"");
  }
  for (const std::string& n : show) {
    t->show.emplace_back();
    if (!column(n, &t->show.back())) return fail(error, "no unit for `" + n + "` in \"units\"");
  }
  const JsonValue* grid = member(doc, "grid", JsonValue::Array);
  if (!grid || grid->array.size() != vary.size() || vary.empty() || vary.size() > 2)
    return fail(error, "\"grid\" must give the number of values of each varied input");
  for (const JsonValue& g : grid->array) {
    uint64_t n = 0;
    if (!wholeNumber(&g, &n) || n == 0) return fail(error, "\"grid\" must hold whole numbers");
    t->grid.push_back(n);
  }
  const JsonValue* log = member(doc, "log", JsonValue::Bool);
  t->log = log && log->boolean;
  const JsonValue* shard = member(doc, "shard", JsonValue::Object);
  uint64_t k = 0, n = 0, total = 0;
  if (!shard || !wholeNumber(shard->find("k"), &k) || !wholeNumber(shard->find("n"), &n) || k < 1 || k > n ||
      n > 1000000)
    return fail(error, "\"shard\" must be {\"k\": K, \"n\": N} with 1 <= K <= N");
  t->shard = static_cast<int>(k);
  t->shards = static_cast<int>(n);
  if (!wholeNumber(doc.find("total_points"), &total) || total != t->totalPoints())
    return fail(error, "\"total_points\" is not the product of \"grid\"");
  const JsonValue* points = member(doc, "points", JsonValue::Array);
  if (!points) return fail(error, "the sweep has no \"points\"");
  for (const JsonValue& p : points->array) {
    uint64_t index = 0;
    if (!wholeNumber(p.find("index"), &index) || index >= total || index % n != k - 1)
      return fail(error, "a point's \"index\" is missing or not of shard " + std::to_string(k) + "/" +
                             std::to_string(n));
    if (!t->index.empty() && index <= t->index.back())
      return fail(error, "the points are not in index order");
    t->index.push_back(index);
    auto values = [&](const char* key, const std::vector<SweepColumn>& cols, std::vector<double>* out,
                      bool required) {
      const JsonValue* o = member(p, key, JsonValue::Object);
      if (!o) return false;
      for (const SweepColumn& c : cols) {
        const JsonValue* q = o->find(c.name);
        const JsonValue* si = q ? q->find("si") : nullptr;
        if (!si || (si->type != JsonValue::Number && (required || si->type != JsonValue::Null))) return false;
        out->push_back(si->type == JsonValue::Number ? si->number : NAN);
      }
      return true;
    };
    if (!values("inputs", t->vary, &t->inputs, true) || !values("results", t->show, &t->results, false))
      return fail(error, "point " + std::to_string(index) + " lacks an input or a result");
    const JsonValue* checks = member(p, "checks", JsonValue::Object);
    if (!checks) return fail(error, "point " + std::to_string(index) + " has no \"checks\"");
    for (const std::string& c : t->checks) {
      const JsonValue* s = checks->find(c);
      if (!s || (s->type != JsonValue::Bool && s->type != JsonValue::Null))
        return fail(error, "point " + std::to_string(index) + " has no state for the check `" + c + "`");
      t->check_states.push_back(s->type == JsonValue::Null ? -1 : s->boolean ? 1 : 0);
    }
    Fault f;
    const JsonValue* e = p.find("error");
    if (e && e->type == JsonValue::String) f.message = e->string;
    t->faults.push_back(std::move(f));
  }
  return true;
}

bool mergeSweeps(std::vector<SweepTable> shards, SweepTable* out, std::string* error) {
  if (shards.empty()) return fail(error, "no shards to merge");
  const SweepTable& first = shards.front();
  std::vector<char> seen(static_cast<size_t>(first.shards), 0);
  for (const SweepTable& s : shards) {
    if (s.sheet_sha256 != first.sheet_sha256 || s.sheet_path != first.sheet_path)
      return fail(error, "the shards are of different worksheets (" + first.sheet_path + " " +
                             first.sheet_sha256.substr(0, 12) + ", " + s.sheet_path + " " +
                             s.sheet_sha256.substr(0, 12) + ")");
    if (s.sets != first.sets) return fail(error, "the shards were run with different --set");
    if (!sameColumns(s.vary, first.vary) || !sameColumns(s.show, first.show) || s.grid != first.grid ||
        s.checks != first.checks || s.log != first.log)
      return fail(error, "the shards are of different sweeps (inputs, results, grid or checks differ)");
    if (s.shards != first.shards)
      return fail(error, "the shards split the sweep differently (into " + std::to_string(first.shards) +
                             " and " + std::to_string(s.shards) + ")");
    if (seen[static_cast<size_t>(s.shard - 1)]++)
      return fail(error,
                  "shard " + std::to_string(s.shard) + "/" + std::to_string(s.shards) + " is given twice");
  }
  for (size_t k = 0; k < seen.size(); ++k)
    if (!seen[k])
      return fail(error,
                  "shard " + std::to_string(k + 1) + "/" + std::to_string(first.shards) + " is missing");

  SweepTable t;
  t.sheet_path = first.sheet_path;
  t.sheet_sha256 = first.sheet_sha256;
  t.sets = first.sets;
  t.vary = first.vary;
  t.show = first.show;
  t.log = first.log;
  t.grid = first.grid;
  t.checks = first.checks;
  // Every point of shard K has an index i with i % N == K - 1: interleave them back in index order.
  struct Ref {
    uint64_t index;
    size_t shard, point;
  };
  std::vector<Ref> refs;
  for (size_t s = 0; s < shards.size(); ++s)
    for (size_t p = 0; p < shards[s].size(); ++p) refs.push_back({shards[s].index[p], s, p});
  std::sort(refs.begin(), refs.end(), [](const Ref& a, const Ref& b) { return a.index < b.index; });
  if (refs.size() != t.totalPoints())
    return fail(error, "the shards hold " + std::to_string(refs.size()) + " points; the sweep has " +
                           std::to_string(t.totalPoints()));
  const size_t nv = t.vary.size(), ns = t.show.size(), nc = t.checks.size();
  for (const Ref& r : refs) {
    const SweepTable& s = shards[r.shard];
    t.index.push_back(r.index);
    for (size_t j = 0; j < nv; ++j) t.inputs.push_back(s.input(r.point, j));
    for (size_t j = 0; j < ns; ++j) t.results.push_back(s.result(r.point, j));
    for (size_t k = 0; k < nc; ++k) t.check_states.push_back(s.check(r.point, k));
    t.faults.push_back(s.faults[r.point]);
  }
  *out = std::move(t);
  return true;
}

}  // namespace calctrail
