// What every importer returns: the network when the file could be read, and the messages
// about it. A file with errors yields no network, so a caller never sees half a document.
#pragma once

#include <optional>

#include "apportion/model/diagnostics.h"
#include "apportion/model/network.h"

namespace apportion {

struct LoadResult {
  std::optional<Network> network;
  Diagnostics diagnostics;

  bool ok() const { return network.has_value(); }
};

}  // namespace apportion
