// `firn cylinder`: oxygen cylinder contents (real gas) and duration, with the US field rule
// for letter sizes and flow-device corrections at altitude.
#include <memory>

#include "cli/cli.hpp"
#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "model/cylinder.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace atm = firn::atmosphere;
namespace cyl = firn::cylinder;

struct CylinderOptions {
  std::optional<std::string> size, water_capacity, pressure, flow, reserve, temperature, altitude,
      model;
};

Result<Report> run_cylinder(const CylinderOptions& o) {
  std::optional<cyl::LetterSize> size;
  if (o.size && o.water_capacity) return Error{"give --size or --water-capacity, not both"};
  if (!o.size && !o.water_capacity) {
    return Error{"--size (D, E, M or H) or --water-capacity (litres, " +
                 format_number(cyl::min_water_capacity_l) + " to " +
                 format_number(cyl::max_water_capacity_l) + " L) is required"};
  }
  Result<atm::Model> chosen_model = model_option(o.model);
  if (!chosen_model) return chosen_model.error();
  const atm::Model model = chosen_model.value();
  // Each option's range is probed on a full E cylinder at sea level with everything else valid.
  const cyl::Reading typical{cyl::letter_size_info(cyl::LetterSize::E).water_capacity, bar(137),
                             celsius(15), atmospheres(1)};
  const VolumeFlow typical_flow = litres_per_minute(2);
  // The contents of the typical cylinder with one field set to the probed value.
  auto contents_with = [&typical](auto set) {
    return [&typical, set](auto value) {
      cyl::Reading r = typical;
      set(r, value);
      return cyl::contents(r);
    };
  };
  Volume water;
  if (o.size) {
    Result<cyl::LetterSize> s = cyl::parse_letter_size(*o.size);
    if (!s) return Error{"--size: " + s.error().message};
    size = s.value();
    water = cyl::letter_size_info(*size).water_capacity;
  } else {
    Result<Volume> v = required_volume(o.water_capacity, "--water-capacity", "water capacity",
                                       range_of<Volume>(contents_with(
                                           [](cyl::Reading& r, Volume w) { r.water_capacity = w; })));
    if (!v) return v.error();
    water = v.value();
  }
  Result<Pressure> gauge = required_pressure(o.pressure, "--pressure", "cylinder gauge pressure",
                                             range_of<Pressure>(contents_with(
                                                 [](cyl::Reading& r, Pressure g) { r.gauge_pressure = g; })));
  if (!gauge) return gauge.error();
  Result<double> flow = required_number(o.flow, "--flow", "flow", cyl::min_flow_lpm,
                                        cyl::max_flow_lpm, "L/min");
  if (!flow) return flow.error();
  Pressure reserve = cyl::field_rule_residual_gauge;
  if (o.reserve) {
    Result<Pressure> r = required_pressure(o.reserve, "--reserve", "reserve pressure",
                                           range_of<Pressure>([&](Pressure res) {
                                             cyl::Reading at = typical;
                                             at.gauge_pressure = gauge.value();
                                             return cyl::duration(at, res, typical_flow);
                                           }));
    if (!r) return r.error();
    reserve = r.value();
  }
  Temperature temperature = celsius(15);
  if (o.temperature) {
    Result<Temperature> t = required_temperature(o.temperature, "--temperature",
                                                 "cylinder temperature",
                                                 range_of<Temperature>(contents_with(
                                                     [](cyl::Reading& r, Temperature c) { r.temperature = c; })));
    if (!t) return t.error();
    temperature = t.value();
  }
  Pressure ambient = atmospheres(1);
  std::optional<Length> altitude;
  if (o.altitude) {
    Result<Length> a = required_length(
        o.altitude, "--altitude", "altitude",
        range_of<Length>([&](Length at) { return atm::pressure_at(at, model); }));
    if (!a) return a.error();
    Result<Pressure> p = atm::pressure_at(a.value(), model);
    if (!p) return Error{"--altitude: " + p.error().message};
    altitude = a.value();
    ambient = p.value();
  }

  cyl::Reading reading{water, gauge.value(), temperature, ambient};
  VolumeFlow lpm = litres_per_minute(flow.value());
  Result<cyl::DurationEstimate> d = cyl::duration(reading, reserve, lpm);
  if (!d) return d.error();

  Report report;
  if (size) report.add_text("size", std::string(cyl::letter_size_info(*size).name), "Size");
  report.add("water_capacity_l", water.in(litres), 2,
             size ? "Water capacity (from memory)" : "Water capacity", "L");
  report.add("pressure_bar", gauge->in(bar), 1, "Gauge pressure", "bar");
  report.add("pressure_psi", gauge->in(psi), 0, "Gauge pressure", "psi");
  report.add("temperature_c", temperature.in(celsius), 1, "Cylinder temperature", "°C");
  report.add("ambient_pressure_hpa", ambient.in(hectopascals), 1, "Ambient pressure", "hPa");
  report.add("z", d->contents.z_in_cylinder, 4, "Compressibility Z", "");
  report.add("contents_l", d->contents.free_gas.in(litres), 0, "Contents (free gas)", "L");
  report.add("ideal_contents_l", d->contents.ideal_free_gas.in(litres), 0,
             "Contents, ideal-gas rule", "L");
  report.add("reserve_bar", reserve.in(bar), 1, "Reserve pressure", "bar");
  report.add("usable_l", d->usable_free_gas.in(litres), 0, "Usable above reserve", "L");
  report.add("flow_lpm", flow.value(), 1, "Flow", "L/min");
  report.add("duration_min", d->to_reserve.in(minutes), 0, "Duration to reserve", "min");
  if (size) {
    Result<Duration> rule = cyl::field_rule_duration(*size, gauge.value(), lpm);
    if (rule) {
      report.add("duration_field_rule_min", rule->in(minutes), 0,
                 "US field rule (psi-200)x" +
                     format_number(cyl::letter_size_info(*size).field_factor, 2) + "/flow",
                 "min");
    } else {
      report.json["duration_field_rule_min"] = nullptr;
      report.rows.emplace_back("US field rule", rule.error().message);
    }
    report.notes.push_back("The field rule is common practice in EMS references; letter-size "
                           "water capacities are from memory: check the cylinder label.");
  }
  if (altitude) {
    report.add("altitude_m", altitude->in(metres), 0, "Altitude", "m");
    Result<cyl::FlowCorrection> rota = cyl::rotameter_at_altitude(lpm, ambient);
    Result<cyl::FlowCorrection> orifice = cyl::fixed_orifice_at_altitude(lpm, ambient);
    if (rota && orifice) {
      report.add("rotameter_actual_lpm", rota->actual_at_ambient.in(litres_per_minute), 1,
                 "Rotameter: actual flow at ambient", "L/min");
      report.add("rotameter_free_gas_lpm", rota->actual_free_gas.in(litres_per_minute), 2,
                 "Rotameter: as free gas", "L/min");
      report.add("fixed_orifice_free_gas_lpm", orifice->actual_free_gas.in(litres_per_minute), 2,
                 "Fixed orifice: as free gas", "L/min");
      report.json["flow_notes"] = {rota->explanation, orifice->explanation};
      report.notes.push_back(rota->explanation);
      report.notes.push_back(orifice->explanation);
    }
  }
  report.json["caution"] = std::string(cautions::short_line);
  report.notes.emplace_back(cautions::short_line);
  return report;
}

}  // namespace

void register_cylinder_commands(CommandTable& table) {
  auto o = std::make_shared<CylinderOptions>();
  CLI::App* c = table.add("cylinder", "Oxygen cylinder contents and duration",
                          [o] { return run_cylinder(*o); });
  c->add_option("--size", o->size, "US letter size: D, E, M or H");
  c->add_option("--water-capacity", o->water_capacity, "Water capacity, litres (e.g. 10)");
  c->add_option("--pressure", o->pressure, "Gauge pressure, e.g. 200bar or 2000psi");
  c->add_option("--flow", o->flow, "Flow, L/min (0.1-30)");
  c->add_option("--reserve", o->reserve, "Reserve gauge pressure (default 200psi)");
  c->add_option("--temperature", o->temperature, "Cylinder temperature (default 15C)");
  c->add_option("--altitude", o->altitude, "Altitude (gauge reference, flowmeter corrections)");
  c->add_option("--model", o->model, "Atmosphere model for --altitude: west (default) or isa");
}

}  // namespace firn::cli
