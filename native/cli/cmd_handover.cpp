// `firn handover`: the handover summary of a casualty record file (docs/incident-record.md).
#include <memory>

#include "cli/cli.hpp"
#include "cli/files.hpp"
#include "model/cautions.hpp"
#include "profile/handover.hpp"

namespace firn::cli {
namespace {

using namespace units;
namespace hv = firn::handover;

constexpr std::uintmax_t kMaxRecordBytes = 2u << 20;  // 2,000 entries of a few hundred bytes

struct HandoverOptions {
  std::optional<std::string> record, units, html, page;
};

Json clock_json(std::optional<record::ClockTime> t) {
  return t ? Json(record::clock_text(*t)) : Json(nullptr);
}

Json breathing_json(const std::optional<record::Breathing>& b) {
  if (!b) return nullptr;
  Json j = Json::object();
  j["on"] = b->on_air() ? std::string("air") : std::string(supplemental_oxygen::device_key(*b->device));
  j["flow_lpm"] = b->on_air() ? 0.0 : rounded(b->flow.in(litres_per_minute), 1);
  return j;
}

Json reading_json(const std::optional<hv::Spo2Reading>& r) {
  if (!r) return nullptr;
  Json j = Json::object();
  j["time"] = record::clock_text(r->time);
  j["spo2_pct"] = rounded(r->spo2.in(percent), 0);
  j["breathing"] = breathing_json(r->on);
  j["altitude_m"] = r->altitude ? Json(rounded(r->altitude->in(metres), 0)) : Json(nullptr);
  if (r->band_on_air) {
    j["expected_on_air_low_pct"] = rounded(r->band_on_air->low.in(percent), 0);
    j["expected_on_air_high_pct"] = rounded(r->band_on_air->high.in(percent), 0);
    j["expected_extrapolated"] = r->band_extrapolated;
  }
  return j;
}

Result<Report> run_handover(const HandoverOptions& o) {
  if (!o.record) return Error{"--record is required: a casualty record JSON file (docs/incident-record.md)"};
  Result<hv::Units> units = hv::parse_units(o.units.value_or("metric"));
  if (!units) return Error{"--units: " + units.error().message};
  Result<hv::Page> page = hv::parse_page(o.page.value_or("a4"));
  if (!page) return Error{"--page: " + page.error().message};
  Result<std::string> text = read_document(*o.record, "record", kMaxRecordBytes);
  if (!text) return text.error();
  Result<record::Record> rec = record::parse_record(*text);
  if (!rec) return Error{*o.record + ": " + rec.error().message};
  hv::Summary s = hv::summarise(*rec);

  Report report;
  report.json["entries"] = s.entries;
  report.json["first_time"] = clock_json(s.first_time);
  report.json["last_time"] = clock_json(s.last_time);
  report.json["first_spo2_pct"] = s.first_spo2 ? Json(rounded(s.first_spo2->spo2.in(percent), 0)) : Json(nullptr);
  report.json["latest_spo2_pct"] = s.latest_spo2 ? Json(rounded(s.latest_spo2->spo2.in(percent), 0)) : Json(nullptr);
  report.json["lowest_spo2_pct"] = s.lowest_spo2 ? Json(rounded(s.lowest_spo2->spo2.in(percent), 0)) : Json(nullptr);
  report.json["first_spo2"] = reading_json(s.first_spo2);
  report.json["latest_spo2"] = reading_json(s.latest_spo2);
  Json oxygen = Json::array();
  for (const hv::OxygenPeriod& p : s.oxygen) {
    Json j = breathing_json(p.setting);
    j["from"] = record::clock_text(p.from);
    j["to"] = clock_json(p.to);
    oxygen.push_back(std::move(j));
  }
  report.json["oxygen_given"] = std::move(oxygen);
  Json bag = Json::array();
  for (const hv::BagSession& b : s.bag_sessions) {
    Json j = Json::object();
    j["start"] = record::clock_text(b.start);
    j["end"] = clock_json(b.end);
    j["duration_min"] = b.end ? Json(record::minutes_between(b.start, *b.end)) : Json(nullptr);
    j["gauge_mbar"] = b.gauge ? Json(rounded(b.gauge->in(millibar), 0)) : Json(nullptr);
    bag.push_back(std::move(j));
  }
  report.json["bag_sessions"] = std::move(bag);
  Json criteria = Json::array();
  for (record::Criterion c : s.criteria_met) criteria.push_back(std::string(record::criterion_key(c)));
  report.json["criteria_met"] = std::move(criteria);
  report.json["current_altitude_m"] = s.current_altitude ? Json(rounded(s.current_altitude->in(metres), 0)) : Json(nullptr);
  report.json["highest_altitude_m"] = s.highest_altitude ? Json(rounded(s.highest_altitude->in(metres), 0)) : Json(nullptr);
  report.json["current_breathing"] = breathing_json(s.current_breathing);
  report.json["cylinder_swaps"] = s.cylinder_swaps;
  std::string summary = hv::summary_text(*rec, s, *units);
  report.json["summary_text"] = summary;
  report.json["caution"] = std::string(cautions::short_line);
  if (o.html) {
    Result<bool> written = write_document(*o.html, hv::render_html(*rec, s, *units, *page));
    if (!written) return Error{"--html: " + written.error().message};
    report.json["html"] = *o.html;
  }
  // The table view is the summary itself: one read, as the crew gets it.
  for (size_t start = 0; start < summary.size();) {
    size_t end = summary.find('\n', start);
    if (end == std::string::npos) end = summary.size();
    report.notes.push_back(summary.substr(start, end - start));
    start = end + 1;
  }
  if (o.html) report.rows.emplace_back("Printable record", *o.html);
  return report;
}

}  // namespace

void register_handover_commands(CommandTable& table) {
  auto o = std::make_shared<HandoverOptions>();
  CLI::App* cmd = table.add("handover", "Handover summary of a casualty record file",
                            [o] { return run_handover(*o); });
  cmd->add_option("--record", o->record, "Casualty record JSON file (docs/incident-record.md)");
  cmd->add_option("--units", o->units, "metric (m, hPa) or us (ft, psi); default metric");
  cmd->add_option("--html", o->html, "Also write the printable one-page record to this HTML file");
  cmd->add_option("--page", o->page, "Page size of the printable record: a4 or a5; default a4");
}

}  // namespace firn::cli
