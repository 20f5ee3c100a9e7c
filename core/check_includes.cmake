# Fails when a file under core/ includes a UI, browser or platform header.
# Called by the build with -DCORE_DIR=...
file(GLOB_RECURSE files "${CORE_DIR}/*.h" "${CORE_DIR}/*.cpp")
set(forbidden "imgui|GLFW/|GL/|GLES[0-9]*/|emscripten|SDL|windows\\.h|unistd\\.h|sys/|pthread\\.h|dlfcn\\.h|X11/")
set(bad "")
foreach(f IN LISTS files)
  file(STRINGS "${f}" lines REGEX "^[ \t]*#[ \t]*include[ \t]*[<\"](${forbidden})")
  foreach(line IN LISTS lines)
    string(APPEND bad "\n  ${f}: ${line}")
  endforeach()
endforeach()
if(bad)
  message(FATAL_ERROR "core/ must not include UI, browser or platform headers:${bad}")
endif()
