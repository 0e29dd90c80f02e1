// `firn ams`: placeholder until the command lands (registers nothing yet).
#include "cli/cli.hpp"

namespace firn::cli {

void register_ams_commands(CommandTable&) {}

}  // namespace firn::cli
