# Fails the build when a file under core/ breaks the layout (see DEVELOPERS.md):
#  - it includes a UI, browser or platform header;
#  - it lies outside the area folders;
#  - it includes a project header of an area its own area may not use, or one that names no
#    area ("apportion/network.h", "../flow/max_flow.h");
#  - it includes HiGHS outside the LP boundary (multiflow/lp_solver.cpp).
# Called by the build with -DCORE_DIR=...
cmake_minimum_required(VERSION 3.25)

# Each area and the areas it may include besides itself. Dependencies run one way: the
# model at the bottom, file formats and algorithms on it, result files on top.
set(allowed_model "")
set(allowed_formats model)
set(allowed_flow model)
set(allowed_layout model)
set(allowed_multiflow model flow)
set(allowed_results model formats flow multiflow)
set(areas model formats flow layout multiflow results)

set(forbidden "imgui|GLFW/|GL/|GLES[0-9]*/|emscripten|SDL|windows\\.h|unistd\\.h|sys/|pthread\\.h|dlfcn\\.h|X11/")
file(GLOB_RECURSE files RELATIVE "${CORE_DIR}" "${CORE_DIR}/*.h" "${CORE_DIR}/*.cpp")
string(REPLACE ";" " " area_names "${areas}")
set(bad "")
foreach(f IN LISTS files)
  string(REGEX MATCH "^([^/]+)/[^/]+$" in_area "${f}")
  set(area "${CMAKE_MATCH_1}")
  if(NOT in_area OR NOT area IN_LIST areas)
    string(APPEND bad "\n  core/${f}: lies outside the area folders (${area_names})")
    continue()
  endif()
  file(STRINGS "${CORE_DIR}/${f}" lines REGEX "^[ \t]*#[ \t]*include")
  foreach(line IN LISTS lines)
    if(line MATCHES "^[ \t]*#[ \t]*include[ \t]*[<\"](${forbidden})")
      string(APPEND bad "\n  core/${f}: ${line} (UI, browser or platform header)")
    elseif(line MATCHES "^[ \t]*#[ \t]*include[ \t]*[<\"](Highs|lp_data/|simplex/|ipm/|mip/|io/Highs)" AND
           NOT f STREQUAL "multiflow/lp_solver.cpp")
      string(APPEND bad "\n  core/${f}: ${line} (only multiflow/lp_solver.cpp includes HiGHS)")
    elseif(line MATCHES "^[ \t]*#[ \t]*include[ \t]*\"apportion/([^/\"]+)/[^/\"]+\"")
      set(target "${CMAKE_MATCH_1}")
      if(NOT target STREQUAL area AND NOT target IN_LIST allowed_${area})
        set(may ${area} ${allowed_${area}})
        string(REPLACE ";" " " may "${may}")
        string(APPEND bad "\n  core/${f}: ${line} (${area} may include only: ${may})")
      endif()
    elseif(line MATCHES "^[ \t]*#[ \t]*include[ \t]*\"")
      string(APPEND bad "\n  core/${f}: ${line} (project headers are included as \"apportion/AREA/NAME.h\")")
    endif()
  endforeach()
endforeach()
if(bad)
  message(FATAL_ERROR "core/ layout check failed:${bad}")
endif()
