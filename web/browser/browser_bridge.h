// The page's side of the browser: downloads, the file picker, share links in the URL
// fragment, and autosave in local storage. Everything stays on the machine: files are read
// and written by the browser itself, and a share link carries the network in the fragment,
// which browsers never send to a server.
#pragma once

#include <string>

namespace apportion::web {

// Offers `text` as a file download (a Blob and an <a download> link; works from file://).
void download_text(const std::string& filename, const std::string& mime, const std::string& text);
// Offers a part of the canvas (x, y, width, height in device pixels) as a PNG download;
// call right after drawing a frame.
void download_canvas_png(const std::string& filename, float x, float y, float width, float height);
// Opens the browser's file picker; chosen files arrive through apportion_receive_files().
void open_file_picker();
// Compresses the network JSON (deflate-raw, base64url) into a link "PAGE#n=...", copies it
// to the clipboard (or, refused, shows it in the browser's prompt to copy by hand) and
// answers through apportion_share_event; the address bar is left as it is.
void publish_share_link(const std::string& network_json);
// Keeps the network JSON in local storage, restored when the page opens without a link.
// The last kAutosaveVersions versions are kept; a failure (quota, blocked storage) is
// reported back through apportion_storage_event.
void autosave(const std::string& network_json);
inline constexpr int kAutosaveVersions = 5;
// The kept versions, newest first, as JSON: [{"slot", "time" (ms), "tab", "name", "bytes"}].
std::string autosave_versions();
// Opens a kept version; it arrives like a file, with source "autosave".
void restore_autosave(int slot);
// Sends a solve request to the solver worker (started on first use from the script inlined
// in the page); answers arrive through apportion_solve_progress / _done / _failed.
void start_solve(int id, const std::string& request_json);
// Terminates the worker, stopping a solve at once; the next start_solve starts a new one.
void stop_solver();
// A page setting kept in this browser's local storage under "apportion.<key>" ("" when
// none, or when storage is blocked; writing then does nothing).
std::string read_setting(const std::string& key);
void write_setting(const std::string& key, const std::string& value);
// The local date and time, "YYYY-MM-DD HH:MM", for what an export says it was made.
std::string local_time_text();
// At start: a network from the URL fragment (which is then cleared from the address bar),
// else from autosave; arrives like a file.
void load_startup_network();

}  // namespace apportion::web
