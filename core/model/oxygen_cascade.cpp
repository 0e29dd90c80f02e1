#include "model/oxygen_cascade.hpp"

#include <algorithm>
#include <array>
#include <cmath>

#include "model/atmosphere.hpp"

namespace firn::cascade {
namespace {

using namespace units;

constexpr double kPbLowHpa = 100.0, kPbHighHpa = 1300.0;
constexpr double kPaco2LowMmhg = 5.0, kPaco2HighMmhg = 80.0;
constexpr double kPio2LowMmhg = 35.0, kPio2HighMmhg = 1000.0;
// Floor for the extrapolated PaCO2: alveolar PCO2 on the Everest summit was ~7.5 mmHg
// (West et al., J Appl Physiol 1983, from memory); nobody at rest goes lower.
constexpr double kPaco2FloorMmhg = 8.0;

struct Paco2Row {
  double altitude_m;
  double low_mmhg, high_mmhg;
};

// From memory, soft ranges (Rahn & Otis, Am J Physiol 1949;157:445, O2–CO2 diagram). Sea level
// 38–42 around the textbook 40 mmHg.
constexpr std::array<Paco2Row, 4> kAcuteRows{{{0, 38, 42}, {3000, 36, 38}, {4000, 34, 36},
                                              {5000, 32, 34}}};
constexpr std::array<Paco2Row, 5> kAcclimatisedRows{
    {{0, 38, 42}, {3000, 32, 34}, {4000, 29, 31}, {5000, 26, 28}, {6300, 22, 24}}};

// PiO2 breathing dry air at a tabulated altitude (West 1996 mountain atmosphere: the field
// observations behind the table were made on mountains).
double table_pio2_mmhg(double altitude_m) {
  Result<Pressure> pb = atmosphere::pressure_at(metres(altitude_m), atmosphere::Model::West1996);
  FIRN_ASSERT(pb.ok(), "table altitude outside the West 1996 model");
  return kDryAirFio2 * (pb->in(mmhg) - kWaterVapourMmhg);
}

// Linear in PiO2 between rows, held at the sea-level row above it, and extended along the last
// segment beyond the highest row. Returns {low, high, extrapolated}.
template <size_t N>
Paco2Estimate interpolate(const std::array<Paco2Row, N>& rows, double pio2) {
  auto band = [](double low, double high) {
    low = std::max(low, kPaco2FloorMmhg);
    high = std::max(high, kPaco2FloorMmhg);
    return PressureBand{mmhg(low), mmhg((low + high) / 2.0), mmhg(high)};
  };
  if (pio2 >= table_pio2_mmhg(rows[0].altitude_m)) {
    return {band(rows[0].low_mmhg, rows[0].high_mmhg), false};
  }
  for (size_t i = 1; i < N; ++i) {
    double upper = table_pio2_mmhg(rows[i - 1].altitude_m);
    double lower = table_pio2_mmhg(rows[i].altitude_m);
    bool last = i + 1 == N;
    if (pio2 >= lower || last) {
      double t = (upper - pio2) / (upper - lower);  // 0 at row i−1, 1 at row i, >1 beyond
      double low = rows[i - 1].low_mmhg + t * (rows[i].low_mmhg - rows[i - 1].low_mmhg);
      double high = rows[i - 1].high_mmhg + t * (rows[i].high_mmhg - rows[i - 1].high_mmhg);
      return {band(low, high), pio2 < lower};
    }
  }
  FIRN_ASSERT(false, "unreachable: table interpolation fell through");
  return {};
}

Error pio2_error(double pio2) {
  return range_error("inspired PO2", kPio2LowMmhg, kPio2HighMmhg, "mmHg", pio2);
}

// The alveolar gas equation takes any PiO2 from 0; its message must name that range, not the
// 35 mmHg floor of the PaCO2 table (sweep finding, docs/hardening.md).
Error alveolar_pio2_error(double pio2) {
  return range_error("inspired PO2", 0.0, kPio2HighMmhg, "mmHg", pio2);
}

Result<double> checked_paco2(Pressure paco2) {
  double value = paco2.in(mmhg);
  if (!in_range(value, kPaco2LowMmhg, kPaco2HighMmhg)) {
    return range_error("PaCO2", kPaco2LowMmhg, kPaco2HighMmhg, "mmHg", value);
  }
  return value;
}

Result<double> checked_quotient(double r) {
  if (!in_range(r, 0.6, 1.2)) {
    return range_error("respiratory exchange ratio R", 0.6, 1.2, "(no unit)", r);
  }
  return r;
}

Result<Pressure> positive_alveolar(double pao2) {
  if (!(pao2 > 0.0)) {
    return Error{"alveolar PO2 comes out at or below zero: PaCO2 is too high for this inspired "
                 "PO2 (check the pressure, FiO2 and PaCO2)"};
  }
  return mmhg(pao2);
}

}  // namespace

Fraction dry_air_fio2() { return fraction(kDryAirFio2); }

std::string_view exposure_key(Exposure exposure) {
  return exposure == Exposure::Acute ? "acute" : "acclimatised";
}

Result<Acclimatisation> acclimatisation_after(Duration time_at_altitude) {
  double d = time_at_altitude.in(units::days);
  if (!within(time_at_altitude, 0.0, kTimeAtAltitudeMaxDays, units::days)) {
    return units::refused(kTimeAtAltitudeDaysRange.what, d, kTimeAtAltitudeDaysRange);
  }
  auto rise = [](double days_at) { return 1.0 - std::exp(-days_at / kAcclimatisationTimeConstantDays); };
  return Acclimatisation{std::min(1.0, rise(d) / rise(kFullyAcclimatisedDays))};
}

Acclimatisation acclimatisation_of(Exposure exposure) {
  return {exposure == Exposure::Acute ? 0.0 : 1.0};
}

Duration preset_time_at_altitude(Exposure exposure) {
  return exposure == Exposure::Acute ? hours(0.0) : units::days(kFullyAcclimatisedDays);
}

std::string_view acclimatisation_key(Acclimatisation a) {
  if (a.share <= 0.0) return "acute";
  if (a.share >= 1.0) return "acclimatised";
  return "partly acclimatised";
}

Result<Pressure> inspired_po2(Pressure barometric, Fraction fio2) {
  double pb = barometric.in(hectopascals);
  if (!in_range(pb, kPbLowHpa, kPbHighHpa)) {
    return range_error("barometric pressure", kPbLowHpa, kPbHighHpa, "hPa", pb);
  }
  double f = fio2.in(fraction);
  if (auto checked = units::check(f, kFio2Range); !checked) return checked.error();
  return mmhg(f * (barometric.in(mmhg) - kWaterVapourMmhg));
}

Result<Pressure> alveolar_po2(Pressure inspired, Pressure paco2, Fraction fio2,
                              double respiratory_quotient) {
  Result<double> c = checked_paco2(paco2);
  if (!c) return c.error();
  Result<double> r = checked_quotient(respiratory_quotient);
  if (!r) return r.error();
  double f = fio2.in(fraction);
  if (auto checked = units::check(f, kFio2Range); !checked) return checked.error();
  double pio2 = inspired.in(mmhg);
  if (!within(inspired, 0.0, kPio2HighMmhg, mmhg)) return alveolar_pio2_error(pio2);
  return positive_alveolar(pio2 - c.value() * (f + (1.0 - f) / r.value()));
}

Result<Pressure> alveolar_po2_simplified(Pressure inspired, Pressure paco2,
                                         double respiratory_quotient) {
  Result<double> c = checked_paco2(paco2);
  if (!c) return c.error();
  Result<double> r = checked_quotient(respiratory_quotient);
  if (!r) return r.error();
  double pio2 = inspired.in(mmhg);
  if (!within(inspired, 0.0, kPio2HighMmhg, mmhg)) return alveolar_pio2_error(pio2);
  return positive_alveolar(pio2 - c.value() / r.value());
}

Result<Paco2Estimate> expected_paco2(Pressure inspired, Acclimatisation acclimatisation) {
  Result<Paco2Estimate> acute = expected_paco2(inspired, Exposure::Acute);
  if (!acute) return acute.error();
  Paco2Estimate acclimatised = expected_paco2(inspired, Exposure::Acclimatised).value();
  double s = std::clamp(acclimatisation.share, 0.0, 1.0);
  auto mix = [s](Pressure a, Pressure b) { return a * (1.0 - s) + b * s; };
  Paco2Estimate out;
  out.paco2.low = mix(acute->paco2.low, acclimatised.paco2.low);
  out.paco2.high = mix(acute->paco2.high, acclimatised.paco2.high);
  out.paco2.mid = (out.paco2.low + out.paco2.high) / 2.0;
  out.extrapolated = acclimatised.extrapolated || (acute->extrapolated && 1.0 - s >= 0.05);
  return out;
}

Result<Paco2Estimate> expected_paco2(Pressure inspired, Exposure exposure) {
  double pio2 = inspired.in(mmhg);
  if (!within(inspired, kPio2LowMmhg, kPio2HighMmhg, mmhg)) return pio2_error(pio2);
  Paco2Estimate acclimatised = interpolate(kAcclimatisedRows, pio2);
  if (exposure == Exposure::Acclimatised) return acclimatised;
  Paco2Estimate acute = interpolate(kAcuteRows, pio2);
  // Beyond its table the acute line is extended too; it never drops below the acclimatised one
  // (acclimatisation only adds ventilation).
  auto at_least = [](Pressure a, Pressure b) { return a < b ? b : a; };
  acute.paco2.low = at_least(acute.paco2.low, acclimatised.paco2.low);
  acute.paco2.high = at_least(acute.paco2.high, acclimatised.paco2.high);
  acute.paco2.mid = (acute.paco2.low + acute.paco2.high) / 2.0;
  return acute;
}

Result<PressureBand> expected_aa_gradient(Pressure inspired) {
  double pio2 = inspired.in(mmhg);
  if (!within(inspired, kPio2LowMmhg, kPio2HighMmhg, mmhg)) return pio2_error(pio2);
  double sea_level = table_pio2_mmhg(0.0);
  double altitude = table_pio2_mmhg(3000.0);
  double t = std::clamp((pio2 - altitude) / (sea_level - altitude), 0.0, 1.0);
  double low = 2.0 + t * (5.0 - 2.0);
  double high = 6.0 + t * (10.0 - 6.0);
  return PressureBand{mmhg(low), mmhg((low + high) / 2.0), mmhg(high)};
}

Compensation compensation_for(Exposure exposure) {
  return exposure == Exposure::Acute ? Compensation::Acute : Compensation::Chronic;
}

Result<double> henderson_hasselbalch_ph(double bicarbonate_mmol_l, Pressure paco2) {
  if (!in_range(bicarbonate_mmol_l, 2.0, 60.0)) {
    return range_error("bicarbonate", 2, 60, "mmol/L", bicarbonate_mmol_l);
  }
  Result<double> c = checked_paco2(paco2);
  if (!c) return c.error();
  // CO2 solubility in plasma at 37 °C, 0.0307 mmol/L per mmHg (Severinghaus JW, Stupfel M &
  // Bradley AF, J Appl Physiol 1956;9, from memory): pH 7.391 at HCO3⁻ 24 / PaCO2 40. The
  // teaching value 0.03 (Guyton & Hall) gives 7.401; kept at the measured value because the
  // expected-SpO2 field calibration (expected_spo2.hpp) was fitted with it (0.03 moves every band
  // up ~1 % SpO2 until refitted).
  constexpr double kCo2SolubilityMmolPerLMmhg = 0.0307;
  return 6.1 + std::log10(bicarbonate_mmol_l / (kCo2SolubilityMmolPerLMmhg * c.value()));
}

Result<AcidBase> compensated_acid_base(Pressure paco2, Compensation compensation) {
  return compensated_acid_base(paco2, Acclimatisation{compensation == Compensation::Acute ? 0.0 : 1.0});
}

Result<AcidBase> compensated_acid_base(Pressure paco2, Acclimatisation acclimatisation) {
  Result<double> c = checked_paco2(paco2);
  if (!c) return c.error();
  double s = std::clamp(acclimatisation.share, 0.0, 1.0);
  double change_per_10 = c.value() < 40.0 ? 2.0 + s * (4.5 - 2.0) : 1.0 + s * (3.5 - 1.0);
  double bicarbonate = 24.0 + change_per_10 * (c.value() - 40.0) / 10.0;
  Result<double> ph = henderson_hasselbalch_ph(bicarbonate, paco2);
  if (!ph) return ph.error();
  double base_excess = 0.93 * (bicarbonate - 24.4 + 14.8 * (ph.value() - 7.40));
  return AcidBase{bicarbonate, ph.value(), base_excess};
}

Result<Cascade> oxygen_cascade(const CascadeInputs& in) {
  Result<Pressure> pio2 = inspired_po2(in.barometric, in.fio2);
  if (!pio2) return pio2.error();
  if (pio2->in(mmhg) < kPio2LowMmhg) {
    Error e = pio2_error(pio2->in(mmhg));
    e.message += ": the pressure is too low for the cascade model";
    return e;
  }
  Result<PressureBand> aa = expected_aa_gradient(pio2.value());
  if (!aa) return aa.error();
  Cascade cascade{in.barometric, pio2.value(), {}, {}, {}, false};
  const Acclimatisation share = in.acclimatisation ? *in.acclimatisation : acclimatisation_of(in.exposure);
  PressureBand paco2;
  if (in.measured_paco2) {
    Result<double> checked = checked_paco2(*in.measured_paco2);
    if (!checked) return checked.error();
    paco2 = {*in.measured_paco2, *in.measured_paco2, *in.measured_paco2};
  } else {
    Result<Paco2Estimate> expected = expected_paco2(pio2.value(), share);
    if (!expected) return expected.error();
    paco2 = expected->paco2;
    cascade.paco2_extrapolated = expected->extrapolated;
  }

  auto path = [&](Pressure co2, Pressure gradient) -> Result<CascadePath> {
    Result<Pressure> alveolar = alveolar_po2(pio2.value(), co2, in.fio2, in.respiratory_quotient);
    if (!alveolar) return alveolar.error();
    Pressure arterial = alveolar.value() - gradient;
    if (arterial.in(mmhg) < 1.0) {
      return Error{"arterial PO2 comes out below 1 mmHg: these inputs are outside what the "
                   "cascade model can describe"};
    }
    Result<AcidBase> acid_base = compensated_acid_base(co2, share);
    if (!acid_base) return acid_base.error();
    dissociation::CurveShift shift;
    shift.temperature = in.body_temperature;
    shift.ph = acid_base->ph;
    shift.base_excess_mmol_l = acid_base->base_excess_mmol_l;
    shift.p50 = in.p50;
    Result<dissociation::Curve> curve = dissociation::make_curve(shift);
    if (!curve) return curve.error();
    return CascadePath{co2, alveolar.value(), gradient, arterial, acid_base.value(),
                       curve->saturation(arterial)};
  };
  Result<CascadePath> lowest = path(paco2.high, aa->high);
  if (!lowest) return lowest.error();
  Result<CascadePath> middle = path(paco2.mid, aa->mid);
  if (!middle) return middle.error();
  Result<CascadePath> highest = path(paco2.low, aa->low);
  if (!highest) return highest.error();
  cascade.lowest = lowest.value();
  cascade.middle = middle.value();
  cascade.highest = highest.value();
  return cascade;
}

}  // namespace firn::cascade
