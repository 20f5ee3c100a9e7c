// Node look-up by id or label; see node_names.h.
#include "apportion/model/node_names.h"

#include "apportion/model/blank_trim.h"

namespace apportion {

NodeNames::NodeNames(const Network& net) {
  for (int v = 0; v < net.node_count(); ++v) {
    by_id_.emplace(net.nodes[v].id, v);
    if (net.nodes[v].label.empty()) continue;
    auto [it, fresh] = by_label_.emplace(net.nodes[v].label, v);
    if (!fresh) it->second = kShared;
  }
}

int NodeNames::find(const std::string& name) const {
  if (auto it = by_id_.find(name); it != by_id_.end()) return it->second;
  const std::string bare = trimmed(name);
  if (auto it = by_id_.find(bare); it != by_id_.end()) return it->second;
  if (auto it = by_label_.find(name); it != by_label_.end()) return it->second;
  if (auto it = by_label_.find(bare); it != by_label_.end()) return it->second;
  return kNone;
}

const char* NodeNames::why_not(int found) {
  return found == kShared ? "several nodes have this label" : "no node has this id or label";
}

}  // namespace apportion
