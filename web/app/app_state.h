// The page's state: one network document with its undo history, the result of the last
// solve and what the user is looking at. The document and the result are the single source
// of truth; every frame is drawn from them. Edits go through edit(), which records undo,
// validates, autosaves and (with auto-solve on) starts a solve in the worker.
#pragma once

#include <GLFW/glfw3.h>

#include <array>
#include <string>
#include <unordered_map>
#include <vector>

#include "app/document_history.h"
#include "apportion/formats/demand_table.h"
#include "apportion/formats/network_graphml.h"
#include "apportion/model/diagnostics.h"
#include "apportion/model/network.h"
#include "apportion/model/network_edit.h"
#include "apportion/multiflow/multiflow.h"
#include "canvas/network_view.h"

namespace apportion::web {

// A solve running in the worker.
struct RunningSolve {
  bool running = false;
  int id = 0;                 // of the newest request; answers to older ones are ignored
  double started_ms = 0;
  long long revision = -1;    // the document revision it solves
  long long document = -1;    // App::document_serial of the network it solves
  int objective = 0;          // index into kObjectives
  Network doc;                // the document as sent, to read the answer against
  std::string stage;
  int round = 0, settled = 0, demands = 0, lp_solves = 0;
};

// The "Add demands" dialog's choices (traffic_matrix.h, demand_table.h): kept between
// openings.
struct MatrixChoices {
  int source = 0;    // 0: generate pairs, 1: a table pasted from a spreadsheet (or opened)
  int between = 0;   // 0: every pair of all nodes, 1: every pair of the selected nodes,
                     // 2: from the selected nodes to every node, 3: from every node to them
  int amounts = 0;   // 0: gravity, 1: the same amount for each pair, 2: as much as possible
  double total = 0;  // gravity: the sum of the amounts (0: a third of the total capacity)
  double amount = 1;
  int seed = 1;
  double weight = 1;
  bool replace = false;
  std::string error;  // of the last attempt, shown in the dialog
  // The table: its text, where it came from, and how it reads against the document
  // (re-read when the text, the replace choice or the document changes).
  std::string table_text, table_name;
  DemandTableRead table;
  long long table_read_at = -1;  // App::doc_changes when `table` was read
  bool table_read_replace = false;
};

// A GraphML file waiting for the "Open topology" dialog's choices (network_graphml.h).
struct GraphmlChoices {
  bool pending = false;
  bool requested = false;  // open the dialog on the next frame
  std::string name, text;
  std::vector<GraphmlAttribute> attributes;
  int attribute = -1;           // index into attributes; -1: none, every link gets the default
  int value_unit = 0;           // 0: already in the network's unit; else kLinkSpeedUnits[value_unit - 1]
  std::string unit = "Gbit/s";  // the network's capacity unit
  double default_capacity = 1;
  int undirected = 0;           // 0: one shared two-way arc, 1: two arcs
  int length_as = 0;            // great-circle length: 0 not used, 1 as cost (km), 2 as transit time
  double speed = 1;             // km per time unit, for 2
  std::string error;            // why the last Open could not read it with these choices
};
inline constexpr const char* kLinkSpeedUnits[] = {"bit/s", "kbit/s", "Mbit/s", "Gbit/s", "Tbit/s"};

// How a long table is filtered and sorted (panels/table_rows.h); set by its filter box and
// column headers, or by the test hook.
struct TableView {
  std::string filter;  // rows containing this text (id, label, origin, destination), any case
  int column = -1;     // sorted by this column; -1: the document's order
  bool descending = false;
};

struct App {
  GLFWwindow* window = nullptr;
  Network doc;
  std::string doc_name;        // where it came from
  long long revision = 0;      // bumps on every edit that changes what a solve sees
  DocumentHistory history;
  Selection selection;
  Diagnostics diagnostics;     // validation of the document, refreshed on every edit

  FairOptions options;
  int objective = 0;           // index into kObjectives
  bool auto_solve = true;
  // A solve (or a cancelled one) that took longer pauses "solve after each edit": an edit
  // should answer at once, and a network that takes this long would start a long solve on
  // every keystroke. 3 s: GtsCe with 500 demands takes 2.7 s in the page (README, Benchmark).
  double auto_solve_pause_ms = 3000;
  MultiflowResult result;
  long long result_revision = -1;
  // Shares of the result before this one, by demand id: what the last edit changed. Only
  // results of the same network compare: each opened network gets a new serial.
  std::unordered_map<std::string, double> previous_shares;
  std::string change_caption;      // what previous_shares is the result before, for the table
  long long document_serial = 0;   // bumps when another network is opened (not on edits)
  long long result_document = -1;  // the serial of the network `result` belongs to
  int result_objective = -1;
  std::vector<std::string> result_doc_ids;  // demand ids of the document the result solves
  RunningSolve solve;

  std::vector<std::string> open_errors;  // from the last failed open, shown until dismissed
  std::string notice;                    // one line about the last event (cancelled, autosave trouble, ...)
  bool other_tab_saved = false;          // another tab autosaved over this one's work

  ViewState view;
  Tool tool = Tool::kSelect;
  char search[128] = "";
  std::vector<char> search_hits;         // per node
  int right_tab = 0;
  int png_requested = 0;        // frames until the canvas PNG is taken (0: none asked for)
  float dpr = 1.0f;
  float applied_scale = 0;      // the UI scale the fonts and style were made for
  float side_width = 0;         // of the side panel, in CSS pixels (dragged, remembered); 0: automatic
  float side_width_used = 0;    // as drawn last frame
  float tabs_y = 0;             // where the side panel's tabs start, below the notices (test hook)
  std::array<float, 4> splitter{};  // the side panel's draggable edge, x0 y0 x1 y1 (test hook)
  // Where the toolbar's items were drawn last frame (for the test hook): name, then x0 y0 x1 y1.
  std::vector<std::pair<std::string, std::array<float, 4>>> toolbar_items;
  bool first_frame_reported = false;
  MatrixChoices matrix;
  bool matrix_dialog_requested = false;  // opened by the test hook, as by its button
  GraphmlChoices graphml;
  long long doc_changes = 0;     // bumps on every edit, labels and positions included
  long long result_changes = 0;  // bumps on every result received
  TableView demand_view, share_view;
  int chart_bars = 0;  // bars the shares chart drew last (fewer than demands: summarised)
  std::vector<std::string> chart_ticks;  // the top tick label of each chart drawn last frame
};

App& app();

inline constexpr FairObjective kObjectives[] = {FairObjective::kMaxMinFair, FairObjective::kMaxConcurrent,
                                                FairObjective::kMaxThroughput, FairObjective::kTradeoff,
                                                FairObjective::kFeasibility};
// What each rule optimises, in a sentence (the rule's tooltip and the shares panel).
inline constexpr const char* kObjectiveExplanations[] = {
    "Raises every demand's share together, in proportion to its weight, until an arc or its own amount stops it, "
    "then raises the rest the same way: no demand can get more without taking from one that has no more.",
    "The largest fraction lambda of every amount that all demands get at once. A demand asking for as much as "
    "possible has no amount to take a fraction of: it gets 0.",
    "The most flow in total, whoever carries it: demands on long or crowded routes may get 0.",
    "The most flow in total while every demand keeps at least (1 - fairness given up) of its max-min fair share.",
    "Whether every amount can be carried at once; if not, the largest fraction of every amount at once and the "
    "smallest total shortfall. A demand asking for as much as possible gets 0 here."};
inline constexpr const char* kObjectiveLabels[] = {"Max-min fair shares (weighted)", "Max concurrent flow",
                                                   "Max throughput", "Throughput with a fairness floor",
                                                   "Can every demand be met?"};

// True when the result belongs to the document as it is now.
bool result_is_current();
// The result to draw: the current one, or null.
const MultiflowResult* current_result();

// Records undo under `what`, lets `change` edit the document, then validates, autosaves
// and re-solves when `affects_solve` (moving nodes does not).
template <class Change>
void edit(const std::string& what, bool affects_solve, Change&& change);
void after_edit(bool affects_solve);

void set_document(Network net, const std::string& name, bool save);
void request_solve();
void cancel_solve();
// Answers from the worker (through the exported functions in main.cpp).
void receive_solve_progress(int id, const std::string& json_text);
void receive_solve_result(int id, const std::string& result_json);
void receive_solve_failure(int id, const std::string& message);
void undo();
void redo();
void delete_selection();
void select_item(const std::string& kind, const std::string& id);  // from a validation message
void report(const char* event);  // a machine-readable console line for tests
void action(const std::string& what);
// Adds the demands app().matrix describes, as one undoable edit; false (and matrix.error
// set) when they cannot be added, with the document unchanged.
bool add_matrix_demands();
// A single CSV arrived: a demands table (its first row names origin and destination) opens
// in the "Add demands" dialog to be checked and added; any other is a traffic matrix, whose
// demands are added to the open network as one undoable
// edit (weight 1), or its errors shown with the document unchanged.
void add_single_csv(const std::string& name, const std::string& text);
// The side panel's width: read from and kept in this browser's storage.
void load_side_width();
void remember_side_width();
// The name every download starts with (the network's name, made safe for a file name).
std::string file_stem();
// The table in app().matrix, read against the document as it is now (cached).
const DemandTableRead& pasted_table();
// Adds the table in app().matrix as one undoable edit; false (and matrix.error set) when it
// has errors, with the document unchanged.
bool add_pasted_table();
// The answer to "Copy share link" (shell.html): says in the notice whether the link was
// copied, and how to share from a page opened as a file.
void receive_share_answer(const std::string& json_text);
// Text pasted into the page (the browser's paste event): into the text field being edited,
// else as a demands table into the "Add demands" dialog, which opens to show it.
void receive_paste(const std::string& text);
// A GraphML file arrived: keep it and ask how to read it (the "Open topology" dialog).
void ask_graphml_choices(const std::string& name, const std::string& text);
// Reads the waiting GraphML file with app().graphml's choices and opens it (warnings in the
// notice), or shows why not; the current document stays when it fails.
void open_graphml_with_choices();

template <class Change>
void edit(const std::string& what, bool affects_solve, Change&& change) {
  app().history.record(app().doc, what);
  change(app().doc);
  after_edit(affects_solve);
}

}  // namespace apportion::web
