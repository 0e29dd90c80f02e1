#include "bench_cases.hpp"

#include "model/cylinder.hpp"
#include "model/dissociation.hpp"
#include "model/evacuation_plan.hpp"
#include "model/expected_spo2.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_eos.hpp"

namespace firn::bench {

using namespace units;

std::vector<Case> model_cases() {
  return {
      {"dissociation::Curve::saturation", 1000000,
       [curve = dissociation::Curve::standard()](int i) {
         return curve.saturation(mmhg(20 + i % 80)).in(percent);
       }},
      {"expected_spo2::expected (acute)", 100000,
       [](int i) {
         return expected_spo2::expected(hectopascals(450 + i % 400), cascade::Exposure::Acute)
             ->band.mid.in(percent);
       }},
      {"oxygen_eos::compressibility", 100000,
       [](int i) { return oxygen_eos::compressibility(celsius(-20 + i % 60), bar(1 + i % 300)).value(); }},
      {"cylinder::duration", 100000,
       [](int i) {
         cylinder::Reading r{litres(10), bar(50 + i % 150)};
         return cylinder::duration(r, bar(10), litres_per_minute(6))->to_reserve.in(minutes);
       }},
      {"hyperbaric_bag::bag_at_altitude", 100000,
       [](int i) {
         return hyperbaric_bag::bag_at_altitude(metres(2500 + i % 3000), atmosphere::Model::West1996, {})
             ->inside_pressure.in(hectopascals);
       }},
      {"evacuation::plan_evacuation (4 cyl, 6 h)", 1000,
       [](int i) {
         evacuation::PlanInput input;
         for (int c = 0; c < 4; ++c) {
           input.cylinders.push_back({"cyl", std::nullopt, litres(10), bar(180 + i % 20)});
         }
         input.phases = {{litres_per_minute(15), hours(1)}, {litres_per_minute(6), hours(1)}};
         input.evacuation = hours(6);
         return evacuation::plan_evacuation(input)->uses.size() * 1.0;
       }},
  };
}

}  // namespace firn::bench
