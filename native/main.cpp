// firn: with a command, the command-line calculators; with none, the native app.
#include "cli/cli.hpp"
#include "glfw_runner.hpp"

int main(int argc, char** argv) {
  firn::cli::AppOptions app_options;
  int code = firn::cli::run(argc, argv, app_options);
  if (code >= 0) return code;
  return firn::native::run_app(app_options);
}
