// The solver worker: the fair-multiflow engine as its own WebAssembly module, run in a Web
// Worker so that the page keeps drawing while it solves. The page sends one request
//   {"network": "<network JSON text>", "objective": "max-min-fair", "epsilon": 0.1,
//    "hop_limit": 0, "k_paths": 0, "certify": false}
// and gets back the result file of core/FORMAT.md ("Fair-multiflow result files"), which it
// reads with read_multiflow_json and checks again with the independent checker. Progress is
// posted at most every 100 ms. Cancel is the page terminating this worker: it stops a solve
// even in the middle of an LP, and the page starts a fresh worker for the next one.
#include <algorithm>
#include <emscripten.h>

#include <nlohmann/json.hpp>
#include <string>

#include "apportion/formats/network_json.h"
#include "apportion/model/validation.h"
#include "apportion/multiflow/fair_multiflow.h"
#include "apportion/results/multiflow_result_export.h"

namespace {

EM_JS(void, post_progress, (int id, const char* stage, int round, int settled, int demands, int lps), {
  postMessage({kind : 'progress', id : id, stage : UTF8ToString(stage), round : round, settled : settled,
               demands : demands, lp_solves : lps});
});

std::string failure(const std::string& message) {
  apportion::MultiflowResult r;
  r.status = apportion::SolveStatus::kBadInput;
  r.message = message;
  return apportion::multiflow_json(apportion::Network{}, r);
}

std::string solve(int id, const char* request_text) {
  using namespace apportion;
  const nlohmann::json request = nlohmann::json::parse(request_text, nullptr, false);
  if (!request.is_object() || !request.contains("network") || !request["network"].is_string())
    return failure("the solve request is not readable");
  LoadResult loaded = read_network_json(request["network"].get<std::string>());
  if (!loaded.ok()) return failure("the network is not readable: " + loaded.diagnostics.items.front().to_string());
  const Network& net = *loaded.network;
  Diagnostics d = validate(net);
  if (d.has_errors()) return failure("the network has errors; validate it first");
  FairOptions options;
  // Typed look-ups: value() on a key of another type would abort the worker (no exceptions).
  auto number = [&request](const char* key, double fallback) {
    const auto it = request.find(key);
    return it != request.end() && it->is_number() ? it->get<double>() : fallback;
  };
  const auto objective = request.find("objective");
  if (objective != request.end() && objective->is_string())
    objective_from_name(objective->get<std::string>(), options.objective);
  options.epsilon = number("epsilon", 0.1);
  options.routing.hop_limit = static_cast<int>(std::clamp(number("hop_limit", 0), 0.0, 1e6));
  options.routing.k_paths = static_cast<int>(std::clamp(number("k_paths", 0), 0.0, 1e6));
  const auto certify = request.find("certify");
  options.certify = certify != request.end() && certify->is_boolean() && certify->get<bool>();
  double last = 0;
  options.on_progress = [&](const SolveProgress& p) {
    const double now = emscripten_get_now();
    if (now - last < 100) return;
    last = now;
    post_progress(id, p.stage, p.round, p.demands_settled, p.demands, p.lp_solves);
  };
  return multiflow_json(net, solve_multiflow(net, options));
}

}  // namespace

extern "C" EMSCRIPTEN_KEEPALIVE const char* apportion_worker_solve(int id, const char* request) {
  static std::string out;
  out = solve(id, request);
  return out.c_str();
}
