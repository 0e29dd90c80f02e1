#include "ui/record_store.hpp"

#include <algorithm>

#include "model/clock.hpp"

namespace firn::ui {

std::string archive_key(int slot) { return "incident-archive-" + std::to_string(slot) + ".json"; }

namespace {

// An empty saved text means "deleted": Platform has no delete, and a record file is never empty.
bool has_text(const std::optional<std::string>& text) { return text && !text->empty(); }

bool save(RecordStore& store, Platform& platform) {
  store.stored = platform.save_text(kRecordKey, record::write_record(store.record));
  store.problem = store.stored ? std::string()
                               : "The record could not be saved on " + platform.storage_location() +
                                     ": it lasts until Firn is closed. Write entries on paper too.";
  return store.stored;
}

}  // namespace

void load_record(RecordStore& store, Platform& platform) {
  store.record = {};
  store.stored = false;
  std::optional<std::string> text = platform.load_text(kRecordKey);
  if (!has_text(text)) return;
  Result<record::Record> parsed = record::parse_record(*text);
  if (parsed) {
    store.record = parsed.value();
    store.stored = true;
    return;
  }
  bool kept = platform.save_text(kBadRecordKey, *text);
  store.problem = "The saved incident record could not be read (" + parsed.error().message + "). " +
                  (kept ? "Its text was kept as " + std::string(kBadRecordKey) + " in " +
                              platform.storage_location() + "; a new record was started."
                        : std::string("Its text could not be copied; it stays until you add an entry."));
}

bool add_entry(RecordStore& store, Platform& platform, const record::Entry& entry) {
  auto& entries = store.record.entries;
  auto after = std::upper_bound(entries.begin(), entries.end(), entry,
                                [](const record::Entry& a, const record::Entry& b) { return a.time < b.time; });
  entries.insert(after, entry);
  return save(store, platform);
}

void new_incident(RecordStore& store, Platform& platform) {
  if (!store.record.entries.empty()) {
    for (int slot = kArchiveSlots; slot > 1; --slot) {
      std::optional<std::string> older = platform.load_text(archive_key(slot - 1));
      platform.save_text(archive_key(slot), has_text(older) ? *older : std::string());
    }
    platform.save_text(archive_key(1), record::write_record(store.record));
  }
  store.record = {};
  save(store, platform);
}

Result<std::string> import_record(RecordStore& store, Platform& platform, std::string_view text,
                                  std::string_view source) {
  Result<record::Record> parsed = record::parse_record(text);
  if (!parsed) {
    return Error{std::string(source) + " was not imported, nothing changed: " + parsed.error().message};
  }
  bool archived = !store.record.entries.empty();
  new_incident(store, platform);
  store.record = parsed.value();
  save(store, platform);
  return std::string(source) + " imported: " + std::to_string(store.record.entries.size()) + " entries" +
         (archived ? "; the incident before it was archived." : ".");
}

void delete_all_records(RecordStore& store, Platform& platform) {
  for (int slot = 1; slot <= kArchiveSlots; ++slot) platform.save_text(archive_key(slot), "");
  platform.save_text(kBadRecordKey, "");
  store.record = {};
  save(store, platform);
}

Result<record::ClockTime> typed_entry_time(const RecordStore& store, std::string_view typed,
                                           record::ClockTime now, std::optional<size_t> index) {
  const auto& entries = store.record.entries;
  bool after_start = entries.size() > 1 && index.value_or(entries.size() - 1) > 0;
  record::ClockTime low = after_start ? entries.front().time
                                      : record::ClockTime{now.minutes - kInProgressHours * 60};
  std::string range = "between " + record::clock_hhmm(low) + " and " + record::clock_hhmm(now) +
                      (after_start ? " (the incident's start and now)" : " (the last 24 h)");
  std::optional<int> of_day = clock::typed_minutes_of_day(typed);
  if (!of_day) return Error{"Type the time as hours and minutes, e.g. 1405 for 14:05, " + range + "."};
  record::ClockTime t{now.minutes - now.minutes % (24 * 60) + *of_day};
  if (t > now) t.minutes -= 24 * 60;
  if (t < low) return Error{"The time must be " + range + " (got " + record::clock_hhmm(t) + ")."};
  return t;
}

bool retime_entry(RecordStore& store, Platform& platform, record::ClockTime time,
                  std::optional<size_t> index) {
  auto& entries = store.record.entries;
  size_t at = index.value_or(entries.size() - 1);
  if (entries.empty() || at >= entries.size()) return false;
  record::Entry moved = entries[at];
  entries.erase(entries.begin() + static_cast<std::ptrdiff_t>(at));
  moved.time = time;
  return add_entry(store, platform, moved);
}

int archived_count(Platform& platform) {
  int count = 0;
  for (int slot = 1; slot <= kArchiveSlots; ++slot) count += has_text(platform.load_text(archive_key(slot)));
  return count;
}

bool incident_in_progress(const RecordStore& store, record::ClockTime now) {
  if (store.record.entries.empty()) return false;
  std::int64_t since_last = record::minutes_between(store.record.entries.back().time, now);
  return since_last <= kInProgressHours * 60;
}

}  // namespace firn::ui
