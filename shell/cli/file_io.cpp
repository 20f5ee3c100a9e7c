// Reading inputs and writing outputs atomically; see file_io.h.
#include "file_io.h"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <sys/stat.h>
#include <unistd.h>

#include "apportion/model/size_limits.h"

namespace apportion::cli {

namespace fs = std::filesystem;

namespace {
std::string canonical_or_absolute(const std::string& path) {
  std::error_code ec;
  fs::path p = fs::weakly_canonical(fs::path(path), ec);
  return ec ? fs::absolute(path).string() : p.string();
}
}  // namespace

bool read_file(const std::string& path, std::string& out, std::string& error) {
  std::error_code ec;
  const auto size = fs::file_size(path, ec);
  if (ec) {
    error = "cannot read '" + path + "': " + ec.message();
    return false;
  }
  if (size > SizeLimits::kMaxFileBytes) {
    error = "'" + path + "' is larger than the limit of 512 MiB";
    return false;
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) {
    error = "cannot open '" + path + "': " + std::strerror(errno);
    return false;
  }
  std::ostringstream ss;
  ss << in.rdbuf();
  out = ss.str();
  return true;
}

void OutputGuard::protect(const std::string& path) { protected_.push_back(canonical_or_absolute(path)); }

bool OutputGuard::write(const std::string& path, const std::string& content, std::string& error) const {
  const std::string target = canonical_or_absolute(path);
  for (const std::string& p : protected_) {
    if (p == target) {
      error = "refusing to overwrite the input file '" + path + "'";
      return false;
    }
  }
  const fs::path dir = fs::path(target).parent_path();
  std::string tmp = (dir / ("." + fs::path(target).filename().string() + ".tmp-XXXXXX")).string();
  const int fd = mkstemp(tmp.data());
  if (fd < 0) {
    error = "cannot create a temporary file in '" + dir.string() + "': " + std::strerror(errno);
    return false;
  }
  // mkstemp makes the file private; an output is an ordinary file for the user's umask.
  const mode_t mask = ::umask(0);
  ::umask(mask);
  ::fchmod(fd, 0666 & ~mask);
  std::size_t done = 0;
  while (done < content.size()) {
    const ssize_t w = ::write(fd, content.data() + done, content.size() - done);
    if (w < 0) {
      if (errno == EINTR) continue;
      error = "cannot write '" + path + "': " + std::strerror(errno);
      ::close(fd);
      std::remove(tmp.c_str());
      return false;
    }
    done += static_cast<std::size_t>(w);
  }
  if (::fsync(fd) != 0 || ::close(fd) != 0) {
    error = "cannot flush '" + path + "': " + std::strerror(errno);
    std::remove(tmp.c_str());
    return false;
  }
  if (std::rename(tmp.c_str(), target.c_str()) != 0) {
    error = "cannot rename onto '" + path + "': " + std::strerror(errno);
    std::remove(tmp.c_str());
    return false;
  }
  return true;
}

}  // namespace apportion::cli
