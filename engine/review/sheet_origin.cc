#include "engine/review/sheet_origin.h"

#include <algorithm>
#include <climits>
#include <cstdlib>
#include <memory>
#include <vector>

// The low-level SHA-1 functions, as engine/util/sha256.cc uses SHA-256's:
// without the start-up of EVP.
#define OPENSSL_SUPPRESS_DEPRECATED
#include <openssl/sha.h>

#include "engine/review/git_source.h"
#include "engine/sheet/control_chars.h"
#include "engine/template/template_path.h"

namespace calctrail {

namespace {

// The history of one path is small; this bounds a pathological one.
constexpr size_t kMaxLogBytes = size_t{64} << 20;

std::string firstLine(const std::string& s) {
  return s.substr(0, s.find('\n'));
}

bool realPath(const std::string& path, std::string* real) {
  std::unique_ptr<char, decltype(&std::free)> resolved(::realpath(path.c_str(), nullptr), &std::free);
  if (!resolved) return false;
  *real = resolved.get();
  return true;
}

std::string baseName(const std::string& path) {
  const size_t slash = path.find_last_of('/');
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

// The basename of the tracked file a temporary file of git stands for; ""
// for any other name. git (2.25 and later) writes a blob to
// `git-blob-XXXXXX/<basename>` in the temporary folder; earlier ones to
// `XXXXXX_<basename>` (six random characters and an underscore).
// *in_folder: the name has the later form, which no sheet of one's own is likely to have.
std::string gitTemporaryBase(const std::string& file, bool* in_folder) {
  const std::string base = baseName(file);
  const size_t slash = file.find_last_of('/');
  const std::string folder = slash == std::string::npos ? "" : baseName(file.substr(0, slash));
  *in_folder = folder.size() == 15 && folder.rfind("git-blob-", 0) == 0;
  if (*in_folder) return base;
  if (base.size() <= 7 || base[6] != '_') return "";
  return base.substr(7);
}

// Why git gave no answer when it was stopped or never run: the time limit,
// or a CALCTRAIL_GIT_TIMEOUT that cannot be read. Kept in *problem, first one only.
void noteStop(const ProcessResult& r, std::string* problem) {
  if (!problem->empty()) return;
  if (r.timed_out)
    *problem = "git did not finish within its time limit (CALCTRAIL_GIT_TIMEOUT, docs/limits.md)";
  else if (r.output_too_large)
    *problem = "git's answer passed its size limit (docs/limits.md)";
  else if (!r.started && !r.err.empty())
    *problem = withoutControlChars(r.err);
}

// The object id of `object` (`HEAD`, `HEAD:PATH`, `:PATH` for the index); "" when there is none.
std::string objectId(const std::string& top, const std::string& object, std::string* problem) {
  const ProcessResult r = runGit({"-C", top, "rev-parse", "--verify", "--quiet", object}, 4096);
  noteStop(r, problem);
  return r.status == 0 ? firstLine(r.out) : "";
}

// `rel` (from the top of the work tree) is a tracked file.
bool tracked(const std::string& top, const std::string& rel, std::string* problem) {
  const ProcessResult r = runGit({"-C", top, "ls-files", "-z", "--", ":(literal)" + rel}, 1 << 16);
  noteStop(r, problem);
  return r.status == 0 && !r.out.empty();
}

bool isCommitLine(const std::string& line) {
  return line.size() == 40 && std::all_of(line.begin(), line.end(), [](char c) {
           return (c >= '0' && c <= '9') || (c >= 'a' && c <= 'f');
         });
}

// The newest first-parent commit from HEAD at which `path` held one of
// `ids`: the end of that version's lifetime. "" when it never did.
std::string newestCommitWith(const std::string& top, const std::string& path,
                             const std::vector<std::string>& ids, std::string* problem) {
  // -m with --first-parent: a merge's change is shown against its first parent only.
  const ProcessResult r = runGit({"-C", top, "log", "--first-parent", "-m", "--format=%H", "--raw",
                                  "--no-abbrev", "--no-renames", "HEAD", "--", path},
                                 kMaxLogBytes);
  noteStop(r, problem);
  if (r.status != 0) return "";
  auto held = [&](const std::string& id) { return std::find(ids.begin(), ids.end(), id) != ids.end(); };
  std::string commit;
  size_t begin = 0;
  while (begin < r.out.size()) {
    size_t end = r.out.find('\n', begin);
    if (end == std::string::npos) end = r.out.size();
    const std::string line = r.out.substr(begin, end - begin);
    begin = end + 1;
    if (isCommitLine(line)) {
      commit = line;
      continue;
    }
    // ":100644 100644 OLD NEW M\tPATH", newest commit first.
    if (line.empty() || line[0] != ':' || commit.empty()) continue;
    const size_t old_at = line.find(' ', line.find(' ') + 1) + 1;
    if (old_at == 0 || line.size() < old_at + 81) continue;  // not git's form: nothing to read
    const std::string old_id = line.substr(old_at, 40), new_id = line.substr(old_at + 41, 40);
    if (held(old_id))
      return objectId(top, commit + "^1", problem);           // changed away here: held until its parent
    if (held(new_id)) return objectId(top, "HEAD", problem);  // written here and never changed since
  }
  return "";
}

std::string withoutCarriageReturns(const std::string& bytes) {
  std::string out;
  out.reserve(bytes.size());
  for (size_t k = 0; k < bytes.size(); ++k)
    if (!(bytes[k] == '\r' && k + 1 < bytes.size() && bytes[k + 1] == '\n')) out += bytes[k];
  return out;
}

}  // namespace

std::string gitBlobId(const std::string& bytes) {
  const std::string header = "blob " + std::to_string(bytes.size()) + std::string(1, '\0');
  unsigned char digest[SHA_DIGEST_LENGTH];
  SHA_CTX context;
  SHA1_Init(&context);
  SHA1_Update(&context, header.data(), header.size());
  SHA1_Update(&context, bytes.data(), bytes.size());
  SHA1_Final(digest, &context);
  static const char* hex = "0123456789abcdef";
  std::string out;
  for (unsigned char b : digest) {
    out += hex[b >> 4];
    out += hex[b & 15];
  }
  return out;
}

SheetOrigin locateSheet(const std::string& file, const std::string& bytes) {
  SheetOrigin origin;
  bool in_folder = false;
  const std::string name = gitTemporaryBase(file, &in_folder);
  std::string problem;
  auto notFound = [&](const std::string& why) {
    if (name.empty()) return origin;  // not a file git wrote: nothing to say
    origin.kind = SheetOrigin::NotFound;
    origin.note = "templates read beside the file: " + why;
    return origin;
  };
  const ProcessResult top = runGit({"rev-parse", "--show-toplevel"}, 1 << 16);
  noteStop(top, &problem);
  std::string top_real, file_real;
  if (!problem.empty()) return notFound(problem);
  if (top.status != 0 || !realPath(firstLine(top.out), &top_real)) return origin;  // not in a work tree
  origin.top = top_real;
  if (realPath(file, &file_real) && insideFolder(file_real, top_real)) {
    const std::string rel = file_real.size() > top_real.size() ? file_real.substr(top_real.size() + 1) : "";
    // A temporary folder inside the work tree (TMPDIR there): git's file is
    // untracked, and stands for another.
    if (!in_folder || tracked(top_real, rel, &problem)) {
      origin.kind = SheetOrigin::WorkTree;
      origin.path = rel;
      return origin;
    }
  }
  if (name.empty()) return origin;
  // git writes the blob as it would be checked out: with CRLF line ends where
  // the repository asks for them; the blob itself may have LF.
  std::vector<std::string> ids = {gitBlobId(bytes)};
  const std::string lf = withoutCarriageReturns(bytes);
  if (lf != bytes) ids.push_back(gitBlobId(lf));
  const ProcessResult listed = runGit({"-C", top_real, "ls-files", "-z", "--full-name"}, kMaxLogBytes);
  noteStop(listed, &problem);
  std::vector<std::string> candidates;
  for (size_t begin = 0; listed.status == 0 && begin < listed.out.size();) {
    size_t end = listed.out.find('\0', begin);
    if (end == std::string::npos) end = listed.out.size();
    const std::string path = listed.out.substr(begin, end - begin);
    if (baseName(path) == name) candidates.push_back(path);
    begin = end + 1;
  }
  std::sort(candidates.begin(), candidates.end());
  // A path in conflict is listed once per stage.
  candidates.erase(std::unique(candidates.begin(), candidates.end()), candidates.end());
  auto found = [&](const std::string& path, const std::string& rev, const std::string& where) {
    origin.kind = SheetOrigin::Revision;
    origin.path = path;
    origin.rev = rev;
    origin.note = "templates and using sheets read at " + where + " (" + withoutControlChars(path) + ")";
    return origin;
  };
  auto held = [&](const std::string& id) { return std::find(ids.begin(), ids.end(), id) != ids.end(); };
  const std::string head = candidates.empty() ? "" : objectId(top_real, "HEAD", &problem);
  for (const std::string& path : candidates) {
    if (!problem.empty()) break;  // each further call would wait as long
    if (!head.empty() && held(objectId(top_real, "HEAD:" + path, &problem)))
      return found(path, head, "commit " + head.substr(0, 7));
    // A staged version, in no commit yet: its templates as staged too.
    if (held(objectId(top_real, ":" + path, &problem))) return found(path, "", "the index");
    const std::string commit = newestCommitWith(top_real, path, ids, &problem);
    if (!commit.empty()) return found(path, commit, "commit " + commit.substr(0, 7));
  }
  return notFound(problem.empty()
                      ? "this version of " + withoutControlChars(name) + " is in no tracked file's history"
                      : problem);
}

}  // namespace calctrail
