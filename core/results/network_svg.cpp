// The network picture; see network_svg.h.
#include "apportion/results/network_svg.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>
#include <unordered_set>

#include "apportion/results/flow_result_export.h"

namespace apportion {

Rgb utilisation_colour(double u) {
  const float t = static_cast<float>(std::clamp(std::isfinite(u) ? u : 0.0, 0.0, 1.0));
  return {0.26f + t * (0.99f - 0.26f), 0.38f + t * (0.91f - 0.38f), 0.60f + t * (0.15f - 0.60f)};
}

std::pair<double, double> Layout::position(const Node& v) const {
  if (v.x && v.y) return {margin + (*v.x - min_x) * scale, margin + (*v.y - min_y) * scale};
  // Unplaced nodes sit on a circle in the middle, by their position in the id order.
  const double angle = 2 * M_PI * (std::hash<std::string>{}(v.id) % 997) / 997.0;
  return {margin + 200 * (1 + std::cos(angle)), margin + 200 * (1 + std::sin(angle))};
}

Layout fit_layout(const Network& net, double width, double height, double margin, double label_room) {
  Layout l;
  l.margin = margin;
  double max_x = -1e300, max_y = -1e300;
  l.min_x = 1e300, l.min_y = 1e300;
  for (const Node& v : net.nodes) {
    if (!v.x || !v.y) continue;
    l.min_x = std::min(l.min_x, *v.x), max_x = std::max(max_x, *v.x);
    l.min_y = std::min(l.min_y, *v.y), max_y = std::max(max_y, *v.y);
  }
  if (max_x < l.min_x) l.min_x = l.min_y = 0, max_x = max_y = 1;
  const double sx = (width - 2 * margin - label_room) / std::max(1e-9, max_x - l.min_x);
  const double sy = (height - 2 * margin) / std::max(1e-9, max_y - l.min_y);
  l.scale = std::max(1e-9, std::min(sx, sy));
  return l;
}

std::vector<char> arcs_with_twin(const Network& net) {
  std::unordered_set<long long> ends;
  auto key = [](int u, int v) { return static_cast<long long>(u) * 2147483648LL + v; };
  for (const Arc& a : net.arcs) ends.insert(key(a.from, a.to));
  std::vector<char> twin(net.arcs.size(), 0);
  for (std::size_t a = 0; a < net.arcs.size(); ++a)
    twin[a] = !net.arcs[a].shared_two_way && ends.count(key(net.arcs[a].to, net.arcs[a].from)) ? 1 : 0;
  return twin;
}

ArcGeometry arc_geometry(bool twin, float x0, float y0, float x1, float y1, float offset) {
  const float dx = x1 - x0, dy = y1 - y0, len = std::max(1.0f, std::sqrt(dx * dx + dy * dy));
  const float off = twin ? offset : 0.0f;
  const float nx = -dy / len * off, ny = dx / len * off;
  return {x0 + nx, y0 + ny, x1 + nx, y1 + ny, len};
}

std::string xml_escape(const std::string& text) {
  std::string out;
  for (unsigned char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      case '\'': out += "&#39;"; break;
      default:
        if (c < 0x20 && c != '\t') out += ' ';  // control characters are not allowed in XML 1.0
        else out += static_cast<char>(c);
    }
  }
  return out;
}

namespace {
std::string hex(const Rgb& c) {
  char buf[8];
  std::snprintf(buf, sizeof buf, "#%02x%02x%02x", static_cast<int>(c.r * 255 + 0.5f), static_cast<int>(c.g * 255 + 0.5f),
                static_cast<int>(c.b * 255 + 0.5f));
  return buf;
}
}  // namespace

std::string network_svg(const Network& net, const MultiflowResult* result, double width, double height) {
  std::ostringstream s;
  s.precision(6);
  const double legend = 90;
  s << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << width << "\" height=\"" << height + legend
    << "\" viewBox=\"0 0 " << width << ' ' << height + legend << "\" font-family=\"sans-serif\" font-size=\"13\">\n";
  s << "<title>" << xml_escape(net.name) << "</title>\n";
  s << "<rect width=\"100%\" height=\"100%\" fill=\"#1d2026\"/>\n";
  const Layout layout = fit_layout(net, width, height, 40, 140);
  double max_cap = 0;
  for (const Arc& a : net.arcs) max_cap = std::max(max_cap, a.capacity);
  const std::vector<char> twin = arcs_with_twin(net);
  for (int a = 0; a < net.arc_count(); ++a) {
    const Arc& arc = net.arcs[a];
    const auto [x0, y0] = layout.position(net.nodes[arc.from]);
    const auto [x1, y1] = layout.position(net.nodes[arc.to]);
    const ArcGeometry g = arc_geometry(twin[a], static_cast<float>(x0), static_cast<float>(y0), static_cast<float>(x1),
                                       static_cast<float>(y1), 5.0f);
    const double u = result && a < static_cast<int>(result->arcs.size()) ? result->arcs[a].utilisation : 0.0;
    const double w = 1.5 + 5.0 * std::sqrt(max_cap > 0 ? arc.capacity / max_cap : 0);
    s << "<line x1=\"" << g.x0 << "\" y1=\"" << g.y0 << "\" x2=\"" << g.x1 << "\" y2=\"" << g.y1 << "\" stroke=\""
      << (arc.enabled ? hex(utilisation_colour(u)) : "#666666") << "\" stroke-width=\"" << w << "\">";
    s << "<title>" << xml_escape(arc.id) << ": capacity " << arc.capacity;
    if (result && a < static_cast<int>(result->arcs.size())) s << ", load " << result->arcs[a].load;
    s << "</title></line>\n";
  }
  for (const Node& v : net.nodes) {
    const auto [x, y] = layout.position(v);
    s << "<circle cx=\"" << x << "\" cy=\"" << y << "\" r=\"7\" fill=\"#e6e8ec\"/>";
    s << "<text x=\"" << x + 10 << "\" y=\"" << y + 4 << "\" fill=\"#e6e8ec\">"
      << xml_escape(v.label.empty() ? v.id : v.label) << "</text>\n";
  }
  // Legend and caution.
  const double ly = height + 20;
  for (int i = 0; i < 20; ++i)
    s << "<rect x=\"" << 40 + i * 8 << "\" y=\"" << ly << "\" width=\"8\" height=\"10\" fill=\""
      << hex(utilisation_colour(i / 19.0)) << "\"/>";
  s << "\n<text x=\"210\" y=\"" << ly + 10 << "\" fill=\"#e6e8ec\">arc utilisation 0 % to 100 %; width: capacity"
    << (net.units.capacity.empty() ? "" : " (" + xml_escape(net.units.capacity) + ")") << "</text>\n";
  s << "<text x=\"40\" y=\"" << ly + 34 << "\" fill=\"#c9ced6\" font-size=\"11\">" << xml_escape(kPlanningCaution)
    << "</text>\n";
  s << "</svg>\n";
  return s.str();
}

}  // namespace apportion
