// `firn oxygenation and curve`: placeholder until the command lands (registers nothing yet).
#include "cli/cli.hpp"

namespace firn::cli {

void register_oxygenation_commands(CommandTable&) {}

}  // namespace firn::cli
