// Checks of every numeric field each model returns: finite, and physically plausible where the
// physics says so (pressures positive, saturations 0–100 %, times ordered). Shared by the model
// and the profile fuzz targets.
#pragma once

#include <string>

#include "fuzz_checks.hpp"
#include "model/cylinder.hpp"
#include "model/dissociation.hpp"
#include "model/evacuation_plan.hpp"
#include "model/expected_spo2.hpp"
#include "model/hyperbaric_bag.hpp"
#include "model/lake_louise.hpp"
#include "model/oxygen_cascade.hpp"
#include "model/oxygen_eos.hpp"
#include "profile/pocket_card.hpp"
#include "model/supplemental_oxygen.hpp"

namespace firn::fuzz {

using namespace units;

inline void require_positive(Pressure p, const std::string& what) {
  require_finite(p, what);
  require(p.in(pascals) > 0.0, what + " is not positive");
}

inline void require_saturation(Fraction f, const std::string& what) {
  require_finite(f, what);
  require(f.in(percent) >= 0.0 && f.in(percent) <= 100.0, what + " outside 0-100 %");
}

inline void require_non_negative(double value, const std::string& what) {
  require_finite(value, what);
  require(value >= 0.0, what + " is negative");
}

inline void check_band(const cascade::PressureBand& b, const std::string& what) {
  require_finite(b.low, what + ".low");
  require_finite(b.mid, what + ".mid");
  require_finite(b.high, what + ".high");
  require(b.low <= b.mid && b.mid <= b.high, what + " edges out of order");
}

inline void check_acid_base(const cascade::AcidBase& a, const std::string& what) {
  require_finite(a.bicarbonate_mmol_l, what + ".bicarbonate");
  require_finite(a.ph, what + ".ph");
  require_finite(a.base_excess_mmol_l, what + ".base_excess");
}

inline void check_path(const cascade::CascadePath& p, const std::string& what) {
  require_positive(p.paco2, what + ".paco2");
  require_positive(p.alveolar, what + ".alveolar");
  require_finite(p.aa_gradient, what + ".aa_gradient");
  require(p.arterial.in(mmhg) >= 1.0, what + ".arterial below 1 mmHg");
  require_finite(p.arterial, what + ".arterial");
  check_acid_base(p.acid_base, what + ".acid_base");
  require_saturation(p.sao2, what + ".sao2");
}

inline void check_cascade(const cascade::Cascade& c) {
  require_positive(c.barometric, "cascade.barometric");
  require_positive(c.inspired, "cascade.inspired");
  check_path(c.lowest, "cascade.lowest");
  check_path(c.middle, "cascade.middle");
  check_path(c.highest, "cascade.highest");
  // Lowest path: high PaCO2 and wide A–a, so never more oxygen than the highest path.
  require(c.lowest.sao2 <= c.highest.sao2, "cascade paths out of order");
}

inline void check_spo2_band(const expected_spo2::Band& b, const std::string& what) {
  require_saturation(b.low, what + ".low");
  require_saturation(b.mid, what + ".mid");
  require_saturation(b.high, what + ".high");
  require(b.low <= b.mid && b.mid <= b.high, what + " edges out of order");
}

inline void check_expectation(const expected_spo2::Expectation& e) {
  check_spo2_band(e.band, "expected SpO2 band");
  check_cascade(e.cascade);
}

inline void check_assessment(const expected_spo2::Assessment& a) {
  require_finite(a.gap_points, "assessment.gap_points");
  require(!a.cautions.empty(), "assessment without cautions");
}

inline void check_prediction(const supplemental_oxygen::Prediction& p) {
  require_saturation(p.fio2, "prediction.fio2");
  check_spo2_band(p.spo2, "prediction.spo2");
}

inline void check_flow_for_target(const supplemental_oxygen::FlowForTarget& f) {
  require_non_negative(f.flow.in(litres_per_minute), "flow_for_target.flow");
  check_prediction(f.at_flow);
}

inline void check_bag(const hyperbaric_bag::BagResult& r) {
  require_positive(r.ambient_pressure, "bag.ambient_pressure");
  require_finite(r.ambient_altitude, "bag.ambient_altitude");
  require_positive(r.inside_pressure, "bag.inside_pressure");
  require(r.inside_pressure >= r.ambient_pressure, "bag inside below ambient");
  if (r.equivalent_altitude) require_finite(*r.equivalent_altitude, "bag.equivalent_altitude");
  if (r.pressure_equivalent_altitude) {
    require_finite(*r.pressure_equivalent_altitude, "bag.pressure_equivalent_altitude");
  }
  if (r.oxygen_equivalent_altitude) {
    require_finite(*r.oxygen_equivalent_altitude, "bag.oxygen_equivalent_altitude");
  }
  // A descent only when the inside is better than outside, and never negative.
  if (r.descent_equivalent) {
    require(r.equivalent_altitude.has_value(), "bag: descent without equivalent altitude");
    require_finite(*r.descent_equivalent, "bag.descent_equivalent");
    require(r.descent_equivalent->in(metres) >= -1e-6, "bag: negative descent equivalent");
    require(r.pio2_inside > r.pio2_ambient, "bag: descent with the inside no better");
  }
  if (r.required_flush) require_non_negative(r.required_flush->in(litres_per_minute), "bag.required_flush");
  if (r.required_flush_strokes_per_minute) {
    require_non_negative(*r.required_flush_strokes_per_minute, "bag.required_flush_strokes");
  }
  require_clean_text(hyperbaric_bag::verdict_text(r, metres), "bag verdict");
  require_clean_text(hyperbaric_bag::flush_more_reason(r), "bag reason");
  require_clean_text(hyperbaric_bag::fire_caution_text(r), "bag fire caution");
  require_saturation(r.inside_o2, "bag.inside_o2");
  require_positive(r.pio2_ambient, "bag.pio2_ambient");
  require_positive(r.pio2_inside, "bag.pio2_inside");
  if (r.gas) {
    require_saturation(r.gas->co2, "bag.gas.co2");
    require_saturation(r.gas->o2, "bag.gas.o2");
    require_non_negative(r.gas->time_constant.in(minutes), "bag.gas.time_constant");
    require_non_negative(r.gas->vco2_in_chamber.in(litres_per_minute), "bag.gas.vco2");
    require_non_negative(r.gas->flush_ambient_air.in(litres_per_minute), "bag.gas.flush_ambient");
    if (r.gas->strokes_per_minute) require_non_negative(*r.gas->strokes_per_minute, "bag.gas.strokes");
  }
  require_non_negative(r.min_flush.in(litres_per_minute), "bag.min_flush");
  if (r.min_flush_strokes_per_minute) {
    require_non_negative(*r.min_flush_strokes_per_minute, "bag.min_flush_strokes");
  }
  for (const std::string& note : r.notes) require_clean_text(note, "bag note");
}

inline void check_contents(const cylinder::Contents& c) {
  require_non_negative(c.free_gas.in(litres), "contents.free_gas");
  require_non_negative(c.ideal_free_gas.in(litres), "contents.ideal_free_gas");
  require_finite(c.z_in_cylinder, "contents.z_in_cylinder");
  require(c.z_in_cylinder > 0.0, "contents.z_in_cylinder not positive");
  require_finite(c.z_reference, "contents.z_reference");
  require_positive(c.absolute_pressure, "contents.absolute_pressure");
}

inline void check_duration(const cylinder::DurationEstimate& d) {
  require_non_negative(d.to_reserve.in(minutes), "duration.to_reserve");
  require_non_negative(d.usable_free_gas.in(litres), "duration.usable_free_gas");
  require_non_negative(d.reserve_free_gas.in(litres), "duration.reserve_free_gas");
  check_contents(d.contents);
}

inline void check_flow_correction(const cylinder::FlowCorrection& c) {
  require_non_negative(c.set_flow.in(litres_per_minute), "correction.set_flow");
  require_non_negative(c.actual_at_ambient.in(litres_per_minute), "correction.actual_at_ambient");
  require_non_negative(c.actual_free_gas.in(litres_per_minute), "correction.actual_free_gas");
  require_non_negative(c.ratio, "correction.ratio");
  require_clean_text(c.explanation, "correction.explanation");
}

inline void check_eos_state(const oxygen_eos::State& s) {
  require_finite(s.compressibility, "eos.compressibility");
  require(s.compressibility > 0.0, "eos.compressibility not positive");
  require_finite(s.molar_density_mol_per_m3, "eos.density");
  require(s.molar_density_mol_per_m3 > 0.0, "eos.density not positive");
  require(s.iterations >= 1, "eos: no iteration");
}

inline void check_plan(const evacuation::EvacuationPlan& p) {
  double previous = 0.0;
  for (const auto& use : p.uses) {
    require_non_negative(use.start.in(minutes), "plan use start");
    require_finite(use.end, "plan use end");
    require(use.end >= use.start, "plan use ends before it starts");
    require(use.start.in(minutes) >= previous - 1e-9, "plan uses out of time order");
    previous = use.start.in(minutes);
    require_non_negative(use.start_gauge.in(bar), "plan use start gauge");
    require_non_negative(use.end_gauge.in(bar), "plan use end gauge");
    require_non_negative(use.delivered.in(litres) + 1e-9, "plan use delivered");
    require_clean_text(use.label, "plan use label");
  }
  previous = 0.0;
  for (const auto& e : p.events) {
    require_non_negative(e.time.in(minutes), "plan event time");
    require(e.time.in(minutes) >= previous - 1e-9, "plan events out of time order");
    previous = e.time.in(minutes);
  }
  previous = 0.0;
  for (const auto& s : p.samples) {
    require_non_negative(s.time.in(minutes), "plan sample time");
    require(s.time.in(minutes) >= previous - 1e-9, "plan samples out of time order");
    previous = s.time.in(minutes);
    require_non_negative(s.gauge.in(bar), "plan sample gauge");
    require_non_negative(s.flow.in(litres_per_minute), "plan sample flow");
  }
  require_non_negative(p.oxygen_needed.in(litres), "plan.oxygen_needed");
  require_non_negative(p.oxygen_usable.in(litres), "plan.oxygen_usable");
  if (p.supply_lasts) require_non_negative(p.supply_lasts->in(minutes), "plan.supply_lasts");
  require_non_negative(p.shortfall.in(minutes), "plan.shortfall");
  require_non_negative(p.spare.in(minutes), "plan.spare");
  require_non_negative(p.shortfall_volume.in(litres), "plan.shortfall_volume");
  require_non_negative(p.spare_volume.in(litres) + 1e-9, "plan.spare_volume");
  require_non_negative(p.counting_cylinder_usable.in(litres), "plan.counting_cylinder_usable");
  require(p.extra_cylinders_needed >= 0, "plan.extra_cylinders_needed negative");
  require_non_negative(p.spare_cylinders + 1e-12, "plan.spare_cylinders");
  require(p.enough == (p.shortfall.in(minutes) == 0.0), "plan: enough disagrees with shortfall");
  for (const std::string& a : p.assumptions) require_clean_text(a, "plan assumption");
}

inline void check_card(const pocket_card::Card& card, bool check_texts) {
  for (const auto& row : card.altitudes) {
    require_finite(row.altitude, "card altitude");
    if (row.pb_west) require_positive(*row.pb_west, "card pb_west");
    if (row.pb_isa) require_positive(*row.pb_isa, "card pb_isa");
    if (row.pio2) require_finite(*row.pio2, "card pio2");
    if (row.spo2_acute) check_spo2_band(*row.spo2_acute, "card spo2 acute");
    if (row.spo2_acclimatised) check_spo2_band(*row.spo2_acclimatised, "card spo2 acclimatised");
    if (row.bag_inside) require_positive(*row.bag_inside, "card bag inside");
    if (row.bag_equivalent) require_finite(*row.bag_equivalent, "card bag equivalent");
    if (row.bag_min_flush) require_non_negative(row.bag_min_flush->in(litres_per_minute), "card flush");
    if (row.bag_min_flush_strokes) require_non_negative(*row.bag_min_flush_strokes, "card strokes");
  }
  for (const auto& row : card.durations) {
    require_finite(row.water_capacity, "card water capacity");
    require_finite(row.fill_gauge, "card fill gauge");
    for (const auto& cell : row.by_flow) {
      if (cell.full) require_non_negative(cell.full->in(minutes), "card duration full");
      if (cell.half) require_non_negative(cell.half->in(minutes), "card duration half");
      require(cell.full.has_value() || !cell.full_note.empty(), "card: empty cell without note");
      require(cell.half.has_value() || !cell.half_note.empty(), "card: empty cell without note");
    }
  }
  if (!check_texts) return;  // the team's own text may say "nan"; then only numbers are checked
  for (const auto& table : card.tables) {
    for (const auto& row : table.rows) {
      for (const std::string& cell : row) require_clean_text(cell, "card cell");
    }
    for (const std::string& h : table.header) require_clean_text(h, "card heading");
    for (const std::string& f : table.footnotes) require_clean_text(f, "card footnote");
  }
}

}  // namespace firn::fuzz
