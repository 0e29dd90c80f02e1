# Emscripten flags of Firn's page, in one place because two builds use them: the page
# (web/CMakeLists.txt) and the benchmark baseline, the bare ImGui example built "with the same
# flags" (tests/bench/bare). Firn's own exports are added in web/CMakeLists.txt; objects are
# compiled with -fno-exceptions (top-level CMakeLists.txt) and FIRN_WEB_SIZE_FLAG.
set(FIRN_WEB_LINK_FLAGS
  -sUSE_GLFW=3 -sUSE_WEBGL2=1 -sFULL_ES3=1 -sMIN_WEBGL_VERSION=2 -sMAX_WEBGL_VERSION=2
  -sALLOW_MEMORY_GROWTH=1 -sENVIRONMENT=web
  -sDYNAMIC_EXECUTION=0          # no eval / new Function: the page runs under a strict CSP
  -sDISABLE_EXCEPTION_CATCHING=1
  -sEXIT_RUNTIME=0
  -sTEXTDECODER=2
  -sMALLOC=emmalloc)             # smaller than dlmalloc (Firn −3.3 KB gzip; docs/BENCHMARKS.md)
# Firn's page only: it does no file I/O (storage is localStorage), so Emscripten's file system
# goes (firn.js 146 → 95 KB raw, 38 → 25 KB gzip). The bare example keeps it: it saves
# imgui.ini through stdio, and without a file system that write throws and stops its loop.
set(FIRN_WEB_PAGE_ONLY_LINK_FLAGS -sFILESYSTEM=0)
# Release and MinSizeRel builds optimise every library and the link for size, across files
# (-flto: the objects are LLVM bitcode, optimised together at the link; Firn's wasm −13.5 KB
# gzip, the link ~20 s longer), without RTTI (nothing uses typeid or dynamic_cast: −1.6 KB;
# docs/BENCHMARKS.md).
set(FIRN_WEB_SIZE_FLAG -Oz -flto -fno-rtti)
