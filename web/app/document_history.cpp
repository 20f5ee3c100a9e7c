// Undo and redo by document snapshots; see document_history.h.
#include "app/document_history.h"

namespace apportion::web {

std::size_t approximate_bytes(const Network& net) {
  std::size_t b = sizeof(Network) + net.metadata_json.size();
  for (const Node& v : net.nodes) b += sizeof(Node) + v.id.size() + v.label.size();
  for (const Arc& a : net.arcs) b += sizeof(Arc) + a.id.size();
  for (const Demand& d : net.demands) b += sizeof(Demand) + d.id.size() + d.label.size();
  return b;
}

void DocumentHistory::record(const Network& doc, std::string what) {
  const std::size_t b = approximate_bytes(doc);
  undo_.push_back({doc, std::move(what), b});
  bytes_ += b;
  for (const Step& s : redo_) bytes_ -= s.bytes;
  redo_.clear();
  trim();
}

// Moves the newest step of `from` to `to`, swapping its snapshot with the document.
bool DocumentHistory::step(std::deque<Step>& from, std::deque<Step>& to, Network& doc) {
  if (from.empty()) return false;
  Step s = std::move(from.back());
  from.pop_back();
  std::swap(doc, s.doc);  // s now holds the state left behind
  s.bytes = approximate_bytes(s.doc);
  to.push_back(std::move(s));
  bytes_ = 0;
  for (const Step& t : undo_) bytes_ += t.bytes;
  for (const Step& t : redo_) bytes_ += t.bytes;
  return true;
}

bool DocumentHistory::undo(Network& doc) { return step(undo_, redo_, doc); }
bool DocumentHistory::redo(Network& doc) { return step(redo_, undo_, doc); }

const std::string& DocumentHistory::undo_name() const {
  static const std::string none;
  return undo_.empty() ? none : undo_.back().what;
}
const std::string& DocumentHistory::redo_name() const {
  static const std::string none;
  return redo_.empty() ? none : redo_.back().what;
}

void DocumentHistory::clear() {
  undo_.clear();
  redo_.clear();
  bytes_ = 0;
}

void DocumentHistory::trim() {
  // Keep at least one step, so that the last edit can always be undone.
  while (undo_.size() > 1 && (bytes_ > kBudgetBytes || undo_.size() > kMaxSteps)) {
    bytes_ -= undo_.front().bytes;
    undo_.pop_front();
  }
}

}  // namespace apportion::web
