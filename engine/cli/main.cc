// calctrail: worksheet engine for screw-driven machines. The command line is
// fixed by the contract (report, check, --set, exit codes); see --help.
#include <CLI/CLI.hpp>

#include <algorithm>
#include <cctype>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <functional>
#include <iostream>
#include <iterator>
#include <string_view>
#include <utility>
#include <vector>

#include "engine/cli/commands.h"
#include "engine/report/formats.h"
#include "engine/util/edit_distance.h"

using namespace calctrail;

namespace {

// Whether `s` is a number written out in decimal: digits with an optional sign,
// point and exponent. Hex, inf, nan and spaces are no option values.
bool isDecimal(const std::string& s, bool whole) {
  size_t i = s[0] == '+' || s[0] == '-' ? 1 : 0;
  size_t digits = 0;
  for (; i < s.size() && std::isdigit(static_cast<unsigned char>(s[i])); ++i) ++digits;
  if (!whole && i < s.size() && s[i] == '.')
    for (++i; i < s.size() && std::isdigit(static_cast<unsigned char>(s[i])); ++i) ++digits;
  if (digits == 0) return false;
  if (!whole && i < s.size() && (s[i] == 'e' || s[i] == 'E')) {
    ++i;
    if (i < s.size() && (s[i] == '+' || s[i] == '-')) ++i;
    const size_t start = i;
    for (; i < s.size() && std::isdigit(static_cast<unsigned char>(s[i])); ++i) {
    }
    if (i == start) return false;
  }
  return i == s.size();
}

// A finite real number, 0 or more (--rtol): NaN would hide every change.
CLI::Validator finiteNonNegative() {
  const std::string wanted = "give a finite number, 0 or more, such as 1e-6";
  return CLI::Validator(
      [wanted](std::string& s) -> std::string {
        if (s.empty() || !isDecimal(s, false)) return "`" + s + "` is not a number; " + wanted;
        const double v = std::strtod(s.c_str(), nullptr);
        if (!std::isfinite(v)) return "`" + s + "` is too large; " + wanted;
        if (v < 0) return "`" + s + "` is negative; " + wanted;
        return {};
      },
      "NUMBER >= 0");
}

// A whole number from `lo` to `hi` (--digits).
CLI::Validator wholeNumberIn(int lo, int hi) {
  const std::string wanted = "give a whole number from " + std::to_string(lo) + " to " + std::to_string(hi);
  return CLI::Validator(
      [lo, hi, wanted](std::string& s) -> std::string {
        if (s.empty() || !isDecimal(s, true)) return "`" + s + "` is not a whole number; " + wanted;
        // Over 9 digits is out of any range here, and strtol need not see it.
        const bool huge = s.size() - (s[0] == '+' || s[0] == '-') > 9;
        const long v = huge ? static_cast<long>(hi) + 1 : std::strtol(s.c_str(), nullptr, 10);
        if (v < lo || v > hi) return "`" + s + "` is out of range; " + wanted;
        return {};
      },
      "INT in [" + std::to_string(lo) + " - " + std::to_string(hi) + "]");
}

// The subcommand the command line names, or null: the first argument that is one.
CLI::App* namedSubcommand(CLI::App& app, int argc, char** argv) {
  for (int i = 1; i < argc; ++i)
    for (CLI::App* sub : app.get_subcommands([](CLI::App*) { return true; }))
      if (sub->get_name() == argv[i]) return sub;
  return nullptr;
}

// Every option name of `cmd` as typed ("--format", "-f"), with --help.
std::vector<std::string> optionNames(const CLI::App& cmd) {
  std::vector<std::string> names;
  for (const CLI::Option* o : cmd.get_options()) {
    for (const std::string& n : o->get_lnames()) names.push_back("--" + n);
    for (const std::string& n : o->get_snames()) names.push_back("-" + n);
  }
  return names;
}

// The arguments after the subcommand that look like options it does not have,
// each with the nearest option it has: CLI11 says only "not expected".
std::vector<std::string> unknownOptions(const CLI::App& cmd, int argc, char** argv) {
  const std::vector<std::string> known = optionNames(cmd);
  std::vector<std::string> messages;
  bool seen_command = false, after_dashes = false;
  for (int i = 1; i < argc; ++i) {
    const std::string arg = argv[i];
    if (!seen_command) {
      seen_command = arg == cmd.get_name();
      continue;
    }
    if (after_dashes || arg == "--") {
      after_dashes = true;
      continue;
    }
    if (arg.size() < 2 || arg[0] != '-' || std::isdigit(static_cast<unsigned char>(arg[1])) || arg[1] == '.')
      continue;  // a value (a file, -, or a negative number)
    const std::string name = arg.substr(0, arg.find('='));
    if (std::find(known.begin(), known.end(), name) != known.end()) continue;
    // A run of short flags (-qw) or a short option with its value attached (-fjson).
    if (name[1] != '-' && std::find(known.begin(), known.end(), name.substr(0, 2)) != known.end()) continue;
    std::string message = "unknown option `" + name + "` for `calctrail " + cmd.get_name() + "`";
    const std::vector<std::string> near = nearestWords(name, known, 2);
    if (!near.empty()) message += "; did you mean " + quotedList(near) + "?";
    messages.push_back(message);
  }
  return messages;
}

// What keepUntilExit keeps: freed by the static destructors of a normal exit.
std::vector<std::shared_ptr<const void>>& kept() {
  static std::vector<std::shared_ptr<const void>> objects;
  return objects;
}

#if defined(__SANITIZE_ADDRESS__) || defined(__SANITIZE_THREAD__)
constexpr bool kSanitized = true;
#elif defined(__has_feature)
#if __has_feature(address_sanitizer) || __has_feature(thread_sanitizer)
constexpr bool kSanitized = true;
#else
constexpr bool kSanitized = false;
#endif
#else
constexpr bool kSanitized = false;
#endif

// Ends the process with `status` once every output is flushed, without the
// destructors of the command line, the calculation, the trail and the
// static tables (the function library, the unit table): freeing them one by
// one cost about 5 % of `calctrail report` (docs/performance.md), and the
// system takes the memory back in one piece. A sanitizer build returns
// normally, so that LeakSanitizer checks every run.
// Output that did not reach standard output (a full disk, /dev/full, a closed
// descriptor) is an error, never a silent exit 0 with a cut-off trail.
int endProcess(int status) {
  errno = 0;
  std::cout.flush();
  const bool lost = !std::cout || std::fflush(stdout) != 0 || std::ferror(stdout);
  if (lost) {
    std::cerr << "calctrail: error: cannot write standard output"
              << (errno != 0 ? std::string(": ") + std::strerror(errno) : std::string()) << "\n";
    status = 2;
  }
  if (kSanitized) return status;
  std::cerr.flush();
  std::clog.flush();
  std::fflush(nullptr);
  std::_Exit(status);
}

}  // namespace

namespace calctrail {
void keepUntilExit(std::shared_ptr<const void> object) {
  kept().push_back(std::move(object));
}
}  // namespace calctrail

int main(int argc, char** argv) {
  CLI::App app{
      "calctrail: calculation worksheets for screw-driven machines (jacks, gates, presses,\n"
      "linear actuators), with units checked and an auditable step-by-step trail.\n",
      "calctrail"};
  app.set_version_flag("--version", std::string("calctrail ") + CALCTRAIL_VERSION);
  app.require_subcommand(1);
  app.footer(
      "\nExit status: 0 all good; 1 a design check failed; 2 the worksheet has errors\n"
      "or the command line is wrong.\n"
      "Examples:\n"
      "  calctrail report worksheets/canal-gate-hoist.calc\n"
      "  calctrail report gate.calc --format json -o gate.json --set \"f=0.18\"\n"
      "  calctrail check worksheets/*.calc");

  // A subcommand's options are defined only when the command line names it
  // (below, before parsing): CLI11 builds each option with its strings,
  // callbacks and validators, and defining every command's on every run cost
  // a twentieth of `calctrail report` (docs/performance.md). `calctrail
  // --help` lists the subcommands by name and description alone, and only the
  // named subcommand can be parsed (require_subcommand(1)).
  std::vector<std::pair<CLI::App*, std::function<void()>>> option_blocks;
  const auto options = [&](CLI::App* cmd, std::function<void()> define) {
    option_blocks.emplace_back(cmd, std::move(define));
  };

  // When the first argument names a subcommand, the others are not built
  // either (a CLI11 App each, some 20 k instructions): only that one can be
  // parsed, and its --help shows no other. Each of them is then `unused`, an
  // App never parsed, so that setting it up and asking parsed() stay as they are.
  // `calctrail --version` alone builds none; `calctrail --help` and a
  // mistyped command build every one. kCommands must name every
  // subcommand below (one left out is only built needlessly).
  static constexpr std::string_view kCommands[] = {"report", "check",    "functions", "units",
                                                   "diff",   "fmt",      "textconv",  "sweep",
                                                   "solve",  "sensitivity", "pick",   "lsp"};
  const std::string_view first = argc > 1 ? argv[1] : "";
  const bool first_named = std::find(std::begin(kCommands), std::end(kCommands), first) != std::end(kCommands);
  const bool version_alone = argc == 2 && first == "--version";
  CLI::App unused;
  const auto command = [&](const char* name, const char* description) {
    return version_alone || (first_named && first != name) ? &unused : app.add_subcommand(name, description);
  };

  ReportArgs report;
  CLI::App* report_cmd = command(
      "report", "Recalculate a worksheet and print its calculation trail (exit 0 even when a check fails)");
  options(report_cmd, [&] {
    report_cmd->add_option("FILE", report.file, "The worksheet (.calc); - reads standard input")->required();
    report_cmd->add_option("--format,-f", report.format, "Output format: " + reportFormatHelp())
        ->check(CLI::IsMember(reportFormatNames()))
        ->default_str("text");
    report_cmd->add_option("-o,--output", report.output,
                           "Write the trail to this file instead of standard output");
    report_cmd
        ->add_option("--set", report.sets,
                     "Replace the definition of NAME by VALUE for this run only, e.g. --set \"d=10 mm\"")
        ->type_name("NAME=VALUE")
        ->allow_extra_args(false);
    report_cmd
        ->add_option("--case", report.case_name,
                     "Evaluate this load case alone, as if the worksheet were written with its replacements")
        ->type_name("NAME");
    report_cmd->add_option("--digits", report.digits, "Significant digits in human formats (1 to 15)")
        ->check(wholeNumberIn(1, 15))
        ->default_str("4");
  });

  CheckArgs check;
  CLI::App* check_cmd = command(
      "check",
      "Evaluate worksheets; print one line per failed check and per error (exit 1 on a failed check)");
  options(check_cmd, [&] {
    check_cmd->add_option("FILE", check.files, "Worksheets to check")->required();
    check_cmd->add_option("--set", check.sets, "Replace NAME by VALUE in every file, e.g. --set \"f=0.18\"")
        ->type_name("NAME=VALUE")
        ->allow_extra_args(false);
    check_cmd->add_option("--case", check.case_name, "Evaluate this load case alone (default: every case)")
        ->type_name("NAME");
    check_cmd->add_flag("--quiet,-q", check.quiet, "No summary line, only the problems");
    check_cmd
        ->add_option("--format,-f", check.format, "Output format: text, json or junit (JUnit XML for CI)")
        ->check(CLI::IsMember({"text", "json", "junit"}))
        ->default_str("text");
    check_cmd->add_option("-j,--jobs", check.jobs, "Worksheets checked at once (default: one per core)")
        ->check(wholeNumberIn(1, 1024));
  });

  std::string fn_name, fn_format = "text";
  CLI::App* fn_cmd =
      command("functions", "List the built-in drive functions, or show one in detail");
  options(fn_cmd, [&] {
    fn_cmd->add_option("NAME", fn_name, "A function name");
    fn_cmd->add_option("--format,-f", fn_format, "Output format")
        ->check(CLI::IsMember({"text", "json", "md"}))
        ->default_str("text");
  });

  std::string units_format = "text";
  CLI::App* units_cmd =
      command("units", "List the units of measure, their definitions and sources");
  options(units_cmd, [&] {
    units_cmd->add_option("--format,-f", units_format, "Output format")
        ->check(CLI::IsMember({"text", "md"}))
        ->default_str("text");
  });

  DiffArgs diff;
  CLI::App* diff_cmd = command(
      "diff",
      "Compare two revisions of a worksheet: flipped checks, changed inputs and formulas, moved results");
  options(diff_cmd, [&] {
    diff_cmd
        ->add_option("OLD", diff.old_side,
                     "The earlier side: a file, or REV:PATH from git (HEAD~1:gate.calc)")
        ->required();
    diff_cmd->add_option("NEW", diff.new_side, "The later side: a file, or REV:PATH from git")->required();
    diff_cmd->add_option("--format,-f", diff.format, "Output format (md for a pull-request comment)")
        ->check(CLI::IsMember({"text", "md", "json"}))
        ->default_str("text");
    diff_cmd->add_option("--rtol", diff.rtol, "Relative change below which a result has not moved")
        ->check(finiteNonNegative())
        ->default_str("1e-9");
    diff_cmd->add_option("--set", diff.sets, "Replace NAME by VALUE on both sides, e.g. --set \"f=0.18\"")
        ->type_name("NAME=VALUE")
        ->allow_extra_args(false);
    diff_cmd->add_option("--digits", diff.digits, "Significant digits of the rounded values (1 to 15)")
        ->check(wholeNumberIn(1, 15))
        ->default_str("4");
  });
  diff_cmd->footer(
      "\nExit status: 0 no number moved and no check fails; 1 a check flipped or still fails, a value moved\n"
      "beyond --rtol, or a quantity or check came or went; 2 a side cannot be read or has errors.\n"
      "Examples:\n"
      "  calctrail diff HEAD~1:worksheets/gate.calc worksheets/gate.calc\n"
      "  calctrail diff main:gate.calc gate.calc --format md > review.md");

  FmtArgs fmt_args;
  CLI::App* fmt_cmd = command("fmt",
                                         "Lay out worksheets canonically (spacing, alignment, unit "
                                         "spelling), keeping every comment and meaning");
  options(fmt_cmd, [&] {
    fmt_cmd->add_option("FILE", fmt_args.files, "Worksheets (.calc); - reads standard input")->required();
    CLI::Option* fmt_check = fmt_cmd->add_flag(
        "--check", fmt_args.check, "Change nothing; exit 1 when a file is not in canonical layout");
    fmt_cmd
        ->add_flag("--write,-w", fmt_args.write,
                   "Rewrite the files in place (atomically; never a file with errors)")
        ->excludes(fmt_check);
  });
  fmt_cmd->footer(
      "\nWithout --check or --write, prints the formatted worksheet (one file).\n"
      "Exit status: 0 done (or all canonical); 1 --check found a file to reformat; 2 a file has errors.");

  std::string textconv_file;
  int textconv_digits = 6;
  CLI::App* textconv_cmd = command(
      "textconv",
      "Print a worksheet with its recalculated results, for git's diff driver (see docs/review.md)");
  options(textconv_cmd, [&] {
    textconv_cmd->add_option("FILE", textconv_file, "The worksheet (.calc)")->required();
    textconv_cmd->add_option("--digits", textconv_digits, "Significant digits of the results (1 to 15)")
        ->check(wholeNumberIn(1, 15))
        ->default_str("6");
  });
  textconv_cmd->footer(
      "\nSet up once per repository:\n"
      "  git config diff.calctrail.textconv \"calctrail textconv\"\n"
      "  echo '*.calc diff=calctrail' >> .gitattributes\n"
      "\nA file git wrote for an old side reads its templates at the revision it\n"
      "comes from; a template's text ends with the results of the sheets using it.");

  // Design studies (docs/studies.md): one block per command.
  auto study_options = [](CLI::App* cmd, StudyArgs* a, std::vector<std::string> formats) {
    cmd->add_option("--set", a->sets, "Replace the definition of NAME by VALUE for this run only")
        ->type_name("NAME=VALUE")
        ->allow_extra_args(false);
    cmd->add_option("--case", a->case_name, "Study this load case (its replacements under --set)")
        ->type_name("NAME");
    cmd->add_option("--format,-f", a->format, "Output format")
        ->check(CLI::IsMember(formats))
        ->default_str("text");
    cmd->add_option("-o,--output", a->output, "Write to this file instead of standard output");
    cmd->add_option("--digits", a->digits, "Significant digits in text output (1 to 15)")
        ->check(CLI::Range(1, 15))
        ->default_str("4");
  };

  SweepArgs sweep;
  CLI::App* sweep_cmd = command(
      "sweep", "Evaluate a worksheet over a range or list of one input (or a grid of two): results, checks");
  options(sweep_cmd, [&] {
    sweep_cmd->add_option("FILE", sweep.study.file, "The worksheet (.calc)");
    sweep_cmd->add_option("--vary", sweep.vary, "NAME=FROM..TO or NAME=V1, V2, ... (twice for a grid)")
        ->type_name("NAME=RANGE")
        ->allow_extra_args(false);
    sweep_cmd->add_option("--steps", sweep.steps, "Points of a range, both ends included")
        ->check(CLI::Range(0, 10000000))
        ->default_str("11");
    sweep_cmd->add_flag("--log", sweep.log, "Logarithmic steps");
    sweep_cmd->add_option("--show", sweep.show, "The results to record: NAME[,NAME...]")
        ->allow_extra_args(false);
    sweep_cmd
        ->add_option("--shard", sweep.shard, "Compute only shard K of N (every N-th point from the K-th)")
        ->type_name("K/N");
    sweep_cmd->add_option("-j,--jobs", sweep.jobs, "Threads (default: one per core)");
    sweep_cmd
        ->add_option("--merge", sweep.merge, "Merge the JSON of the shards of a sweep (no FILE or --vary)")
        ->type_name("SHARD.json...");
    study_options(sweep_cmd, &sweep.study, {"text", "csv", "json", "svg"});
  });
  sweep_cmd->footer(
      "\nExit status: 0 every point calculated (checks failing at some points are shown, not an error);\n"
      "2 a point cannot be calculated, or the worksheet or the command line has errors.\n"
      "Examples:\n"
      "  calctrail sweep gate.calc --vary \"d=20 mm..60 mm\" --steps 9 --show T_raise,P_motor\n"
      "  calctrail sweep lift.calc --vary \"m_load=3 t..6 t\" --show P_motor --shard 1/2 -f json > a.json\n"
      "  calctrail sweep --merge a.json b.json --format csv");

  SolveArgs solve;
  CLI::App* solve_cmd = command(
      "solve", "Find the input that meets a target, or the largest/smallest for which every check passes");
  options(solve_cmd, [&] {
    solve_cmd->add_option("FILE", solve.study.file, "The worksheet (.calc)")->required();
    solve_cmd->add_option("--vary", solve.vary, "The input to solve for (a given value)")->required();
    solve_cmd->add_option("--between", solve.between, "The bracket LO..HI, with units")->required();
    solve_cmd->add_option("--target", solve.target, "An equation EXPR = EXPR, as in \"T_motor = 12 [N*m]\"");
    solve_cmd->add_option("--capacity", solve.capacity, "max or min: the extreme value passing every check")
        ->check(CLI::IsMember({"max", "min"}));
    solve_cmd->add_option("--samples", solve.samples, "Points the bracket is sampled at before solving")
        ->check(CLI::Range(3, 100000))
        ->default_str("41");
    study_options(solve_cmd, &solve.study, {"text", "json"});
  });
  solve_cmd->footer(
      "\nExit status: 0 solved (every check passes there); 1 no root in the bracket, nothing\n"
      "passes, or a check fails at the value found; 2 errors.");

  SensitivityArgs sens;
  CLI::App* sens_cmd = command(
      "sensitivity", "Rank the given values by their effect on a result (elasticity), and checks they flip");
  options(sens_cmd, [&] {
    sens_cmd->add_option("FILE", sens.study.file, "The worksheet (.calc)")->required();
    sens_cmd->add_option("--of", sens.of, "The quantity studied")->required();
    study_options(sens_cmd, &sens.study, {"text", "json"});
  });
  sens_cmd->footer("\nExit status: 0 done; 1 a check fails at the nominal point; 2 errors.");

  PickArgs pick;
  CLI::App* pick_cmd = command(
      "pick", "Choose the smallest standard size (or the least --by result) for which every check passes");
  options(pick_cmd, [&] {
    pick_cmd->add_option("FILE", pick.study.file, "The worksheet (.calc)")->required();
    pick_cmd->add_option("--vary", pick.vary, "The input picked for (a given value)")->required();
    pick_cmd
        ->add_option("--from", pick.from, "A series (trapezoidal, acme, motor_outputs) or \"V1, V2, ...\"")
        ->required();
    pick_cmd->add_flag("--smallest", pick.smallest, "The smallest value that passes (the default)");
    pick_cmd->add_option("--by", pick.by, "The passing value with the least result of EXPR instead");
    study_options(pick_cmd, &pick.study, {"text", "json"});
  });
  pick_cmd->footer("\nExit status: 0 a value passes; 1 none does; 2 errors.");

  CLI::App* lsp_cmd = command(
      "lsp", "Serve the Language Server Protocol on standard input and output (docs/editors/lsp.md)");
  lsp_cmd->footer(
      "\nEditors start it themselves: diagnostics, values on hover and as inlay hints, definition,\n"
      "references, rename, completion and formatting as one types.");

  if (const CLI::App* named = namedSubcommand(app, argc, argv))
    for (const auto& [cmd, define] : option_blocks)
      if (cmd == named) define();
  try {
    app.parse(argc, argv);
  } catch (const CLI::CallForHelp& e) {
    return app.exit(e);
  } catch (const CLI::CallForAllHelp& e) {
    return app.exit(e);
  } catch (const CLI::CallForVersion& e) {
    return app.exit(e);
  } catch (const CLI::ParseError& e) {
    // A mistake inside a subcommand points at that subcommand's options.
    CLI::App* sub = namedSubcommand(app, argc, argv);
    std::vector<std::string> unknown;
    if (sub && dynamic_cast<const CLI::ExtrasError*>(&e)) unknown = unknownOptions(*sub, argc, argv);
    if (unknown.empty()) std::cerr << "calctrail: error: " << e.what() << "\n";
    for (const std::string& message : unknown) std::cerr << "calctrail: error: " << message << "\n";
    if (sub)
      std::cerr << "see: calctrail " << sub->get_name() << " --help\n";
    else
      std::cerr << "Run `calctrail --help` for the commands and options.\n";
    return kExitError;
  }
  try {
    if (report_cmd->parsed()) return endProcess(runReport(report));
    if (check_cmd->parsed()) return endProcess(runCheck(check));
    if (fn_cmd->parsed()) return endProcess(runFunctions(fn_name, fn_format));
    if (units_cmd->parsed()) return endProcess(runUnits(units_format));
    if (diff_cmd->parsed()) return endProcess(runDiff(diff));
    if (fmt_cmd->parsed()) return endProcess(runFmt(fmt_args));
    if (textconv_cmd->parsed()) return endProcess(runTextconv(textconv_file, textconv_digits));
    if (sweep_cmd->parsed()) return endProcess(runSweepCommand(sweep));
    if (solve_cmd->parsed()) return endProcess(runSolveCommand(solve));
    if (sens_cmd->parsed()) return endProcess(runSensitivityCommand(sens));
    if (pick_cmd->parsed()) return endProcess(runPickCommand(pick));
    if (lsp_cmd->parsed()) return endProcess(runLsp());
  } catch (const std::exception& e) {
    std::cerr << "calctrail: internal error: " << e.what() << "\n";
    return kExitError;
  }
  return kExitError;
}
