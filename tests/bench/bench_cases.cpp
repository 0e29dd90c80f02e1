#include "bench_cases.hpp"

#include "model/cylinder.hpp"
#include "model/dissociation.hpp"
#include "model/evacuation_plan.hpp"
#include "model/expected_spo2.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/oxygen_eos.hpp"
#include "profile/pocket_card.hpp"
#include "profile/team_profile.hpp"

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
         cylinder::Reading r{litres(10), bar.gauge(50 + i % 150)};
         return cylinder::duration(r, bar.gauge(10), litres_per_minute(6))->to_reserve.in(minutes);
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
           input.cylinders.push_back({"cyl", std::nullopt, litres(10), bar.gauge(180 + i % 20)});
         }
         input.phases = {{litres_per_minute(15), hours(1)}, {litres_per_minute(6), hours(1)}};
         input.evacuation = hours(6);
         return evacuation::plan_evacuation(input)->uses.size() * 1.0;
       }},
  };
}

std::vector<Task> task_cases() {
  return {
      // What `firn card` does for the demo profile: every figure, the A6 HTML and each table's
      // CSV (the profile is parsed from its JSON text each time, as the CLI reads a file).
      {"pocket card, demo profile (build + A6 HTML + CSV)",
       [] {
         Result<team_profile::TeamProfile> profile =
             team_profile::parse_profile(team_profile::demo_profile_json());
         pocket_card::Card card = pocket_card::build_card(profile.value(), "2026-01-31");
         std::size_t bytes = pocket_card::render_html(card, pocket_card::Size::A6).size();
         for (const pocket_card::Table& table : card.tables) bytes += pocket_card::table_csv(table).size();
         return static_cast<double>(bytes);
       }},
      // What `firn oxygenation --altitude X` computes, 10 000 times over 0–8800 m, both
      // exposures: the pressure (West 1996), the whole cascade and the expected SpO2 band.
      {"10 000 oxygenation evaluations",
       [] {
         double total = 0.0;
         for (int i = 0; i < 10000; ++i) {
           Result<Pressure> pb = atmosphere::pressure_at(metres(i % 8800), atmosphere::default_medical_model);
           auto exposure = i % 2 ? cascade::Exposure::Acclimatised : cascade::Exposure::Acute;
           Result<expected_spo2::Expectation> e = expected_spo2::expected(pb.value(), exposure);
           if (e) total += e->band.mid.in(percent);
         }
         return total;
       }},
  };
}

}  // namespace firn::bench
