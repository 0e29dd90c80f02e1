// Catch2 entry point for the core unit tests (native and WebAssembly builds alike).
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>
