// The network canvas: nodes and arcs of the document drawn with ImGui's draw lists, and the
// mouse on them. Arc width follows capacity and colour follows utilisation (legend
// included); marks move along each loaded arc in the direction of its flow, faster the
// fuller it is. A filter shows one demand or one tier in its own colour, with the binding
// arcs outlined in another (and one demand's origin and destination marked). Arcs out of
// service are dashed and crossed at their middle: the picture of a failure. Hovering an arc shows capacity, load, load per demand and shadow price.
//
// Immediate mode: the canvas reads the document, the result and the selection and never
// changes them. What the mouse asked for comes back as CanvasInput, and the app turns it
// into edits (with undo) or selection changes. ViewState holds only how the user looks.
//
// Mouse: wheel zooms about the cursor; right or middle drag pans. With the select tool a
// click selects (Shift adds), dragging a node moves the selected nodes, dragging on empty
// canvas selects the nodes in the box. The add tools add a node where clicked, or an arc or
// demand from the first node clicked to the second.
#pragma once

#include <array>
#include <vector>

#include "apportion/model/network.h"
#include "apportion/model/network_edit.h"
#include "apportion/multiflow/multiflow.h"
#include "apportion/results/network_svg.h"

namespace apportion::web {

enum class Tool { kSelect, kAddNode, kAddArc, kAddDemand };

struct ViewState {
  float pan_x = 0, pan_y = 0;  // in device pixels
  float zoom = 1;
  Layout layout;               // document coordinates -> canvas, fixed until the next fit
  bool fitted = false;         // false: fit the network into the canvas on the next frame
  float fitted_w = 0, fitted_h = 0;  // the canvas size of the last fit
  bool animate = true;
  int filter_demand = -1;      // >= 0: show this demand's flow and binding arcs
  int filter_tier = 0;         // > 0: show this tier's flows and binding arcs
  int pending_from = -1;       // add-arc / add-demand tool: the first node chosen
  // Mouse gestures in progress.
  int pressed_node = -1;
  bool moving = false, boxing = false;
  float press_x = 0, press_y = 0;
  // Node centres in device pixels as drawn last frame (for the test hook), and the canvas box.
  std::vector<float> node_screen;
  float canvas_x = 0, canvas_y = 0, canvas_w = 0, canvas_h = 0;
  double frame_ms = 0;         // how long the last canvas took to build, for the status line
  // What the last frame marked, for the test hook: arcs drawn dashed as out of service, and
  // the filtered demand's origin and destination.
  std::vector<int> drawn_out_of_service;
  int drawn_origin = -1, drawn_destination = -1;
  // Node labels drawn (the others would overlap): node index, then the box x0 y0 x1 y1.
  std::vector<std::array<float, 5>> drawn_labels;
  int drawn_cut_arcs = 0;      // feasibility: arcs of the overloaded cut outlined
};

struct CanvasInput {
  int clicked_node = -1, clicked_arc = -1;
  bool clicked_empty = false;
  bool additive = false;               // Shift was held
  double doc_x = 0, doc_y = 0;         // where the click was, in document coordinates
  bool box_done = false;
  Selection box;                       // nodes in the box and arcs with both ends in it
  bool move_started = false, move_ended = false;
  double move_dx = 0, move_dy = 0;     // this frame's move of the selected nodes, in document units
  int link_from = -1, link_to = -1;    // add-arc / add-demand: both ends chosen
};

// `highlight`: per node, 1 to mark it (search matches); may be empty.
CanvasInput draw_network(const Network& net, const MultiflowResult* result, const Selection& selection,
                         const std::vector<char>& highlight, Tool tool, ViewState& view, float ui_scale);

}  // namespace apportion::web
