#include "model/hyperbaric_bag.hpp"

#include <algorithm>
#include <cmath>
#include <string>
#include <utility>

namespace firn::hyperbaric_bag {
namespace {

using namespace units;

constexpr double kR = 8.314462618;               // J/(mol·K), CODATA 2018
constexpr double kStpdPressurePa = 101325.0;     // STPD: 0 °C, 101.325 kPa, dry
constexpr double kStpdTemperatureK = 273.15;
constexpr double kFreeGasTemperatureK = 288.15;  // oxygen feed: free gas at 1 atm, 15 °C
constexpr double kWaterVapourMmhg = 47.0;        // at 37 °C

double moles_per_min(VolumeFlow flow, double pressure_pa, double temperature_k) {
  return flow.in(litres_per_minute) / 1000.0 * pressure_pa / (kR * temperature_k);
}

Result<double> check(const Settings& s) {
  if (auto g = units::check("bag gauge pressure", s.gauge, kGaugeRange); !g) return g.error();
  if (s.flush) {
    double f = s.flush->in(litres_per_minute);
    if (!in_range(f, min_flush_lpm, max_flush_lpm)) {
      return range_error("flush flow", min_flush_lpm, max_flush_lpm, "L/min", f);
    }
  }
  double o2 = s.oxygen_feed.in(litres_per_minute);
  if (!in_range(o2, 0.0, max_oxygen_feed_lpm)) {
    return range_error("oxygen feed", 0, max_oxygen_feed_lpm, "L/min", o2);
  }
  double v = s.bag_volume.in(litres);
  if (!in_range(v, min_bag_volume_l, max_bag_volume_l)) {
    return range_error("bag volume", min_bag_volume_l, max_bag_volume_l, "L", v);
  }
  if (auto t = units::check(s.chamber_temperature, kChamberTemperatureRange); !t) return t.error();
  double limit = s.co2_limit.in(percent);
  if (!in_range(limit, min_co2_limit_pct, max_co2_limit_pct)) {
    return range_error("CO2 limit", min_co2_limit_pct, max_co2_limit_pct, "%", limit);
  }
  double vco2 = s.vco2_stpd.in(litres_per_minute), vo2 = s.vo2_stpd.in(litres_per_minute);
  if (!in_range(vco2, min_vco2_lpm, max_vco2_lpm)) {
    return range_error("VCO2", min_vco2_lpm, max_vco2_lpm, "L/min", vco2);
  }
  if (!in_range(vo2, min_vo2_lpm, max_vo2_lpm)) {
    return range_error("VO2", min_vo2_lpm, max_vo2_lpm, "L/min", vo2);
  }
  if (s.stroke_volume) {
    double sv = s.stroke_volume->in(litres);
    if (!in_range(sv, min_stroke_l, max_stroke_l)) {
      return range_error("pump stroke volume", min_stroke_l, max_stroke_l, "L", sv);
    }
  }
  return 0.0;
}

Pressure pio2(double o2_fraction, Pressure total) {
  return mmhg(o2_fraction * (total.in(mmhg) - kWaterVapourMmhg));
}

// The altitude whose dry ambient air gives `inspired`: PB = PiO2/0.2095 + 47 mmHg, inverted by
// the same model. Absent outside the model's pressures (below sea level, above its top).
// The same atmosphere both ways: the model, or the latitude/month table when one is given.
Result<Length> altitude_of(Pressure p, atmosphere::Model model, const Settings& s) {
  return s.where ? atmosphere::altitude_at(p, *s.where) : atmosphere::altitude_at(p, model);
}
Result<Pressure> pressure_of(Length h, atmosphere::Model model, const Settings& s) {
  return s.where ? atmosphere::pressure_at(h, *s.where) : atmosphere::pressure_at(h, model);
}

std::optional<Length> oxygen_equivalent(Pressure inspired, atmosphere::Model model, const Settings& s) {
  Result<Length> h = altitude_of(
      mmhg(inspired.in(mmhg) / air_o2_fraction + kWaterVapourMmhg), model, s);
  if (!h) return std::nullopt;
  return h.value();
}

// Moles of fresh air per minute that bring O2 inside up to `needed` (a dry fraction):
//   (n·0.2095 + n_feed − n_o2) / (n + n_feed − n_o2 + n_co2) ≥ needed.
// Absent when no air flush can (needed at least the air's own 20.95 % and the feed too small).
std::optional<double> air_for_o2(double needed, double n_feed, double n_o2, double n_co2) {
  double shortfall = needed * (n_feed - n_o2 + n_co2) - (n_feed - n_o2);
  if (shortfall <= 0.0) return 0.0;
  if (air_o2_fraction - needed <= 0.0) return std::nullopt;
  return shortfall / (air_o2_fraction - needed);
}

// Strokes per minute for a flush at chamber pressure: each stroke moves `stroke` of ambient air,
// which occupies stroke·PB/P_inside inside (same temperature).
std::optional<double> strokes(const Settings& s, VolumeFlow flush_chamber, Pressure ambient,
                              Pressure inside) {
  if (!s.stroke_volume) return std::nullopt;
  double per_stroke_inside_l = s.stroke_volume->in(litres) * (ambient / inside);
  return flush_chamber.in(litres_per_minute) / per_stroke_inside_l;
}

// The one place the verdict, the limiting equivalent altitude and the fire risk are decided.
void decide(BagResult& r, const Settings& s) {
  constexpr double tolerance = 1e-9;  // a flush set exactly to the requirement is enough
  r.co2_limit = s.co2_limit;
  if (r.gas) {
    r.oxygen_equivalent_altitude = oxygen_equivalent(r.pio2_inside, r.model, s);
    r.co2_above_limit = r.gas->co2.in(fraction) > s.co2_limit.in(fraction) * (1 + tolerance);
    r.oxygen_below_outside = r.pio2_inside.in(mmhg) < r.pio2_ambient.in(mmhg) * (1 - tolerance);
  }
  r.verdict = r.gas && !r.co2_above_limit && !r.oxygen_below_outside ? Verdict::Ok : Verdict::FlushMore;

  const bool better_inside = r.pio2_inside.in(mmhg) > r.pio2_ambient.in(mmhg) * (1 + tolerance);
  const std::optional<Length>& by_pressure = r.pressure_equivalent_altitude;
  const std::optional<Length>& by_oxygen = r.oxygen_equivalent_altitude;
  // Absent figures are below sea level when the inside is better (a lower altitude than any).
  bool oxygen_higher = by_oxygen && (!by_pressure || *by_oxygen > *by_pressure);
  if (!better_inside && r.gas) oxygen_higher = true;  // an absent figure is then above the top
  r.limited_by = oxygen_higher ? Limit::Oxygen : Limit::Pressure;
  r.equivalent_altitude = oxygen_higher ? by_oxygen : by_pressure;
  if (better_inside && r.equivalent_altitude) {
    r.descent_equivalent = r.ambient_altitude - *r.equivalent_altitude;
  }

  r.fire_risk = r.gas ? r.inside_o2.in(fraction) > fire_risk_o2_fraction
                      : s.oxygen_feed.in(litres_per_minute) > 0.0;
}

Result<BagResult> compute(Pressure ambient, Length ambient_altitude, atmosphere::Model model,
                          const Settings& s) {
  BagResult r;
  r.model = model;
  r.ambient_pressure = ambient;
  r.ambient_altitude = ambient_altitude;
  r.inside_pressure = units::absolute_from_gauge(s.gauge, ambient);
  Result<Length> equivalent = altitude_of(r.inside_pressure, model, s);
  if (equivalent) {
    r.pressure_equivalent_altitude = equivalent.value();
  } else {
    r.notes.push_back("The pressure inside is above sea-level pressure in the " +
                      std::string(atmosphere::model_name(model)) +
                      " model: the pressure-equivalent altitude is below sea level (not shown).");
  }

  // Molar balance at steady state, per minute (dry gas): in = air flush + oxygen feed;
  // the casualty takes up VO2 and gives off VCO2; out = in − VO2 + VCO2.
  const double p_in = r.inside_pressure.in(pascals);
  const double t_ch = s.chamber_temperature.in(kelvin);
  const double n_co2 = moles_per_min(s.vco2_stpd, kStpdPressurePa, kStpdTemperatureK);
  const double n_o2 = moles_per_min(s.vo2_stpd, kStpdPressurePa, kStpdTemperatureK);
  const double n_feed = moles_per_min(s.oxygen_feed, kStpdPressurePa, kFreeGasTemperatureK);
  const double limit = s.co2_limit.in(fraction);

  // Smallest air flush for the CO2 limit:
  //   (n_air·f_co2 + n_co2) / (n_air + n_feed − n_o2 + n_co2) = limit
  double n_air_min = (n_co2 - limit * (n_feed - n_o2 + n_co2)) / (limit - air_co2_fraction);
  n_air_min = std::max(0.0, n_air_min);
  r.min_flush = litres_per_minute(n_air_min * kR * t_ch / p_in * 1000.0);
  r.min_flush_strokes_per_minute = strokes(s, r.min_flush, ambient, r.inside_pressure);
  // The flush for the verdict ok also keeps PiO2 inside at least PiO2 outside.
  r.pio2_ambient = pio2(air_o2_fraction, ambient);
  double o2_needed = r.pio2_ambient.in(mmhg) / (r.inside_pressure.in(mmhg) - kWaterVapourMmhg);
  if (std::optional<double> n_air_o2 = air_for_o2(o2_needed, n_feed, n_o2, n_co2)) {
    double n_air = std::max(n_air_min, *n_air_o2);
    VolumeFlow required = litres_per_minute(n_air * kR * t_ch / p_in * 1000.0);
    r.required_flush = std::max(required, litres_per_minute(min_flush_lpm));
    r.required_flush_strokes_per_minute = strokes(s, *r.required_flush, ambient, r.inside_pressure);
  }

  r.inside_o2 = fraction(air_o2_fraction);
  if (s.flush) {
    double n_air = moles_per_min(*s.flush, p_in, t_ch);
    double n_out = n_air + n_feed - n_o2 + n_co2;
    double o2_out = n_air * air_o2_fraction + n_feed - n_o2;
    if (o2_out <= 0.0 || n_out <= 0.0) {
      // No steady state: the casualty takes up more oxygen than the flush brings.
      VolumeFlow needed = r.required_flush ? *r.required_flush : r.min_flush;
      return Error{"flush flow is too low for the casualty's oxygen uptake: flush more, at least " +
                   format_number(std::ceil(needed.in(litres_per_minute)), 0) + " L/min"};
    }
    GasBalance g;
    g.co2 = fraction((n_air * air_co2_fraction + n_co2) / n_out);
    g.o2 = fraction(o2_out / n_out);
    g.time_constant = s.bag_volume / *s.flush;
    g.vco2_in_chamber = litres_per_minute(n_co2 * kR * t_ch / p_in * 1000.0);
    g.flush_ambient_air = *s.flush * (r.inside_pressure / ambient);
    g.strokes_per_minute = strokes(s, *s.flush, ambient, r.inside_pressure);
    r.inside_o2 = g.o2;
    r.gas = g;
    r.notes.push_back("Steady state after about 3 time constants (95 %); CO2 and O2 are dry-gas "
                      "fractions. VCO2 " + format_number(s.vco2_stpd.in(litres_per_minute), 2) +
                      " and VO2 " + format_number(s.vo2_stpd.in(litres_per_minute), 2) +
                      " L/min STPD (resting " + format_number(rest_vco2_lpm, 2) + " and " +
                      format_number(rest_vo2_lpm, 2) +
                      ", typical resting figures; shivering or distress several times more).");
  } else if (s.oxygen_feed.in(litres_per_minute) > 0.0) {
    r.notes.push_back("An oxygen feed is only balanced together with a fresh-air flush "
                      "(give the flush).");
  }
  r.pio2_inside = pio2(r.inside_o2.in(fraction), r.inside_pressure);
  decide(r, s);
  r.notes.push_back("Bag volume " + format_number(s.bag_volume.in(litres), 0) +
                    " L is an assumption unless entered for the device.");
  r.notes.push_back("Sessions are commonly 1-2 h, then reassess (common practice). The bag buys "
                    "time for descent; symptoms may return after.");
  return r;
}

}  // namespace

std::string_view verdict_key(Verdict verdict) {
  return verdict == Verdict::Ok ? "ok" : "flush_more";
}

std::string_view limit_key(Limit limit) { return limit == Limit::Oxygen ? "oxygen" : "pressure"; }

double altitude_rounded_up(Length altitude, const Unit<LengthDimension>& unit, double step) {
  return std::ceil(altitude.in(unit) / step) * step;
}

double descent_rounded_down(Length descent, const Unit<LengthDimension>& unit, double step) {
  return std::floor(descent.in(unit) / step) * step;
}

std::string verdict_text(const BagResult& r, const Unit<LengthDimension>& unit) {
  std::string u(unit.symbol);
  if (r.verdict == Verdict::FlushMore) {
    if (!r.required_flush) {
      return "Flush more: no flush is enough at this bag pressure; check the bag is pressurised";
    }
    // Rounded up: "at least" must be enough.
    std::string text = "Flush more: at least " +
                       format_number(std::ceil(r.required_flush->in(litres_per_minute)), 0) + " L/min";
    if (r.required_flush_strokes_per_minute) {
      text += ", or " + format_number(std::ceil(*r.required_flush_strokes_per_minute), 0) +
              " strokes/min";
    }
    return text;
  }
  if (!r.equivalent_altitude) {
    return "Equivalent altitude below sea level: a descent of at least " +
           format_number(std::floor(r.ambient_altitude.in(unit)), 0) + " " + u;
  }
  if (!r.descent_equivalent) return "No descent equivalent: the bag is worth no more than outside air";
  // Conservative rounding: the descent down, the altitude it is equivalent to up.
  return "Descent equivalent " + format_number(descent_rounded_down(*r.descent_equivalent, unit), 0) + " " + u +
         " (to " + format_number(altitude_rounded_up(*r.equivalent_altitude, unit), 0) + " " + u + "): the " +
         (r.limited_by == Limit::Oxygen ? "oxygen inside" : "pressure") + " limits it";
}

std::string flush_more_reason(const BagResult& r) {
  if (r.verdict == Verdict::Ok) return "";
  if (!r.gas) return "No flush entered: without fresh air the casualty's CO2 builds up in the bag.";
  std::string reason;
  if (r.co2_above_limit) {
    reason = "CO2 inside " + format_number(r.gas->co2.in(percent), 1) + " % is above the " +
             format_number(r.co2_limit.in(percent), 2) + " % limit. ";
  }
  if (r.oxygen_below_outside) {
    reason += "The oxygen inside is worth less than outside air (PiO2 " +
              format_number(r.pio2_inside.in(mmhg), 0) + " vs " +
              format_number(r.pio2_ambient.in(mmhg), 0) + " mmHg). ";
  }
  if (!reason.empty()) reason.pop_back();
  return reason;
}

std::string fire_caution_text(const BagResult& r) {
  if (!r.fire_risk) return "";
  std::string threshold = format_number(fire_risk_o2_fraction * 100.0, 1) + " %";
  std::string what = r.gas ? "Oxygen inside " + format_number(r.inside_o2.in(percent), 1) +
                                 " % is above " + threshold
                           : "Oxygen fed into the bag without a flush builds up above " + threshold;
  return what + " (oxygen-enriched, NFPA 99): fire risk. No flame, stove or sparks near the bag; "
                "common practice is a mask inside the bag with exhaled gas vented out.";
}

// The bag's own range: the model's, cut where the ambient pressure falls below min_ambient_hpa
// (ISA to 20 000 m gave a negative PiO2 outside: docs/hardening.md).
units::Range<units::LengthDimension> altitude_range(atmosphere::Model model) {
  static const auto make = [](atmosphere::Model m) {
    units::Range<units::LengthDimension> r = atmosphere::altitude_range(m);
    double top_m = r.high_in_unit();
    bool cut = atmosphere::pressure_at(r.high, m)->in(hectopascals) < min_ambient_hpa;
    if (cut) top_m = std::floor(atmosphere::altitude_at(hectopascals(min_ambient_hpa), m)->in(metres));
    std::string note = " for a bag in the " + std::string(atmosphere::model_name(m)) + " model";
    if (cut) note += " (ambient pressure at least " + format_number(min_ambient_hpa) + " hPa)";
    return std::pair{top_m, note};
  };
  static const auto isa = make(atmosphere::Model::Isa), west = make(atmosphere::Model::West1996);
  const auto& [top_m, note] = model == atmosphere::Model::Isa ? isa : west;
  return {atmosphere::altitude_range(model).low, metres(top_m), &metres, "altitude", note};
}

units::Range<units::PressureDimension> ambient_pressure_range(atmosphere::Model model) {
  static const std::string isa = " for a bag in the ISA model", west = " for a bag in the West 1996 model";
  units::Range<units::PressureDimension> r = atmosphere::pressure_range(model);
  return {std::max(r.low, hectopascals(min_ambient_hpa)), r.high, &hectopascals, "ambient pressure",
          model == atmosphere::Model::Isa ? isa : west};
}

Result<BagResult> bag_at_altitude(Length ambient_altitude, atmosphere::Model model,
                                  const Settings& settings) {
  Result<double> ok = check(settings);
  if (!ok) return ok.error();
  if (auto z = units::check(ambient_altitude, hyperbaric_bag::altitude_range(model)); !z) return z.error();
  Result<Pressure> ambient = pressure_of(ambient_altitude, model, settings);
  if (!ambient) return ambient.error();
  return compute(ambient.value(), ambient_altitude, model, settings);
}

Result<BagResult> bag_at_pressure(Pressure ambient_pressure, atmosphere::Model model,
                                  const Settings& settings) {
  Result<double> ok = check(settings);
  if (!ok) return ok.error();
  // Judged on the exact bounds; the published range (rounded inward) names the refusal.
  units::Range<units::LengthDimension> z = atmosphere::altitude_range(model);
  double model_low = atmosphere::pressure_at(z.high, model)->in(hectopascals);
  double model_high = atmosphere::pressure_at(z.low, model)->in(hectopascals);
  if (!in_range(ambient_pressure.in(hectopascals), std::max(min_ambient_hpa, model_low), model_high)) {
    return units::refused(ambient_pressure, ambient_pressure_range(model));
  }
  Result<Length> altitude = altitude_of(ambient_pressure, model, settings);
  if (!altitude) return altitude.error();
  return compute(ambient_pressure, altitude.value(), model, settings);
}

}  // namespace firn::hyperbaric_bag
