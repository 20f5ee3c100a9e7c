// The page's side of the browser: downloads, the file picker, share links in the URL
// fragment, and autosave in local storage. Everything stays on the machine: files are read
// and written by the browser itself, and a share link carries the network in the fragment,
// which browsers never send to a server.
#pragma once

#include <string>

namespace apportion::web {

// Offers `text` as a file download (a Blob and an <a download> link; works from file://).
void download_text(const std::string& filename, const std::string& mime, const std::string& text);
// Offers the canvas as a PNG download; call right after drawing a frame.
void download_canvas_png(const std::string& filename);
// Opens the browser's file picker; chosen files arrive through apportion_receive_files().
void open_file_picker();
// Compresses the network JSON (deflate-raw, base64url) into the URL fragment "#n=...",
// copies the link to the clipboard when allowed, and logs it for tests.
void publish_share_link(const std::string& network_json);
// Keeps the network JSON in local storage, restored when the page opens without a link.
void autosave(const std::string& network_json);
// At start: a network from the URL fragment, else from autosave; arrives like a file.
void load_startup_network();

}  // namespace apportion::web
