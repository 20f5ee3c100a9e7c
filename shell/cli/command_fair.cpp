// `apportion fair|throughput|concurrent|feasible|tradeoff`: the fair-multiflow objectives.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <ctime>
#include <iostream>
#include <sstream>
#ifndef __EMSCRIPTEN__
#include <unistd.h>
#endif

#include "apportion/model/number_text.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/flow_result_export.h"
#include "apportion/results/multiflow_result_export.h"
#include "apportion/results/network_svg.h"
#include "commands.h"
#include "network_loader.h"
#include "text_table.h"

namespace apportion::cli {

namespace {

const char* kHelp = R"(apportion fair|throughput|concurrent|feasible|tradeoff FILE [options]

Shares the network's capacity among all demands of FILE. Each demand k has an origin, a
destination, an amount a_k (or "max") and a weight w_k; its share f_k is routed splittably
over any paths; arcs hold the flow of all demands together.

  fair        weighted max-min fairness, exact: raise f_k = w_k t for all demands together;
              a demand freezes when it gets its amount, or when it cannot grow without
              lowering a demand whose f_j / w_j is at or below its own. Each round is a tier.
              Also solves max throughput, for the price of fairness.
  throughput  the most total flow, each demand at most its amount
  concurrent  the largest lambda such that lambda * a_k fits for every demand with an amount
  feasible    can every amount be met? If not: by how much, with a certificate
              (dual arc lengths, and an overloaded cut when one is found)
  tradeoff    the most total flow keeping every demand at >= (1 - epsilon) of its fair share

Options:
  --epsilon E      tradeoff: the share of fairness given up (default 0.1)
  --hop-limit H    route each demand over paths of at most H arcs
  --k-paths K      route each demand over its K shortest paths (fewest arcs) only
  --by-origin      fair, tradeoff: run the max-min rounds on an LP with the demands
                   aggregated by origin; the same shares, 2-4x faster on some networks
                   with thousands of demands, slower on others (README, Benchmark)
  --certify        fair: prove how far each share can be from the exact max-min fair
                   share, independently of the rounds that found it (the routing as the
                   witness for lower bounds, LP prices recomputed by shortest paths for
                   upper bounds; a fraction of the solve's time); adds the bounds to the
                   table, --json and --csv; exit status 3 when a share is not proven to
                   1e-6 of the largest share (see also 'apportion certify')
  --all-arcs       list arcs without load too
  --json OUT       the whole result as JSON (core/FORMAT.md)
  --csv PREFIX     PREFIX.demands.csv, PREFIX.arcs.csv, PREFIX.paths.csv
  --svg OUT        a picture for a report: the network with its loads on white, with the
                   name, the rule, the totals, the date, a legend and the caution
  --progress       report the solve's progress on standard error (stage, round, demands
                   settled, LPs, time); shown anyway when standard error is a terminal
  (and the reading options of 'apportion validate --help')

Every result is verified by an independent checker before it is printed.

Example:
  apportion fair demo-networks/harrowmere-fibre.json --paths --json /tmp/fair.json
)";

// The rule as the picture's subtitle names it.
const char* rule_in_words(FairObjective o) {
  switch (o) {
    case FairObjective::kMaxMinFair: return "max-min fair shares (weighted)";
    case FairObjective::kMaxConcurrent: return "max concurrent flow";
    case FairObjective::kMaxThroughput: return "max throughput";
    case FairObjective::kTradeoff: return "throughput with a fairness floor";
    case FairObjective::kFeasibility: return "can every demand be met?";
  }
  return "";
}

FairObjective objective_of(const std::string& cmd) {
  if (cmd == "throughput") return FairObjective::kMaxThroughput;
  if (cmd == "concurrent") return FairObjective::kMaxConcurrent;
  if (cmd == "feasible") return FairObjective::kFeasibility;
  if (cmd == "tradeoff") return FairObjective::kTradeoff;
  return FairObjective::kMaxMinFair;
}

std::string num(double v) {
  std::ostringstream s;
  s.precision(6);
  s << v;
  return s.str();
}

std::string percent(double v) {
  if (v < 0) return "-";
  std::ostringstream s;
  s.precision(1);
  s << std::fixed << v << "%";
  return s.str();
}

std::optional<int> positive_int(const Args& args, const char* name, std::string& error) {
  auto v = args.get(name);
  if (!v) return 0;
  auto x = parse_number(*v);
  if (!x || *x < 1 || *x != std::floor(*x) || *x > 1e6) {
    error = std::string("--") + name + " needs a whole number >= 1";
    return std::nullopt;
  }
  return static_cast<int>(*x);
}

// Progress on standard error: on a terminal one line rewritten in place, else a line every
// 10 s, so that a solve of many minutes shows it is alive and how far it got.
class ProgressLine {
 public:
  ProgressLine(std::string cmd, bool wanted) : cmd_(std::move(cmd)) {
#ifndef __EMSCRIPTEN__
    terminal_ = isatty(2) != 0;
#endif
    on_ = wanted || terminal_;
  }
  ~ProgressLine() {
    if (shown_ && terminal_) std::fprintf(stderr, "\r%*s\r", static_cast<int>(width_), "");
    if (on_ && !terminal_)
      std::fprintf(stderr, "apportion %s: solved in %.1f s, %d LPs\n", cmd_.c_str(), seconds(), lp_solves_);
  }
  bool on() const { return on_; }
  void report(const SolveProgress& p) {
    lp_solves_ = p.lp_solves;
    const double now = seconds();
    if (now - last_ < (terminal_ ? 0.5 : 10.0)) return;
    last_ = now;
    std::string line = "apportion " + cmd_ + ": " + p.stage;
    if (p.round > 0 && p.demands_settled < p.demands)  // the max-min rounds
      line += ", round " + std::to_string(p.round) + ", " + std::to_string(p.demands_settled) + " of " +
              std::to_string(p.demands) + " demands settled";
    line += ", " + std::to_string(p.lp_solves) + " LPs, " + std::to_string(static_cast<long>(now)) + " s";
    // Time left from the rate at which demands settle so far: rough, so only once a tenth
    // is settled, and as "about" (the page shows the same).
    const double fraction = p.demands > 0 ? static_cast<double>(p.demands_settled) / p.demands : 0.0;
    if (p.round > 0 && fraction >= 0.1 && fraction < 1.0)
      line += ", about " + std::to_string(static_cast<long>(now * (1.0 - fraction) / fraction)) + " s left in this stage";
    if (terminal_) {
      std::fprintf(stderr, "\r%-*s", static_cast<int>(width_), line.c_str());
      width_ = std::max(width_, line.size());
    } else {
      std::fprintf(stderr, "%s\n", line.c_str());
    }
    std::fflush(stderr);
    shown_ = true;
  }

 private:
  double seconds() const {
    return std::chrono::duration<double>(std::chrono::steady_clock::now() - start_).count();
  }
  std::string cmd_;
  bool terminal_ = false, on_ = false, shown_ = false;
  std::size_t width_ = 0;
  int lp_solves_ = 0;
  double last_ = 0.0;
  std::chrono::steady_clock::time_point start_ = std::chrono::steady_clock::now();
};

}  // namespace

int run_fair(int argc, char** argv) {
  const std::string cmd = argv[1];
  std::set<std::string> valued = kLoaderOptions;
  valued.insert({"epsilon", "hop-limit", "k-paths", "json", "csv", "svg"});
  Args args = parse_args(argc, argv, 2, valued, {"help", "paths", "all-arcs", "progress", "by-origin", "certify"});
  if (args.has("help")) return std::cout << kHelp, kExitOk;
  if (usage_error(args, cmd, 1, kHelp)) return kExitBadInput;
  FairOptions opt;
  opt.objective = objective_of(cmd);
  std::string error;
  auto hop = positive_int(args, "hop-limit", error);
  auto kp = positive_int(args, "k-paths", error);
  if (!hop || !kp) {
    std::cerr << "apportion " << cmd << ": " << error << '\n';
    return kExitBadInput;
  }
  opt.routing.hop_limit = *hop;
  opt.routing.k_paths = *kp;
  if (args.has("by-origin")) opt.origin_rounds_from = 0;
  const bool certify = opt.certify = args.has("certify");
  if (certify && opt.objective != FairObjective::kMaxMinFair) {
    std::cerr << "apportion " << cmd << ": --certify proves max-min fair shares: use it with 'apportion fair'\n";
    return kExitBadInput;
  }
  if (auto e = args.get("epsilon")) {
    auto v = parse_number(*e);
    if (!v || *v < 0 || *v > 1) {
      std::cerr << "apportion " << cmd << ": --epsilon needs a number between 0 and 1\n";
      return kExitBadInput;
    }
    opt.epsilon = *v;
  }
  OutputGuard guard;
  const std::optional<Network> loaded = load_for_command(args, guard);
  if (!loaded) return kExitBadInput;
  const Network& net = *loaded;

  MultiflowResult r;
  {
    ProgressLine progress(cmd, args.has("progress"));
    if (progress.on()) opt.on_progress = [&progress](const SolveProgress& p) { progress.report(p); };
    r = solve_multiflow(net, opt);
  }
  if (r.status != SolveStatus::kOptimal) {
    std::cerr << "apportion " << cmd << ": " << status_name(r.status) << ": " << r.message << '\n';
    return kExitBadInput;
  }
  const std::string unit = net.units.capacity.empty() ? "" : " " + net.units.capacity;
  std::cout << net.name << " -- " << objective_name(r.objective) << "\n\n";
  if (r.objective == FairObjective::kFeasibility) {
    if (r.all_demands_met) {
      std::cout << "every demand can be met in full (max concurrent flow lambda = " << num(r.lambda) << ")\n\n";
    } else {
      std::cout << "NOT every demand can be met: at most " << num(r.lambda * 100) << "% of every amount at once"
                << " (lambda = " << num(r.lambda) << "); at best " << num(r.shortfall) << unit
                << " in total stays undelivered.\n";
      std::cout << "certificate: arc lengths with sum(capacity x length) = " << num(r.certificate_capacity)
                << " < sum(amount x distance) = " << num(r.certificate_demand) << "\n";
      TextTable t({"arc", "length"});
      for (int a = 0; a < net.arc_count(); ++a)
        if (r.dual_lengths[a] > 0) t.add({net.arcs[a].id, num(r.dual_lengths[a])});
      t.print(std::cout);
      if (!r.overloaded_cut_source_side.empty()) {
        std::string side;
        for (int v : r.overloaded_cut_source_side) side += (side.empty() ? "" : ", ") + net.nodes[v].id;
        std::cout << "overloaded cut: {" << side << "} must send " << num(r.overloaded_cut_demand) << unit
                  << " across capacity " << num(r.overloaded_cut_capacity) << unit << '\n';
      }
      std::cout << '\n';
    }
  }
  const bool bounds = r.fairness.status == SolveStatus::kOptimal;
  std::vector<std::string> columns{"demand", "from", "to", "amount", "weight", "share", "% of amount", "tier", "bound by"};
  if (bounds) columns.push_back("fair share proven in");
  TextTable dt(columns);
  for (std::size_t k = 0; k < r.demands.size(); ++k) {
    const Demand& d = net.demands[k];
    const DemandShare& s = r.demands[k];
    std::string bound;
    if (s.limited_by_amount) {
      bound = "its amount";
    } else {
      for (int a : s.binding_arcs) bound += (bound.empty() ? "" : " ") + net.arcs[a].id;
      if (s.binding_arcs_form_cut) bound += " (cut)";
    }
    std::vector<std::string> row{d.id, net.nodes[d.origin].id, net.nodes[d.destination].id,
                                 d.amount ? num(*d.amount) : "max", num(d.weight), num(s.share),
                                 percent(s.percent_of_amount), s.tier ? std::to_string(s.tier) : "-", bound};
    if (bounds) row.push_back("[" + num(r.fairness.lower[k]) + ", " + num(r.fairness.upper[k]) + "]");
    dt.add(row);
  }
  dt.print(std::cout);
  if (!r.tiers.empty() && r.objective != FairObjective::kFeasibility) {
    std::cout << '\n';
    TextTable tt({"tier", "level (share/weight)", "demands", "binding arcs"});
    for (const Tier& t : r.tiers) {
      std::string ds, as;
      for (int k : t.demands) ds += (ds.empty() ? "" : " ") + net.demands[k].id;
      for (int a : t.binding_arcs) as += (as.empty() ? "" : " ") + net.arcs[a].id;
      tt.add({std::to_string(t.index), num(t.level), ds, as});
    }
    tt.print(std::cout);
  }
  std::cout << '\n';
  TextTable at({"arc", "from", "to", "capacity", "load", "utilisation", "shadow price", "tier"});
  for (int a = 0; a < net.arc_count(); ++a) {
    const ArcLoad& l = r.arcs[a];
    if (!args.has("all-arcs") && l.load <= 0) continue;
    const Arc& arc = net.arcs[a];
    at.add({arc.id, net.nodes[arc.from].id, net.nodes[arc.to].id, num(arc.enabled ? arc.capacity : 0), num(l.load),
            percent(100 * l.utilisation), num(l.shadow_price), l.tier ? std::to_string(l.tier) : "-"});
  }
  at.print(std::cout);
  if (args.has("paths")) {
    std::cout << '\n';
    TextTable pt({"demand", "amount", "path"});
    for (std::size_t k = 0; k < r.demands.size(); ++k)
      for (const PathShare& p : r.demands[k].paths) {
        std::string nodes;
        for (int v : p.nodes) nodes += (nodes.empty() ? "" : " > ") + net.nodes[v].id;
        pt.add({net.demands[k].id, num(p.amount), nodes});
      }
    pt.print(std::cout);
  }
  std::cout << "\nthroughput " << num(r.throughput) << unit << ", minimum normalised share " << num(r.min_normalised_share)
            << ", Jain's index " << num(r.jain_index);
  if (r.lambda >= 0) std::cout << ", lambda " << num(r.lambda);
  if (r.price_of_fairness >= 0)
    std::cout << "\nmax throughput " << num(r.max_throughput) << unit << ", price of fairness "
              << percent(100 * r.price_of_fairness);
  std::cout << "\nchecked: " << (r.check.ok ? "ok" : "FAILED") << " (largest capacity violation "
            << num(r.check.max_capacity_violation) << ", conservation " << num(r.check.max_conservation_violation)
            << ", each relative to its own arc or demand)\n";
  std::cout << r.stats.lp_solves << " LP solves, " << r.stats.simplex_iterations << " simplex iterations, "
            << r.stats.path_columns << " paths generated, " << r.stats.saturation_tests << " saturation tests, "
            << r.stats.amount_tests << " amount tests\n";
  // The certificate's verdict: proven to 1e-6 of the largest share, or not.
  constexpr double kProven = 1e-6;
  bool unproven = false;
  if (certify) {
    const FairnessCertificate& c = r.fairness;
    if (c.status != SolveStatus::kOptimal) {
      std::cout << "fairness certificate: " << status_name(c.status) << ": " << c.message << '\n';
      unproven = true;
    } else {
      unproven = !(c.max_relative_error <= kProven);
      std::cout << "fairness certificate: every share is within " << num(c.max_error) << unit << " ("
                << num(c.max_relative_error) << " of the largest share) of the exact max-min fair share"
                << (unproven ? " -- NOT proven to 1e-6, worst: demand " + net.demands[c.worst_demand].id : "")
                << "\n  (to the witnesses' tolerance " << num(c.witness_tolerance) << "; " << c.levels
                << (c.levels == 1 ? " level, " : " levels, ") << c.stats.lp_solves << " LP solves, "
                << c.stats.simplex_iterations << " simplex iterations, " << num(c.seconds) << " s)\n";
    }
  }
  std::cout << '\n' << kPlanningCaution << '\n';

  if (auto p = args.get("json"); p && !guard.write(*p, multiflow_json(net, r), error)) {
    std::cerr << "apportion: " << error << '\n';
    return kExitBadInput;
  }
  if (auto p = args.get("svg")) {
    PictureOptions o;
    o.rule = rule_in_words(r.objective);
    char date[32] = "";
    const std::time_t now = std::time(nullptr);
    std::strftime(date, sizeof date, "%Y-%m-%d %H:%M", std::localtime(&now));
    o.date = date;
    if (!guard.write(*p, network_svg(net, &r, o), error)) {
      std::cerr << "apportion: " << error << '\n';
      return kExitBadInput;
    }
  }
  if (auto p = args.get("csv")) {
    if (!guard.write(*p + ".demands.csv", multiflow_demands_csv(net, r), error) ||
        !guard.write(*p + ".arcs.csv", multiflow_arcs_csv(net, r), error) ||
        !guard.write(*p + ".paths.csv", multiflow_paths_csv(net, r), error)) {
      std::cerr << "apportion: " << error << '\n';
      return kExitBadInput;
    }
  }
  if (unproven) {
    std::cerr << "apportion " << cmd << ": the fairness certificate did not prove the shares to 1e-6 of the largest\n";
    return kExitUnproven;
  }
  return kExitOk;
}

}  // namespace apportion::cli
