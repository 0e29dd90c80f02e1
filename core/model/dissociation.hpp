// Oxygen–haemoglobin dissociation: Severinghaus 1979 SO2(PO2), its exact inverse, and shifts of
// the curve expressed as a "virtual PO2" (temperature, pH, base excess, P50).
//   Severinghaus JW, "Simple, accurate equations for human blood O2 dissociation computations",
//   J Appl Physiol 1979;46:599–602: S = 1 / (23400 / (PO2³ + 150·PO2) + 1), PO2 in mmHg,
//   accuracy ±0.0055 in S.
#pragma once

#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::dissociation {

using units::Fraction;
using units::Pressure;
using units::Temperature;

// P50 of the standard curve (37 °C, pH 7.40, BE 0): the PO2 at which the Severinghaus equation
// itself gives 50 %, the root of P³ + 150·P = 23400: 26.857 mmHg. (Severinghaus 1979 quotes the
// human curve's P50 as 26.8; scaling by the rounded 26.8 made a requested P50 of 30 come out as
// 30.06.) A requested P50 is then exactly the shifted curve's P50.
inline constexpr double kStandardP50Mmhg = 26.85680014307396;

// What moves the curve. Defaults are the standard conditions.
// The valid shifts and PO2 (body temperature 20…43 °C, pH 6.8…7.8, base excess ±30 mmol/L,
// P50 15…40 mmHg) and PO2 (0…1000 mmHg: 100 % oxygen at sea level and in a bag).
inline constexpr units::Range<units::TemperatureDimension> kBodyTemperatureRange{
    units::celsius(20.0), units::celsius(43.0), &units::celsius, "body temperature"};
inline constexpr units::NumberRange kPhRange{6.8, 7.8, "(no unit)", "pH"};
inline constexpr units::NumberRange kBaseExcessRange{-30.0, 30.0, "mmol/L", "base excess"};
inline constexpr units::Range<units::PressureDimension> kP50Range{units::mmhg(15.0), units::mmhg(40.0),
                                                                 &units::mmhg, "P50"};
inline constexpr units::Range<units::PressureDimension> kPo2Range{units::mmhg(0.0), units::mmhg(1000.0),
                                                                 &units::mmhg, "PO2"};

struct CurveShift {
  Temperature temperature = units::celsius(37.0);  // valid 20…43 °C
  double ph = 7.40;                                // valid 6.80…7.80
  double base_excess_mmol_l = 0.0;                 // valid −30…+30 mmol/L
  Pressure p50 = units::mmhg(kStandardP50Mmhg);    // valid 15…40 mmHg (whole-curve shift, 2,3-DPG)
};

// A validated, shifted curve. Cheap to evaluate: build it once, then sample it (the UI draws the
// curve from this). Evaluation never fails: PO2 below 0 counts as 0, saturations are clamped.
class Curve {
 public:
  static Curve standard();

  Fraction saturation(Pressure po2) const;     // SO2 at an actual PO2
  Pressure po2_for(Fraction saturation) const;  // exact inverse; 0…<1, clamped to 0.9999
  Pressure p50() const;                          // PO2 at SO2 50 % on this curve
  double virtual_po2_factor() const { return factor_; }  // PO2v / PO2

 private:
  friend Result<Curve> make_curve(const CurveShift& shift);
  explicit Curve(double factor) : factor_(factor) {}
  double factor_ = 1.0;
};

// Validates the shift (message names range and unit) and builds the curve.
// Virtual PO2, from memory (Severinghaus/Kelman form):
//   PO2v = PO2 · 10^[0.024·(37 − T) + 0.48·(pH − 7.40) − 0.0013·BE] · kStandardP50Mmhg / P50
Result<Curve> make_curve(const CurveShift& shift);

// Checked single evaluations for user input: PO2 valid 0…1000 mmHg; SO2 valid 0…99.9 %.
Result<Fraction> saturation(Pressure po2, const CurveShift& shift = {});
Result<Pressure> po2_for_saturation(Fraction saturation, const CurveShift& shift = {});

// The published approximate inverse (same author, 1979), standard conditions:
//   ln PO2 = 0.385·ln(1/(1/S − 1)) + 3.32 − 1/(72·S) − 0.17·S⁶.   Valid SO2 1…99.9 %.
// po2_for_saturation() solves the forward cubic exactly instead; this one is kept to show the
// two agree.
Result<Pressure> severinghaus_inverse_approximation(Fraction saturation);

// Unchecked core of the forward equation, PO2 in mmHg (virtual), returns S as a fraction.
double severinghaus_saturation(double virtual_po2_mmhg);

}  // namespace firn::dissociation
