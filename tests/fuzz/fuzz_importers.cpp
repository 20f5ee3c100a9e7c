// libFuzzer targets for every way a file or link reaches Apportion: the network importers
// (JSON, CSV tables, DIMACS, GraphML, the traffic-matrix CSV and the demands table), the browser's file payload (which carries share
// links, picked files and autosaves), and result files read back. Each input must give a
// network or diagnostics -- never a crash, a hang or a sanitizer finding -- and a network
// that comes back must pass validation and survive a JSON round trip unchanged in size.
//
// One source, one target per importer: APPORTION_FUZZ_TARGET selects the entry point.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>

#include "apportion/formats/demand_table.h"
#include "apportion/formats/matrix_csv.h"
#include "apportion/formats/network_csv.h"
#include "apportion/formats/network_dimacs.h"
#include "apportion/formats/network_graphml.h"
#include "apportion/formats/network_json.h"
#include "apportion/model/validation.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/multiflow_result_import.h"
#include "browser/file_payload.h"

using namespace apportion;

namespace {

// A network that an importer accepted must be valid and must write and read back.
void check_loaded(const LoadResult& r) {
  if (!r.ok()) {
    if (!r.diagnostics.has_errors()) std::abort();  // refused without saying why
    return;
  }
  // A few bytes of DIMACS may declare 2 million nodes: legal, and seconds of validation and
  // JSON round trip under the sanitizers that explore nothing new. Above 2,000 items the
  // importer's own closing validation stands; large round trips are the command-line tests'
  // job (tests/cli: 200,000 arcs).
  if (r.network->node_count() + r.network->arc_count() > 2000) return;
  if (validate(*r.network).has_errors()) std::abort();
  const LoadResult again = read_network_json(write_network_json(*r.network));
  if (!again.ok() || again.network->node_count() != r.network->node_count() ||
      again.network->arc_count() != r.network->arc_count() ||
      again.network->demands.size() != r.network->demands.size())
    std::abort();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
#if APPORTION_FUZZ_TARGET == 1
  check_loaded(read_network_json(text));
#elif APPORTION_FUZZ_TARGET == 2
  // Three tables separated by form feeds: nodes, arcs, demands.
  NetworkCsv t;
  const std::size_t a = text.find('\f'), b = a == std::string::npos ? a : text.find('\f', a + 1);
  t.nodes = text.substr(0, a);
  if (a != std::string::npos) t.arcs = text.substr(a + 1, b == std::string::npos ? b : b - a - 1);
  if (b != std::string::npos) t.demands = text.substr(b + 1);
  check_loaded(read_network_csv(t));
#elif APPORTION_FUZZ_TARGET == 3
  check_loaded(read_dimacs(text));
#elif APPORTION_FUZZ_TARGET == 4
  check_loaded(read_graphml(text));
#elif APPORTION_FUZZ_TARGET == 5
  const web::Payload p = web::read_payload(text);
  if (!p.single_csv.empty()) return 0;  // a demands table or matrix: the matrix target reads those
  check_loaded(p.loaded);
#elif APPORTION_FUZZ_TARGET == 6
  // Validate, then solve small networks: a result that says optimal must pass the checker.
  const LoadResult r = read_network_json(text);
  if (!r.ok() || r.network->node_count() > 12 || r.network->arc_count() > 40 || r.network->demands.size() > 6)
    return 0;
  for (FairObjective o : {FairObjective::kMaxMinFair, FairObjective::kMaxConcurrent}) {
    FairOptions options;
    options.objective = o;
    const MultiflowResult m = solve_multiflow(*r.network, options);
    if (m.status == SolveStatus::kOptimal && !check_multiflow(*r.network, m).ok) std::abort();
  }
#elif APPORTION_FUZZ_TARGET == 7
  // Result files of the demo network read back.
  static const Network net = [] {
    Network n;
    for (const char* id : {"a", "b", "c"}) n.nodes.push_back({id, "", 0.0, 0.0, 0.0});
    n.arcs.push_back({"ab", 0, 1, 5.0, std::nullopt, std::nullopt, true, false});
    n.arcs.push_back({"bc", 1, 2, 5.0, std::nullopt, std::nullopt, true, false});
    n.demands.push_back({"d", "", 0, 2, std::nullopt, 1.0});
    return n;
  }();
  std::string error;
  const auto r = read_multiflow_json(net, text, error);
  if (!r && error.empty()) std::abort();
#elif APPORTION_FUZZ_TARGET == 8
  // A traffic matrix for a three-node network (nodes by id or label): what it accepts must
  // make valid demands, and must write and read back to the same pairs.
  static const Network net = [] {
    Network n;
    for (const char* id : {"a", "b", "c"}) n.nodes.push_back({id, std::string("Node ") + id, 0.0, 0.0, 0.0});
    n.arcs.push_back({"ab", 0, 1, 5.0, std::nullopt, std::nullopt, true, false});
    n.arcs.push_back({"bc", 1, 2, 5.0, std::nullopt, std::nullopt, true, false});
    return n;
  }();
  // The same text as a demands table (demand_table.h): what it accepts must make valid
  // demands with unique ids, and the network's own demands table must read back whole.
  {
    DemandTableRead t = read_demand_table(net, text);
    if (!t.ok() && !t.demands.empty()) std::abort();  // refused, yet demands given
    if (t.ok()) {
      Network with = net;
      const std::size_t count = t.demands.size();
      add_demand_table(with, std::move(t), false);
      if (validate(with).has_errors()) std::abort();
      const DemandTableRead back = read_demand_table(net, write_network_csv(with).demands, true);
      if (!back.ok() || back.demands.size() != count) std::abort();
    }
  }
  const MatrixCsvRead m = read_matrix_csv(net, text);
  if (!m.ok()) {
    if (!m.pairs.empty()) std::abort();  // refused, yet pairs given
    return 0;
  }
  Network with = net;
  add_pair_demands(with, m.pairs, 1.0, false);
  if (validate(with).has_errors()) std::abort();
  const MatrixCsvRead back = read_matrix_csv(net, write_matrix_csv(with).text);
  if (!back.ok() || back.pairs.size() != m.pairs.size()) std::abort();
#endif
  return 0;
}
