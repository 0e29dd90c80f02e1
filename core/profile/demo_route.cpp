// The demo route, the demo team's usual carry-out (DEMO DATA: a fictional team in a fictional
// range): assets/demo-route.json, embedded at build time by core/profile/CMakeLists.txt (the web page has no filesystem).
#include "profile/route_file.hpp"

#include <cstddef>

namespace firn::assets {
extern const unsigned char demo_route_json[];
extern const std::size_t demo_route_json_size;
}  // namespace firn::assets

namespace firn::route {

std::string_view demo_route_json() {
  return {reinterpret_cast<const char*>(assets::demo_route_json), assets::demo_route_json_size};
}

}  // namespace firn::route
