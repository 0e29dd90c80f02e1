// `firn bag`: portable hyperbaric bag — inside pressure, pressure- and oxygen-equivalent altitude,
// gas balance, and the model's verdict (ok / flush more).
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
  std::optional<std::string> altitude, pressure, gauge, model, flush, o2_feed, bag_volume,
      stroke_volume, co2_limit, vco2, vo2, chamber_temperature;
  LatitudeMonthOptions where;
};

// Where the bag is: an altitude (ambient by the model) or a measured ambient pressure.
struct Place {
  std::optional<Length> altitude;
  std::optional<Pressure> pressure;
};

Result<hb::BagResult> bag_at(const Place& place, atm::Model model, const hb::Settings& s) {
  if (place.pressure) return hb::bag_at_pressure(*place.pressure, model, s);
  return hb::bag_at_altitude(*place.altitude, model, s);
}

Result<Place> place_option(const BagOptions& o, atm::Model model) {
  if (o.altitude && o.pressure) return Error{"give --altitude or --pressure, not both"};
  Place place;
  if (o.pressure) {
    Result<Pressure> p = required_pressure(o.pressure, "--pressure", "ambient pressure",
                                           hb::ambient_pressure_range(model));
    if (!p) return p.error();
    place.pressure = p.value();
    return place;
  }
  Result<Length> altitude = required_length(o.altitude, o.altitude ? "--altitude" : "--altitude or --pressure",
                                            "altitude", hb::altitude_range(model));
  if (!altitude) return altitude.error();
  place.altitude = altitude.value();
  return place;
}

// A plain-number option in [low, high] `unit`, stored through `set`.
template <class Set>
std::optional<Error> number_option(const std::optional<std::string>& text, const char* option,
                                   const char* what, double low, double high, const char* unit,
                                   Set set) {
  if (!text) return std::nullopt;
  Result<double> v = required_number(text, option, what, low, high, unit);
  if (!v) return v.error();
  set(v.value());
  return std::nullopt;
}

Result<hb::Settings> settings_option(const BagOptions& o) {
  hb::Settings s;
  Result<std::optional<atm::LatitudeMonth>> where = latitude_month_option(o.where);
  if (!where) return where.error();
  s.where = where.value();
  if (o.gauge) {
    Result<GaugePressure> g =
        required_gauge_pressure(o.gauge, "--gauge", "bag gauge pressure", hb::kGaugeRange);
    if (!g) return g.error();
    s.gauge = g.value();
  }
  if (o.chamber_temperature) {
    Result<Temperature> t = required_temperature(
        o.chamber_temperature, "--chamber-temperature", "chamber temperature",
        hb::kChamberTemperatureRange);
    if (!t) return t.error();
    s.chamber_temperature = t.value();
  }
  std::optional<Error> bad;
  auto lpm = [](auto& field) { return [&field](double v) { field = litres_per_minute(v); }; };
  auto l = [](auto& field) { return [&field](double v) { field = litres(v); }; };
  if (!bad) bad = number_option(o.flush, "--flush", "flush flow", hb::min_flush_lpm, hb::max_flush_lpm,
                                "L/min", [&](double v) { s.flush = litres_per_minute(v); });
  if (!bad) bad = number_option(o.o2_feed, "--o2-feed", "oxygen feed", 0, hb::max_oxygen_feed_lpm,
                                "L/min", lpm(s.oxygen_feed));
  if (!bad) bad = number_option(o.bag_volume, "--bag-volume", "bag volume", hb::min_bag_volume_l,
                                hb::max_bag_volume_l, "L", l(s.bag_volume));
  if (!bad) bad = number_option(o.stroke_volume, "--stroke-volume", "pump stroke volume",
                                hb::min_stroke_l, hb::max_stroke_l, "L",
                                [&](double v) { s.stroke_volume = litres(v); });
  if (!bad) bad = number_option(o.co2_limit, "--co2-limit", "CO2 limit", hb::min_co2_limit_pct,
                                hb::max_co2_limit_pct, "%", [&](double v) { s.co2_limit = percent(v); });
  if (!bad) bad = number_option(o.vco2, "--vco2", "VCO2", hb::min_vco2_lpm, hb::max_vco2_lpm,
                                "L/min", lpm(s.vco2_stpd));
  if (!bad) bad = number_option(o.vo2, "--vo2", "VO2", hb::min_vo2_lpm, hb::max_vo2_lpm, "L/min",
                                lpm(s.vo2_stpd));
  if (bad) return *bad;
  return s;
}

// An altitude that may be absent: JSON null and a word in the table. Rounded as the verdict
// rounds it (an altitude up, a descent down: less descent claimed).
void add_altitude(Report& report, const char* key, const std::optional<Length>& altitude,
                  const char* label, const char* absent, bool descent = false) {
  if (altitude) {
    report.add(key, descent ? hb::descent_rounded_down(*altitude, metres) : hb::altitude_rounded_up(*altitude, metres),
               0, label, "m");
  } else {
    report.json[key] = nullptr;
    report.rows.emplace_back(label, absent);
  }
}

void add_figures(Report& report, const hb::BagResult& r) {
  report.json["verdict"] = std::string(hb::verdict_key(r.verdict));
  report.add_text("verdict_text", hb::verdict_text(r, metres), "Verdict");
  if (r.verdict == hb::Verdict::FlushMore) report.add_text("reason", hb::flush_more_reason(r), "Why");
  report.add_text("limited_by", std::string(hb::limit_key(r.limited_by)), "Limited by");
  add_altitude(report, "equivalent_altitude_m", r.equivalent_altitude,
               "Equivalent altitude (limiting)", "none (outside the model)");
  add_altitude(report, "descent_equivalent_m", r.descent_equivalent, "Descent equivalent",
               "none: no better than outside", /*descent=*/true);
  add_altitude(report, "pressure_equivalent_altitude_m", r.pressure_equivalent_altitude,
               "Pressure-equivalent altitude", "below sea level (outside model range)");
  add_altitude(report, "oxygen_equivalent_altitude_m", r.oxygen_equivalent_altitude,
               "Oxygen-equivalent altitude",
               r.gas ? "outside the model range" : "needs --flush (gas inside unknown)");
  if (r.required_flush) {
    report.add("required_flush_lpm", r.required_flush->in(litres_per_minute), 1,
               "Flush for the verdict ok", "L/min");
  } else {
    report.json["required_flush_lpm"] = nullptr;
  }
  if (r.required_flush_strokes_per_minute) {
    report.add("required_strokes_per_min", *r.required_flush_strokes_per_minute, 1,
               "Pump strokes for the verdict ok", "/min");
  }
  report.json["fire_risk"] = r.fire_risk;
  if (r.fire_risk) report.add_text("fire_caution", hb::fire_caution_text(r), "Fire");
}

Result<Report> run_bag(const BagOptions& o) {
  Result<atm::Model> chosen_model = model_option(o.model);
  if (!chosen_model) return chosen_model.error();
  const atm::Model model = chosen_model.value();
  Result<Place> place = place_option(o, model);
  if (!place) return place.error();
  Result<hb::Settings> settings = settings_option(o);
  if (!settings) return settings.error();
  const hb::Settings& s = settings.value();
  Result<hb::BagResult> bag = bag_at(place.value(), model, s);
  if (!bag) return bag.error();
  const hb::BagResult& r = bag.value();

  Report report;
  if (s.where) {
    report.add("latitude_deg", s.where->latitude_deg, 2, "Latitude", "deg");
    report.add("month", s.where->month, 0, "Month", "");
    report.notes.emplace_back("Pressures and equivalent altitudes from " +
                              std::string(atm::latitude_month_model_name()) +
                              " for this latitude and month (Picone JM et al., J Geophys Res "
                              "2002;107:1468), both ways.");
  }
  report.add_text("model", std::string(atm::model_key(model)), "Model");
  report.add("altitude_m", r.ambient_altitude.in(metres), 1, "Altitude", "m");
  report.add("ambient_pressure_hpa", r.ambient_pressure.in(hectopascals), 1, "Ambient pressure",
             "hPa");
  report.add("gauge_hpa", s.gauge.in(hectopascals), 1, "Bag gauge pressure", "hPa");
  report.add("gauge_psi", s.gauge.in(psi), 2, "Bag gauge pressure", "psi");
  report.add("inside_pressure_hpa", r.inside_pressure.in(hectopascals), 1, "Pressure inside",
             "hPa");
  report.add("inside_pressure_mmhg", r.inside_pressure.in(mmhg), 1, "Pressure inside", "mmHg");
  add_figures(report, r);
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
  report.add("vco2_lpm", s.vco2_stpd.in(litres_per_minute), 2, "Casualty VCO2 (STPD)", "L/min");
  report.add("vo2_lpm", s.vo2_stpd.in(litres_per_minute), 2, "Casualty VO2 (STPD)", "L/min");
  report.add("chamber_temperature_c", s.chamber_temperature.in(celsius), 1, "Chamber temperature",
             "°C");
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
  CLI::App* bag = table.add("bag", "Portable hyperbaric bag: equivalent altitude, gas inside, verdict",
                            [o] { return run_bag(*o); });
  bag->add_option("--altitude", o->altitude, "Altitude of the bag, e.g. 4243m or 13920ft");
  bag->add_option("--pressure", o->pressure, "Measured ambient pressure instead, e.g. 616hPa");
  bag->add_option("--gauge", o->gauge, "Bag gauge pressure, e.g. 2psi (default) or 140hPa");
  bag->add_option("--model", o->model, "Atmosphere model: west (default) or isa");
  add_latitude_month_options(bag, o->where);
  bag->add_option("--flush", o->flush, "Fresh-air flush, L/min at bag pressure (5-300)");
  bag->add_option("--o2-feed", o->o2_feed, "Oxygen fed into the bag, L/min (0-15)");
  bag->add_option("--bag-volume", o->bag_volume, "Gas volume of the bag, L (default 480, assumed)");
  bag->add_option("--stroke-volume", o->stroke_volume, "Pump stroke volume, L of outside air");
  bag->add_option("--co2-limit", o->co2_limit, "CO2 limit for the minimum flush, % (default 1)");
  bag->add_option("--vco2", o->vco2, "Casualty's CO2 output, L/min STPD (rest " +
                                         format_number(hb::rest_vco2_lpm, 2) + ")");
  bag->add_option("--vo2", o->vo2, "Casualty's O2 uptake, L/min STPD (rest " +
                                       format_number(hb::rest_vo2_lpm, 2) + ")");
  bag->add_option("--chamber-temperature", o->chamber_temperature,
                  "Gas temperature inside the bag, e.g. 20C (default)");
}

}  // namespace firn::cli
