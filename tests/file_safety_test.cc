// Files calctrail writes (docs/limits.md): an output that is the worksheet is
// refused, links and special files are written through and never replaced,
// temporaries cannot be redirected, and fmt --write keeps what the file was.
// Where permissions matter the program runs as the user nobody, since root
// passes every permission check.
#include <dirent.h>
#include <fcntl.h>
#include <sys/inotify.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <catch2/catch.hpp>
#include <cerrno>
#include <cstring>
#include <vector>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

constexpr uid_t kNobody = 65534;
constexpr gid_t kNogroup = 65534;

const char* const kSheet = "F = 2 kN   # load\nr = 0.1 m\nT [N*m] = F * r\ncheck t: T < 500 [N*m]\n";
const char* const kUncanonical = "F=2 kN\nr =0.1 m\nT [N*m]=F*r\n";

// The program run as nobody, with no supplementary groups.
std::string asNobody() {
  INFO("setpriv comes with the Debian package util-linux");
  REQUIRE(access("/usr/bin/setpriv", X_OK) == 0);
  return "/usr/bin/setpriv --reuid=65534 --regid=65534 --clear-groups";
}

// A fresh folder nobody owns, so nobody may create and rename files in it.
std::string nobodyDir() {
  const std::string dir = tempDir();
  REQUIRE(chown(dir.c_str(), kNobody, kNogroup) == 0);
  REQUIRE(chmod(dir.c_str(), 0755) == 0);
  return dir;
}

// Writes a file with the given owner and mode.
void makeFile(const std::string& path, const std::string& text, uid_t uid, gid_t gid, mode_t mode) {
  writeFile(path, text);
  REQUIRE(chown(path.c_str(), uid, gid) == 0);
  REQUIRE(chmod(path.c_str(), mode) == 0);
}

// What a test promises stays the same about a file.
struct FileState {
  std::string bytes;         // the contents
  mode_t type_and_mode = 0;  // st_mode: file type and permission bits
  uid_t uid = 0;             // owner
  gid_t gid = 0;             // group
  nlink_t links = 0;         // hard links
  bool operator==(const FileState& o) const {
    return bytes == o.bytes && type_and_mode == o.type_and_mode && uid == o.uid && gid == o.gid &&
           links == o.links;
  }
};

FileState stateOf(const std::string& path) {
  struct stat st;
  REQUIRE(lstat(path.c_str(), &st) == 0);
  FileState s;
  if (S_ISREG(st.st_mode)) s.bytes = readFile(path);
  s.type_and_mode = st.st_mode;
  s.uid = st.st_uid;
  s.gid = st.st_gid;
  s.links = st.st_nlink;
  return s;
}

std::vector<std::string> entries(const std::string& path) {
  std::vector<std::string> names;
  DIR* dir = opendir(path.c_str());
  REQUIRE(dir != nullptr);
  while (dirent* e = readdir(dir))
    if (std::strcmp(e->d_name, ".") != 0 && std::strcmp(e->d_name, "..") != 0) names.push_back(e->d_name);
  closedir(dir);
  std::sort(names.begin(), names.end());
  return names;
}

}  // namespace

TEST_CASE("report -o onto its own worksheet is refused, by name, hard link or symbolic link",
          "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kSheet, kNobody, kNogroup, 0644);
  REQUIRE(link((dir + "/x.calc").c_str(), (dir + "/hard.calc").c_str()) == 0);
  REQUIRE(symlink("x.calc", (dir + "/soft.calc").c_str()) == 0);
  const FileState before = stateOf(dir + "/x.calc");
  for (const char* out : {"x.calc", "hard.calc", "soft.calc", "./x.calc"}) {
    INFO(out);
    Run r = runCliThrough(dir, user, std::string("report x.calc -o ") + out);
    CHECK(r.status == 2);
    CHECK(r.err ==
          std::string(out) +
              ":1:1: error: cannot write: it is `x.calc`, the worksheet this command reads (the same "
              "file); give another output\n");
    CHECK(stateOf(dir + "/x.calc") == before);
  }
  // Standard input read from the worksheet counts as reading it.
  Run r = runCliThrough(dir, user, "report - -o x.calc <x.calc");
  CHECK(r.status == 2);
  CHECK(r.err.find("x.calc:1:1: error: cannot write: it is standard input, the worksheet") == 0);
  CHECK(stateOf(dir + "/x.calc") == before);
  CHECK(entries(dir) == std::vector<std::string>{"hard.calc", "soft.calc", "x.calc"});
}

TEST_CASE("report -o through a symbolic link writes the file it leads to and keeps the link",
          "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kSheet, kNobody, kNogroup, 0644);
  makeFile(dir + "/trail.txt", "old trail\n", kNobody, kNogroup, 0640);
  REQUIRE(symlink("trail.txt", (dir + "/out.txt").c_str()) == 0);
  Run r = runCliThrough(dir, user, "report x.calc -o out.txt");
  CHECK(r.status == 0);
  CHECK(r.err.empty());
  const FileState link = stateOf(dir + "/out.txt");
  CHECK(S_ISLNK(link.type_and_mode));
  const FileState target = stateOf(dir + "/trail.txt");
  CHECK(target.bytes.find("T = F · r") != std::string::npos);
  CHECK((target.type_and_mode & 07777) == 0640);
  CHECK(target.uid == kNobody);

  // A link that leads nowhere is refused, and no file appears.
  REQUIRE(symlink("missing.txt", (dir + "/dangling.txt").c_str()) == 0);
  Run d = runCliThrough(dir, user, "report x.calc -o dangling.txt");
  CHECK(d.status == 2);
  CHECK(d.err ==
        "dangling.txt:1:1: error: cannot write: it is a symbolic link to a file that does not exist\n");
  CHECK(entries(dir) == std::vector<std::string>{"dangling.txt", "out.txt", "trail.txt", "x.calc"});
}

TEST_CASE("report -o onto a device writes into it and reports its write errors, and the node stays",
          "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kSheet, kNobody, kNogroup, 0644);
  const FileState full = stateOf("/dev/full"), null = stateOf("/dev/null");
  REQUIRE(S_ISCHR(full.type_and_mode));
  Run r = runCliThrough(dir, user, "report x.calc -o /dev/full");
  CHECK(r.status == 2);
  CHECK(r.err == "/dev/full:1:1: error: cannot write: No space left on device\n");
  CHECK(stateOf("/dev/full") == full);
  Run n = runCliThrough(dir, user, "report x.calc -o /dev/null");
  CHECK(n.status == 0);
  CHECK(n.err.empty());
  CHECK(stateOf("/dev/null") == null);
}

TEST_CASE("report -o onto a FIFO writes into it as a stream, and a FIFO nobody reads is an error, not a hang",
          "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kSheet, kNobody, kNogroup, 0644);
  const std::string fifo = dir + "/pipe";
  REQUIRE(mkfifo(fifo.c_str(), 0666) == 0);
  REQUIRE(chown(fifo.c_str(), kNobody, kNogroup) == 0);
  const FileState before = stateOf(fifo);

  Run lonely = runCliThrough(dir, user, "report x.calc -o pipe");
  CHECK(lonely.status == 2);
  CHECK(lonely.err == "pipe:1:1: error: cannot write: no process is reading the FIFO\n");

  // A reader that is already there gets the trail; the trail of this sheet fits the pipe's buffer.
  const int reader = open(fifo.c_str(), O_RDONLY | O_NONBLOCK);
  REQUIRE(reader >= 0);
  Run r = runCliThrough(dir, user, "report x.calc -o pipe");
  CHECK(r.status == 0);
  CHECK(r.err.empty());
  std::string got;
  char buf[4096];
  for (ssize_t n; (n = read(reader, buf, sizeof buf)) > 0;) got.append(buf, static_cast<size_t>(n));
  close(reader);
  CHECK(got == runCliIn(dir, "report x.calc").out);
  CHECK(stateOf(fifo) == before);
  CHECK(entries(dir) == std::vector<std::string>{"pipe", "x.calc"});
}

TEST_CASE("fmt --write: a link planted under a temporary name redirects nothing", "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kUncanonical, kNobody, kNogroup, 0644);
  makeFile(dir + "/victim.txt", "precious\n", kNobody, kNogroup, 0644);
  // The names the old code used, PATH.calctrail-tmp-PID, for the process ids
  // the next commands are likely to get.
  const int first = static_cast<int>(getpid());
  for (int pid = first; pid < first + 400; ++pid) {
    const std::string planted = dir + "/x.calc.calctrail-tmp-" + std::to_string(pid);
    REQUIRE(symlink("victim.txt", planted.c_str()) == 0);
  }
  const FileState victim = stateOf(dir + "/victim.txt");
  Run r = runCliThrough(dir, user, "fmt --write x.calc");
  CHECK(r.status == 0);
  CHECK(r.out == "x.calc: rewritten in canonical layout\n");
  const FileState sheet = stateOf(dir + "/x.calc");
  CHECK(S_ISREG(sheet.type_and_mode));
  CHECK(sheet.bytes == "F = 2 kN\nr = 0.1 m\nT [N*m] = F * r\n");
  CHECK(stateOf(dir + "/victim.txt") == victim);
  const std::vector<std::string> names = entries(dir);
  CHECK(names.size() == 402);  // the sheet, the victim and the planted links: no temporary left
  for (int pid = first; pid < first + 400; ++pid) {
    struct stat st;
    const std::string planted = dir + "/x.calc.calctrail-tmp-" + std::to_string(pid);
    REQUIRE(lstat(planted.c_str(), &st) == 0);
    CHECK(S_ISLNK(st.st_mode));
  }
}

TEST_CASE("fmt --write refuses a read-only file and one with other hard links", "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/ro.calc", kUncanonical, kNobody, kNogroup, 0444);
  const FileState ro = stateOf(dir + "/ro.calc");
  Run r = runCliThrough(dir, user, "fmt --write ro.calc");
  CHECK(r.status == 2);
  CHECK(r.err ==
        "ro.calc:1:1: error: cannot write: the file is read-only for you; calctrail leaves it as it is; "
        "the file is unchanged\n");
  CHECK(stateOf(dir + "/ro.calc") == ro);

  makeFile(dir + "/a.calc", kUncanonical, kNobody, kNogroup, 0644);
  REQUIRE(link((dir + "/a.calc").c_str(), (dir + "/b.calc").c_str()) == 0);
  const FileState a = stateOf(dir + "/a.calc");
  CHECK(a.links == 2);
  Run h = runCliThrough(dir, user, "fmt --write a.calc");
  CHECK(h.status == 2);
  CHECK(h.err ==
        "a.calc:1:1: error: cannot write: the file has 2 hard links, and rewriting it would split them; "
        "calctrail leaves it as it is; the file is unchanged\n");
  CHECK(stateOf(dir + "/a.calc") == a);
  CHECK(stateOf(dir + "/b.calc") == a);
  CHECK(entries(dir) == std::vector<std::string>{"a.calc", "b.calc", "ro.calc"});
}

TEST_CASE("fmt --write keeps the owner and group, and refuses where it cannot", "[file-safety]") {
  // As root every owner can be given: the rewritten file keeps 1234:5678.
  const std::string dir = tempDir();
  makeFile(dir + "/x.calc", kUncanonical, 1234, 5678, 0640);
  Run r = runCliIn(dir, "fmt --write x.calc");
  CHECK(r.status == 0);
  const FileState after = stateOf(dir + "/x.calc");
  CHECK(after.bytes == "F = 2 kN\nr = 0.1 m\nT [N*m] = F * r\n");
  CHECK(after.uid == 1234);
  CHECK(after.gid == 5678);
  CHECK((after.type_and_mode & 07777) == 0640);
  CHECK(after.links == 1);

  // nobody may write a group-writable file of another user, but a copy would
  // become nobody's: refused, the file as it was.
  const std::string user = asNobody();
  const std::string shared = nobodyDir();
  makeFile(shared + "/y.calc", kUncanonical, 1234, kNogroup, 0664);
  const FileState before = stateOf(shared + "/y.calc");
  Run n = runCliThrough(shared, user, "fmt --write y.calc");
  CHECK(n.status == 2);
  CHECK(n.err ==
        "y.calc:1:1: error: cannot write: the file belongs to user 1234, group 65534, which a rewritten copy "
        "cannot keep; calctrail leaves it as it is; the file is unchanged\n");
  CHECK(stateOf(shared + "/y.calc") == before);
  CHECK(entries(shared) == std::vector<std::string>{"y.calc"});
}

TEST_CASE("fmt --write gives the temporary the file's mode before renaming it", "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kUncanonical, kNobody, kNogroup, 0600);
  // inotify reports the operations in the order they happened: a change of
  // mode on the final name after the rename would be a window where the
  // worksheet was readable by others.
  const int watch = inotify_init1(IN_NONBLOCK);
  REQUIRE(watch >= 0);
  REQUIRE(inotify_add_watch(watch, dir.c_str(), IN_CREATE | IN_ATTRIB | IN_MOVED_TO) >= 0);
  Run r = runCliThrough(dir, user, "fmt --write x.calc");
  CHECK(r.status == 0);
  std::vector<std::pair<uint32_t, std::string>> events;
  alignas(inotify_event) char buf[65536];
  for (ssize_t n; (n = read(watch, buf, sizeof buf)) > 0;) {
    for (char* p = buf; p < buf + n;) {
      const inotify_event* e = reinterpret_cast<const inotify_event*>(p);
      events.emplace_back(e->mask & (IN_CREATE | IN_ATTRIB | IN_MOVED_TO), e->len ? e->name : "");
      p += sizeof(inotify_event) + e->len;
    }
  }
  close(watch);
  std::string seen;
  for (const auto& e : events)
    seen += (e.first == IN_CREATE   ? "create "
             : e.first == IN_ATTRIB ? "attrib "
                                    : "moved_to ") +
            e.second + "\n";
  INFO(seen);
  REQUIRE(events.size() >= 3);
  // The temporary is made in the worksheet's folder, its mode set, then renamed.
  const std::string temp = events.front().second;
  CHECK(events.front().first == IN_CREATE);
  CHECK(temp.rfind(".x.calc.calctrail-", 0) == 0);
  const auto moved =
      std::find(events.begin(), events.end(), std::make_pair(uint32_t{IN_MOVED_TO}, std::string("x.calc")));
  REQUIRE(moved != events.end());
  CHECK(std::find(events.begin(), moved, std::make_pair(uint32_t{IN_ATTRIB}, temp)) != moved);
  CHECK(std::find(moved, events.end(), std::make_pair(uint32_t{IN_ATTRIB}, std::string("x.calc"))) ==
        events.end());
  const FileState after = stateOf(dir + "/x.calc");
  CHECK((after.type_and_mode & 07777) == 0600);
  CHECK(after.uid == kNobody);
  CHECK(after.gid == kNogroup);
  CHECK(after.links == 1);
  CHECK(entries(dir) == std::vector<std::string>{"x.calc"});
}

TEST_CASE("report -o refuses a read-only output and gives a new one the mode of the umask", "[file-safety]") {
  const std::string user = asNobody();
  const std::string dir = nobodyDir();
  makeFile(dir + "/x.calc", kSheet, kNobody, kNogroup, 0644);
  makeFile(dir + "/old.txt", "signed trail\n", kNobody, kNogroup, 0444);
  const FileState old = stateOf(dir + "/old.txt");
  Run r = runCliThrough(dir, user, "report x.calc -o old.txt");
  CHECK(r.status == 2);
  CHECK(r.err ==
        "old.txt:1:1: error: cannot write: the file is read-only for you; calctrail leaves it as it is\n");
  CHECK(stateOf(dir + "/old.txt") == old);

  Run n = runCliThrough(dir, "umask 027 && " + user, "report x.calc -o new.txt");
  CHECK(n.status == 0);
  const FileState made = stateOf(dir + "/new.txt");
  CHECK((made.type_and_mode & 07777) == 0640);
  CHECK(made.uid == kNobody);
  CHECK(made.bytes == runCliIn(dir, "report x.calc").out);
  CHECK(entries(dir) == std::vector<std::string>{"new.txt", "old.txt", "x.calc"});
}
