// The current incident's casualty record kept on the device (Platform::save_text("incident.json"),
// the same file `firn handover --record` reads), written after every entry so a reload, going
// offline or a phone restart loses nothing. A saved record that cannot be read is kept as
// "incident.json.bad" before anything else is written, and the user is told. "New incident"
// archives the current one (the newest kArchiveSlots kept). No ImGui here.
#pragma once

#include <string>

#include "model/incident_record.hpp"
#include "ui/platform.hpp"

namespace firn::ui {

inline constexpr const char* kRecordKey = "incident.json";
inline constexpr const char* kBadRecordKey = "incident.json.bad";
inline constexpr int kArchiveSlots = 5;  // "incident-archive-1.json" (newest) … "-5.json"
std::string archive_key(int slot);       // slot 1…kArchiveSlots

struct RecordStore {
  record::Record record;
  bool stored = false;     // the last write reached the platform's storage
  std::string problem;     // shown until the next successful write or load
};

// At start: the saved incident, an empty one, or (unreadable) a backup + empty + problem.
void load_record(RecordStore& store, Platform& platform);
// Appends `entry` in time order and saves; returns false (and sets problem) if saving failed —
// the entry is still kept in memory for this session.
bool add_entry(RecordStore& store, Platform& platform, const record::Entry& entry);
// Archives the current incident (if it has entries) and starts an empty one.
void new_incident(RecordStore& store, Platform& platform);
// Makes a record file (the one `firn handover --record` reads) the current incident, the current
// one archived first as by new_incident. Unreadable: nothing changes, the error names each
// problem with its path and valid range. Returns what was imported, in words, or the error.
inline constexpr const char* kRecordExportName = "firn-incident-record.json";
Result<std::string> import_record(RecordStore& store, Platform& platform, std::string_view text,
                                  std::string_view source);
// Deletes the current incident and every archived one (privacy), leaving an empty record.
void delete_all_records(RecordStore& store, Platform& platform);
// A clock time the medic types for an entry ("1405", "905", "14.05"; `index` in the record,
// none: the latest), on the day of `now` (the day before if that would be later than now).
// Valid from the incident's start (its first entry; for a lone entry or the first one itself,
// kInProgressHours before now) to now: otherwise a message with that range.
Result<record::ClockTime> typed_entry_time(const RecordStore& store, std::string_view typed,
                                           record::ClockTime now, std::optional<size_t> index = {});
// Moves an entry (`index`, none: the latest) to `time` (the record stays in time order), saves.
bool retime_entry(RecordStore& store, Platform& platform, record::ClockTime time,
                  std::optional<size_t> index = {});
// How many archived incidents are stored.
int archived_count(Platform& platform);


// An incident is in progress while its record has entries and the last is at most this old:
// the app then opens on the Record screen (an older record stays, and is not pushed forward).
inline constexpr int kInProgressHours = 24;
bool incident_in_progress(const RecordStore& store, record::ClockTime now);

}  // namespace firn::ui
