#include "cli/cli.hpp"

#include <cmath>
#include <cstdio>
#include <exception>
#include <string>
#include <iostream>

#include "model/cylinder.hpp"

namespace firn::cli {

double rounded(double value, int decimals) {
  FIRN_ASSERT(std::isfinite(value), "a non-finite number reached CLI output");
  double scale = std::pow(10.0, decimals);
  double r = std::round(value * scale) / scale;
  return r == 0.0 ? 0.0 : r;  // no "-0"
}

void Report::add(const std::string& key, double value, int decimals, const std::string& label,
                 const std::string& unit) {
  double r = rounded(value, decimals);
  // Whole-number figures (scores, minutes, metres at 0 decimals) print as integers: "4", not "4.0".
  if (decimals <= 0 && std::fabs(r) < 9e15) {
    json[key] = static_cast<long long>(r);
  } else {
    json[key] = r;
  }
  rows.emplace_back(label, format_number(r, decimals) + (unit.empty() ? "" : " " + unit));
}

void Report::add_text(const std::string& key, const std::string& value, const std::string& label) {
  json[key] = value;
  rows.emplace_back(label, value);
}

CLI::App* CommandTable::add(const std::string& name, const std::string& description,
                            CommandAction action) {
  CLI::App* sub = root.add_subcommand(name, description);
  commands.emplace_back(sub, std::move(action));
  return sub;
}

Error with_range(Error error, const units::NumberRange& range) {
  return Error{error.message + "; " + units::range_error(range.what, range).message};
}

namespace {

Error missing(const std::string& option, const std::string& what) {
  return Error{option + " is required: " + what};
}

}  // namespace

namespace {

template <class Dimension>
Error with_optional_range(Error error, const OptionalRange<Dimension>& range) {
  return range ? with_range(std::move(error), *range) : error;
}

template <class Dimension, class Parse>
Result<units::Quantity<Dimension>> required_quantity(const std::optional<std::string>& text,
                                                     const std::string& option,
                                                     const std::string& what,
                                                     const std::string& examples, Parse parse,
                                                     const OptionalRange<Dimension>& range) {
  if (!text) return with_optional_range(missing(option, what + ", e.g. " + examples), range);
  Result<units::Quantity<Dimension>> parsed = parse(*text, what);
  if (!parsed) return with_optional_range(Error{option + ": " + parsed.error().message}, range);
  return parsed;
}

}  // namespace

Result<units::Length> required_length(const std::optional<std::string>& text,
                                      const std::string& option, const std::string& what,
                                      const OptionalRange<units::LengthDimension>& range) {
  return required_quantity(text, option, what, "4000m or 13120ft", units::parse_length, range);
}

Result<units::Pressure> required_pressure(const std::optional<std::string>& text,
                                          const std::string& option, const std::string& what,
                                          const OptionalRange<units::PressureDimension>& range) {
  return required_quantity(text, option, what, "616hPa, 462mmHg or 2psi", units::parse_pressure,
                           range);
}

Result<units::GaugePressure> required_gauge_pressure(
    const std::optional<std::string>& text, const std::string& option, const std::string& what,
    const OptionalRange<units::GaugePressureDimension>& range) {
  return required_quantity(text, option, what, "616hPa, 462mmHg or 2psi",
                           units::parse_gauge_any_unit, range);
}

Result<units::Pressure> measured_ambient_pressure(const std::optional<std::string>& text) {
  Result<units::Pressure> p = required_pressure(text, "--ambient-pressure", "measured air pressure",
                                                cylinder::kAmbientRange);
  if (!p) return p.error();
  if (auto checked = units::check(p.value(), cylinder::kAmbientRange); !checked) {
    return Error{"--ambient-pressure: " + checked.error().message};
  }
  return p;
}

Result<units::Temperature> required_temperature(const std::optional<std::string>& text,
                                                const std::string& option, const std::string& what,
                                                const OptionalRange<units::TemperatureDimension>& range) {
  return required_quantity(text, option, what, "-5C or 23F", units::parse_temperature, range);
}

Result<units::Volume> required_volume(const std::optional<std::string>& text,
                                      const std::string& option, const std::string& what,
                                      const OptionalRange<units::VolumeDimension>& range) {
  return required_quantity(text, option, what, "4.6 or 4.6L", units::parse_volume, range);
}

Result<atmosphere::Model> model_option(const std::optional<std::string>& text) {
  if (!text) return atmosphere::default_medical_model;
  Result<atmosphere::Model> model = atmosphere::parse_model(*text);
  if (!model) return Error{"--model: " + model.error().message};
  return model;
}

void add_latitude_month_options(CLI::App* command, LatitudeMonthOptions& options) {
  command->add_option("--latitude", options.latitude,
                      "Latitude in degrees, north + / south - (with --month): NRLMSISE-00 pressure");
  command->add_option("--month", options.month, "Month 1-12 (with --latitude)");
}

Result<std::optional<atmosphere::LatitudeMonth>> latitude_month_option(
    const LatitudeMonthOptions& options) {
  using Where = std::optional<atmosphere::LatitudeMonth>;
  if (!options.latitude && !options.month) return Where{};
  if (!options.latitude) return Error{"--month needs --latitude (degrees, north + / south -)"};
  if (!options.month) return Error{"--latitude needs --month (1 = January ... 12 = December)"};
  Result<double> latitude = required_number(options.latitude, "--latitude", "latitude",
                                            atmosphere::kLatitudeLowDeg, atmosphere::kLatitudeHighDeg,
                                            "degrees (north +, south -)");
  if (!latitude) return latitude.error();
  Result<double> month = required_number(options.month, "--month", "month", atmosphere::kFirstMonth,
                                         atmosphere::kLastMonth, "(1 = January)");
  if (!month) return month.error();
  Result<atmosphere::LatitudeMonth> where =
      atmosphere::make_latitude_month(latitude.value(), month.value());
  if (!where) return Error{"--month: " + where.error().message};
  return Where{where.value()};
}

Result<units::Pressure> ambient_pressure(units::Length altitude, atmosphere::Model model,
                                         const LatitudeMonthOptions& options, Report& report) {
  Result<std::optional<atmosphere::LatitudeMonth>> where = latitude_month_option(options);
  if (!where) return where.error();
  Result<units::Pressure> pb = atmosphere::pressure_at(altitude, model, where.value());
  if (!pb) return Error{"--altitude: " + pb.error().message};
  if (where.value()) {
    const atmosphere::LatitudeMonth& w = *where.value();
    std::string name(atmosphere::latitude_month_model_name());
    report.add("latitude_deg", w.latitude_deg, 2, "Latitude", "deg");
    report.add("month", w.month, 0, "Month", "");
    report.add_text("pressure_source", "latitude-month (" + name + ")", "Pressure from");
    report.notes.emplace_back("Pressure from " + name +
                              " for this latitude and month (Picone JM et al., J Geophys Res "
                              "2002;107:1468), not " + std::string(atmosphere::model_name(model)) +
                              "; a barometer reading here is better still.");
  }
  return pb;
}

Result<double> required_number(const std::optional<std::string>& text, const std::string& option,
                               const std::string& what, double low, double high,
                               const std::string& unit) {
  if (!text) {
    return missing(option, what + " between " + format_number(low) + " and " +
                               format_number(high) + (unit.empty() ? "" : " " + unit));
  }
  Result<double> number = units::parse_number(*text, what);
  if (!number) {
    return Error{option + ": " + number.error().message + "; " +
                 range_error(what, low, high, unit).message};
  }
  if (!in_range(number.value(), low, high)) {
    return Error{option + ": " + range_error(what, low, high, unit, number.value()).message};
  }
  return number;
}

namespace {

// JSON for stdout. Strings may echo what the user typed (an option name, a file path) and so may
// not be UTF-8: such bytes print as U+FFFD instead of throwing (fuzz_cli finding, see
// docs/hardening.md).
std::string json_text(const Json& json) { return json.dump(); }

void print_table(const Report& report) {
  size_t width = 0;
  for (const auto& row : report.rows) width = std::max(width, row.first.size());
  for (const auto& [label, value] : report.rows) {
    std::printf("%-*s  %s\n", static_cast<int>(width), label.c_str(), value.c_str());
  }
  for (const std::string& note : report.notes) std::printf("* %s\n", note.c_str());
}

int fail(bool json, const std::string& message) {
  std::fprintf(stderr, "firn: %s\n", message.c_str());
  if (json) std::printf("%s\n", json_text(Json{{"error", message}}).c_str());
  return 2;
}

// CLI::Range lets NaN through (every comparison with it is false): the app's own options are
// checked here, finite and in range, with the unit named like every other message.
CLI::Validator finite_between(double low, double high, const std::string& unit) {
  return CLI::Validator(
      [=](std::string& text) -> std::string {
        double value = 0.0;
        try {
          std::size_t used = 0;
          value = std::stod(text, &used);
          if (used != text.size()) value = std::nan("");
        } catch (const std::exception&) {
          value = std::nan("");
        }
        if (in_range(value, low, high)) return {};
        return range_error("value", low, high, unit).message;
      },
      "", "finite_between");
}
}  // namespace

int run(int argc, char** argv, AppOptions& app_options) {
  CLI::App root{"Firn: altitude and oxygen field calculator for mountain rescue. "
                "Decision support only; clinical signs first; descent is the definitive "
                "treatment.", "firn"};
  root.set_version_flag("--version", std::string("firn ") + FIRN_VERSION);
  root.add_option("--screenshot", app_options.screenshot_path,
                  "App: render a few frames, write this PNG and exit");
  root.add_option("--screen", app_options.screen, "App: screen to open");
  root.add_option("--theme", app_options.theme, "App: day, night or projector");
  root.add_option("--width", app_options.width, "App: window width (logical pixels)")
      ->check(finite_between(200, 16384, "px"));
  root.add_option("--height", app_options.height, "App: window height (logical pixels)")
      ->check(finite_between(200, 16384, "px"));
  root.add_option("--frames", app_options.frames, "App: frames to draw before --screenshot")
      ->check(finite_between(1, 1000, "frames"));
  root.add_option("--pixel-ratio", app_options.pixel_ratio, "App: override the display scale")
      ->check(finite_between(0.5, 8, ""));
  root.add_option("--idle-report", app_options.idle_seconds,
                  "App: wait this many seconds without input, print frames drawn, exit")
      ->check(finite_between(0.1, 600, "s"));
  root.add_option("--test-items", app_options.test_items_path,
                  "App: write the labelled item rectangles of the last frame to this file");

  bool json = false;
  CommandTable table{root, {}};
  register_atmosphere_commands(table);
  register_oxygenation_commands(table);
  register_ams_commands(table);
  register_bag_commands(table);
  register_cylinder_commands(table);
  register_profile_commands(table);
  register_route_commands(table);
  register_handover_commands(table);
  for (auto& [sub, action] : table.commands) {
    sub->add_flag("--json", json, "Print JSON instead of a table");
  }

  // An error is JSON whenever --json is on the line, even where the parser took it as the value
  // of an option missing its own ("plan --profile --json"; fuzz_cli finding).
  bool json_on_line = false;
  for (int i = 1; i < argc; ++i) json_on_line = json_on_line || std::string(argv[i]) == "--json";

  try {
    root.parse(argc, argv);
  } catch (const CLI::CallForHelp& e) {
    return root.exit(e);
  } catch (const CLI::CallForAllHelp& e) {
    return root.exit(e);
  } catch (const CLI::CallForVersion& e) {
    return root.exit(e);
  } catch (const CLI::ParseError& e) {
    return fail(json || json_on_line, e.what());
  }

  for (auto& [sub, action] : table.commands) {
    if (!sub->parsed()) continue;
    Result<Report> report = action();
    if (!report) return fail(json || json_on_line, report.error().message);
    if (json) {
      std::printf("%s\n", json_text(report->json).c_str());
    } else {
      print_table(report.value());
    }
    return 0;
  }
  return -1;
}

}  // namespace firn::cli
