// The command-line calculators: `firn <command> [options] [--json]`. Each command lives in its
// own cmd_*.cpp and registers itself in register_commands(). The contract (command names, option
// names and JSON keys) is stable: tests outside the project rely on it (see docs/cli.md).
#pragma once

#include <CLI/CLI.hpp>

#include <functional>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "model/atmosphere.hpp"
#include "model/json.hpp"
#include "model/latitude_month.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::cli {

using Json = json::Value;  // the page's own reader and writer (core/model/json.hpp)

// What a command computed: JSON for --json, and rows + notes for the human table.
struct Report {
  Json json = Json::object();
  std::vector<std::pair<std::string, std::string>> rows;  // label, value with unit
  std::vector<std::string> notes;                          // cautions, explanations

  void add(const std::string& key, double value, int decimals, const std::string& label,
           const std::string& unit);
  void add_text(const std::string& key, const std::string& value, const std::string& label);
};

using CommandAction = std::function<Result<Report>()>;

// Registers a subcommand; `action` runs when it is chosen and its options parsed.
struct CommandTable {
  CLI::App& root;
  std::vector<std::pair<CLI::App*, CommandAction>> commands;
  CLI::App* add(const std::string& name, const std::string& description, CommandAction action);
};

// One function per command file (cmd_<name>.cpp).
void register_atmosphere_commands(CommandTable& table);    // pressure, altitude
void register_oxygenation_commands(CommandTable& table);   // oxygenation, curve
void register_ams_commands(CommandTable& table);           // ams
void register_bag_commands(CommandTable& table);           // bag
void register_cylinder_commands(CommandTable& table);      // cylinder
void register_profile_commands(CommandTable& table);       // plan, card, profile
void register_route_commands(CommandTable& table);         // route
void register_handover_commands(CommandTable& table);      // handover

// A missing or unreadable option is told the valid range the model publishes:
// `error` + "; " + "altitude must be between 0 and 9000 m for the West 1996 model".
template <class Dimension>
Error with_range(Error error, const units::Range<Dimension>& range) {
  return Error{error.message + "; " + units::range_error(range.what, range).message};
}
Error with_range(Error error, const units::NumberRange& range);

template <class Dimension>
using OptionalRange = std::optional<units::Range<Dimension>>;

// Options that hold "number + unit" text are parsed by the core, so messages name the unit, and
// with a range the valid range.
Result<units::Length> required_length(const std::optional<std::string>& text,
                                      const std::string& option, const std::string& what,
                                      const OptionalRange<units::LengthDimension>& range = {});
Result<units::Pressure> required_pressure(const std::optional<std::string>& text,
                                          const std::string& option, const std::string& what,
                                          const OptionalRange<units::PressureDimension>& range = {});
// A bag's gauge pressure (above ambient) in any pressure unit, as --pressure is read.
Result<units::GaugePressure> required_gauge_pressure(
    const std::optional<std::string>& text, const std::string& option, const std::string& what,
    const OptionalRange<units::GaugePressureDimension>& range = {});
Result<units::Temperature> required_temperature(const std::optional<std::string>& text,
                                                const std::string& option, const std::string& what,
                                                const OptionalRange<units::TemperatureDimension>& range = {});
Result<units::Volume> required_volume(const std::optional<std::string>& text,
                                      const std::string& option, const std::string& what,
                                      const OptionalRange<units::VolumeDimension>& range = {});
// --ambient-pressure: the air pressure measured where cylinder gauges are read (what the
// cylinder model takes as the gauges' reference).
Result<units::Pressure> measured_ambient_pressure(const std::optional<std::string>& text);
// A plain number in [low, high]; every message names that range and the unit.
Result<double> required_number(const std::optional<std::string>& text, const std::string& option,
                               const std::string& what, double low, double high,
                               const std::string& unit);

// --model: West 1996 (the medical default) when not given.
Result<atmosphere::Model> model_option(const std::optional<std::string>& text);

// --latitude DEG --month 1…12 (pressure, oxygenation, bag): the pressure at an altitude from the
// NRLMSISE-00 latitude/month figures instead of the model's. Both or neither. A command holds a
// LatitudeMonthOptions, registers it with one call and gets its pressure with another.
struct LatitudeMonthOptions {
  std::optional<std::string> latitude, month;
};
void add_latitude_month_options(CLI::App* command, LatitudeMonthOptions& options);
Result<std::optional<atmosphere::LatitudeMonth>> latitude_month_option(
    const LatitudeMonthOptions& options);
// PB at `altitude`: by latitude/month when given (then adds latitude_deg, month and
// pressure_source to `report`, with a note), else by `model`.
Result<units::Pressure> ambient_pressure(units::Length altitude, atmosphere::Model model,
                                         const LatitudeMonthOptions& options, Report& report);

// Rounds for output: JSON carries the same figures the table shows, never NaN.
double rounded(double value, int decimals);

// Returns the process exit code: 0 done, 2 bad input or usage; -1 means "no command: open the
// app" and fills `gui_arguments` with the app options.
struct AppOptions {
  std::string screenshot_path;
  std::string screen;
  std::string theme;
  std::string test_items_path;
  int width = 1280;
  int height = 800;
  int frames = 6;
  double idle_seconds = 0.0;  // > 0: run this long without input and report frames drawn
  float pixel_ratio = 0.0f;   // 0: ask the monitor
};
int run(int argc, char** argv, AppOptions& app_options);

}  // namespace firn::cli
