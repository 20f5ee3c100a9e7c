// The network canvas: nodes and arcs of the document drawn with ImGui's draw lists. Arc
// width follows capacity and colour follows utilisation (legend included); marks move along
// each loaded arc in the direction of its flow, faster the fuller it is. Selecting a demand
// draws its paths in their own colour and its binding arcs outlined. Hovering an arc shows
// capacity, load, load per demand and shadow price. Drag to pan, wheel to zoom.
// Immediate mode: drawn from the document and the result each frame; ViewState holds only
// how the user looks at them.
#pragma once

#include "apportion/multiflow.h"
#include "apportion/network.h"

namespace apportion::web {

struct ViewState {
  float pan_x = 0, pan_y = 0;  // in device pixels
  float zoom = 1;
  int selected_demand = -1;    // -1: none
  bool animate = true;
};

void draw_network(const Network& net, const MultiflowResult* result, ViewState& view, float ui_scale);

}  // namespace apportion::web
