// Supplemental oxygen: device FiO2, predicted SpO2 and lowest flow for a target.
#include <catch2/catch.hpp>

#include <cmath>

#include "model/atmosphere.hpp"
#include "model/supplemental_oxygen.hpp"
#include "sweep.hpp"

using namespace firn;
using namespace firn::units;
using namespace firn::supplemental_oxygen;

namespace {
Pressure west(double metres_value) {
  return atmosphere::pressure_at(metres(metres_value), atmosphere::Model::West1996).value();
}
double fio2(Device d, double lpm) { return delivered_fio2(d, litres_per_minute(lpm))->in(fraction); }
}  // namespace

TEST_CASE("device FiO2 rules of thumb", "[oxygen]") {
  // Rules of thumb, common practice: cannula +0.04 per L/min from 0.21 to ~0.45 at 6 L/min;
  // simple mask 5–10 L/min → 0.35–0.55; non-rebreather 10–15 L/min → 0.6–0.9.
  CHECK(fio2(Device::NasalCannula, 1) == Approx(0.25));
  CHECK(fio2(Device::NasalCannula, 6) == Approx(0.45));
  CHECK(fio2(Device::SimpleMask, 5) == Approx(0.35));
  CHECK(fio2(Device::SimpleMask, 10) == Approx(0.55));
  CHECK(fio2(Device::NonRebreather, 10) == Approx(0.60));
  CHECK(fio2(Device::NonRebreather, 15) == Approx(0.90));
  CHECK(fio2(Device::SimpleMask, 7.5) == Approx(0.45));
}

TEST_CASE("flows outside a device's range are errors", "[oxygen][errors]") {
  Result<Fraction> cannula = delivered_fio2(Device::NasalCannula, litres_per_minute(8));
  REQUIRE_FALSE(cannula.ok());
  CHECK(cannula.error().message ==
        "oxygen flow for a nasal cannula must be between 0.5 and 6 L/min (got 8 L/min)");
  CHECK_FALSE(delivered_fio2(Device::SimpleMask, litres_per_minute(3)).ok());
  CHECK_FALSE(delivered_fio2(Device::NonRebreather, litres_per_minute(NAN)).ok());
  CHECK_FALSE(parse_device("tent").ok());
  CHECK(parse_device("non-rebreather").value() == Device::NonRebreather);
}

TEST_CASE("oxygen raises predicted SpO2 and more flow raises it more", "[oxygen][property]") {
  Pressure pb = west(5000);
  double previous = 0;
  for (double lpm = 0.5; lpm <= 6.0; lpm += 0.5) {
    Result<Prediction> p = predict(pb, Exposure::Acute, Device::NasalCannula, litres_per_minute(lpm));
    REQUIRE(p.ok());
    CHECK(p->spo2.mid.in(percent) > previous);
    previous = p->spo2.mid.in(percent);
  }
  // At 5000 m acute (~73 % on air, Botella 2005) 2 L/min by cannula (FiO2 ~0.29) brings the
  // middle of the band above the WMS target of 90 % (Luks 2019): cascade physics.
  CHECK(predict(pb, Exposure::Acute, Device::NasalCannula, litres_per_minute(2))->spo2.mid.in(percent) >
        90.0);
}

TEST_CASE("lowest flow for the WMS target", "[oxygen][target]") {
  // WMS guidelines (Luks AM et al., Wilderness Environ Med 2019): target SpO2 > 90 %.
  Result<FlowForTarget> f = lowest_flow_for_target(west(5000), Exposure::Acute, Device::NasalCannula);
  REQUIRE(f.ok());
  CHECK(f->reachable);
  CHECK_FALSE(f->reached_on_air);
  CHECK(f->at_flow.spo2.low.in(percent) >= 90.0);
  // Half a litre less does not reach it (it is the lowest 0.5 L/min step).
  double lpm = f->flow.in(litres_per_minute);
  CHECK(std::fmod(lpm * 2.0, 1.0) == Approx(0.0).margin(1e-9));
  if (lpm > 0.5) {
    CHECK(predict(west(5000), Exposure::Acute, Device::NasalCannula, litres_per_minute(lpm - 0.5))
              ->spo2.low.in(percent) < 90.0);
  }
  // At sea level no oxygen is needed for a healthy person: the device minimum, flagged.
  Result<FlowForTarget> sea = lowest_flow_for_target(west(0), Exposure::Acute, Device::SimpleMask);
  REQUIRE(sea.ok());
  CHECK(sea->reached_on_air);
  CHECK(sea->flow.in(litres_per_minute) == Approx(5.0));
  // A target a cannula cannot reach high up: "not reachable", with the best it can do.
  Result<FlowForTarget> no = lowest_flow_for_target(hectopascals(330), Exposure::Acute,
                                                    Device::NasalCannula, percent(98));
  REQUIRE(no.ok());
  CHECK_FALSE(no->reachable);
  CHECK(no->flow.in(litres_per_minute) == Approx(6.0));
  CHECK(no->at_flow.spo2.low.in(percent) < 98.0);
  CHECK_FALSE(lowest_flow_for_target(west(4000), Exposure::Acute, Device::NasalCannula, percent(100)).ok());
}

TEST_CASE("sweep: every device over its flows, pressures and targets", "[oxygen][sweep]") {
  for (Device d : {Device::NasalCannula, Device::SimpleMask, Device::NonRebreather}) {
    FlowRange range = valid_flows(d);
    double previous = 0.0;
    for (double lpm : sweep::grid(range.low.in(litres_per_minute), range.high.in(litres_per_minute), 50)) {
      Result<Fraction> f = delivered_fio2(d, litres_per_minute(lpm));
      REQUIRE(f.ok());
      CHECK(f->in(fraction) >= 0.21);  // never less than air
      CHECK(f->in(fraction) <= 0.90);
      CHECK(f->in(fraction) > previous);
      previous = f->in(fraction);
    }
    // Prediction and lowest flow over PB 100…1300 hPa and targets 80…99 %. Where the device's
    // lowest FiO2 still gives PiO2 < 35 mmHg the cascade refuses (its documented range).
    for (Exposure exposure : {Exposure::Acute, Exposure::Acclimatised}) {
      for (double pb : sweep::grid(100, 1300, 24)) {
        INFO(device_key(d) << " at PB " << pb << " hPa");
        for (double lpm : sweep::grid(range.low.in(litres_per_minute), range.high.in(litres_per_minute), 4)) {
          Result<Prediction> p = predict(hectopascals(pb), exposure, d, litres_per_minute(lpm));
          if (!p.ok()) {  // the cascade's documented refusals (expected_spo2.hpp)
            CHECK_THAT(p.error().message, Catch::Contains("inspired PO2") || Catch::Contains("arterial PO2"));
            continue;
          }
          CHECK(p->spo2.low.in(percent) >= 0.0);
          CHECK(p->spo2.high.in(percent) <= 100.0);
          CHECK(p->spo2.low <= p->spo2.high);
        }
        for (double target : sweep::grid(80, 99, 4)) {
          Result<FlowForTarget> t = lowest_flow_for_target(hectopascals(pb), exposure, d, percent(target));
          // Devices never give less than air, so where air is inside the cascade's range (PiO2
          // ≥ 35 mmHg, ≥ 41 acute) all succeed.
          double air_pio2 = 0.2095 * (hectopascals(pb).in(mmhg) - 47.0);
          if (air_pio2 >= (exposure == Exposure::Acute ? 41.0 : 35.0)) REQUIRE(t.ok());
          if (!t.ok()) {
            CHECK_THAT(t.error().message, Catch::Contains("inspired PO2") || Catch::Contains("arterial PO2"));
            continue;
          }
          CHECK(t->flow >= range.low);
          CHECK(t->flow <= range.high);
          if (t->reachable) CHECK(t->at_flow.spo2.low.in(percent) >= target - 1e-9);
        }
      }
    }
  }
}

TEST_CASE("sweep: just outside every oxygen range the message names it", "[oxygen][sweep][errors]") {
  CHECK_REFUSED_NAMING(delivered_fio2(Device::NasalCannula, litres_per_minute(0.49)), "between 0.5 and 6 L/min");
  CHECK_REFUSED_NAMING(delivered_fio2(Device::NasalCannula, litres_per_minute(6.01)), "between 0.5 and 6 L/min");
  CHECK_REFUSED_NAMING(delivered_fio2(Device::SimpleMask, litres_per_minute(4.99)), "between 5 and 10 L/min");
  CHECK_REFUSED_NAMING(delivered_fio2(Device::SimpleMask, litres_per_minute(10.01)), "between 5 and 10 L/min");
  CHECK_REFUSED_NAMING(delivered_fio2(Device::NonRebreather, litres_per_minute(9.99)), "between 10 and 15 L/min");
  CHECK_REFUSED_NAMING(delivered_fio2(Device::NonRebreather, litres_per_minute(15.01)), "between 10 and 15 L/min");
  CHECK_REFUSED_NAMING(predict(hectopascals(99.99), Exposure::Acute, Device::SimpleMask, litres_per_minute(6)),
                       "between 100 and 1300 hPa");
  CHECK_REFUSED_NAMING(predict(hectopascals(1300.01), Exposure::Acute, Device::SimpleMask, litres_per_minute(6)),
                       "between 100 and 1300 hPa");
  CHECK_REFUSED_NAMING(lowest_flow_for_target(west(4000), Exposure::Acute, Device::NasalCannula, percent(79.99)),
                       "between 80 and 99 %");
  CHECK_REFUSED_NAMING(lowest_flow_for_target(west(4000), Exposure::Acute, Device::NasalCannula, percent(99.01)),
                       "between 80 and 99 %");
}

TEST_CASE("minute ventilation from the alveolar ventilation equation", "[oxygen][fio2-altitude]") {
  // VA (BTPS) = 0.863 · VCO2 (mL/min STPD) / PaCO2 (physiology texts); VCO2 0.20 L/min at rest
  // and dead-space ventilation 2 L/min (from memory): at PaCO2 40 mmHg VE = 4.3 + 2 = 6.3 L/min,
  // the textbook resting ~6 L/min.
  CHECK(minute_ventilation(mmhg(40), Breathing::Rest)->in(litres_per_minute) ==
        Approx(0.863 * 200 / 40 + 2.0));
  CHECK(minute_ventilation(mmhg(30), Breathing::Rest)->in(litres_per_minute) >
        minute_ventilation(mmhg(40), Breathing::Rest)->in(litres_per_minute));
  CHECK(minute_ventilation(mmhg(40), Breathing::Distress)->in(litres_per_minute) ==
        Approx(3.0 * (0.863 * 200 / 40 + 2.0)));
  CHECK_REFUSED_NAMING(minute_ventilation(mmhg(4), Breathing::Rest), "between 5 and 80 mmHg");
  CHECK(parse_breathing("distress").value() == Breathing::Distress);
  CHECK_FALSE(parse_breathing("panting").ok());
}

TEST_CASE("FiO2 at altitude: free-gas litres expand, ventilation dilutes", "[oxygen][fio2-altitude]") {
  // Flowmeters pass sea-level litres, which expand by P0/P at altitude (Boyle's law); at rest a
  // setting gives the same or a higher FiO2 than at sea level, only a high minute ventilation a
  // lower one (issue 11 §4; derivation in docs/expected-spo2.md §7).
  const Acclimatisation acute{0.0};
  auto at = [&](double metres_value, Device d, double lpm, Breathing b) {
    return delivered_fio2_at(d, litres_per_minute(lpm), west(metres_value), acute, b).value();
  };
  // Sea level at rest: the rule of thumb itself (West 1996 sea level 759.5 Torr ≈ 1012.6 hPa).
  CHECK(at(0, Device::NasalCannula, 2, Breathing::Rest).fio2.in(fraction) == Approx(0.29).margin(0.002));
  // 4500 m, cannula 2 L/min: P0/P ≈ 1.70 (West 1996), VE ≈ 7.1 L/min at PaCO2 34: excess
  // 0.08 × 1.70 × 6.3/7.1 ≈ 0.12 → FiO2 ≈ 0.33, above the sea-level 0.29.
  DeliveredFio2 rest = at(4500, Device::NasalCannula, 2, Breathing::Rest);
  CHECK(rest.expansion == Approx(1013.25 / west(4500).in(hectopascals)));
  CHECK(rest.fio2.in(fraction) > rest.sea_level_rule.in(fraction));
  CHECK(rest.fio2.in(fraction) == Approx(0.2095 + 0.08 * rest.expansion * 6.315 /
                                                      rest.ventilation.in(litres_per_minute)));
  CHECK(rest.for_planning() == rest.sea_level_rule);
  DeliveredFio2 distress = at(4500, Device::NasalCannula, 2, Breathing::Distress);
  CHECK(distress.fio2.in(fraction) < distress.sea_level_rule.in(fraction));
  CHECK(distress.for_planning() == distress.fio2);
  // Never above the device's highest rule-of-thumb FiO2, never below air, rest never below the
  // rule: over altitude 0…8000 m, every device and flow.
  for (Device d : {Device::NasalCannula, Device::SimpleMask, Device::NonRebreather}) {
    FlowRange r = valid_flows(d);
    double ceiling = delivered_fio2(d, r.high)->in(fraction);
    for (double h : sweep::grid(0, 8000, 16)) {
      for (double lpm : sweep::grid(r.low.in(litres_per_minute), r.high.in(litres_per_minute), 5)) {
        INFO(device_key(d) << " " << lpm << " L/min at " << h << " m");
        DeliveredFio2 x = at(h, d, lpm, Breathing::Rest);
        CHECK(x.fio2.in(fraction) <= ceiling + 1e-12);
        CHECK(x.fio2.in(fraction) >= x.sea_level_rule.in(fraction) - 0.001);
        DeliveredFio2 y = at(h, d, lpm, Breathing::Distress);
        CHECK(y.fio2.in(fraction) >= 0.2095);
        CHECK(y.fio2 <= x.fio2);
      }
    }
  }
  // Planning in distress asks for at least the flow the rule gives.
  Result<FlowForTarget> calm = lowest_flow_for_target(west(5000), acute, Device::NasalCannula,
                                                      percent(90), Breathing::Rest);
  Result<FlowForTarget> breathless = lowest_flow_for_target(west(5000), acute, Device::NasalCannula,
                                                            percent(90), Breathing::Distress);
  REQUIRE(calm.ok());
  REQUIRE(breathless.ok());
  CHECK(breathless->flow >= calm->flow);
}
