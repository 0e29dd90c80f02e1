#include "model/dissociation.hpp"

#include <algorithm>
#include <cmath>

namespace firn::dissociation {
namespace {

using namespace units;

constexpr double kSaturationMaxPercent = 99.9;
constexpr double kMaxSaturation = 0.9999;  // inverse clamps here: the curve never reaches 1

// Exact inverse of S = 1/(23400/(P³ + 150P) + 1): P³ + 150·P = q with q = 23400·S/(1 − S).
// A depressed cubic with p = 150 > 0 has one real root (Cardano).
double exact_virtual_po2(double s) {
  s = std::clamp(s, 0.0, kMaxSaturation);
  double q = 23400.0 * s / (1.0 - s);
  constexpr double p = 150.0;
  double root = std::sqrt(q * q / 4.0 + p * p * p / 27.0);
  return std::cbrt(q / 2.0 + root) + std::cbrt(q / 2.0 - root);
}

}  // namespace

double severinghaus_saturation(double virtual_po2_mmhg) {
  double p = std::max(virtual_po2_mmhg, 0.0);
  if (p == 0.0) return 0.0;
  return 1.0 / (23400.0 / (p * p * p + 150.0 * p) + 1.0);
}

Curve Curve::standard() { return Curve(1.0); }

Fraction Curve::saturation(Pressure po2) const {
  double p = po2.in(mmhg);
  FIRN_ASSERT(!std::isnan(p), "Curve::saturation called with NaN");
  return fraction(severinghaus_saturation(std::min(p, 1e4) * factor_));
}

Pressure Curve::po2_for(Fraction saturation) const {
  double s = saturation.in(fraction);
  FIRN_ASSERT(!std::isnan(s), "Curve::po2_for called with NaN");
  return mmhg(exact_virtual_po2(s) / factor_);
}

Pressure Curve::p50() const { return po2_for(fraction(0.5)); }

Result<Curve> make_curve(const CurveShift& shift) {
  if (auto t = units::check(shift.temperature, kBodyTemperatureRange); !t) return t.error();
  if (!kPhRange.contains(shift.ph)) {
    // pH has no unit: the value is given without the "(no unit)".
    Error e = units::range_error(kPhRange.what, kPhRange);
    e.message += std::isfinite(shift.ph) ? " (got " + format_number(shift.ph, 3) + ")"
                                         : std::string(got_not_a_number);
    return e;
  }
  if (auto be = units::check(shift.base_excess_mmol_l, kBaseExcessRange); !be) return be.error();
  if (auto p = units::check(shift.p50, kP50Range); !p) return p.error();
  const double t = shift.temperature.in(celsius), p50 = shift.p50.in(mmhg);
  // Warmer, more acid blood or a higher P50 releases O2 more easily: a right shift, i.e. the
  // same PO2 behaves like a lower PO2 on the standard curve.
  double exponent = 0.024 * (37.0 - t) + 0.48 * (shift.ph - 7.40) - 0.0013 * shift.base_excess_mmol_l;
  return Curve(std::pow(10.0, exponent) * kStandardP50Mmhg / p50);
}

Result<Fraction> saturation(Pressure po2, const CurveShift& shift) {
  if (auto p = units::check(po2, kPo2Range); !p) return p.error();
  Result<Curve> curve = make_curve(shift);
  if (!curve) return curve.error();
  return curve->saturation(po2);
}

Result<Pressure> po2_for_saturation(Fraction saturation, const CurveShift& shift) {
  double pct = saturation.in(percent);
  if (!in_range(pct, 0.0, kSaturationMaxPercent)) {
    return range_error("oxygen saturation", 0, kSaturationMaxPercent, "%", pct);
  }
  Result<Curve> curve = make_curve(shift);
  if (!curve) return curve.error();
  return curve->po2_for(saturation);
}

Result<Pressure> severinghaus_inverse_approximation(Fraction saturation) {
  double pct = saturation.in(percent);
  if (!in_range(pct, 1.0, kSaturationMaxPercent)) {
    return range_error("oxygen saturation", 1, kSaturationMaxPercent, "%", pct);
  }
  double s = saturation.in(fraction);
  double ln_po2 = 0.385 * std::log(1.0 / (1.0 / s - 1.0)) + 3.32 - 1.0 / (72.0 * s) -
                  0.17 * std::pow(s, 6);
  return mmhg(std::exp(ln_po2));
}

}  // namespace firn::dissociation
