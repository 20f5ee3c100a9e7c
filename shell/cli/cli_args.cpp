// Parsing of subcommand arguments; see cli_args.h.
#include "cli_args.h"

namespace apportion::cli {

Args parse_args(int argc, char** argv, int first, const std::set<std::string>& valued,
                const std::set<std::string>& switches) {
  Args a;
  for (int i = first; i < argc; ++i) {
    std::string s = argv[i];
    if (s.size() > 2 && s.compare(0, 2, "--") == 0) {
      std::string name = s.substr(2), value;
      const auto eq = name.find('=');
      const bool inline_value = eq != std::string::npos;
      if (inline_value) value = name.substr(eq + 1), name = name.substr(0, eq);
      if (switches.count(name) && !inline_value) {
        a.flags.insert(name);
      } else if (valued.count(name)) {
        if (!inline_value) {
          if (i + 1 >= argc) {
            a.error = "option --" + name + " needs a value";
            return a;
          }
          value = argv[++i];
        }
        a.options[name] = value;
      } else {
        a.error = "unknown option --" + name;
        return a;
      }
    } else {
      a.positional.push_back(s);
    }
  }
  return a;
}

}  // namespace apportion::cli
