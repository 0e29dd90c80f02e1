// `firn bag`: portable hyperbaric bag — inside pressure, equivalent altitude, gas balance.
#include <memory>

#include "cli/cli.hpp"
#include "model/cautions.hpp"
#include "model/hyperbaric_bag.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace atm = firn::atmosphere;
namespace hb = firn::hyperbaric_bag;

struct BagOptions {
  std::optional<std::string> altitude, gauge, model, flush, o2_feed, bag_volume, stroke_volume,
      co2_limit;
  LatitudeMonthOptions where;
};

Result<Report> run_bag(const BagOptions& o) {
  Result<atm::Model> chosen_model = model_option(o.model);
  if (!chosen_model) return chosen_model.error();
  const atm::Model model = chosen_model.value();
  Result<Length> altitude = required_length(o.altitude, "--altitude", "altitude",
                                            range_of<Length>([&](Length a) {
                                              return hb::bag_at_altitude(a, model, hb::Settings{});
                                            }));
  if (!altitude) return altitude.error();
  hb::Settings s;
  if (o.gauge) {
    Result<Pressure> g = required_pressure(o.gauge, "--gauge", "bag gauge pressure",
                                           range_of<Pressure>([&](Pressure gauge) {
                                             hb::Settings probe;
                                             probe.gauge = gauge;
                                             return hb::bag_at_altitude(altitude.value(), model, probe);
                                           }));
    if (!g) return g.error();
    s.gauge = g.value();
  }
  if (o.flush) {
    Result<double> f = required_number(o.flush, "--flush", "flush flow", hb::min_flush_lpm,
                                       hb::max_flush_lpm, "L/min");
    if (!f) return f.error();
    s.flush = litres_per_minute(f.value());
  }
  if (o.o2_feed) {
    Result<double> f = required_number(o.o2_feed, "--o2-feed", "oxygen feed", 0,
                                       hb::max_oxygen_feed_lpm, "L/min");
    if (!f) return f.error();
    s.oxygen_feed = litres_per_minute(f.value());
  }
  if (o.bag_volume) {
    Result<double> v = required_number(o.bag_volume, "--bag-volume", "bag volume",
                                       hb::min_bag_volume_l, hb::max_bag_volume_l, "L");
    if (!v) return v.error();
    s.bag_volume = litres(v.value());
  }
  if (o.stroke_volume) {
    Result<double> v = required_number(o.stroke_volume, "--stroke-volume", "pump stroke volume",
                                       hb::min_stroke_l, hb::max_stroke_l, "L");
    if (!v) return v.error();
    s.stroke_volume = litres(v.value());
  }
  if (o.co2_limit) {
    Result<double> v = required_number(o.co2_limit, "--co2-limit", "CO2 limit",
                                       hb::min_co2_limit_pct, hb::max_co2_limit_pct, "%");
    if (!v) return v.error();
    s.co2_limit = percent(v.value());
  }
  Report report;
  // With --latitude/--month the ambient pressure is NRLMSISE-00's; altitudes stay on `model`'s scale.
  Result<Pressure> latitude_pb = ambient_pressure(altitude.value(), model, o.where, report);
  if (!latitude_pb) return latitude_pb.error();
  Result<hb::BagResult> bag = o.where.latitude ? hb::bag_at_pressure(latitude_pb.value(), model, s)
                                               : hb::bag_at_altitude(altitude.value(), model, s);
  if (!bag) return bag.error();
  const hb::BagResult& r = bag.value();
  if (o.where.latitude) report.notes.emplace_back("With --latitude/--month the altitudes are " + std::string(atm::model_name(model)) + " pressure altitudes of that pressure: in a cold atmosphere the real descent to the inside pressure is shorter (firn altitude --pressure <inside> --latitude --month).");

  report.add_text("model", std::string(atm::model_key(model)), "Model");
  report.add("altitude_m", r.ambient_altitude.in(metres), 1, "Altitude", "m");
  report.add("ambient_pressure_hpa", r.ambient_pressure.in(hectopascals), 1, "Ambient pressure",
             "hPa");
  report.add("gauge_hpa", s.gauge.in(hectopascals), 1, "Bag gauge pressure", "hPa");
  report.add("gauge_psi", s.gauge.in(psi), 2, "Bag gauge pressure", "psi");
  report.add("inside_pressure_hpa", r.inside_pressure.in(hectopascals), 1, "Pressure inside",
             "hPa");
  report.add("inside_pressure_mmhg", r.inside_pressure.in(mmhg), 1, "Pressure inside", "mmHg");
  if (r.equivalent_altitude) {
    report.add("equivalent_altitude_m", r.equivalent_altitude->in(metres), 0,
               "Equivalent altitude", "m");
    report.add("descent_equivalent_m", r.descent_equivalent->in(metres), 0,
               "Descent equivalent", "m");
  } else {
    report.json["equivalent_altitude_m"] = nullptr;
    report.json["descent_equivalent_m"] = nullptr;
    report.rows.emplace_back("Equivalent altitude", "below sea level (outside model range)");
  }
  report.add("pio2_ambient_mmhg", r.pio2_ambient.in(mmhg), 1, "PiO2 outside", "mmHg");
  report.add("pio2_mmhg", r.pio2_inside.in(mmhg), 1, "PiO2 inside", "mmHg");
  if (r.gas) {
    report.add("flush_lpm", s.flush->in(litres_per_minute), 1, "Flush (at bag pressure)", "L/min");
    report.add("flush_ambient_lpm", r.gas->flush_ambient_air.in(litres_per_minute), 1,
               "Flush (as outside air)", "L/min");
    report.add("co2_pct", r.gas->co2.in(percent), 2, "CO2 inside (steady state)", "%");
    report.add("o2_pct", r.gas->o2.in(percent), 2, "O2 inside (steady state)", "%");
    report.add("time_constant_min", r.gas->time_constant.in(minutes), 1,
               "Bag gas time constant", "min");
    if (r.gas->strokes_per_minute) {
      report.add("strokes_per_min", *r.gas->strokes_per_minute, 1, "Pump strokes", "/min");
    }
  }
  report.add("o2_feed_lpm", s.oxygen_feed.in(litres_per_minute), 1, "Oxygen feed", "L/min");
  report.add("bag_volume_l", s.bag_volume.in(litres), 0, "Bag volume (assumed)", "L");
  report.add("co2_limit_pct", s.co2_limit.in(percent), 2, "CO2 limit", "%");
  report.add("min_flush_lpm", r.min_flush.in(litres_per_minute), 1,
             "Minimum flush for the CO2 limit", "L/min");
  if (r.min_flush_strokes_per_minute) {
    report.add("min_strokes_per_min", *r.min_flush_strokes_per_minute, 1,
               "Minimum pump strokes", "/min");
  }
  report.json["notes"] = r.notes;
  report.json["caution"] = std::string(cautions::short_line);
  report.notes = r.notes;
  report.notes.emplace_back(cautions::short_line);
  return report;
}

}  // namespace

void register_bag_commands(CommandTable& table) {
  auto o = std::make_shared<BagOptions>();
  CLI::App* bag = table.add("bag", "Portable hyperbaric bag: equivalent altitude and gas inside",
                            [o] { return run_bag(*o); });
  bag->add_option("--altitude", o->altitude, "Altitude of the bag, e.g. 4243m or 13920ft");
  bag->add_option("--gauge", o->gauge, "Bag gauge pressure, e.g. 2psi (default) or 140mbar");
  bag->add_option("--model", o->model, "Atmosphere model: west (default) or isa");
  add_latitude_month_options(bag, o->where);
  bag->add_option("--flush", o->flush, "Fresh-air flush, L/min at bag pressure (5-300)");
  bag->add_option("--o2-feed", o->o2_feed, "Oxygen fed into the bag, L/min (0-15)");
  bag->add_option("--bag-volume", o->bag_volume, "Gas volume of the bag, L (default 480, assumed)");
  bag->add_option("--stroke-volume", o->stroke_volume, "Pump stroke volume, L of outside air");
  bag->add_option("--co2-limit", o->co2_limit, "CO2 limit for the minimum flush, % (default 1)");
}

}  // namespace firn::cli
