// Catch2 main for the core test binary (native and WebAssembly under node).
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>
