// Naming a node the way a spreadsheet does: by its id, else by its label. Tables from outside
// (traffic matrices, demands tables, node lists on the command line) use whichever a
// planner has at hand; an id always wins, and a label that several nodes share names none
// of them, so a row never lands on the wrong site.
#pragma once

#include <string>
#include <unordered_map>

#include "apportion/model/network.h"

namespace apportion {

class NodeNames {
 public:
  static constexpr int kNone = -1;    // no node has this id or label
  static constexpr int kShared = -2;  // a label several nodes share (and no node's id)

  explicit NodeNames(const Network& net);
  // The node index, or kNone / kShared. Leading and trailing blanks are not part of a name
  // (spreadsheet cells often carry them), unless a node's id has them.
  int find(const std::string& name) const;
  // "no node has this id or label" / "several nodes have this label", for messages.
  static const char* why_not(int found);

 private:
  std::unordered_map<std::string, int> by_id_, by_label_;
};

}  // namespace apportion
