// Loading a network for the command line, in any format the core imports. The format comes
// from --format or from the file name: .json; .graphml; .max, .min, .dimacs (DIMACS); and
// CSV tables given as NAME.nodes.csv (NAME.arcs.csv and NAME.demands.csv beside it).
#pragma once

#include <optional>
#include <string>

#include "apportion/formats/load_result.h"
#include "cli_args.h"
#include "file_io.h"

namespace apportion::cli {

// Options every subcommand that reads a network accepts.
inline const std::set<std::string> kLoaderOptions = {"format", "capacity-attribute", "default-capacity",
                                                     "undirected", "attribute-unit", "unit", "length-as", "speed"};

// Reads the file(s), protects them from being overwritten, and returns the load result.
// On a read error the result holds a "file" diagnostic.
LoadResult load_network(const std::string& path, const Args& args, OutputGuard& guard);

// Prints the diagnostics to stderr, one per line.
void print_diagnostics(const Diagnostics& d);

// What every solving subcommand does first: load the file named by the first positional,
// print its diagnostics, and give the network, or nothing when it has errors.
std::optional<Network> load_for_command(const Args& args, OutputGuard& guard);

// True (after printing the problem and the help to stderr) when the arguments do not parse
// or there are not exactly `positionals` of them.
bool usage_error(const Args& args, const std::string& command, std::size_t positionals, const char* help);

}  // namespace apportion::cli
