// Browser bridge; see browser_bridge.h, and web/browser/shell.html for the JavaScript side. Files
// reach C++ as one JSON text
// {"source": "...", "files": [{"name": "...", "text": "..."}]} through the exported
// apportion_receive_files(), defined in web/app/main.cpp.
#include "browser/browser_bridge.h"

#include <emscripten.h>

#include <cstdlib>

namespace apportion::web {

namespace {

// The JavaScript lives in web/browser/shell.html (window.apportionBridge); these are the calls.
EM_JS(void, js_download, (const char* name, const char* mime, const char* text),
      { apportionBridge.download(UTF8ToString(name), UTF8ToString(mime), UTF8ToString(text)); });
EM_JS(void, js_png, (const char* name, int x, int y, int w, int h), { apportionBridge.png(UTF8ToString(name), x, y, w, h); });
EM_JS(void, js_open_picker, (), { apportionBridge.openPicker(); });
EM_JS(void, js_share, (const char* json), { apportionBridge.share(UTF8ToString(json)); });
EM_JS(void, js_autosave, (const char* json), { apportionBridge.autosave(UTF8ToString(json)); });
EM_JS(void, js_startup, (), { apportionBridge.startup(); });
EM_JS(void, js_solve, (int id, const char* request), { apportionBridge.solve(id, UTF8ToString(request)); });
EM_JS(char*, js_autosave_list, (), {
  var s = apportionBridge.autosaveList();
  var len = lengthBytesUTF8(s) + 1;
  var p = _malloc(len);
  stringToUTF8(s, p, len);
  return p;
});
EM_JS(void, js_restore_autosave, (int slot), { apportionBridge.restoreAutosave(slot); });
EM_JS(char*, js_read_setting, (const char* key), {
  var s = String();
  try { s = localStorage.getItem('apportion.' + UTF8ToString(key)) || String(); } catch (e) {}
  var len = lengthBytesUTF8(s) + 1;
  var p = _malloc(len);
  stringToUTF8(s, p, len);
  return p;
});
EM_JS(void, js_write_setting, (const char* key, const char* value), {
  try { localStorage.setItem('apportion.' + UTF8ToString(key), UTF8ToString(value)); } catch (e) {}
});
EM_JS(char*, js_local_time, (), {
  var d = new Date();
  var two = function (n) { return String(n).padStart(2, '0'); };
  var s = d.getFullYear() + '-' + two(d.getMonth() + 1) + '-' + two(d.getDate()) + ' ' + two(d.getHours()) + ':' +
          two(d.getMinutes());
  var len = lengthBytesUTF8(s) + 1;
  var p = _malloc(len);
  stringToUTF8(s, p, len);
  return p;
});
EM_JS(void, js_stop_solver, (), { apportionBridge.stopSolver(); });

}  // namespace

void download_text(const std::string& filename, const std::string& mime, const std::string& text) {
  js_download(filename.c_str(), mime.c_str(), text.c_str());
}
void open_file_picker() { js_open_picker(); }
void download_canvas_png(const std::string& filename, float x, float y, float width, float height) {
  js_png(filename.c_str(), static_cast<int>(x), static_cast<int>(y), static_cast<int>(width), static_cast<int>(height));
}
void publish_share_link(const std::string& network_json) { js_share(network_json.c_str()); }
void autosave(const std::string& network_json) { js_autosave(network_json.c_str()); }
void load_startup_network() { js_startup(); }
void start_solve(int id, const std::string& request_json) { js_solve(id, request_json.c_str()); }
void stop_solver() { js_stop_solver(); }
std::string autosave_versions() {
  char* p = js_autosave_list();
  std::string s = p ? p : "[]";
  std::free(p);
  return s;
}
void restore_autosave(int slot) { js_restore_autosave(slot); }
std::string read_setting(const std::string& key) {
  char* p = js_read_setting(key.c_str());
  std::string s = p ? p : "";
  std::free(p);
  return s;
}
std::string local_time_text() {
  char* p = js_local_time();
  std::string s = p ? p : "";
  std::free(p);
  return s;
}
void write_setting(const std::string& key, const std::string& value) { js_write_setting(key.c_str(), value.c_str()); }

}  // namespace apportion::web
