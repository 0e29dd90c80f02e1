// The handover summary of a casualty record, as text and as a printable page.
#include "profile/handover.hpp"

#include <algorithm>
#include <cmath>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "profile/html_text.hpp"

namespace firn::handover {

using namespace units;
using record::Entry;
using record::Kind;

// [SECTION] Summary

namespace {

Spo2Reading reading_of(const Entry& e, std::optional<Length> altitude) {
  Spo2Reading r{e.time, *e.spo2, e.breathing, altitude, std::nullopt, false};
  if (r.on && r.on->on_air() && altitude) {
    Result<Pressure> pb = atmosphere::pressure_at(*altitude, atmosphere::default_medical_model);
    if (pb) {
      Result<expected_spo2::Expectation> x = expected_spo2::expected(*pb, cascade::Exposure::Acute);
      if (x) {
        r.band_on_air = x->band;
        r.band_extrapolated = x->extrapolated;
      }
    }
  }
  return r;
}

void close_oxygen(Summary& s, ClockTime at) {
  if (!s.oxygen.empty() && !s.oxygen.back().to) s.oxygen.back().to = at;
}

}  // namespace

Summary summarise(const record::Record& record) {
  Summary s;
  s.entries = static_cast<int>(record.entries.size());
  std::optional<Length> altitude;
  for (const Entry& e : record.entries) {
    if (!s.first_time) s.first_time = e.time;
    s.last_time = e.time;
    if (e.altitude) {
      altitude = e.altitude;
      if (!s.highest_altitude || *e.altitude > *s.highest_altitude) s.highest_altitude = e.altitude;
    }
    for (record::Criterion c : e.criteria) {
      if (std::find(s.criteria_met.begin(), s.criteria_met.end(), c) == s.criteria_met.end()) {
        s.criteria_met.push_back(c);
      }
    }
    switch (e.kind) {
      case Kind::Observation:
        if (e.spo2) {
          Spo2Reading r = reading_of(e, altitude);
          if (!s.first_spo2) s.first_spo2 = r;
          s.latest_spo2 = r;
          if (!s.lowest_spo2 || r.spo2 < s.lowest_spo2->spo2) s.lowest_spo2 = r;
        }
        if (e.heart_rate) s.latest_heart_rate = e.heart_rate;
        if (e.breathing_rate) s.latest_breathing_rate = e.breathing_rate;
        if (e.avpu) s.latest_avpu = e.avpu;
        if (e.lake_louise) s.latest_lake_louise = e.lake_louise;
        break;
      case Kind::Oxygen:
        close_oxygen(s, e.time);
        s.current_breathing = e.breathing;
        if (e.breathing && !e.breathing->on_air()) {
          s.oxygen.push_back({e.time, std::nullopt, *e.breathing});
        }
        break;
      case Kind::BagStart:
        if (s.bag_sessions.empty() || s.bag_sessions.back().end) {
          s.bag_sessions.push_back({e.time, std::nullopt, e.bag_gauge});
        }
        break;
      case Kind::BagEnd:
        if (!s.bag_sessions.empty() && !s.bag_sessions.back().end) s.bag_sessions.back().end = e.time;
        break;
      case Kind::CylinderSwap: ++s.cylinder_swaps; break;
      case Kind::Descent:
      case Kind::Arrival:
      case Kind::Note: break;
    }
  }
  s.current_altitude = altitude;
  return s;
}

Result<Units> parse_units(std::string_view key) {
  if (key == "metric") return Units::Metric;
  if (key == "us") return Units::Us;
  return Error{"units must be metric or us, got '" + std::string(key) + "'"};
}

Result<Page> parse_page(std::string_view key) {
  if (key == "a4") return Page::A4;
  if (key == "a5") return Page::A5;
  return Error{"page size must be a4 or a5, got '" + std::string(key) + "'"};
}

// [SECTION] Text

namespace {

// 5200 → "5,200": altitudes are read at a glance.
std::string grouped(double value) {
  long long n = std::llround(value);
  std::string digits = std::to_string(n < 0 ? -n : n);
  std::string text = n < 0 ? "-" : "";
  for (size_t i = 0; i < digits.size(); ++i) {
    if (i > 0 && (digits.size() - i) % 3 == 0) text += ',';
    text += digits[i];
  }
  return text;
}

std::string altitude_text(Length h, Units u) {
  return u == Units::Us ? grouped(h.in(feet)) + " ft" : grouped(h.in(metres)) + " m";
}

std::string gauge_text(GaugePressure g, Units u) {
  return u == Units::Us ? format_number(g.in(psi), 1) + " psi gauge"
                        : format_number(g.in(hectopascals), 0) + " hPa gauge";
}

std::string duration_text(std::int64_t minutes) {
  if (minutes < 60) return std::to_string(minutes) + " min";
  return std::to_string(minutes / 60) + " h " + std::to_string(minutes % 60) + " min";
}

std::string pct(Fraction f) { return format_number(std::round(f.in(percent)), 0) + " %"; }

std::string reading_text(const Spo2Reading& r, Units u) {
  std::string text = pct(r.spo2) + " on " + (r.on ? record::breathing_words(*r.on) : "(not written)") +
                     " at " + record::clock_hhmm(r.time);
  if (r.altitude) text += ", " + altitude_text(*r.altitude, u);
  if (r.band_on_air) {
    text += " (healthy newcomers there: " + pct(r.band_on_air->low) + "–" + pct(r.band_on_air->high) +
            (r.band_extrapolated ? ", extrapolated" : "") + ")";
  }
  return text;
}

std::string period_text(ClockTime from, std::optional<ClockTime> to) {
  return record::clock_hhmm(from) + "–" + (to ? record::clock_hhmm(*to) : std::string("now"));
}

}  // namespace

std::string summary_text(const record::Record& record, const Summary& s, Units u) {
  std::string out = "HANDOVER";
  if (!record.casualty.empty()) out += " — " + record.casualty;
  if (!record.incident.empty()) out += " — " + record.incident;
  out += "\n";
  if (s.entries == 0) {
    return out + "No entries recorded.\n" + std::string(cautions::short_line) + "\n";
  }
  out += "Record " + record::clock_hhmm(*s.first_time) + "–" + record::clock_hhmm(*s.last_time) +
         " (" + duration_text(record::minutes_between(*s.first_time, *s.last_time)) + "), " +
         std::to_string(s.entries) + " entries.\n";
  if (s.first_spo2) {
    out += "SpO2 first " + reading_text(*s.first_spo2, u) + ".\n";
    out += "SpO2 latest " + reading_text(*s.latest_spo2, u) + ".\n";
    if (s.lowest_spo2->time != s.first_spo2->time && s.lowest_spo2->time != s.latest_spo2->time) {
      out += "SpO2 lowest " + reading_text(*s.lowest_spo2, u) + ".\n";
    }
  } else {
    out += "No SpO2 recorded.\n";
  }
  if (s.oxygen.empty()) {
    out += "Oxygen: none given.\n";
  } else {
    out += "Oxygen:";
    for (size_t i = 0; i < s.oxygen.size(); ++i) {
      out += (i ? "; " : " ") + record::breathing_words(s.oxygen[i].setting) + " " +
             period_text(s.oxygen[i].from, s.oxygen[i].to);
    }
    out += ".\n";
  }
  if (!s.bag_sessions.empty()) {
    out += "Hyperbaric bag:";
    for (size_t i = 0; i < s.bag_sessions.size(); ++i) {
      const BagSession& b = s.bag_sessions[i];
      out += (i ? "; " : " ") + period_text(b.start, b.end);
      if (b.end) out += " (" + duration_text(record::minutes_between(b.start, *b.end)) + ")";
      if (b.gauge) out += " at " + gauge_text(*b.gauge, u);
    }
    out += ".\n";
  }
  if (!s.criteria_met.empty()) {
    out += "Criteria met (as ticked by the medic):";
    for (size_t i = 0; i < s.criteria_met.size(); ++i) {
      out += (i ? ", " : " ") + std::string(record::criterion_words(s.criteria_met[i]));
    }
    out += ".\n";
  }
  std::string latest;
  auto add = [&latest](const std::string& part) { latest += (latest.empty() ? "" : ", ") + part; };
  if (s.latest_heart_rate) add("heart rate " + std::to_string(*s.latest_heart_rate) + "/min");
  if (s.latest_breathing_rate) add("breathing " + std::to_string(*s.latest_breathing_rate) + "/min");
  if (s.latest_avpu) add(std::string(record::avpu_words(*s.latest_avpu)));
  if (s.latest_lake_louise) add("Lake Louise score " + std::to_string(*s.latest_lake_louise));
  if (!latest.empty()) out += "Latest: " + latest + ".\n";
  std::string now;
  if (s.current_altitude) now += "at " + altitude_text(*s.current_altitude, u);
  if (s.highest_altitude && s.current_altitude && *s.highest_altitude > *s.current_altitude) {
    now += " (highest " + altitude_text(*s.highest_altitude, u) + ")";
  }
  if (s.current_breathing) now += (now.empty() ? "on " : ", on ") + record::breathing_words(*s.current_breathing);
  if (s.cylinder_swaps > 0) {
    now += (now.empty() ? "" : "; ") + std::to_string(s.cylinder_swaps) + " cylinder swap" +
           (s.cylinder_swaps == 1 ? "" : "s");
  }
  if (!now.empty()) out += "Now: " + now + ".\n";
  out += std::string(cautions::short_line) + "\n";
  return out;
}

// [SECTION] Printable page

namespace {

std::string entry_row(const Entry& e, Units u) {
  std::string findings;
  auto add = [&findings](const std::string& part) {
    findings += (findings.empty() ? "" : ", ") + part;
  };
  if (e.spo2) add("SpO2 " + pct(*e.spo2));
  if (e.breathing) add((e.kind == Kind::Oxygen ? "now on " : "on ") + record::breathing_words(*e.breathing));
  if (e.heart_rate) add("HR " + std::to_string(*e.heart_rate));
  if (e.breathing_rate) add("RR " + std::to_string(*e.breathing_rate));
  if (e.avpu) add("AVPU " + std::string(record::avpu_key(*e.avpu)));
  if (e.lake_louise) add("LLS " + std::to_string(*e.lake_louise));
  for (record::Criterion c : e.criteria) add(std::string(record::criterion_words(c)) + " criteria met");
  if (e.bag_gauge) add(gauge_text(*e.bag_gauge, u));
  std::string kind(record::kind_key(e.kind));
  std::replace(kind.begin(), kind.end(), '_', ' ');
  return "<tr><td>" + record::clock_hhmm(e.time) + "</td><td>" + html_escape(kind) + "</td><td>" +
         (e.altitude ? altitude_text(*e.altitude, u) : std::string()) + "</td><td>" +
         html_escape(findings) + "</td><td>" + html_escape(e.note) + "</td></tr>\n";
}

}  // namespace

std::string render_html(const record::Record& record, const Summary& s, Units u, Page page) {
  std::string html =
      "<!doctype html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n<title>Handover — " +
      html_escape(record.casualty) + "</title>\n<style>\n@page{size:" +
      (page == Page::A4 ? "A4" : "A5") +
      ";margin:10mm}\nbody{font-family:'DejaVu Sans','Liberation Sans',Arial,sans-serif;"
      "font-size:" + (page == Page::A4 ? "10pt" : "8.5pt") +
      ";color:#000;background:#fff;margin:0}\n"
      "h1{font-size:1.4em;margin:0 0 .4em}h2{font-size:1.1em;margin:.8em 0 .3em}\n"
      "p.summary{white-space:pre-wrap;font-size:1.05em;border:.4mm solid #000;padding:2mm;margin:0}\n"
      "table{border-collapse:collapse;width:100%}th,td{border-bottom:.2mm solid #000;"
      "padding:.6mm 1mm;text-align:left;vertical-align:top}th{font-size:.85em}\n"
      "td:first-child{white-space:nowrap;font-variant-numeric:tabular-nums}\n"
      "ul.cautions{font-size:.9em;padding-left:1.2em}\n</style></head><body>\n";
  html += "<h1>Casualty handover</h1>\n<p class=\"summary\" data-summary>" +
          html_escape(summary_text(record, s, u)) + "</p>\n";
  html += "<h2>Record (" + std::to_string(s.entries) + " entries)</h2>\n<table data-record>\n"
          "<tr><th>Time</th><th>Entry</th><th>Altitude</th><th>Findings</th><th>Note</th></tr>\n";
  for (const Entry& e : record.entries) html += entry_row(e, u);
  html += "</table>\n<h2>Cautions</h2>\n<ul class=\"cautions\">\n";
  for (std::string_view c : cautions::full_text) html += "<li>" + html_escape(c) + "</li>\n";
  html += "</ul>\n</body></html>\n";
  return html;
}

}  // namespace firn::handover
