// The oxygen cascade from the air to arterial blood: inspired PO2, alveolar gas equation,
// expected PaCO2 at altitude, A–a gradient, arterial PO2, pH and SaO2.
#pragma once

#include <optional>
#include <string_view>

#include "model/dissociation.hpp"
#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::cascade {

using units::Fraction;
using units::Pressure;
using units::Temperature;

// Dry-air oxygen fraction 0.2095; it does not change with altitude (common practice).
// Older physiology texts use 0.2093.
inline constexpr double kDryAirFio2 = 0.2095;
// Water vapour pressure at 37 °C: 47 mmHg (6.3 kPa), physiology texts.
inline constexpr double kWaterVapourMmhg = 47.0;
// Respiratory exchange ratio at rest.
inline constexpr double kRestingRespiratoryQuotient = 0.8;

units::Fraction dry_air_fio2();

// How long the person has been at this altitude.
enum class Exposure {
  Acute,         // hours to a day or two: ventilation up, kidneys not yet compensating
  Acclimatised,  // days to weeks: more ventilation, renal bicarbonate loss
};
std::string_view exposure_key(Exposure exposure);  // "acute" / "acclimatised"

// Ventilatory acclimatisation as a share from 0 (the acute calibration) to 1 (the acclimatised
// one); the PaCO2 band, the renal compensation and the field P50 move along it linearly.
// Time course, from memory: in lowlanders at 4300 m (the Pikes Peak studies reviewed by Dempsey JA
// & Forster HV, Physiol Rev 1982;62:262–346) ventilation rises and PaCO2 falls over the first days,
// most of the change within about a week, little after 2–3 weeks. Modelled as 1 − e^(−t/τ),
// τ = 2 days, scaled to reach 1 at 21 days. Time counts at (or above) this altitude.
struct Acclimatisation {
  double share = 0.0;
  bool operator==(const Acclimatisation&) const = default;
};
inline constexpr double kAcclimatisationTimeConstantDays = 2.0;
inline constexpr double kFullyAcclimatisedDays = 21.0;
inline constexpr double kTimeAtAltitudeMaxDays = 365.0;
inline constexpr units::NumberRange kTimeAtAltitudeDaysRange{0.0, kTimeAtAltitudeMaxDays, "days",
                                                             "time at altitude"};
// FiO2 as a fraction (room air to pure oxygen; below 0.15 is a slip).
inline constexpr units::NumberRange kFio2Range{0.15, 1.0, "(fraction)", "FiO2"};
// Time valid 0…365 days.
Result<Acclimatisation> acclimatisation_after(units::Duration time_at_altitude);
// The two presets: acute = on arrival (share 0), acclimatised = 21 days (share 1).
Acclimatisation acclimatisation_of(Exposure exposure);
units::Duration preset_time_at_altitude(Exposure exposure);
// "acute" (share 0), "acclimatised" (share 1) or "partly acclimatised".
std::string_view acclimatisation_key(Acclimatisation a);

// PiO2 = FiO2·(PB − 47). PB valid 100…1300 hPa (1300 allows a pressurised bag at sea level),
// FiO2 valid 0.15…1.
Result<Pressure> inspired_po2(Pressure barometric, Fraction fio2);

// Alveolar gas equation, full: PAO2 = PiO2 − PaCO2·[FiO2 + (1 − FiO2)/R].
// PiO2 valid 0…1000 mmHg, PaCO2 5…80 mmHg, R 0.6…1.2, FiO2 0.15…1. An alveolar PO2 at or below
// zero is an error (the
// inputs contradict each other), never a silent number.
Result<Pressure> alveolar_po2(Pressure inspired, Pressure paco2, Fraction fio2,
                              double respiratory_quotient = kRestingRespiratoryQuotient);
// Simplified: PAO2 = PiO2 − PaCO2/R.
Result<Pressure> alveolar_po2_simplified(Pressure inspired, Pressure paco2,
                                         double respiratory_quotient = kRestingRespiratoryQuotient);

// A soft range and its middle.
struct PressureBand {
  Pressure low, mid, high;
};

struct Paco2Estimate {
  PressureBand paco2;
  bool extrapolated = false;  // beyond the highest tabulated altitude (linear extension)
};

// Expected resting PaCO2 of a healthy lowlander. From memory, soft ranges (Rahn & Otis, Am J
// Physiol 1949;157:445, O2–CO2 diagram), acute / acclimatised: 3000 m 36–38 / 32–34;
// 4000 m 34–36 / 29–31; 5000 m 32–34 / 26–28; 6300 m — / 22–24 mmHg; sea level 40 (38–42).
// Ventilation follows the hypoxic stimulus, so the table is indexed by inspired PO2 (its
// altitudes mapped with the West 1996 model and dry air). With added oxygen the PaCO2 of the
// altitude with the same PiO2 is used, which predicts slightly less oxygen, never more.
// Inspired PO2 valid 35…300 mmHg.
Result<Paco2Estimate> expected_paco2(Pressure inspired, Exposure exposure);
// Between the two: each edge linear in the share. Extrapolated when the acclimatised line is, or
// when the acute line is and it carries at least 5 % of the weight (a smaller share moves the
// band by well under a point of SpO2).
Result<Paco2Estimate> expected_paco2(Pressure inspired, Acclimatisation acclimatisation);

// Resting A–a gradient, from memory: ~5–10 mmHg at sea level, ~2–6 at altitude; taken as the
// altitude value from the PiO2 of 3000 m (West 1996) upwards, linear in PiO2 below that. Wider
// in HAPE. Inspired PO2 valid 35…1000 mmHg.
Result<PressureBand> expected_aa_gradient(Pressure inspired);

// Renal compensation of a respiratory acid–base change, common practice ("Boston rules"):
// alkalosis (PaCO2 < 40): HCO3⁻ falls 2 mmol/L per 10 mmHg acutely, 4–5 (we use 4.5) after days;
// acidosis (PaCO2 > 40): rises 1 acutely, 3.5 after days.
enum class Compensation { Acute, Chronic };
Compensation compensation_for(Exposure exposure);

struct AcidBase {
  double bicarbonate_mmol_l;
  double ph;
  double base_excess_mmol_l;  // standard base excess, Van Slyke equation (from memory)
};

// pH = 6.1 + log10(HCO3⁻ / (0.0307·PaCO2)) (Henderson–Hasselbalch; CO2 solubility at 37 °C). HCO3⁻ valid 2…60 mmol/L,
// PaCO2 5…80 mmHg.
Result<double> henderson_hasselbalch_ph(double bicarbonate_mmol_l, Pressure paco2);
// HCO3⁻ from 24 mmol/L at PaCO2 40 with the compensation rule, then pH and base excess.
// Standard base excess (Siggaard-Andersen's Van Slyke equation, from memory):
//   SBE = 0.93·(HCO3⁻ − 24.4 + 14.8·(pH − 7.40)).
Result<AcidBase> compensated_acid_base(Pressure paco2, Compensation compensation);
// With the renal change per 10 mmHg moved from the acute to the chronic rule by the share.
Result<AcidBase> compensated_acid_base(Pressure paco2, Acclimatisation acclimatisation);

// Everything the cascade needs. PaCO2 is the expected band unless a measured value is given.
struct CascadeInputs {
  Pressure barometric;
  Fraction fio2 = dry_air_fio2();
  Exposure exposure = Exposure::Acute;
  std::optional<Acclimatisation> acclimatisation;  // when set, used instead of `exposure`
  double respiratory_quotient = kRestingRespiratoryQuotient;
  std::optional<Pressure> measured_paco2;
  Temperature body_temperature = units::celsius(37.0);
  Pressure p50 = units::mmhg(dissociation::kStandardP50Mmhg);
};

// One path down the cascade.
struct CascadePath {
  Pressure paco2;
  Pressure alveolar;     // PAO2 (full alveolar gas equation)
  Pressure aa_gradient;  // A–a
  Pressure arterial;     // PaO2 = PAO2 − A–a (at least 1 mmHg)
  AcidBase acid_base;
  Fraction sao2;         // Severinghaus on the virtual PO2 (pH, base excess, temperature, P50)
};

struct Cascade {
  Pressure barometric;
  Pressure inspired;
  // lowest: high PaCO2 and wide A–a; middle: both mid; highest: low PaCO2 and narrow A–a.
  CascadePath lowest, middle, highest;
  bool paco2_extrapolated = false;
};

// Refused (a message, never a number) when PiO2 is below 35 mmHg, when a path's alveolar PO2 is
// at or below zero, or its arterial PO2 below 1 mmHg (acute exposure with PiO2 below ~41 mmHg).
Result<Cascade> oxygen_cascade(const CascadeInputs& inputs);

}  // namespace firn::cascade
