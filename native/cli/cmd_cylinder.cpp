// `firn cylinder`: placeholder until the command lands (registers nothing yet).
#include "cli/cli.hpp"

namespace firn::cli {

void register_cylinder_commands(CommandTable&) {}

}  // namespace firn::cli
