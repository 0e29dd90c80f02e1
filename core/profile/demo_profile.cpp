// The demo team profile (DEMO DATA: a fictional team in a fictional range): assets/demo-profile.json,
// embedded at build time by core/profile/CMakeLists.txt (the web page has no filesystem).
#include "profile/team_profile.hpp"

#include <cstddef>

namespace firn::assets {
extern const unsigned char demo_profile_json[];
extern const std::size_t demo_profile_json_size;
}  // namespace firn::assets

namespace firn::team_profile {

std::string_view demo_profile_json() {
  return {reinterpret_cast<const char*>(assets::demo_profile_json), assets::demo_profile_json_size};
}

}  // namespace firn::team_profile
