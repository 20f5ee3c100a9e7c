// Browser bridge; see browser_bridge.h, and web/shell.html for the JavaScript side. Files
// reach C++ as one JSON text
// {"source": "...", "files": [{"name": "...", "text": "..."}]} through the exported
// apportion_receive_files(), defined in main.cpp.
#include "browser_bridge.h"

#include <emscripten.h>

namespace apportion::web {

namespace {

// The JavaScript lives in web/shell.html (window.apportionBridge); these are the calls.
EM_JS(void, js_download, (const char* name, const char* mime, const char* text),
      { apportionBridge.download(UTF8ToString(name), UTF8ToString(mime), UTF8ToString(text)); });
EM_JS(void, js_png, (const char* name), { apportionBridge.png(UTF8ToString(name)); });
EM_JS(void, js_open_picker, (), { apportionBridge.openPicker(); });
EM_JS(void, js_share, (const char* json), { apportionBridge.share(UTF8ToString(json)); });
EM_JS(void, js_autosave, (const char* json), { apportionBridge.autosave(UTF8ToString(json)); });
EM_JS(void, js_startup, (), { apportionBridge.startup(); });

}  // namespace

void download_text(const std::string& filename, const std::string& mime, const std::string& text) {
  js_download(filename.c_str(), mime.c_str(), text.c_str());
}
void open_file_picker() { js_open_picker(); }
void download_canvas_png(const std::string& filename) { js_png(filename.c_str()); }
void publish_share_link(const std::string& network_json) { js_share(network_json.c_str()); }
void autosave(const std::string& network_json) { js_autosave(network_json.c_str()); }
void load_startup_network() { js_startup(); }

}  // namespace apportion::web
