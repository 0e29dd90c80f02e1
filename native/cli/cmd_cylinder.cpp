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
      ambient_pressure, model;
};

// An option read by a core parser; a missing or unreadable value names the model's range.
template <class Dimension, class Parse>
Result<units::Quantity<Dimension>> option_value(const std::optional<std::string>& text,
                                                const std::string& option, const std::string& what,
                                                const std::string& examples, Parse parse,
                                                const units::Range<Dimension>& range) {
  if (!text) return with_range(Error{option + " is required: " + what + ", e.g. " + examples}, range);
  Result<units::Quantity<Dimension>> parsed = parse(*text, what);
  if (!parsed) return with_range(Error{option + ": " + parsed.error().message}, range);
  return parsed;
}

// Where the gauges' reference pressure comes from: sea level, an altitude, or a measurement.
struct Ambient {
  Pressure pressure = atmospheres(1);
  std::optional<Length> altitude;
  std::string source = "sea_level";
};

Result<Ambient> ambient_option(const CylinderOptions& o, atm::Model model) {
  Ambient a;
  if (o.altitude && o.ambient_pressure) {
    return Error{"give --altitude or --ambient-pressure (a measured air pressure), not both"};
  }
  if (o.ambient_pressure) {
    Result<Pressure> p = measured_ambient_pressure(o.ambient_pressure);
    if (!p) return p.error();
    a.pressure = p.value();
    a.source = "measured";
  } else if (o.altitude) {
    Result<Length> h =
        required_length(o.altitude, "--altitude", "altitude", atm::altitude_range(model));
    if (!h) return h.error();
    Result<Pressure> p = atm::pressure_at(h.value(), model);
    if (!p) return Error{"--altitude: " + p.error().message};
    a.altitude = h.value();
    a.pressure = p.value();
    a.source = "altitude";
  }
  return a;
}

void add_flow_corrections(Report& report, VolumeFlow lpm, Pressure ambient) {
  Result<cyl::FlowCorrection> rota = cyl::rotameter_at_altitude(lpm, ambient);
  Result<cyl::FlowCorrection> orifice = cyl::fixed_orifice_at_altitude(lpm, ambient);
  if (!rota || !orifice) return;
  report.add("rotameter_actual_lpm", rota->actual_at_ambient.in(litres_per_minute), 1,
             "Rotameter: actual flow at ambient", "L/min");
  report.add("rotameter_free_gas_lpm", rota->actual_free_gas.in(litres_per_minute), 2,
             "Rotameter: as free gas", "L/min");
  report.add("fixed_orifice_free_gas_lpm", orifice->actual_free_gas.in(litres_per_minute), 2,
             "Fixed orifice: as free gas", "L/min");
  report.json["flow_notes"] = std::vector<std::string>{rota->explanation, orifice->explanation};
  report.notes.push_back(rota->explanation);
  report.notes.push_back(orifice->explanation);
}

// What the options say, each value read and checked against the model's range.
struct CylinderInput {
  std::optional<cyl::LetterSize> size;
  Volume water;
  bool capacity_assumed = false;  // from --size alone
  GaugePressure gauge, reserve = cyl::default_reserve_gauge;
  VolumeFlow flow;
  Temperature temperature = cyl::assumed_temperature;
  Ambient ambient;
};

Result<CylinderInput> cylinder_input(const CylinderOptions& o) {
  if (!o.size && !o.water_capacity) {
    return Error{"--size (D, E, M or H) or --water-capacity (litres, " +
                 format_number(cyl::min_water_capacity_l) + " to " +
                 format_number(cyl::max_water_capacity_l) + " L) is required"};
  }
  Result<atm::Model> model = model_option(o.model);
  if (!model) return model.error();
  CylinderInput in;
  if (o.size) {
    Result<cyl::LetterSize> s = cyl::parse_letter_size(*o.size);
    if (!s) return Error{"--size: " + s.error().message};
    in.size = s.value();
    in.water = cyl::letter_size_info(*in.size).water_capacity;
  }
  // With --size too, the team's own water capacity wins (D and E vary by maker); the size then
  // only chooses the field rule.
  if (o.water_capacity) {
    Result<Volume> v = required_volume(o.water_capacity, "--water-capacity", "water capacity",
                                       cyl::kWaterCapacityRange);
    if (!v) return v.error();
    in.water = v.value();
  }
  in.capacity_assumed = in.size && !o.water_capacity;
  Result<GaugePressure> gauge = option_value(o.pressure, "--pressure", "cylinder gauge pressure",
                                             "200bar or 2900psi", units::parse_gauge_pressure,
                                             cyl::kGaugeRange);
  if (!gauge) return gauge.error();
  in.gauge = gauge.value();
  Result<VolumeFlow> flow = option_value(o.flow, "--flow", "flow", "2 or 2L/min",
                                         units::parse_volume_flow, cyl::kFlowRange);
  if (!flow) return flow.error();
  if (auto checked = units::check(flow.value(), cyl::kFlowRange); !checked) {
    return Error{"--flow: " + checked.error().message};
  }
  in.flow = flow.value();
  if (o.reserve) {
    Result<GaugePressure> r = option_value(o.reserve, "--reserve", "reserve pressure (gauge)",
                                           "20bar or 290psi", units::parse_gauge_pressure,
                                           cyl::kReserveRange);
    if (!r) return r.error();
    in.reserve = r.value();
  }
  if (o.temperature) {
    Result<Temperature> t = required_temperature(o.temperature, "--temperature",
                                                 "cylinder temperature", cyl::kTemperatureRange);
    if (!t) return t.error();
    in.temperature = t.value();
  }
  Result<Ambient> ambient = ambient_option(o, model.value());
  if (!ambient) return ambient.error();
  in.ambient = ambient.value();
  return in;
}

// The cylinder, its contents and the duration to reserve by the real-gas model.
void add_contents_rows(Report& report, const CylinderInput& in, const cyl::DurationEstimate& d) {
  if (in.size) report.add_text("size", std::string(cyl::letter_size_info(*in.size).name), "Size");
  report.add("water_capacity_l", in.water.in(litres), 2,
             in.capacity_assumed ? "Water capacity (assumed for the size)" : "Water capacity", "L");
  report.json["water_capacity_assumed"] = in.capacity_assumed;
  report.add("pressure_bar", in.gauge.in(bar), 1, "Gauge pressure", "bar");
  report.add("pressure_psi", in.gauge.in(psi), 0, "Gauge pressure", "psi (gauge)");
  report.add("temperature_c", in.temperature.in(celsius), 1, "Cylinder temperature", "°C");
  report.add("ambient_pressure_hpa", in.ambient.pressure.in(hectopascals), 1, "Ambient pressure", "hPa");
  report.json["ambient_pressure_source"] = in.ambient.source;
  report.add("z", d.contents.z_in_cylinder, 4, "Compressibility Z", "");
  report.add("contents_l", d.contents.free_gas.in(litres), 0, "Contents (free gas)", "L");
  report.add("ideal_contents_l", d.contents.ideal_free_gas.in(litres), 0,
             "Contents, ideal-gas rule", "L");
  report.add("cold_gain_pct", d.contents.cold_gain * 100.0, 1, "Extra gas the cold temperature claims", "%");
  report.json["extrapolated"] = d.contents.extrapolated;
  report.add("reserve_bar", in.reserve.in(bar), 1, "Reserve pressure (gauge)", "bar");
  report.add("reserve_psi", in.reserve.in(psi), 0, "Reserve pressure", "psi (gauge)");
  report.add("usable_l", d.usable_free_gas.in(litres), 0, "Usable above reserve", "L");
  report.add("flow_lpm", in.flow.in(litres_per_minute), 1, "Flow", "L/min");
  report.json["below_reserve"] = d.below_reserve;
  if (d.below_reserve) report.rows.emplace_back("Verdict", std::string(cyl::below_reserve_text));
  // Whole minutes, rounded down: the oxygen never lasts less than the figure says.
  report.add("duration_min", cyl::whole_minutes_down(d.to_reserve).in(minutes), 0,
             "Duration to reserve (real gas)", "min");
}

// The US field rule beside the real-gas figure, and the one to count on (the shorter).
void add_field_rule_rows(Report& report, const CylinderInput& in, const cyl::DurationEstimate& d) {
  std::optional<Duration> rule;
  if (in.size) {
    Result<Duration> rule_result = cyl::field_rule_duration(*in.size, in.gauge, in.flow);
    if (rule_result) {
      rule = rule_result.value();
      report.add("duration_field_rule_min", cyl::whole_minutes_down(*rule).in(minutes), 0,
                 "US field rule (psi-200)x" +
                     format_number(cyl::letter_size_info(*in.size).field_factor, 2) + "/flow",
                 "min");
    } else {
      report.json["duration_field_rule_min"] = nullptr;
      report.rows.emplace_back("US field rule", rule_result.error().message);
    }
    report.notes.push_back("The field rule is common practice in EMS references.");
  }
  cyl::LeadingDuration lead = cyl::leading_duration(d, rule);
  report.add("duration_lead_min", lead.duration.in(minutes), 0, "Count on", "min");
  report.json["duration_lead_basis"] =
      lead.basis == cyl::DurationBasis::FieldRule ? "field_rule" : "real_gas";
  report.notes.push_back("Count on " + format_number(lead.duration.in(minutes), 0) + " min: " + lead.why + ".");
}

// The assumption, the temperature cautions and the flowmeter corrections at altitude.
void add_cylinder_notes(Report& report, const CylinderInput& in, const cyl::DurationEstimate& d) {
  if (in.capacity_assumed) {
    std::string assumption = cyl::letter_size_assumption(*in.size);
    report.json["water_capacity_assumption"] = assumption;
    assumption[0] = 'S';
    report.notes.push_back(assumption + " (--water-capacity).");
  }
  std::vector<std::string> cautions = cyl::temperature_cautions(d.contents, in.temperature);
  report.json["temperature_cautions"] = cautions;
  for (const std::string& c : cautions) report.notes.push_back(c);
  if (cautions.empty() || d.contents.cold_gain <= cyl::cold_gain_caution_fraction) {
    report.notes.emplace_back(cyl::temperature_advice);
  }
  report.notes.emplace_back("Pressures are gauge readings (bar, psi gauge, kPa or MPa).");
  if (in.ambient.altitude) report.add("altitude_m", in.ambient.altitude->in(metres), 0, "Altitude", "m");
  if (in.ambient.source != "sea_level") add_flow_corrections(report, in.flow, in.ambient.pressure);
}

Result<Report> run_cylinder(const CylinderOptions& o) {
  Result<CylinderInput> in = cylinder_input(o);
  if (!in) return in.error();
  cyl::Reading reading{in->water, in->gauge, in->temperature, in->ambient.pressure};
  Result<cyl::DurationEstimate> d = cyl::duration(reading, in->reserve, in->flow);
  if (!d) return d.error();
  Report report;
  add_contents_rows(report, in.value(), d.value());
  add_field_rule_rows(report, in.value(), d.value());
  add_cylinder_notes(report, in.value(), d.value());
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
  c->add_option("--water-capacity", o->water_capacity,
                 "Water capacity, litres (e.g. 10); with --size, your cylinder's own");
  c->add_option("--pressure", o->pressure,
                 "Gauge pressure: bar, psi (gauge), kPa or MPa, e.g. 200bar or 2000psi");
  c->add_option("--flow", o->flow, "Flow, L/min (0.1-30), e.g. 2 or 2L/min");
  c->add_option("--reserve", o->reserve,
                "Reserve gauge pressure (default " +
                    format_number(cyl::default_reserve_gauge.in(bar)) + "bar)");
  c->add_option("--temperature", o->temperature,
                "Cylinder temperature (default 15C); when unsure, the warmer one");
  c->add_option("--altitude", o->altitude, "Altitude (gauge reference, flowmeter corrections)");
  c->add_option("--ambient-pressure", o->ambient_pressure,
                "Measured air pressure instead of --altitude, e.g. 560hPa");
  c->add_option("--model", o->model, "Atmosphere model for --altitude: west (default) or isa");
}

}  // namespace firn::cli
