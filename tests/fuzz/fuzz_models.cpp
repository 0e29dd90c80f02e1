// Fuzz target: every core model's entry points with finite AND non-finite doubles (NaN, ±inf,
// huge, tiny, negative, just past each boundary). The first byte picks the entry point; the rest
// feeds its arguments (fuzz_checks.hpp: awkward_double).
// Invariants: no crash, FIRN_ASSERT or sanitizer report; an error has a message naming something
// (never "nan"); every number in a success value is finite and physically plausible
// (model_checks.hpp); inverse functions give back what went in.
#include <cmath>
#include <string>

#include "fuzz_checks.hpp"
#include "model_checks.hpp"
#include "model/atmosphere.hpp"
#include "profile/team_profile.hpp"

using namespace firn;
using namespace firn::units;
using fuzz::awkward_double;

namespace {

atmosphere::Model any_model(FuzzedDataProvider& d) {
  return d.ConsumeBool() ? atmosphere::Model::Isa : atmosphere::Model::West1996;
}
cascade::Exposure any_exposure(FuzzedDataProvider& d) {
  return d.ConsumeBool() ? cascade::Exposure::Acute : cascade::Exposure::Acclimatised;
}
supplemental_oxygen::Device any_device(FuzzedDataProvider& d) {
  static constexpr supplemental_oxygen::Device devices[] = {
      supplemental_oxygen::Device::NasalCannula, supplemental_oxygen::Device::SimpleMask,
      supplemental_oxygen::Device::NonRebreather};
  return d.PickValueInArray(devices);
}
cylinder::LetterSize any_size(FuzzedDataProvider& d) {
  static constexpr cylinder::LetterSize sizes[] = {cylinder::LetterSize::D, cylinder::LetterSize::E,
                                                   cylinder::LetterSize::M, cylinder::LetterSize::H};
  return d.PickValueInArray(sizes);
}

template <class T, class Check>
void check(const Result<T>& r, const char* what, Check c, bool message_may_echo_input = false) {
  fuzz::check_result(r, what, c, message_may_echo_input);
}

void atmosphere_calls(FuzzedDataProvider& d, int which) {
  atmosphere::Model model = any_model(d);
  switch (which) {
    case 0: {
      Length z = metres(awkward_double(d, -600, 21000));
      Result<Pressure> p = atmosphere::pressure_at(z, model);
      check(p, "pressure_at", [&](Pressure v) {
        fuzz::require_positive(v, "pressure_at");
        Result<Length> back = atmosphere::altitude_at(v, model);
        fuzz::require(back.ok(), "altitude_at refuses what pressure_at gave");
        fuzz::require(std::fabs(back->in(metres) - z.in(metres)) < 0.01, "altitude_at ∘ pressure_at");
      });
      break;
    }
    case 1:
      check(atmosphere::altitude_at(hectopascals(awkward_double(d, 40, 1100)), model), "altitude_at",
            [](Length v) { fuzz::require_finite(v, "altitude_at"); });
      break;
    case 2:
      check(atmosphere::pressure_from_qnh(metres(awkward_double(d, -500, 9000)),
                                          hectopascals(awkward_double(d, 900, 1100))),
            "pressure_from_qnh", [](Pressure v) { fuzz::require_positive(v, "pressure_from_qnh"); });
      break;
    case 3: {
      Length z = metres(awkward_double(d, -500, 9000));
      Pressure qnh = hectopascals(awkward_double(d, 900, 1100));
      Temperature t = celsius(awkward_double(d, -60, 50));
      auto where = d.ConsumeBool() ? atmosphere::TemperatureAt::SeaLevel : atmosphere::TemperatureAt::Station;
      check(atmosphere::pressure_from_qnh(z, qnh, t, where), "pressure_from_qnh(T)",
            [](Pressure v) { fuzz::require_positive(v, "pressure_from_qnh(T)"); });
      break;
    }
    default:
      check(atmosphere::pressure_from_station_reading(hectopascals(awkward_double(d, 150, 1100))),
            "pressure_from_station_reading",
            [](Pressure v) { fuzz::require_positive(v, "station reading"); });
      check(atmosphere::parse_model(d.ConsumeRandomLengthString(16)), "parse_model", [](auto) {}, true);
  }
}

void cascade_calls(FuzzedDataProvider& d, int which) {
  switch (which) {
    case 0:
      check(cascade::inspired_po2(hectopascals(awkward_double(d, 100, 1300)),
                                  fraction(awkward_double(d, 0.15, 1))),
            "inspired_po2", [](Pressure v) { fuzz::require_finite(v, "inspired_po2"); });
      break;
    case 1: {
      Pressure pio2 = mmhg(awkward_double(d, 0, 1000));
      Pressure paco2 = mmhg(awkward_double(d, 5, 80));
      Fraction fio2 = fraction(awkward_double(d, 0.15, 1));
      double r = awkward_double(d, 0.6, 1.2);
      check(cascade::alveolar_po2(pio2, paco2, fio2, r), "alveolar_po2",
            [](Pressure v) { fuzz::require_positive(v, "alveolar_po2"); });
      check(cascade::alveolar_po2_simplified(pio2, paco2, r), "alveolar_po2_simplified",
            [](Pressure v) { fuzz::require_positive(v, "alveolar_po2_simplified"); });
      break;
    }
    case 2: {
      Pressure pio2 = mmhg(awkward_double(d, 35, 1000));
      check(cascade::expected_paco2(pio2, any_exposure(d)), "expected_paco2",
            [](const cascade::Paco2Estimate& e) { fuzz::check_band(e.paco2, "expected_paco2"); });
      check(cascade::expected_aa_gradient(pio2), "expected_aa_gradient",
            [](const cascade::PressureBand& b) { fuzz::check_band(b, "expected_aa_gradient"); });
      break;
    }
    case 3: {
      Pressure paco2 = mmhg(awkward_double(d, 5, 80));
      check(cascade::henderson_hasselbalch_ph(awkward_double(d, 2, 60), paco2), "henderson_hasselbalch",
            [](double ph) { fuzz::require_finite(ph, "pH"); });
      auto comp = d.ConsumeBool() ? cascade::Compensation::Acute : cascade::Compensation::Chronic;
      check(cascade::compensated_acid_base(paco2, comp), "compensated_acid_base",
            [](const cascade::AcidBase& a) { fuzz::check_acid_base(a, "acid_base"); });
      break;
    }
    default: {
      cascade::CascadeInputs in;
      in.barometric = hectopascals(awkward_double(d, 100, 1300));
      in.fio2 = fraction(awkward_double(d, 0.15, 1));
      in.exposure = any_exposure(d);
      in.respiratory_quotient = awkward_double(d, 0.6, 1.2);
      if (d.ConsumeBool()) in.measured_paco2 = mmhg(awkward_double(d, 5, 80));
      in.body_temperature = celsius(awkward_double(d, 20, 43));
      in.p50 = mmhg(awkward_double(d, 15, 40));
      check(cascade::oxygen_cascade(in), "oxygen_cascade", fuzz::check_cascade);
    }
  }
}

void spo2_calls(FuzzedDataProvider& d, int which) {
  Pressure pb = hectopascals(awkward_double(d, 100, 1300));
  cascade::Exposure exposure = any_exposure(d);
  if (which == 0) {
    Fraction fio2 = d.ConsumeBool() ? cascade::dry_air_fio2() : fraction(awkward_double(d, 0.15, 1));
    check(expected_spo2::expected(pb, exposure, fio2), "expected", fuzz::check_expectation);
    return;
  }
  Result<expected_spo2::Expectation> e = expected_spo2::expected(pb, exposure);
  if (!e) return;
  check(expected_spo2::assess(percent(awkward_double(d, 30, 100)), e->band), "assess",
        fuzz::check_assessment);
}

void oxygen_calls(FuzzedDataProvider& d, int which) {
  supplemental_oxygen::Device device = any_device(d);
  Pressure pb = hectopascals(awkward_double(d, 100, 1300));
  cascade::Exposure exposure = any_exposure(d);
  switch (which) {
    case 0:
      check(supplemental_oxygen::delivered_fio2(device, litres_per_minute(awkward_double(d, 0.5, 15))),
            "delivered_fio2", [](Fraction f) { fuzz::require_saturation(f, "delivered_fio2"); });
      check(supplemental_oxygen::parse_device(d.ConsumeRandomLengthString(20)), "parse_device",
            [](auto) {}, true);
      break;
    case 1:
      check(supplemental_oxygen::predict(pb, exposure, device,
                                         litres_per_minute(awkward_double(d, 0.5, 15))),
            "predict", fuzz::check_prediction);
      break;
    default:
      check(supplemental_oxygen::lowest_flow_for_target(pb, exposure, device,
                                                        percent(awkward_double(d, 80, 99))),
            "lowest_flow_for_target", fuzz::check_flow_for_target);
  }
}

dissociation::CurveShift any_shift(FuzzedDataProvider& d) {
  dissociation::CurveShift s;
  s.temperature = celsius(awkward_double(d, 20, 43));
  s.ph = awkward_double(d, 6.8, 7.8);
  s.base_excess_mmol_l = awkward_double(d, -30, 30);
  s.p50 = mmhg(awkward_double(d, 15, 40));
  return s;
}

void dissociation_calls(FuzzedDataProvider& d, int which) {
  switch (which) {
    case 0: {
      Result<dissociation::Curve> curve = dissociation::make_curve(any_shift(d));
      check(curve, "make_curve", [&](const dissociation::Curve& c) {
        fuzz::require_finite(c.virtual_po2_factor(), "curve factor");
        fuzz::require_positive(c.p50(), "curve p50");
        double po2 = awkward_double(d, 0, 1000);
        if (!std::isnan(po2)) fuzz::require_saturation(c.saturation(mmhg(po2)), "Curve::saturation");
        double s = awkward_double(d, 0, 1);
        if (!std::isnan(s)) fuzz::require_finite(c.po2_for(fraction(s)), "Curve::po2_for");
      });
      break;
    }
    case 1: {
      dissociation::CurveShift shift = any_shift(d);
      Pressure po2 = mmhg(awkward_double(d, 0, 1000));
      check(dissociation::saturation(po2, shift), "saturation", [&](Fraction s) {
        fuzz::require_saturation(s, "saturation");
        // Inverse: below 99.9 % the exact inverse gives the PO2 back.
        if (s.in(percent) > 1e-6 && s.in(percent) < 99.9) {
          Result<Pressure> back = dissociation::po2_for_saturation(s, shift);
          fuzz::require(back.ok(), "po2_for_saturation refuses what saturation gave");
          double want = po2.in(mmhg);
          fuzz::require(std::fabs(back->in(mmhg) - want) <= 1e-6 * std::max(1.0, want),
                        "po2_for_saturation ∘ saturation");
        }
      });
      break;
    }
    case 2:
      check(dissociation::po2_for_saturation(percent(awkward_double(d, 0, 99.9)), any_shift(d)),
            "po2_for_saturation", [](Pressure p) { fuzz::require_finite(p, "po2_for_saturation"); });
      break;
    default:
      check(dissociation::severinghaus_inverse_approximation(percent(awkward_double(d, 1, 99.9))),
            "severinghaus_inverse_approximation",
            [](Pressure p) { fuzz::require_positive(p, "severinghaus_inverse_approximation"); });
  }
}

void bag_calls(FuzzedDataProvider& d) {
  hyperbaric_bag::Settings s;
  s.gauge = millibar.gauge(awkward_double(d, 0, 250));
  if (d.ConsumeBool()) s.flush = litres_per_minute(awkward_double(d, 5, 300));
  s.oxygen_feed = litres_per_minute(awkward_double(d, 0, 15));
  s.bag_volume = litres(awkward_double(d, 100, 2000));
  s.chamber_temperature = celsius(awkward_double(d, -30, 45));
  s.co2_limit = percent(awkward_double(d, 0.1, 5));
  s.vco2_stpd = litres_per_minute(awkward_double(d, 0.05, 2));
  s.vo2_stpd = litres_per_minute(awkward_double(d, 0.05, 2.5));
  if (d.ConsumeBool()) s.stroke_volume = litres(awkward_double(d, 0.1, 10));
  atmosphere::Model model = any_model(d);
  if (d.ConsumeBool()) {
    check(hyperbaric_bag::bag_at_altitude(metres(awkward_double(d, -500, 20000)), model, s),
          "bag_at_altitude", fuzz::check_bag);
  } else {
    check(hyperbaric_bag::bag_at_pressure(hectopascals(awkward_double(d, 50, 1100)), model, s),
          "bag_at_pressure", fuzz::check_bag);
  }
}

cylinder::Reading any_reading(FuzzedDataProvider& d) {
  return {litres(awkward_double(d, 0.1, 100)), bar.gauge(awkward_double(d, 0, 350)),
          celsius(awkward_double(d, -40, 60)), hectopascals(awkward_double(d, 150, 1100))};
}

void cylinder_calls(FuzzedDataProvider& d, int which) {
  switch (which) {
    case 0: {
      cylinder::Reading r = any_reading(d);
      check(cylinder::contents(r), "contents", [&](const cylinder::Contents& c) {
        fuzz::check_contents(c);
        Result<GaugePressure> back =
            cylinder::gauge_pressure_for(r.water_capacity, r.temperature, r.ambient_pressure, c.free_gas);
        fuzz::require(back.ok() || c.free_gas.in(litres) < 1e-6, "gauge_pressure_for refuses contents()");
        if (back) {
          fuzz::require(std::fabs(back->in(bar) - r.gauge_pressure.in(bar)) < 1e-3,
                        "gauge_pressure_for ∘ contents");
        }
      });
      break;
    }
    case 1: {
      cylinder::Reading r = any_reading(d);
      check(cylinder::gauge_pressure_for(r.water_capacity, r.temperature, r.ambient_pressure,
                                         litres(awkward_double(d, 0, 40000))),
            "gauge_pressure_for", [](GaugePressure p) {
              fuzz::require_non_negative(p.in(bar), "gauge_pressure_for");
            });
      break;
    }
    case 2: {
      cylinder::Reading r = any_reading(d);
      check(cylinder::duration(r, bar.gauge(awkward_double(d, 0, 350)),
                               litres_per_minute(awkward_double(d, 0.1, 30))),
            "duration", fuzz::check_duration);
      break;
    }
    case 3:
      check(cylinder::field_rule_duration(any_size(d), psi.gauge(awkward_double(d, 200, 3000)),
                                          litres_per_minute(awkward_double(d, 0.1, 30))),
            "field_rule_duration",
            [](Duration t) { fuzz::require_non_negative(t.in(minutes), "field_rule_duration"); });
      check(cylinder::parse_letter_size(d.ConsumeRandomLengthString(4)), "parse_letter_size",
            [](auto) {}, true);
      break;
    default: {
      VolumeFlow flow = litres_per_minute(awkward_double(d, 0.1, 30));
      Pressure ambient = hectopascals(awkward_double(d, 150, 1100));
      Pressure calibration = hectopascals(awkward_double(d, 500, 1100));
      check(cylinder::rotameter_at_altitude(flow, ambient, calibration), "rotameter_at_altitude",
            fuzz::check_flow_correction);
      check(cylinder::fixed_orifice_at_altitude(flow, ambient, psi.gauge(awkward_double(d, 10, 100)),
                                                calibration),
            "fixed_orifice_at_altitude", fuzz::check_flow_correction);
    }
  }
}

void eos_calls(FuzzedDataProvider& d) {
  Temperature t = celsius(awkward_double(d, -50, 65));
  Pressure p = bar(awkward_double(d, 0, 400));
  check(oxygen_eos::state_at(t, p), "state_at", fuzz::check_eos_state);
  check(oxygen_eos::compressibility(t, p), "compressibility",
        [](double z) { fuzz::require_finite(z, "compressibility"); });
}

evacuation::CylinderSpec any_spec(FuzzedDataProvider& d) {
  evacuation::CylinderSpec s;
  s.label = d.ConsumeRandomLengthString(12);
  if (d.ConsumeBool()) s.letter_size = any_size(d);
  if (d.ConsumeBool() || !s.letter_size) s.water_capacity = litres(awkward_double(d, 0.1, 100));
  s.gauge_pressure = bar.gauge(awkward_double(d, 0, 350));
  s.temperature = celsius(awkward_double(d, -40, 60));
  return s;
}

void plan_calls(FuzzedDataProvider& d) {
  evacuation::PlanInput in;
  int cylinders = d.ConsumeIntegralInRange<int>(0, 6);
  for (int i = 0; i < cylinders; ++i) in.cylinders.push_back(any_spec(d));
  int phases = d.ConsumeIntegralInRange<int>(0, 5);
  for (int i = 0; i < phases; ++i) {
    in.phases.push_back({litres_per_minute(awkward_double(d, 0, 30)),
                         minutes(awkward_double(d, 1, 4320))});
  }
  in.evacuation = minutes(awkward_double(d, 1, 4320));
  in.reserve_gauge = bar.gauge(awkward_double(d, 0, 350));
  in.ambient_pressure = hectopascals(awkward_double(d, 150, 1100));
  if (d.ConsumeBool()) in.counting_cylinder = any_spec(d);
  if (d.ConsumeBool()) in.sample_interval = minutes(awkward_double(d, 1, 60));
  check(evacuation::plan_evacuation(in), "plan_evacuation", fuzz::check_plan);
}

void lake_louise_calls(FuzzedDataProvider& d) {
  lake_louise::Answers a;
  auto item = [&] { return d.ConsumeBool() ? d.ConsumeIntegralInRange<int>(-1, 4) : d.ConsumeIntegral<int>(); };
  a.headache = item();
  a.gastrointestinal = item();
  a.fatigue = item();
  a.dizziness = item();
  a.recent_ascent = d.ConsumeBool();
  check(lake_louise::score(a), "lake_louise::score", [&](const lake_louise::Score& s) {
    fuzz::require(s.total >= 0 && s.total <= 12, "Lake Louise total outside 0-12");
    fuzz::require(s.total == a.headache + a.gastrointestinal + a.fatigue + a.dizziness,
                  "Lake Louise total is not the sum");
  });
}

// The card from the demo profile with fuzzed figures, validated through the profile reader
// first (build_card's contract is a valid profile).
void card_calls(FuzzedDataProvider& d) {
  team_profile::TeamProfile p = team_profile::demo_profile();
  p.units = d.ConsumeBool() ? team_profile::UnitSystem::Metric : team_profile::UnitSystem::Us;
  p.atmosphere_model = any_model(d);
  p.card.altitude_from = metres(awkward_double(d, 0, 9000));
  p.card.altitude_to = metres(awkward_double(d, 0, 9000));
  p.card.altitude_step = metres(awkward_double(d, 50, 1000));
  p.reserve_pressure_gauge = bar.gauge(awkward_double(d, 0, 100));
  for (auto& c : p.cylinders) c.fill_pressure_gauge = bar.gauge(awkward_double(d, 50, 300));
  for (auto& f : p.flows) f = litres_per_minute(awkward_double(d, 0.25, 25));
  p.bag.gauge_pressure = hectopascals.gauge(awkward_double(d, 50, 250));
  p.bag.pump_stroke_volume = litres(awkward_double(d, 0.1, 10));
  p.bag.co2_limit = percent(awkward_double(d, 0.2, 3));
  Result<team_profile::TeamProfile> valid = team_profile::parse_profile(team_profile::serialize_profile(p));
  if (!valid) {
    fuzz::require(!valid.error().message.empty(), "profile error without message");
    return;
  }
  pocket_card::Card card = pocket_card::build_card(valid.value(), "2025-01-31");
  fuzz::check_card(card, true);
  fuzz::require_clean_text(pocket_card::render_html(card, pocket_card::Size::Wallet), "card HTML");
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* bytes, size_t size) {
  FuzzedDataProvider d(bytes, size);
  int entry = d.ConsumeIntegralInRange<int>(0, 28);
  if (entry < 5) atmosphere_calls(d, entry);
  else if (entry < 10) cascade_calls(d, entry - 5);
  else if (entry < 12) spo2_calls(d, entry - 10);
  else if (entry < 15) oxygen_calls(d, entry - 12);
  else if (entry < 19) dissociation_calls(d, entry - 15);
  else if (entry < 20) bag_calls(d);
  else if (entry < 25) cylinder_calls(d, entry - 20);
  else if (entry == 25) eos_calls(d);
  else if (entry == 26) lake_louise_calls(d);
  else if (entry == 27) plan_calls(d);
  else card_calls(d);
  return 0;
}
