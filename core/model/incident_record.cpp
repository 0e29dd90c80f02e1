// The casualty record file: reading with every problem named by its path, writing so that it
// reads back the same. Format: docs/incident-record.md.
#include "model/incident_record.hpp"
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <type_traits>

#include "model/json.hpp"

namespace firn::record {

using Json = json::Value;
using namespace units;

// [SECTION] Clock times

namespace {
// Days from 1970-01-01 to a civil date (proleptic Gregorian): H. Hinnant's days_from_civil.
std::int64_t days_from_civil(std::int64_t y, unsigned m, unsigned d) {
  y -= m <= 2;
  const std::int64_t era = (y >= 0 ? y : y - 399) / 400;
  const unsigned yoe = static_cast<unsigned>(y - era * 400);
  const unsigned doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
  const unsigned doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
  return era * 146097 + static_cast<std::int64_t>(doe) - 719468;
}

struct Civil {
  std::int64_t year;
  unsigned month, day;
};
Civil civil_from_days(std::int64_t z) {
  z += 719468;
  const std::int64_t era = (z >= 0 ? z : z - 146096) / 146097;
  const unsigned doe = static_cast<unsigned>(z - era * 146097);
  const unsigned yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
  const unsigned doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
  const unsigned mp = (5 * doy + 2) / 153;
  const unsigned d = doy - (153 * mp + 2) / 5 + 1;
  const unsigned m = mp < 10 ? mp + 3 : mp - 9;
  return {static_cast<std::int64_t>(yoe) + era * 400 + (m <= 2), m, d};
}

bool digits(std::string_view s, size_t at, size_t count, int& out) {
  out = 0;
  for (size_t i = at; i < at + count; ++i) {
    if (i >= s.size() || s[i] < '0' || s[i] > '9') return false;
    out = out * 10 + (s[i] - '0');
  }
  return true;
}

int days_in_month(int year, int month) {
  static constexpr int days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  bool leap = (year % 4 == 0 && year % 100 != 0) || year % 400 == 0;
  return month == 2 && leap ? 29 : days[month - 1];
}
}  // namespace

Result<ClockTime> parse_clock_time(std::string_view text) {
  int y = 0, mo = 0, d = 0, h = 0, mi = 0;
  bool shape = text.size() == 16 && text[4] == '-' && text[7] == '-' && text[10] == 'T' &&
               text[13] == ':' && digits(text, 0, 4, y) && digits(text, 5, 2, mo) &&
               digits(text, 8, 2, d) && digits(text, 11, 2, h) && digits(text, 14, 2, mi);
  if (!shape || y < 2000 || y > 2200 || mo < 1 || mo > 12 || d < 1 ||
      d > days_in_month(y, mo) || h > 23 || mi > 59) {
    return Error{"time must be a date and clock time like 2026-12-02T14:05 (years 2000 to 2200)"};
  }
  return ClockTime{days_from_civil(y, static_cast<unsigned>(mo), static_cast<unsigned>(d)) * 1440 +
                   h * 60 + mi};
}

std::string clock_text(ClockTime t) {
  std::int64_t days = t.minutes >= 0 ? t.minutes / 1440 : (t.minutes - 1439) / 1440;
  int in_day = static_cast<int>(t.minutes - days * 1440);
  Civil c = civil_from_days(days);
  char buffer[64];  // room for any year GCC can imagine (-Wformat-truncation)
  std::snprintf(buffer, sizeof buffer, "%04lld-%02u-%02uT%02d:%02d",
                static_cast<long long>(c.year), c.month, c.day, in_day / 60, in_day % 60);
  return buffer;
}

std::string clock_hhmm(ClockTime t) { return clock_text(t).substr(11); }

std::int64_t minutes_between(ClockTime from, ClockTime to) { return to.minutes - from.minutes; }

// [SECTION] Names

namespace {
constexpr Kind kAllKinds[] = {Kind::Observation, Kind::Oxygen,  Kind::BagStart,
                              Kind::BagEnd,      Kind::Descent, Kind::Arrival,
                              Kind::CylinderSwap, Kind::Note};
constexpr Avpu kAllAvpu[] = {Avpu::Alert, Avpu::Voice, Avpu::Pain, Avpu::Unresponsive};
constexpr Criterion kAllCriteria[] = {Criterion::Ams, Criterion::Hape, Criterion::Hace};
}  // namespace

std::string_view kind_key(Kind kind) {
  switch (kind) {
    case Kind::Observation: return "observation";
    case Kind::Oxygen: return "oxygen";
    case Kind::BagStart: return "bag_start";
    case Kind::BagEnd: return "bag_end";
    case Kind::Descent: return "descent";
    case Kind::Arrival: return "arrival";
    case Kind::CylinderSwap: return "cylinder_swap";
    case Kind::Note: return "note";
  }
  return "note";
}

std::optional<Kind> parse_kind(std::string_view key) {
  for (Kind k : kAllKinds) {
    if (kind_key(k) == key) return k;
  }
  return std::nullopt;
}

std::string_view avpu_key(Avpu avpu) {
  switch (avpu) {
    case Avpu::Alert: return "A";
    case Avpu::Voice: return "V";
    case Avpu::Pain: return "P";
    case Avpu::Unresponsive: return "U";
  }
  return "A";
}

std::string_view avpu_words(Avpu avpu) {
  switch (avpu) {
    case Avpu::Alert: return "alert";
    case Avpu::Voice: return "responds to voice";
    case Avpu::Pain: return "responds to pain only";
    case Avpu::Unresponsive: return "unresponsive";
  }
  return "alert";
}

std::string_view criterion_key(Criterion c) {
  switch (c) {
    case Criterion::Ams: return "ams";
    case Criterion::Hape: return "hape";
    case Criterion::Hace: return "hace";
  }
  return "ams";
}

std::string_view criterion_words(Criterion c) {
  switch (c) {
    case Criterion::Ams: return "AMS";
    case Criterion::Hape: return "HAPE";
    case Criterion::Hace: return "HACE";
  }
  return "AMS";
}

std::string breathing_words(const Breathing& b) {
  if (b.on_air()) return "air";
  return std::string(supplemental_oxygen::device_key(*b.device)) + " " +
         format_number(b.flow.in(litres_per_minute), 1) + " L/min";
}

// [SECTION] Reading

namespace {

// Reads one entry's fields, naming every problem with its path.
class EntryReader {
 public:
  EntryReader(const Json& object, std::string path, std::vector<std::string>& problems)
      : object_(object), path_(std::move(path)), problems_(problems) {}

  void fail(std::string_view key, const std::string& message) {
    problems_.push_back(path_ + "." + std::string(key) + ": " + message);
  }

  const Json* find(std::string_view key) {
    return object_.find(key);
  }

  std::optional<std::string> text(std::string_view key, size_t max_chars) {
    const Json* v = find(key);
    if (!v) return std::nullopt;
    if (!v->is_string()) {
      fail(key, "must be text in quotes, got " + shown(*v));
      return std::nullopt;
    }
    const std::string& s = v->as_string();
    if (s.size() > max_chars) {
      fail(key, std::to_string(s.size()) + " characters is more than " +
                    std::to_string(max_chars));
      return std::nullopt;
    }
    return s;
  }

  std::optional<int> whole(std::string_view key, int low, int high, std::string_view unit) {
    const Json* v = find(key);
    if (!v) return std::nullopt;
    if (!v->is_number() || !std::isfinite(v->as_double()) ||
        v->as_double() != std::floor(v->as_double()) || v->as_double() < low ||
        v->as_double() > high) {
      fail(key, "must be a whole number from " + std::to_string(low) + " to " +
                    std::to_string(high) + (unit.empty() ? "" : " ") + std::string(unit) +
                    ", got " + shown(*v));
      return std::nullopt;
    }
    return static_cast<int>(v->as_double());
  }

  // "5200m", "2psi", "6L/min": parsed by the unit parser, then checked in `unit`.
  // The quantity's type is what `parse` gives (a bag gauge is read in pressure units).
  template <class Parse, class D,
            class Q = typename std::invoke_result_t<Parse&, std::string_view,
                                                    std::string_view>::value_type>
  std::optional<Q> quantity(std::string_view key, Parse parse, const Unit<D>& unit, double low,
                            double high, std::string_view example) {
    std::optional<std::string> t = text(key, 40);
    if (!t) return std::nullopt;
    Result<Q> q = parse(*t, key);
    if (!q) {
      fail(key, q.error().message + " (example: \"" + std::string(example) + "\")");
      return std::nullopt;
    }
    if (!within(*q, low, high, unit)) {
      fail(key, "\"" + *t + "\" is outside " + format_number(low) + " to " + format_number(high) +
                    " " + std::string(unit.symbol));
      return std::nullopt;
    }
    return *q;
  }

 private:
  const Json& object_;
  std::string path_;
  std::vector<std::string>& problems_;
};


std::optional<Breathing> read_breathing(EntryReader& r) {
  std::optional<std::string> on = r.text("on", 20);
  if (!on) return std::nullopt;
  if (*on == "air") return Breathing{std::nullopt, litres_per_minute(0.0)};
  Result<supplemental_oxygen::Device> device = supplemental_oxygen::parse_device(*on);
  if (!device) {
    r.fail("on", "must be air, cannula, mask or non-rebreather, got \"" + *on + "\"");
    return std::nullopt;
  }
  supplemental_oxygen::FlowRange range = supplemental_oxygen::valid_flows(*device);
  auto flow = r.quantity("flow", parse_volume_flow, litres_per_minute,
                         range.low.in(litres_per_minute), range.high.in(litres_per_minute),
                         "4L/min");
  if (!flow) {
    if (!r.find("flow")) r.fail("flow", "is missing: the flow on " + *on + " (example: \"4L/min\")");
    return std::nullopt;
  }
  return Breathing{*device, *flow};
}

std::optional<Entry> read_entry(const Json& value, const std::string& path,
                                std::vector<std::string>& problems) {
  if (!value.is_object()) {
    problems.push_back(path + ": must be an object {…}, got " + shown(value));
    return std::nullopt;
  }
  size_t before = problems.size();
  EntryReader r(value, path, problems);
  for (const std::string& key : json::unknown_keys(value, {"time", "kind", "altitude", "spo2", "on",
           "flow", "heart_rate", "breathing_rate", "avpu", "lake_louise", "criteria", "bag_gauge", "note"})) {
    r.fail(key, "unknown field (a typo?)");
  }
  Entry e;
  if (std::optional<std::string> t = r.text("time", 40)) {
    Result<ClockTime> time = parse_clock_time(*t);
    if (time) e.time = *time;
    else r.fail("time", time.error().message + ", got \"" + *t + "\"");
  } else if (!r.find("time")) {
    r.fail("time", "is missing (example: \"2026-12-02T14:05\")");
  }
  if (std::optional<std::string> k = r.text("kind", 20)) {
    if (std::optional<Kind> kind = parse_kind(*k)) e.kind = *kind;
    else r.fail("kind", "must be observation, oxygen, bag_start, bag_end, descent, arrival, "
                        "cylinder_swap or note, got \"" + *k + "\"");
  } else if (!r.find("kind")) {
    r.fail("kind", "is missing (example: \"observation\")");
  }
  e.altitude = r.quantity("altitude", parse_length, metres, kMinAltitudeM, kMaxAltitudeM, "5200m");
  e.spo2 = r.quantity("spo2", [](std::string_view t, std::string_view w) {
    Result<double> n = parse_number(t.ends_with('%') ? t.substr(0, t.size() - 1) : t, w);
    if (!n) return Result<Fraction>(n.error());
    return Result<Fraction>(percent(*n));
  }, percent, kMinSpo2Pct, kMaxSpo2Pct, "88%");
  e.breathing = read_breathing(r);
  if (!r.find("on") && r.find("flow")) r.fail("flow", "needs \"on\": the device it flows through");
  e.heart_rate = r.whole("heart_rate", kMinHeartRate, kMaxHeartRate, "beats/min");
  e.breathing_rate = r.whole("breathing_rate", kMinBreathingRate, kMaxBreathingRate, "breaths/min");
  if (std::optional<std::string> a = r.text("avpu", 2)) {
    bool found = false;
    for (Avpu v : kAllAvpu) {
      if (avpu_key(v) == *a) { e.avpu = v; found = true; }
    }
    if (!found) r.fail("avpu", "must be A, V, P or U, got \"" + *a + "\"");
  }
  e.lake_louise = r.whole("lake_louise", 0, 12, "points");
  if (const Json* c = r.find("criteria")) {
    if (!c->is_array()) {
      r.fail("criteria", "must be a list like [\"hape\"], got " + shown(*c));
    } else {
      for (const Json& item : *c) {
        bool found = false;
        for (Criterion k : kAllCriteria) {
          if (item.is_string() && item.as_string() == criterion_key(k)) {
            if (std::find(e.criteria.begin(), e.criteria.end(), k) == e.criteria.end()) {
              e.criteria.push_back(k);
            }
            found = true;
          }
        }
        if (!found) r.fail("criteria", "each must be ams, hape or hace, got " + shown(item));
      }
    }
  }
  e.bag_gauge = r.quantity("bag_gauge", parse_gauge_any_unit, millibar, 0.0, kMaxBagGaugeMbar, "2psi");
  if (std::optional<std::string> n = r.text("note", kMaxNoteChars)) e.note = *n;
  if (e.kind == Kind::Observation && !e.spo2 && !e.heart_rate && !e.breathing_rate && !e.avpu &&
      !e.lake_louise && e.criteria.empty() && problems.size() == before) {
    problems.push_back(path + ": an observation needs at least one finding (spo2, heart_rate, "
                              "breathing_rate, avpu, lake_louise or criteria)");
  }
  if (e.kind == Kind::Oxygen && !e.breathing && problems.size() == before) {
    problems.push_back(path + ": an oxygen entry needs \"on\" (air when oxygen is stopped)");
  }
  if (problems.size() != before) return std::nullopt;
  return e;
}

}  // namespace

Result<Record> parse_record(std::string_view json_text) {
  json::Parsed parsed = json::parse(json_text);
  if (!parsed.ok && !parsed.error.limit.empty()) {
    return Error{"the record file is not a Firn record: " + parsed.error.limit};
  }
  if (!parsed.ok) return Error{"the record file is not valid JSON"};
  const Json& root = parsed.value;
  if (!root.is_object()) return Error{"the record file must hold one JSON object {…}"};
  std::vector<std::string> problems;
  const Json* version = root.find("firn_record");
  if (!version || !version->is_number_integer() || version->as_integer() != kSchemaVersion) {
    return Error{"firn_record: this file is not a Firn casualty record of version " +
                 std::to_string(kSchemaVersion) + " (\"firn_record\": 1)"};
  }
  Record record;
  for (auto [key, target] : {std::pair{"incident", &record.incident},
                             std::pair{"casualty", &record.casualty}}) {
    const Json* it = root.find(key);
    if (!it) continue;
    if (!it->is_string() || it->as_string().size() > kMaxLabelChars) {
      problems.push_back(std::string(key) + ": must be text of at most " +
                         std::to_string(kMaxLabelChars) + " characters");
    } else {
      *target = it->as_string();
    }
  }
  for (const std::string& key : json::unknown_keys(root, {"firn_record", "incident", "casualty", "entries"})) {
    problems.push_back(key + ": unknown field (a typo?)");
  }
  const Json* entries = root.find("entries");
  if (!entries || !entries->is_array()) {
    problems.push_back("entries: must be a list […] of entries");
  } else if (entries->size() > kMaxEntries) {
    problems.push_back("entries: " + std::to_string(entries->size()) + " entries is more than " +
                       std::to_string(kMaxEntries));
  } else {
    for (size_t i = 0; i < entries->size(); ++i) {
      std::optional<Entry> e =
          read_entry((*entries)[i], "entries[" + std::to_string(i) + "]", problems);
      if (e) record.entries.push_back(std::move(*e));
    }
  }
  if (!problems.empty()) {
    std::string joined;
    for (const std::string& p : problems) joined += (joined.empty() ? "" : "; ") + p;
    return Error{joined};
  }
  std::stable_sort(record.entries.begin(), record.entries.end(),
                   [](const Entry& a, const Entry& b) { return a.time < b.time; });
  return record;
}

// [SECTION] Writing

std::string write_record(const Record& record) {
  Json root = Json::object();
  root["firn_record"] = kSchemaVersion;
  root["incident"] = record.incident;
  root["casualty"] = record.casualty;
  Json entries = Json::array();
  for (const Entry& e : record.entries) {
    Json j = Json::object();
    j["time"] = clock_text(e.time);
    j["kind"] = std::string(kind_key(e.kind));
    // 17 significant digits read back to the same double.
    auto exact = [](double v, std::string_view unit) {
      char buffer[64];
      std::snprintf(buffer, sizeof buffer, "%.17g", v);
      return std::string(buffer) + std::string(unit);
    };
    if (e.altitude) j["altitude"] = exact(e.altitude->in(metres), "m");
    if (e.spo2) j["spo2"] = exact(e.spo2->in(percent), "%");
    if (e.breathing) {
      j["on"] = e.breathing->on_air() ? std::string("air")
                                      : std::string(supplemental_oxygen::device_key(*e.breathing->device));
      if (!e.breathing->on_air()) j["flow"] = exact(e.breathing->flow.in(litres_per_minute), "L/min");
    }
    if (e.heart_rate) j["heart_rate"] = *e.heart_rate;
    if (e.breathing_rate) j["breathing_rate"] = *e.breathing_rate;
    if (e.avpu) j["avpu"] = std::string(avpu_key(*e.avpu));
    if (e.lake_louise) j["lake_louise"] = *e.lake_louise;
    if (!e.criteria.empty()) {
      Json c = Json::array();
      for (Criterion k : e.criteria) c.push_back(std::string(criterion_key(k)));
      j["criteria"] = c;
    }
    if (e.bag_gauge) j["bag_gauge"] = exact(e.bag_gauge->in(millibar), "mbar");
    if (!e.note.empty()) j["note"] = e.note;
    entries.push_back(std::move(j));
  }
  root["entries"] = std::move(entries);
  return root.dump(2) + "\n";
}

}  // namespace firn::record
