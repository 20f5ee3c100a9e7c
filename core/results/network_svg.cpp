// The network picture; see network_svg.h.
#include "apportion/results/network_svg.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>
#include <unordered_set>

#include "apportion/results/flow_result_export.h"

namespace apportion {

Rgb utilisation_colour(double u, PictureTheme theme) {
  const float t = static_cast<float>(std::clamp(std::isfinite(u) ? u : 0.0, 0.0, 1.0));
  if (theme == PictureTheme::kLight)  // light grey (still visible on white) to deep blue
    return {0.74f + t * (0.00f - 0.74f), 0.76f + t * (0.19f - 0.76f), 0.80f + t * (0.45f - 0.80f)};
  return {0.26f + t * (0.99f - 0.26f), 0.38f + t * (0.91f - 0.38f), 0.60f + t * (0.15f - 0.60f)};
}

std::pair<double, double> Layout::position(const Node& v) const {
  if (v.x && v.y) return {margin + offset_x + (*v.x - min_x) * scale, margin + offset_y + (*v.y - min_y) * scale};
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
  // Centred in the room the scale leaves over (the label room stays on the right).
  l.offset_x = std::max(0.0, (width - 2 * margin - label_room - (max_x - l.min_x) * l.scale) / 2);
  l.offset_y = std::max(0.0, (height - 2 * margin - (max_y - l.min_y) * l.scale) / 2);
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

namespace {

struct SvgColours {
  const char *background, *ink, *quiet, *idle, *out_of_service;
};
constexpr SvgColours kDarkSvg = {"#1d2026", "#e6e8ec", "#c9ced6", "#8c96a5", "#bec3cd"};
constexpr SvgColours kLightSvg = {"#ffffff", "#202228", "#4a4f58", "#7e8490", "#5a5f69"};

// Splits a sentence into lines of at most `width` characters, at spaces.
std::vector<std::string> wrap(const std::string& text, std::size_t width) {
  std::vector<std::string> lines;
  std::string line, word;
  std::istringstream words(text);
  while (words >> word) {
    if (!line.empty() && line.size() + 1 + word.size() > width) lines.push_back(line), line.clear();
    line += (line.empty() ? "" : " ") + word;
  }
  if (!line.empty()) lines.push_back(line);
  return lines;
}

std::string number(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

}  // namespace

std::string network_svg(const Network& net, const MultiflowResult* result, const PictureOptions& o) {
  const SvgColours& c = o.theme == PictureTheme::kLight ? kLightSvg : kDarkSvg;
  const double width = o.width, height = o.height;
  const bool solved = result && result->status == SolveStatus::kOptimal;
  const std::string unit = net.units.capacity.empty() ? "" : " " + net.units.capacity;
  // Title block: the name, then the rule and the totals, then the date.
  std::vector<std::string> subtitle;
  if (!o.rule.empty()) subtitle.push_back("Rule: " + o.rule);
  if (solved) {
    std::string totals = "throughput " + number(result->throughput) + unit + "; minimum normalised share " +
                         number(result->min_normalised_share) + "; Jain's index " + number(result->jain_index);
    if (!result->tiers.empty()) totals += "; " + std::to_string(result->tiers.size()) + " tiers";
    totals += std::string("; independent check ") + (result->check.ok ? "passed" : "FAILED");
    subtitle.push_back(totals);
  } else {
    subtitle.push_back("No result: the network alone.");
  }
  subtitle.push_back(std::to_string(net.node_count()) + " nodes, " + std::to_string(net.arc_count()) + " arcs, " +
                     std::to_string(net.demands.size()) + " demands" + (o.date.empty() ? "" : "; made " + o.date));
  const double header = 34 + 18.0 * subtitle.size();
  const std::vector<std::string> caution = wrap(kPlanningCaution, static_cast<std::size_t>(std::max(40.0, width / 7)));
  const double legend = 70 + 15.0 * caution.size();
  const double total_height = header + height + legend;

  std::ostringstream s;
  s.precision(6);
  s << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << width << "\" height=\"" << total_height
    << "\" viewBox=\"0 0 " << width << ' ' << total_height << "\" font-family=\"DejaVu Sans, Arial, sans-serif\" "
    << "font-size=\"13\">\n";
  s << "<title>" << xml_escape(net.name) << "</title>\n";
  s << "<rect width=\"100%\" height=\"100%\" fill=\"" << c.background << "\"/>\n";
  s << "<text x=\"40\" y=\"28\" font-size=\"20\" font-weight=\"bold\" fill=\"" << c.ink << "\">"
    << xml_escape(net.name.empty() ? "Network" : net.name) << "</text>\n";
  for (std::size_t i = 0; i < subtitle.size(); ++i)
    s << "<text x=\"40\" y=\"" << 50 + 18.0 * i << "\" fill=\"" << c.quiet << "\">" << xml_escape(subtitle[i])
      << "</text>\n";

  s << "<g transform=\"translate(0," << header << ")\">\n";
  const Layout layout = fit_layout(net, width, height, 40, 140);
  double max_cap = 0;
  for (const Arc& a : net.arcs) max_cap = std::max(max_cap, a.capacity);
  const std::vector<char> twin = arcs_with_twin(net);
  bool any_out = false;
  for (int a = 0; a < net.arc_count(); ++a) {
    const Arc& arc = net.arcs[a];
    const auto [x0, y0] = layout.position(net.nodes[arc.from]);
    const auto [x1, y1] = layout.position(net.nodes[arc.to]);
    const ArcGeometry g = arc_geometry(twin[a], static_cast<float>(x0), static_cast<float>(y0), static_cast<float>(x1),
                                       static_cast<float>(y1), 5.0f);
    const bool loaded = solved && a < static_cast<int>(result->arcs.size());
    const double u = loaded ? result->arcs[a].utilisation : 0.0;
    const double w = 1.5 + 5.0 * std::sqrt(max_cap > 0 ? arc.capacity / max_cap : 0);
    const std::string colour = !arc.enabled ? c.out_of_service : loaded ? hex(utilisation_colour(u, o.theme)) : c.idle;
    s << "<g><title>" << xml_escape(arc.id) << ": capacity " << arc.capacity << unit;
    if (loaded) s << ", load " << result->arcs[a].load << " (" << number(100 * u) << " %)";
    if (!arc.enabled) s << ", out of service";
    s << "</title>";
    s << "<line x1=\"" << g.x0 << "\" y1=\"" << g.y0 << "\" x2=\"" << g.x1 << "\" y2=\"" << g.y1 << "\" stroke=\""
      << colour << "\" stroke-width=\"" << (arc.enabled ? w : std::max(2.0, 0.6 * w)) << "\""
      << (arc.enabled ? "" : " stroke-dasharray=\"7 5\"") << "/>";
    const float ux = (g.x1 - g.x0) / g.length, uy = (g.y1 - g.y0) / g.length;
    if (!arc.enabled) {  // a cross at the middle, as on the canvas
      any_out = true;
      const double mx = (g.x0 + g.x1) / 2, my = (g.y0 + g.y1) / 2, k = 6;
      s << "<circle cx=\"" << mx << "\" cy=\"" << my << "\" r=\"" << k + 3 << "\" fill=\"" << c.background << "\"/>"
        << "<path d=\"M" << mx - k << ' ' << my - k << "L" << mx + k << ' ' << my + k << "M" << mx - k << ' ' << my + k
        << "L" << mx + k << ' ' << my - k << "\" stroke=\"" << c.out_of_service << "\" stroke-width=\"2.5\"/>";
    } else if (!arc.shared_two_way && g.length > 28) {  // an arrowhead at two thirds of the way
      const double tx = g.x0 + (g.x1 - g.x0) * 0.67, ty = g.y0 + (g.y1 - g.y0) * 0.67, k = 5 + w * 0.5;
      s << "<polygon points=\"" << tx + ux * k << ',' << ty + uy * k << ' ' << tx - uy * k << ',' << ty + ux * k << ' '
        << tx + uy * k << ',' << ty - ux * k << "\" fill=\"" << colour << "\"/>";
    }
    s << "</g>\n";
  }
  for (const Node& v : net.nodes) {
    const auto [x, y] = layout.position(v);
    const std::string label = xml_escape(shown_name(v));
    s << "<circle cx=\"" << x << "\" cy=\"" << y << "\" r=\"7\" fill=\"" << c.ink << "\" stroke=\"" << c.background
      << "\" stroke-width=\"1.5\"/>";
    // A halo in the background's colour under each label keeps it readable across arcs.
    s << "<text x=\"" << x + 10 << "\" y=\"" << y + 4 << "\" fill=\"" << c.background << "\" stroke=\"" << c.background
      << "\" stroke-width=\"3\" stroke-linejoin=\"round\">" << label << "</text>";
    s << "<text x=\"" << x + 10 << "\" y=\"" << y + 4 << "\" fill=\"" << c.ink << "\">" << label << "</text>\n";
  }
  s << "</g>\n";

  // Legend and caution.
  const double ly = header + height + 16;
  if (solved) {
    for (int i = 0; i < 20; ++i)
      s << "<rect x=\"" << 40 + i * 8 << "\" y=\"" << ly << "\" width=\"8\" height=\"10\" fill=\""
        << hex(utilisation_colour(i / 19.0, o.theme)) << "\"/>";
    s << "\n<text x=\"210\" y=\"" << ly + 10 << "\" fill=\"" << c.ink
      << "\">arc utilisation 0 % to 100 %; width: capacity" << xml_escape(unit.empty() ? "" : " (" + unit.substr(1) + ")")
      << "; arrowhead: direction of a one-way arc</text>\n";
  } else {
    s << "<text x=\"40\" y=\"" << ly + 10 << "\" fill=\"" << c.ink << "\">width: capacity"
      << xml_escape(unit.empty() ? "" : " (" + unit.substr(1) + ")") << "; arrowhead: direction of a one-way arc</text>\n";
  }
  if (any_out)
    s << "<line x1=\"40\" y1=\"" << ly + 27 << "\" x2=\"70\" y2=\"" << ly + 27 << "\" stroke=\"" << c.out_of_service
      << "\" stroke-width=\"2\" stroke-dasharray=\"7 5\"/><text x=\"80\" y=\"" << ly + 31 << "\" fill=\"" << c.ink
      << "\">dashed and crossed: out of service</text>\n";
  for (std::size_t i = 0; i < caution.size(); ++i)
    s << "<text x=\"40\" y=\"" << ly + 54 + 15.0 * i << "\" fill=\"" << c.quiet << "\" font-size=\"11\">"
      << xml_escape(caution[i]) << "</text>\n";
  s << "</svg>\n";
  return s.str();
}

}  // namespace apportion
