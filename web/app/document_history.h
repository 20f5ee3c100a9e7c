// Undo and redo for the network document: every edit records the document as it was before,
// with a name the Edit menu shows ("Undo move 3 nodes"). Whole-document snapshots keep undo
// exact whatever the edit did (removing a node renumbers every arc after it), and cost
// little next to what a browser tab holds; the oldest steps are dropped past a memory budget.
#pragma once

#include <cstddef>
#include <deque>
#include <string>

#include "apportion/model/network.h"

namespace apportion::web {

class DocumentHistory {
 public:
  // Call before changing `doc`: remembers it under `what`, and forgets the redo steps.
  void record(const Network& doc, std::string what);
  // Swap `doc` with the previous (next) state; false when there is none.
  bool undo(Network& doc);
  bool redo(Network& doc);
  bool can_undo() const { return !undo_.empty(); }
  bool can_redo() const { return !redo_.empty(); }
  const std::string& undo_name() const;
  const std::string& redo_name() const;
  void clear();
  std::size_t steps() const { return undo_.size(); }

  static constexpr std::size_t kBudgetBytes = 64u << 20;  // about 64 MB of snapshots
  static constexpr std::size_t kMaxSteps = 500;

 private:
  struct Step {
    Network doc;
    std::string what;
    std::size_t bytes = 0;
  };
  bool step(std::deque<Step>& from, std::deque<Step>& to, Network& doc);
  void trim();
  std::deque<Step> undo_, redo_;
  std::size_t bytes_ = 0;
};

// A rough size of a document in memory, for the budget.
std::size_t approximate_bytes(const Network& net);

}  // namespace apportion::web
