// The network canvas of the placeholder page: nodes and arcs of a document drawn with
// ImGui's draw lists, arcs coloured by their share of a maximum flow. Immediate mode: it
// draws from the document and the result each frame and keeps no copy of either.
#pragma once

#include "apportion/max_flow.h"
#include "apportion/network.h"

namespace apportion::web {

void draw_network(const Network& net, const MaxFlowResult* flow, float ui_scale);

}  // namespace apportion::web
