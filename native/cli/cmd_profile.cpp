// `firn plan, card and profile`: placeholder until the command lands (registers nothing yet).
#include "cli/cli.hpp"

namespace firn::cli {

void register_profile_commands(CommandTable&) {}

}  // namespace firn::cli
