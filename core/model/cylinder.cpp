#include "model/cylinder.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>

#include "model/oxygen_eos.hpp"

namespace firn::cylinder {
namespace {

using namespace units;

constexpr double kR = oxygen_eos::gas_constant_j_per_mol_k;

Result<double> check_reading(const Reading& r) {
  using units::check;
  if (auto w = check(r.water_capacity, kWaterCapacityRange); !w) return w.error();
  if (auto g = check(r.gauge_pressure, kGaugeRange); !g) return g.error();
  if (auto t = check(r.temperature, kTemperatureRange); !t) return t.error();
  if (auto a = check(r.ambient_pressure, kAmbientRange); !a) return a.error();
  return 0.0;
}

Result<double> check_flow(VolumeFlow flow, std::string_view what = "flow") {
  if (auto f = units::check(what, flow, kFlowRange); !f) return f.error();
  return flow.in(litres_per_minute);
}

// Compressibility at the reference state (≈ 0.9992): a constant of the equation of state,
// solved once rather than on every call (the plan asks for thousands of contents).
double reference_compressibility() {
  static const double z_ref =
      oxygen_eos::compressibility(reference_temperature, reference_pressure).value();
  return z_ref;
}

// Free-gas litres of one mole at the reference state (real gas).
double free_litres_per_mole() {
  return reference_compressibility() * kR * reference_temperature.in(kelvin) /
         reference_pressure.in(pascals) * 1000.0;
}

// Contents of an already-checked reading.
Contents contents_checked(const Reading& r) {
  Pressure absolute = units::absolute_from_gauge(r.gauge_pressure, r.ambient_pressure);
  oxygen_eos::State s = oxygen_eos::state_at(r.temperature, absolute).value();
  double moles = s.molar_density_mol_per_m3 * r.water_capacity.in(litres) / 1000.0;
  double z_ref = reference_compressibility();
  Contents c;
  c.free_gas = litres(moles * free_litres_per_mole());
  c.ideal_free_gas = r.water_capacity * (absolute / reference_pressure);
  c.z_in_cylinder = s.compressibility;
  c.z_reference = z_ref;
  c.absolute_pressure = absolute;
  return c;
}

Error ambient_error(Pressure p, std::string_view what) {
  return range_error(what, min_ambient_hpa, max_ambient_hpa, "hPa", p.in(hectopascals));
}

}  // namespace

LetterSizeInfo letter_size_info(LetterSize size) {
  // Factors: common practice in EMS references. Water capacities and full pressures: FROM
  // MEMORY, typical US medical cylinders (aluminium D, E, M; steel H) — check the label.
  switch (size) {
    case LetterSize::D: return {size, "D", 0.16, litres(2.8), psi.gauge(2015), litres(415)};
    case LetterSize::E: return {size, "E", 0.28, litres(4.6), psi.gauge(2015), litres(680)};
    case LetterSize::M: return {size, "M", 1.56, litres(23.0), psi.gauge(2015), litres(3450)};
    case LetterSize::H: return {size, "H", 3.14, litres(42.6), psi.gauge(2200), litres(6900)};
  }
  FIRN_ASSERT(false, "unknown letter size");
  return {size, "?", 0.0, litres(0), psi.gauge(0), litres(0)};
}

std::string letter_size_assumption(LetterSize size) {
  LetterSizeInfo info = letter_size_info(size);
  return "size " + std::string(info.name) + ": water capacity " +
         format_number(info.water_capacity.in(litres), 1) +
         " L assumed (a typical US cylinder; D and E vary by maker): check the label "
         "and give your own water capacity";
}

Result<LetterSize> parse_letter_size(std::string_view text) {
  if (text == "D" || text == "d") return LetterSize::D;
  if (text == "E" || text == "e") return LetterSize::E;
  if (text == "M" || text == "m") return LetterSize::M;
  if (text == "H" || text == "h") return LetterSize::H;
  return Error{"unknown cylinder size '" + std::string(text) + "': use D, E, M or H"};
}

Result<Contents> contents(const Reading& reading) {
  Result<double> ok = check_reading(reading);
  if (!ok) return ok.error();
  Contents c = contents_checked(reading);
  c.extrapolated = oxygen_eos::extrapolated(reading.temperature);
  if (reading.temperature < reference_temperature) {
    Reading at_reference = reading;
    at_reference.temperature = reference_temperature;
    double warm = contents_checked(at_reference).free_gas.in(litres);
    if (warm > 0.0) c.cold_gain = std::max(0.0, c.free_gas.in(litres) / warm - 1.0);
  }
  return c;
}

std::vector<std::string> temperature_cautions(const Contents& c, Temperature temperature) {
  std::vector<std::string> lines;
  if (c.cold_gain > cold_gain_caution_fraction) {
    lines.push_back("At " + format_number(temperature.in(celsius), 0) +
                    " \xC2\xB0" "C this gauge reading means " + format_number(c.cold_gain * 100.0, 0) +
                    " % more oxygen than at 15 \xC2\xB0" "C. " + std::string(temperature_advice));
  }
  if (c.extrapolated) {
    std::string text(oxygen_eos::extrapolated_text);
    text[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(text[0])));
    lines.push_back(text + ".");
  }
  return lines;
}

Duration whole_minutes_down(Duration d) {
  return minutes(std::floor(d.in(minutes) + 1e-9));
}

Duration whole_minutes_up(Duration d) {
  return minutes(std::ceil(d.in(minutes) - 1e-9));
}

LeadingDuration leading_duration(const DurationEstimate& real_gas,
                                 const std::optional<Duration>& field_rule) {
  Duration gas = whole_minutes_down(real_gas.to_reserve);
  if (!field_rule) return {gas, DurationBasis::RealGas, "real-gas estimate to the reserve"};
  Duration rule = whole_minutes_down(*field_rule);
  if (rule < gas) {
    return {rule, DurationBasis::FieldRule,
            "the US field rule gives less than the real-gas estimate (" + format_number(gas.in(minutes), 0) +
                " min): its factors are conservative nominal capacities, so it leads"};
  }
  return {gas, DurationBasis::RealGas,
          "the real-gas estimate to the reserve gives less than the US field rule (" +
              format_number(rule.in(minutes), 0) + " min to 200 psi), so it leads"};
}

Result<GaugePressure> gauge_pressure_for(Volume water_capacity, Temperature temperature,
                                         Pressure ambient_pressure, Volume free_gas) {
  Reading r{water_capacity, bar.gauge(0), temperature, ambient_pressure};
  Result<double> ok = check_reading(r);
  if (!ok) return ok.error();
  double empty = contents_checked(r).free_gas.in(litres);
  r.gauge_pressure = bar.gauge(max_gauge_bar);
  double full = contents_checked(r).free_gas.in(litres);
  double want = free_gas.in(litres);
  // The solver is exact to a part in 10^12, so contents at 349.99999999999994 bar can exceed the
  // figure at 350 bar: that far past an end is the end (fuzz finding: an evacuation plan's
  // FIRN_ASSERT fired for a cylinder read a rounding below the maximum).
  double tolerance = 1e-9 * full;
  if (!in_range(want, empty - tolerance, full + tolerance)) {
    return range_error("free gas in this cylinder", std::ceil(empty * 10) / 10,
                       std::floor(full * 10) / 10, "L", want);
  }
  want = std::clamp(want, empty, full);
  // The equation of state is explicit in density: the moles fix ρ, and P(ρ, T) follows directly.
  double moles = want / free_litres_per_mole();
  double density = moles / (water_capacity.in(litres) / 1000.0);
  Pressure absolute = pascals(oxygen_eos::pressure_pa(density, temperature.in(kelvin)));
  GaugePressure gauge = units::gauge_from_absolute(absolute, ambient_pressure);
  if (gauge < bar.gauge(0.0)) return bar.gauge(0.0);  // rounding at the empty end
  if (gauge > bar.gauge(max_gauge_bar)) return bar.gauge(max_gauge_bar);
  return gauge;
}

Result<DurationEstimate> duration(const Reading& reading, GaugePressure reserve_gauge,
                                  VolumeFlow flow) {
  Result<Contents> now = contents(reading);
  if (!now) return now.error();
  Result<double> f = check_flow(flow);
  if (!f) return f.error();
  if (auto r = units::check(reserve_gauge, kReserveRange); !r) return r.error();
  DurationEstimate d;
  d.contents = now.value();
  if (!(reading.gauge_pressure > reserve_gauge)) {
    d.below_reserve = true;
    d.reserve_free_gas = now->free_gas;
    d.usable_free_gas = litres(0);
    d.to_reserve = minutes(0);
    return d;
  }
  Reading at_reserve = reading;
  at_reserve.gauge_pressure = reserve_gauge;
  Contents reserve = contents_checked(at_reserve);
  d.reserve_free_gas = reserve.free_gas;
  d.usable_free_gas = now->free_gas - reserve.free_gas;
  d.to_reserve = d.usable_free_gas / flow;
  return d;
}

Result<Duration> field_rule_duration(LetterSize size, GaugePressure gauge, VolumeFlow flow) {
  double p = gauge.in(psi);
  if (!in_range(p, 200.0, 3000.0)) {
    Error e = range_error("cylinder pressure", 200, 3000, "psi", p);
    e.message += " for the field rule";
    return e;
  }
  Result<double> f = check_flow(flow);
  if (!f) return f.error();
  return minutes((p - field_rule_residual_gauge.in(psi)) * letter_size_info(size).field_factor /
                 f.value());
}

Result<FlowCorrection> rotameter_at_altitude(VolumeFlow indicated, Pressure ambient,
                                             Pressure calibration) {
  Result<double> f = check_flow(indicated, "indicated flow");
  if (!f) return f.error();
  if (!in_range(ambient.in(hectopascals), min_ambient_hpa, max_ambient_hpa)) {
    return ambient_error(ambient, "ambient pressure");
  }
  if (!in_range(calibration.in(hectopascals), 500.0, max_ambient_hpa)) {
    return range_error("flowmeter calibration pressure", 500, max_ambient_hpa, "hPa",
                       calibration.in(hectopascals));
  }
  double pressure_ratio = calibration / ambient;  // > 1 at altitude
  FlowCorrection c;
  c.set_flow = indicated;
  c.actual_at_ambient = indicated * std::sqrt(pressure_ratio);
  c.actual_free_gas = c.actual_at_ambient * (ambient / reference_pressure);
  c.ratio = c.actual_free_gas / indicated;
  c.explanation =
      "Rotameter (float in a tapered tube) calibrated at " +
      format_number(calibration.in(hectopascals), 0) + " hPa, used at " +
      format_number(ambient.in(hectopascals), 0) +
      " hPa: the thinner gas lifts the float less, so it reads low. Actual flow is about "
      "indicated x sqrt(P_cal/P_ambient) = " +
      format_number(c.actual_at_ambient.in(litres_per_minute), 1) +
      " L/min by volume at ambient pressure, which is " +
      format_number(c.actual_free_gas.in(litres_per_minute), 1) +
      " L/min as free gas at 1 atm (what the cylinder loses). Rotameter density correction, "
      "manufacturers' technical notes.";
  return c;
}

Result<FlowCorrection> fixed_orifice_at_altitude(VolumeFlow nominal, Pressure ambient,
                                                 GaugePressure regulated_gauge,
                                                 Pressure calibration) {
  Result<double> f = check_flow(nominal, "set flow");
  if (!f) return f.error();
  if (!in_range(ambient.in(hectopascals), min_ambient_hpa, max_ambient_hpa)) {
    return ambient_error(ambient, "ambient pressure");
  }
  double reg_psi = regulated_gauge.in(psi);
  if (!in_range(reg_psi, 10.0, 100.0)) {
    return range_error("regulated pressure (gauge)", 10, 100, "psi", reg_psi);
  }
  if (!in_range(calibration.in(hectopascals), 500.0, max_ambient_hpa)) {
    return range_error("regulator calibration pressure", 500, max_ambient_hpa, "hPa",
                       calibration.in(hectopascals));
  }
  // Choked orifice: mass flow ∝ absolute upstream pressure (same gas temperature).
  double ratio = units::absolute_from_gauge(regulated_gauge, ambient) /
                 units::absolute_from_gauge(regulated_gauge, calibration);
  FlowCorrection c;
  c.set_flow = nominal;
  c.actual_free_gas = nominal * ratio;
  c.actual_at_ambient = c.actual_free_gas * (reference_pressure / ambient);
  c.ratio = ratio;
  c.explanation =
      "Fixed-orifice (choked) regulator set to " +
      format_number(nominal.in(litres_per_minute), 1) + " L/min: its mass flow follows the "
      "absolute pressure behind the orifice (" + format_number(reg_psi, 0) +
      " psi regulated above ambient). At " + format_number(ambient.in(hectopascals), 0) +
      " hPa that falls by a factor " + format_number(ratio, 3) + ", so it delivers " +
      format_number(c.actual_free_gas.in(litres_per_minute), 2) +
      " L/min as free gas at 1 atm (" +
      format_number(c.actual_at_ambient.in(litres_per_minute), 1) +
      " L/min by volume at ambient pressure). Derived from choked-flow physics; no published "
      "measurement known.";
  return c;
}

}  // namespace firn::cylinder
