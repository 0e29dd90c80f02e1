// `firn oxygenation`: the oxygen cascade and the expected SpO2 band at an altitude or pressure
// (optionally with oxygen and a measured SpO2); `firn curve`: the dissociation curve at a PO2.
#include <cmath>
#include <memory>

#include "cli/cli.hpp"
#include "model/atmosphere.hpp"
#include "model/casualty_oxygen.hpp"
#include "model/casualty_spo2.hpp"
#include "model/cautions.hpp"
#include "model/dissociation.hpp"
#include "model/expected_spo2.hpp"
#include "model/oxygen_cascade.hpp"
#include "model/supplemental_oxygen.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace atm = firn::atmosphere;
namespace o2 = firn::supplemental_oxygen;

struct OxygenationOptions {
  std::optional<std::string> altitude, pressure, model, fio2, spo2, device, flow, target;
  std::optional<std::string> time_at_altitude, breathing;
  bool acclimatised = false;
  LatitudeMonthOptions where;
};

struct CurveOptions {
  std::optional<std::string> po2, ph, temperature, base_excess, p50;
};

// A number that may carry a trailing '%': "0.3" → 0.3, "30%" → 0.3 when `percent_sign_scales`.
Result<double> number_or_percent(const std::string& text, const std::string& option,
                                 const std::string& what, bool percent_sign_scales,
                                 const units::NumberRange& range) {
  std::string body = text;
  bool had_percent = !body.empty() && body.back() == '%';
  if (had_percent) body.pop_back();
  Result<double> n = parse_number(body, what);
  if (!n) return with_range(Error{option + ": " + n.error().message}, range);
  return had_percent && percent_sign_scales ? n.value() / 100.0 : n.value();
}

// An optional plain number; the model checks its range and names it.
Result<std::optional<double>> optional_number(const std::optional<std::string>& text,
                                              const std::string& option, const std::string& what,
                                              const units::NumberRange& range) {
  if (!text) return std::optional<double>{};
  Result<double> n = parse_number(*text, what);
  if (!n) return with_range(Error{option + ": " + n.error().message}, range);
  return std::optional<double>{n.value()};
}

Result<Pressure> barometric_pressure(const OxygenationOptions& o, atm::Model model,
                                     Report& report) {
  if (o.altitude && o.pressure) return Error{"give --altitude or --pressure, not both"};
  if (o.pressure && (o.where.latitude || o.where.month)) return Error{"--latitude/--month go with --altitude, not --pressure"};
  if (o.pressure) {
    Result<Pressure> p = required_pressure(o.pressure, "--pressure", "barometric pressure",
                                           atm::kStationReadingRange);
    if (!p) return p.error();
    Result<Pressure> checked = atm::pressure_from_station_reading(p.value());
    if (!checked) return Error{"--pressure: " + checked.error().message};
    return checked;
  }
  Result<Length> altitude = required_length(
      o.altitude, o.altitude ? "--altitude" : "--altitude or --pressure", "altitude",
      atm::altitude_range(model));
  if (!altitude) return altitude.error();
  Result<Pressure> p = ambient_pressure(altitude.value(), model, o.where, report);
  if (!p) return p.error();
  report.add("altitude_m", altitude->in(metres), 1, "Altitude", "m");
  return p;
}

// Adds the device rows; returns the error if an option is bad.
Result<o2::Breathing> breathing_option(const OxygenationOptions& o) {
  if (!o.breathing) return o2::Breathing::Rest;
  Result<o2::Breathing> b = o2::parse_breathing(*o.breathing);
  if (!b) return Error{"--breathing: " + b.error().message};
  return b;
}

// This casualty's own flow from the SpO2 measured on air (casualty_oxygen): an estimate.
std::optional<Error> add_casualty_flow_rows(Report& report, Pressure pb,
                                            cascade::Acclimatisation exposure, o2::Device device,
                                            Fraction spo2_on_air, Fraction target,
                                            o2::Breathing breathing) {
  casualty_oxygen::Casualty c{pb, exposure, spo2_on_air, breathing};
  Result<casualty_oxygen::CasualtyFlow> f = casualty_oxygen::lowest_flow(c, device, target);
  if (!f) return Error{"--spo2: " + f.error().message};
  report.add("casualty_virtual_shunt_pct", f->shunt.fraction * 100.0, 0,
             "Virtual shunt of this casualty (estimate)", "%");
  report.json["casualty_target_reachable"] = f->reachable;
  report.json["casualty_flow_is_estimate"] = true;
  if (f->reachable) {
    report.add("casualty_lowest_flow_lpm", f->flow.in(litres_per_minute), 1,
               "Lowest flow for this casualty (estimate)", "L/min");
  } else {
    report.json["casualty_lowest_flow_lpm"] = nullptr;
    report.rows.emplace_back("Lowest flow for this casualty (estimate)", "not reachable with this device");
  }
  report.add("casualty_predicted_spo2_pct", f->predicted.in(percent), 0,
             "SpO2 predicted at that flow (estimate)", "%");
  Json table = Json::array();
  for (const casualty_oxygen::FlowPoint& p : f->by_flow) {
    table.push_back({{"flow_lpm", rounded(p.flow.in(litres_per_minute), 1)},
                     {"spo2_pct", rounded(p.spo2.in(percent), 0)}});
  }
  report.json["casualty_spo2_by_flow"] = table;
  report.notes.emplace_back(casualty_oxygen::kEstimateNote);
  return std::nullopt;
}

std::optional<Error> add_oxygen_rows(Report& report, const OxygenationOptions& o, Pressure pb,
                                     cascade::Acclimatisation exposure) {
  Result<o2::Device> device = o2::parse_device(*o.device);
  if (!device) return Error{"--device: " + device.error().message};
  Result<o2::Breathing> breathing = breathing_option(o);
  if (!breathing) return breathing.error();
  report.add_text("device", std::string(o2::device_key(device.value())), "Oxygen device");
  report.add_text("breathing", std::string(o2::breathing_key(breathing.value())), "Breathing");
  if (o.flow) {
    Result<double> lpm = parse_number(*o.flow, "oxygen flow");
    if (!lpm) {
      return with_range(Error{"--flow: " + lpm.error().message}, o2::flow_range(device.value()));
    }
    Result<o2::Prediction> p =
        o2::predict(pb, exposure, device.value(), litres_per_minute(lpm.value()));
    if (!p) return Error{"--flow: " + p.error().message};
    report.add("flow_lpm", lpm.value(), 1, "Oxygen flow", "L/min");
    report.add("device_fio2", p->fio2.in(fraction), 2, "FiO2 with device (sea-level rule of thumb)", "");
    Result<o2::DeliveredFio2> here = o2::delivered_fio2_at(device.value(), litres_per_minute(lpm.value()),
                                                           pb, exposure, breathing.value());
    if (!here) return Error{"--flow: " + here.error().message};
    report.add("device_fio2_at_altitude", here->fio2.in(fraction), 2,
               "FiO2 with device here (gas expansion, ventilation)", "");
    report.add("minute_ventilation_lpm", here->ventilation.in(litres_per_minute), 1,
               "Minute ventilation assumed", "L/min");
    report.add("spo2_with_oxygen_low_pct", p->spo2.low.in(percent), 0, "SpO2 on oxygen, low", "%");
    report.add("spo2_with_oxygen_pct", p->spo2.mid.in(percent), 0, "SpO2 on oxygen", "%");
    report.add("spo2_with_oxygen_high_pct", p->spo2.high.in(percent), 0, "SpO2 on oxygen, high", "%");
  }
  Fraction target = percent(o2::kDefaultTargetPercent);
  if (o.target) {
    Result<double> t = number_or_percent(
        *o.target, "--target", "target SpO2", false, o2::kTargetSpo2Range);
    if (!t) return t.error();
    target = percent(t.value());
  }
  Result<o2::FlowForTarget> f =
      o2::lowest_flow_for_target(pb, exposure, device.value(), target, breathing.value());
  if (!f) return Error{"--target: " + f.error().message};
  report.add("target_spo2_pct", target.in(percent), 0, "Target SpO2 (WMS: > 90 %)", "%");
  report.json["target_reachable"] = f->reachable;
  if (f->reachable) {
    report.add("lowest_flow_lpm", f->flow.in(litres_per_minute), 1, "Lowest flow for target", "L/min");
  } else {
    report.json["lowest_flow_lpm"] = nullptr;
    report.rows.emplace_back("Lowest flow for target", "not reachable with this device");
  }
  if (o.spo2 && !o.flow) {  // measured on air: this casualty's own estimate
    Result<double> s = number_or_percent(*o.spo2, "--spo2", "measured SpO2", false, {});
    if (!s) return s.error();
    if (std::optional<Error> bad = add_casualty_flow_rows(report, pb, exposure, device.value(),
                                                          percent(s.value()), target, breathing.value())) {
      return bad;
    }
  }
  report.notes.emplace_back(o2::kRuleOfThumbNote);
  return std::nullopt;
}

// --time-at-altitude (2d, 36h) or the --acclimatised preset; none when neither is given (the
// figures are then for a newcomer, and an SpO2 verdict is judged at both ends).
Result<std::optional<Duration>> time_at_altitude(const OxygenationOptions& o) {
  if (o.acclimatised && o.time_at_altitude) {
    return Error{"give --acclimatised or --time-at-altitude, not both"};
  }
  if (o.acclimatised) return std::optional(cascade::preset_time_at_altitude(cascade::Exposure::Acclimatised));
  if (!o.time_at_altitude) return std::optional<Duration>();
  Result<Duration> t = parse_long_duration(*o.time_at_altitude, "time at altitude");
  if (!t) {
    return with_range(Error{"--time-at-altitude: " + t.error().message},
                      cascade::kTimeAtAltitudeDaysRange);
  }
  return std::optional(t.value());
}

// The measured SpO2 against the band for the oxygen actually given (casualty_spo2::assess): on
// oxygen when --device and --flow are given, else room air.
std::optional<Error> add_spo2_rows(Report& report, const OxygenationOptions& o, Pressure pb,
                                   std::optional<cascade::Acclimatisation> exposure) {
  casualty_spo2::Reading reading{pb, exposure, std::nullopt, percent(NAN)};
  Result<o2::Breathing> breathing = breathing_option(o);
  if (!breathing) return breathing.error();
  reading.breathing = breathing.value();
  if (o.device && o.flow) {
    Result<o2::Device> device = o2::parse_device(*o.device);
    if (!device) return Error{"--device: " + device.error().message};
    Result<double> lpm = parse_number(*o.flow, "oxygen flow");
    if (lpm) reading.oxygen = casualty_spo2::OxygenGiven{device.value(), litres_per_minute(lpm.value())};
  }
  auto judged = [&](double pct) {
    casualty_spo2::Reading r = reading;
    r.measured = percent(pct);
    return casualty_spo2::assess(r);
  };
  Result<double> s = number_or_percent(*o.spo2, "--spo2", "measured SpO2", false,
                                       expected_spo2::kMeasuredSpo2Range);
  if (!s) return s.error();
  Result<casualty_spo2::Verdict> v = judged(s.value());
  if (!v) {
    bool spo2_fault = v.error().message.find("measured SpO2") != std::string::npos;
    return Error{(spo2_fault ? "--spo2: " : "--flow: ") + v.error().message};
  }
  const expected_spo2::Assessment& a = v->assessment;
  report.add("spo2_measured_pct", s.value(), 0, "Measured SpO2", "%");
  report.add_text("spo2_compared_with", v->on_oxygen ? "oxygen" : "air", "Compared with the band on");
  report.add("spo2_band_low_pct", v->band.low.in(percent), 0, "Band compared with, low", "%");
  report.add("spo2_band_high_pct", v->band.high.in(percent), 0, "Band compared with, high", "%");
  report.json["spo2_band_extrapolated"] = a.extrapolated;
  report.add("spo2_gap_pct", a.gap_points, 1, "Gap to expected band", "% points");
  report.add_text("spo2_assessment", std::string(expected_spo2::position_key(a.position)),
                  "Assessment");
  if (v->judged_at) {
    report.add_text("spo2_band_judged_at", std::string(cascade::exposure_key(*v->judged_at)),
                    "Band compared with, time not given: the less reassuring end");
    report.json["spo2_ends_differ"] = v->ends_differ;
  }
  report.add_text("spo2_verdict", v->headline, "Verdict");
  report.add_text("spo2_action", v->action, "What to do");
  report.json["hape_suspected"] = a.hape_suspected;
  report.json["oximeter_unreliable"] = a.oximeter_unreliable;
  report.json["below_oxygen_target"] = v->below_oxygen_target;
  Json why = Json::array();
  for (std::string_view w : a.why) {
    why.push_back(std::string(w));
    report.notes.emplace_back("Why: " + std::string(w));
  }
  report.json["why"] = why;
  Json list = Json::array();
  for (std::string_view c : a.cautions) list.push_back(std::string(c));
  report.json["cautions"] = list;
  for (std::string_view c : a.cautions) report.notes.emplace_back(c);
  return std::nullopt;
}

Result<Report> run_oxygenation(const OxygenationOptions& o) {
  Result<atm::Model> chosen_model = model_option(o.model);
  if (!chosen_model) return chosen_model.error();
  const atm::Model model = chosen_model.value();
  Report report;
  Result<Pressure> pb = barometric_pressure(o, model, report);
  if (!pb) return pb.error();
  Fraction fio2 = cascade::dry_air_fio2();
  if (o.fio2) {
    // Typed as a fraction or a percentage: the message says both.
    const units::NumberRange fio2_range{cascade::kFio2Range.low, cascade::kFio2Range.high,
                                        "(fraction; or 15% to 100%)", cascade::kFio2Range.what};
    Result<double> f = number_or_percent(*o.fio2, "--fio2", "FiO2", true, fio2_range);
    if (!f) return f.error();
    if (auto checked = units::check(f.value(), fio2_range); !checked) {
      return Error{"--fio2: " + checked.error().message};
    }
    fio2 = fraction(f.value());
  }
  Result<std::optional<Duration>> given = time_at_altitude(o);
  if (!given) return given.error();
  const std::optional<Duration> time = given.value();
  Result<cascade::Acclimatisation> exposure = cascade::acclimatisation_after(
      time.value_or(cascade::preset_time_at_altitude(cascade::Exposure::Acute)));
  if (!exposure) return Error{"--time-at-altitude: " + exposure.error().message};
  Result<expected_spo2::Expectation> e = expected_spo2::expected(pb.value(), exposure.value(), fio2);
  if (!e) return e.error();
  const cascade::CascadePath& mid = e->cascade.middle;

  report.add_text("model", std::string(atm::model_key(model)), "Atmosphere model");
  report.add_text("exposure", std::string(cascade::acclimatisation_key(exposure.value())), "Exposure");
  report.json["time_at_altitude_given"] = time.has_value();
  if (time) {
    report.add("time_at_altitude_h", time->in(hours), 1, "Time at this altitude", "h");
  } else {
    report.notes.emplace_back("Time at this altitude not given (--time-at-altitude): the figures are "
                              "for a newcomer (on arrival, the least oxygen); an SpO2 verdict is "
                              "judged on arrival and after 3 weeks, the less reassuring shown.");
  }
  report.add("acclimatisation_share", exposure->share, 2,
             "Ventilatory acclimatisation (0 acute, 1 acclimatised)", "");
  report.add("pressure_hpa", pb->in(hectopascals), 1, "Barometric pressure", "hPa");
  report.add("pressure_mmhg", pb->in(mmhg), 1, "Barometric pressure", "mmHg");
  report.add("fio2", fio2.in(fraction), 4, "FiO2", "");
  report.add("pio2_mmhg", e->cascade.inspired.in(mmhg), 1, "Inspired PO2 (PiO2)", "mmHg");
  report.add("paco2_mmhg", mid.paco2.in(mmhg), 1, "PaCO2 expected", "mmHg");
  report.add("paco2_low_mmhg", e->cascade.highest.paco2.in(mmhg), 1, "PaCO2 range, low", "mmHg");
  report.add("paco2_high_mmhg", e->cascade.lowest.paco2.in(mmhg), 1, "PaCO2 range, high", "mmHg");
  report.add("pao2_mmhg", mid.alveolar.in(mmhg), 1, "Alveolar PO2 (PAO2)", "mmHg");
  report.add("a_a_gradient_mmhg", mid.aa_gradient.in(mmhg), 1, "A-a gradient", "mmHg");
  report.add("arterial_po2_mmhg", mid.arterial.in(mmhg), 1, "Arterial PO2 (PaO2)", "mmHg");
  report.add("ph", mid.acid_base.ph, 2, "Arterial pH", "");
  report.add("bicarbonate_mmol_l", mid.acid_base.bicarbonate_mmol_l, 1, "Bicarbonate", "mmol/L");
  report.add("spo2_expected_low_pct", e->band.low.in(percent), 0, "Expected SpO2, low", "%");
  report.add("spo2_expected_pct", e->band.mid.in(percent), 0, "Expected SpO2", "%");
  report.add("spo2_expected_high_pct", e->band.high.in(percent), 0, "Expected SpO2, high", "%");
  report.json["extrapolated"] = e->extrapolated;
  if (e->extrapolated) {
    report.notes.emplace_back("Beyond the altitudes of the field data (above ~5500 m): the band "
                              "is an extrapolation.");
  }

  if (o.spo2) {
    std::optional<cascade::Acclimatisation> known;
    if (time) known = exposure.value();
    if (std::optional<Error> bad = add_spo2_rows(report, o, pb.value(), known)) return *bad;
  } else {
    report.notes.emplace_back(cautions::short_line);
  }
  if (o.device) {
    if (std::optional<Error> bad = add_oxygen_rows(report, o, pb.value(), exposure.value())) return *bad;
  } else if (o.flow || o.target) {
    return Error{"--flow and --target need --device (cannula, mask or non-rebreather)"};
  }
  return report;
}

Result<Report> run_curve(const CurveOptions& o) {
  Result<Pressure> po2 = required_pressure(o.po2, "--po2", "PO2", dissociation::kPo2Range);
  if (!po2) return po2.error();
  dissociation::CurveShift shift;
  Result<std::optional<double>> ph = optional_number(
      o.ph, "--ph", "pH", dissociation::kPhRange);
  if (!ph) return ph.error();
  if (ph.value()) shift.ph = **ph;
  Result<std::optional<double>> be = optional_number(
      o.base_excess, "--base-excess", "base excess", dissociation::kBaseExcessRange);
  if (!be) return be.error();
  if (be.value()) shift.base_excess_mmol_l = **be;
  if (o.temperature) {
    Result<Temperature> t = required_temperature(
        o.temperature, "--temperature", "body temperature", dissociation::kBodyTemperatureRange);
    if (!t) return t.error();
    shift.temperature = t.value();
  }
  if (o.p50) {
    Result<Pressure> p50 = required_pressure(
        o.p50, "--p50", "P50", dissociation::kP50Range);
    if (!p50) return p50.error();
    shift.p50 = p50.value();
  }
  Result<dissociation::Curve> curve = dissociation::make_curve(shift);
  if (!curve) return curve.error();
  Result<Fraction> s = dissociation::saturation(po2.value(), shift);
  if (!s) return Error{"--po2: " + s.error().message};
  Report report;
  report.add("po2_mmhg", po2->in(mmhg), 1, "PO2", "mmHg");
  report.add("po2_kpa", po2->in(kilopascals), 2, "PO2", "kPa");
  report.add("so2_pct", s->in(percent), 2, "Oxygen saturation (Severinghaus 1979)", "%");
  report.add("virtual_po2_mmhg", po2->in(mmhg) * curve->virtual_po2_factor(), 1,
             "Virtual PO2 (standard curve)", "mmHg");
  report.add("p50_mmhg", curve->p50().in(mmhg), 1, "P50 of this curve", "mmHg");
  report.add("ph", shift.ph, 2, "pH", "");
  report.add("temperature_c", shift.temperature.in(celsius), 1, "Temperature", "°C");
  report.add("base_excess_mmol_l", shift.base_excess_mmol_l, 1, "Base excess", "mmol/L");
  report.notes.emplace_back("Shifts as virtual PO2 (Severinghaus/Kelman form, from memory).");
  return report;
}

}  // namespace

void register_oxygenation_commands(CommandTable& table) {
  auto o = std::make_shared<OxygenationOptions>();
  CLI::App* ox = table.add("oxygenation", "Oxygen cascade and expected SpO2 at an altitude",
                           [o] { return run_oxygenation(*o); });
  ox->add_option("--altitude", o->altitude, "Altitude, e.g. 4000m or 13120ft");
  ox->add_option("--pressure", o->pressure, "Measured barometric pressure, e.g. 616hPa");
  ox->add_option("--model", o->model, "Atmosphere model for --altitude: west (default) or isa");
  add_latitude_month_options(ox, o->where);
  ox->add_flag("--acclimatised", o->acclimatised,
               "Preset: 3 weeks at this altitude (default: acute, on arrival)");
  ox->add_option("--time-at-altitude", o->time_at_altitude,
                 "Time at (or above) this altitude, e.g. 36h or 2d (default 0 h)");
  ox->add_option("--fio2", o->fio2, "Inspired O2 fraction, e.g. 0.21 or 30% (default 0.2095)");
  ox->add_option("--spo2", o->spo2, "Measured SpO2 in %, compared with the expected band");
  ox->add_option("--device", o->device, "Oxygen device: cannula, mask or non-rebreather");
  ox->add_option("--flow", o->flow, "Oxygen flow in L/min with --device");
  ox->add_option("--target", o->target, "Target SpO2 in % with --device (default 90)");
  ox->add_option("--breathing", o->breathing,
                 "rest (default) or distress: minute ventilation for the FiO2 a device gives here");

  auto c = std::make_shared<CurveOptions>();
  CLI::App* curve = table.add("curve", "Oxygen saturation at a PO2 (dissociation curve)",
                              [c] { return run_curve(*c); });
  curve->add_option("--po2", c->po2, "PO2 with unit, e.g. 60mmHg or 8kPa");
  curve->add_option("--ph", c->ph, "Blood pH (default 7.40)");
  curve->add_option("--temperature", c->temperature, "Body temperature, e.g. 37C (default)");
  curve->add_option("--base-excess", c->base_excess, "Base excess in mmol/L (default 0)");
  curve->add_option("--p50", c->p50, "P50 with unit, e.g. 26.8mmHg (default)");
}

}  // namespace firn::cli
