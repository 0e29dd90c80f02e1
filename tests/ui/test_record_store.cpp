// The incident record kept on the device (ui/record_store.hpp): nothing written is lost across a
// restart, an unreadable store is kept as a backup and announced, archive and delete-all.
#include <catch2/catch.hpp>

#include <map>

#include "ui/platform.hpp"
#include "ui/record_store.hpp"

using namespace firn;
using namespace firn::ui;

namespace {

// Storage that can be made to refuse writes (a full or blocked localStorage).
class FlakyStorage : public Platform {
 public:
  std::map<std::string, std::string> stored;
  bool refuse_writes = false;
  std::optional<std::string> load_text(std::string_view key) override {
    auto it = stored.find(std::string(key));
    if (it == stored.end()) return std::nullopt;
    return it->second;
  }
  bool save_text(std::string_view key, std::string_view text) override {
    if (refuse_writes) return false;
    stored[std::string(key)] = std::string(text);
    return true;
  }
  bool open_html_document(std::string_view, std::string_view) override { return false; }
  std::string_view name() const override { return "test"; }
};

record::Entry spo2_at(const char* time, double pct) {
  record::Entry e;
  e.time = record::parse_clock_time(time).value();
  e.kind = record::Kind::Observation;
  e.spo2 = units::percent(pct);
  e.breathing = record::Breathing{std::nullopt, units::litres_per_minute(0)};
  return e;
}

}  // namespace

TEST_CASE("record store: every entry survives a restart, in time order", "[record]") {
  FlakyStorage storage;
  RecordStore store;
  load_record(store, storage);
  CHECK(store.record.entries.empty());
  REQUIRE(add_entry(store, storage, spo2_at("2026-07-14T14:00", 80)));
  REQUIRE(add_entry(store, storage, spo2_at("2026-07-14T13:40", 68)));  // written up late
  RecordStore restarted;
  load_record(restarted, storage);
  REQUIRE(restarted.record.entries.size() == 2);
  CHECK(restarted.record.entries[0].spo2->in(units::percent) == Approx(68));
  CHECK(restarted.record.entries[1].spo2->in(units::percent) == Approx(80));
  CHECK(restarted.problem.empty());
}

TEST_CASE("record store: an unreadable store is kept as a backup and announced", "[record]") {
  FlakyStorage storage;
  storage.stored[kRecordKey] = "{\"firn_record\": 1, \"entries\": [{\"time\": \"half writ";
  RecordStore store;
  load_record(store, storage);
  CHECK(store.record.entries.empty());
  CHECK(storage.stored[kBadRecordKey] == "{\"firn_record\": 1, \"entries\": [{\"time\": \"half writ");
  CHECK(store.problem.find("could not be read") != std::string::npos);
  CHECK(store.problem.find(kBadRecordKey) != std::string::npos);
}

TEST_CASE("record store: a refused write is said, and the entry stays in memory", "[record]") {
  FlakyStorage storage;
  RecordStore store;
  load_record(store, storage);
  storage.refuse_writes = true;
  CHECK_FALSE(add_entry(store, storage, spo2_at("2026-07-14T14:00", 80)));
  CHECK(store.record.entries.size() == 1);
  CHECK(store.problem.find("could not be saved") != std::string::npos);
  storage.refuse_writes = false;
  CHECK(add_entry(store, storage, spo2_at("2026-07-14T14:10", 82)));
  CHECK(store.problem.empty());
}

TEST_CASE("record store: new incident archives, the oldest beyond the slots is dropped", "[record]") {
  FlakyStorage storage;
  RecordStore store;
  load_record(store, storage);
  for (int i = 0; i < kArchiveSlots + 2; ++i) {
    add_entry(store, storage, spo2_at("2026-07-14T14:00", 70 + i));
    new_incident(store, storage);
    CHECK(store.record.entries.empty());
  }
  CHECK(archived_count(storage) == kArchiveSlots);
  // Slot 1 holds the newest (SpO2 70 + 6), slot 5 the fifth newest (70 + 2).
  CHECK(record::parse_record(storage.stored[archive_key(1)])->entries[0].spo2->in(units::percent) == Approx(76));
  CHECK(record::parse_record(storage.stored[archive_key(kArchiveSlots)])->entries[0].spo2->in(units::percent) == Approx(72));
  new_incident(store, storage);  // an empty record is not archived
  CHECK(record::parse_record(storage.stored[archive_key(1)])->entries[0].spo2->in(units::percent) == Approx(76));

  add_entry(store, storage, spo2_at("2026-07-14T15:00", 90));
  delete_all_records(store, storage);
  CHECK(archived_count(storage) == 0);
  RecordStore restarted;
  load_record(restarted, storage);
  CHECK(restarted.record.entries.empty());
}

TEST_CASE("record store: an incident is in progress up to a day after its last entry", "[record]") {
  FlakyStorage storage;
  RecordStore store;
  load_record(store, storage);
  record::ClockTime last = record::parse_clock_time("2026-07-14T14:00").value();
  CHECK_FALSE(incident_in_progress(store, last));  // no entries: nothing in progress
  REQUIRE(add_entry(store, storage, spo2_at("2026-07-14T14:00", 80)));
  CHECK(incident_in_progress(store, last));
  CHECK(incident_in_progress(store, record::ClockTime{last.minutes + kInProgressHours * 60}));
  CHECK_FALSE(incident_in_progress(store, record::ClockTime{last.minutes + kInProgressHours * 60 + 1}));
}

TEST_CASE("record store: an imported record file becomes the incident, the one before archived", "[record]") {
  FlakyStorage storage;
  RecordStore store;
  load_record(store, storage);
  REQUIRE(add_entry(store, storage, spo2_at("2026-07-14T14:00", 80)));
  std::string before = storage.stored[kRecordKey];

  // Unreadable: nothing changes, each problem named with its path and range.
  Result<std::string> refused = import_record(store, storage,
      R"({"firn_record": 1, "entries": [{"time": "2026-07-14T15:00", "kind": "observation", "spo2": "120%"}]})",
      "bad.json");
  REQUIRE_FALSE(refused);
  CHECK(refused.error().message.find("bad.json was not imported, nothing changed") == 0);
  CHECK(refused.error().message.find("entries[0].spo2") != std::string::npos);
  CHECK(storage.stored[kRecordKey] == before);
  CHECK(archived_count(storage) == 0);

  record::Record other;
  other.incident = "DEMO import";
  other.entries = {spo2_at("2026-07-15T09:00", 91), spo2_at("2026-07-15T09:10", 93)};
  Result<std::string> done = import_record(store, storage, record::write_record(other), "other.json");
  REQUIRE(done);
  CHECK(done.value() == "other.json imported: 2 entries; the incident before it was archived.");
  CHECK(storage.stored[archive_key(1)] == before);  // nothing lost
  RecordStore restarted;
  load_record(restarted, storage);
  REQUIRE(restarted.record.entries.size() == 2);
  CHECK(restarted.record.incident == "DEMO import");
  CHECK(restarted.record.entries[1].spo2->in(units::percent) == Approx(93));
}

TEST_CASE("record store: the latest entry's time corrected, within the incident's start and now", "[record]") {
  FlakyStorage storage;
  RecordStore store;
  load_record(store, storage);
  record::ClockTime now = record::parse_clock_time("2026-07-14T15:05").value();
  // A lone entry: the last 24 h.
  REQUIRE(add_entry(store, storage, spo2_at("2026-07-14T15:00", 80)));
  CHECK(typed_entry_time(store, "1500", now)->minutes == record::parse_clock_time("2026-07-14T15:00")->minutes);
  CHECK(typed_entry_time(store, "1510", now)->minutes == record::parse_clock_time("2026-07-13T15:10")->minutes);
  CHECK(record::clock_text(typed_entry_time(store, "1504", now).value()) == "2026-07-14T15:04");
  CHECK(typed_entry_time(store, "1505", now).ok());  // now itself

  REQUIRE(add_entry(store, storage, spo2_at("2026-07-14T13:40", 68)));  // the incident's start
  record::Entry event;
  event.time = now;
  event.kind = record::Kind::BagStart;
  REQUIRE(add_entry(store, storage, event));
  // Accepted forms; the day is today unless that is later than now.
  CHECK(record::clock_text(typed_entry_time(store, "1452", now).value()) == "2026-07-14T14:52");
  CHECK(record::clock_text(typed_entry_time(store, "14.52", now).value()) == "2026-07-14T14:52");
  CHECK(record::clock_text(typed_entry_time(store, "14:52", now).value()) == "2026-07-14T14:52");
  CHECK(record::clock_text(typed_entry_time(store, "1340", now).value()) == "2026-07-14T13:40");
  // Refused, each with the valid range.
  for (const char* typed : {"1339", "1506", "2460", "99", "14.5", "ab12", ""}) {
    Result<record::ClockTime> t = typed_entry_time(store, typed, now);
    INFO(typed);
    REQUIRE_FALSE(t);
    CHECK(t.error().message.find("between 13:40 and 15:05 (the incident's start and now)") != std::string::npos);
  }
  REQUIRE(retime_entry(store, storage, typed_entry_time(store, "1452", now).value()));
  RecordStore restarted;
  load_record(restarted, storage);
  REQUIRE(restarted.record.entries.size() == 3);
  CHECK(restarted.record.entries[1].kind == record::Kind::BagStart);  // back in time order
  CHECK(record::clock_text(restarted.record.entries[1].time) == "2026-07-14T14:52");
  CHECK(record::clock_text(restarted.record.entries[2].time) == "2026-07-14T15:00");
}
