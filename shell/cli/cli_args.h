// Command-line arguments of one `apportion` subcommand: positionals, "--name value"
// options and "--flag" switches. Unknown options are usage errors (exit code 2).
#pragma once

#include <map>
#include <optional>
#include <set>
#include <string>
#include <vector>

namespace apportion::cli {

struct Args {
  std::vector<std::string> positional;
  std::map<std::string, std::string> options;
  std::set<std::string> flags;
  std::string error;  // non-empty when the arguments do not parse

  std::optional<std::string> get(const std::string& name) const {
    auto it = options.find(name);
    return it == options.end() ? std::nullopt : std::optional<std::string>(it->second);
  }
  bool has(const std::string& flag) const { return flags.count(flag) > 0; }
};

// `valued` lists the options that take a value, `switches` those that do not.
Args parse_args(int argc, char** argv, int first, const std::set<std::string>& valued,
                const std::set<std::string>& switches);

}  // namespace apportion::cli
