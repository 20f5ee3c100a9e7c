// The network canvas of the placeholder page: nodes and arcs of a document drawn with
// ImGui's draw lists, arcs coloured by their utilisation, with a legend. Immediate mode: it
// draws from the document and the result each frame and keeps no copy of either.
#pragma once

#include "apportion/multiflow.h"
#include "apportion/network.h"

namespace apportion::web {

void draw_network(const Network& net, const MultiflowResult* result, float ui_scale);

}  // namespace apportion::web
