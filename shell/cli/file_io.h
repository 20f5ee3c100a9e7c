// Files for the command line: whole-file reads with a size limit, and atomic writes (a
// temporary file in the same folder, flushed, then renamed over the target) that refuse to
// replace any input file of the same run.
#pragma once

#include <string>
#include <vector>

namespace apportion::cli {

// False with `error` set when the file cannot be read or exceeds the size limit.
bool read_file(const std::string& path, std::string& out, std::string& error);

class OutputGuard {
 public:
  // Files that must never be written (the inputs of this run).
  void protect(const std::string& path);
  // Writes atomically; false with `error` set on failure (nothing is left behind).
  bool write(const std::string& path, const std::string& content, std::string& error) const;

 private:
  std::vector<std::string> protected_;
};

}  // namespace apportion::cli
