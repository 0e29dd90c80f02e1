// The cards as self-contained, print-ready HTML. Black on white, no colour needed, bold figures
// for a headlamp; CSS @page sizes the sheet. The pocket card is laid out for the casualty:
//   A6 side 1: expected SpO2 by altitude, "acute"/"acclimatised" defined, its footnotes;
//   A6 side 2: cylinder minutes at the team's flows, the bag at the team's gauge, the cautions.
// The wallet card splits the same into four sides; the A4 reference sheet holds every row.
#include <algorithm>
#include <cctype>

#include "model/atmosphere.hpp"
#include "model/cautions.hpp"
#include "profile/html_text.hpp"
#include "profile/pocket_card.hpp"

namespace firn::pocket_card {
namespace {

// What one side holds. Checked by tests/cli/card_pdf.test.mjs: the PDF has exactly one page per
// section for the demo profile and for the largest profile the schema allows.
struct Layout {
  const char* page_size;  // CSS @page size
  const char* margin;
  const char* body_pt;    // running text and footnotes (never below 8 pt)
  const char* table_pt;   // figures
  size_t air_rows;        // expected-SpO2 rows on its side
  size_t bag_rows;
  size_t flows;           // flow columns of the cylinder table
  size_t lines;           // printed lines for the cylinder table (+ the bag's on A6)
};

Layout layout_for(Size size) {
  switch (size) {
    case Size::A6: return {"105mm 148mm", "4mm", "8pt", "9.5pt", 20, 10, 6, 9};
    case Size::Wallet: return {"85.6mm 54mm", "2mm", "8pt", "8pt", 10, 6, 5, 7};
    case Size::Reference: return {"210mm 297mm", "12mm", "10pt", "10pt", 40, 40, 8, 99};
  }
  return layout_for(Size::A6);
}

std::string css(const Layout& l) {
  return std::string("@page{size:") + l.page_size + ";margin:" + l.margin + "}\n" +
         "html,body{margin:0;padding:0;background:#fff;color:#000}\n"
         "body{font-family:'DejaVu Sans','Liberation Sans',Arial,sans-serif;font-size:" +
         l.body_pt + ";line-height:1.18}\n"
         "section.page{break-after:page;page-break-after:always}\n"
         "section.page:last-of-type{break-after:auto;page-break-after:auto}\n"
         "h1{font-size:1.35em;margin:0 0 .2em}h2{font-size:1.1em;margin:.25em 0 .15em}\n"
         "p{margin:0 0 .2em}ul{margin:0 0 .2em;padding-left:1em}li{margin:0 0 .1em}\n"
         ".top{display:flex;justify-content:space-between;gap:1em;font-weight:bold;"
         "border-bottom:.4mm solid #000;margin-bottom:.2em}\n"
         ".demo{border:.5mm solid #000;padding:0 1mm;font-weight:bold;white-space:nowrap}\n"
         ".nw{white-space:nowrap}\n"
         ".name{white-space:nowrap;overflow:hidden;text-overflow:ellipsis}\n"
         "table{border-collapse:collapse;width:100%;font-size:" + l.table_pt + "}\n"
         "th{font-size:8pt;font-weight:bold;text-align:right;border-bottom:.4mm solid #000;"
         "padding:.1mm .2mm;vertical-align:bottom;line-height:1.05}\n"
         "td{font-weight:bold;text-align:right;padding:.05mm .2mm;border-bottom:.15mm solid #000;"
         "font-variant-numeric:tabular-nums;white-space:nowrap;line-height:1.15}\n"
         "th:first-child,td:first-child{text-align:left}\n"
         "td:first-child{white-space:normal}td.long{overflow-wrap:anywhere;min-width:7em}\n"
         "td.note{font-weight:normal;font-size:8pt;white-space:normal}\n"
         "td.ext{font-style:italic;font-weight:normal}\n"
         ".blocks{display:flex;gap:1.2mm}.blocks>table{flex:1}\n"
         ".small{font-size:8pt}.def{font-size:8pt;border:.2mm solid #000;padding:.3mm .8mm;margin:.3em 0}\n"
         ".foot{font-size:8pt;margin-top:.3em;border-top:.2mm solid #000;padding-top:.15em}\n"
         "@media screen{body{background:#ccc}section.page{background:#fff;margin:4mm auto;"
         "padding:3mm;width:max-content;max-width:100%;box-shadow:0 0 2mm #0006}"
         ".hint{font:14px sans-serif;text-align:center;padding:4px}}\n"
         "@media print{.hint{display:none}}\n";
}

// Rows of a table a side can hold: all of them, or evenly thinned keeping the first and the
// last (the highest altitude matters most).
std::vector<size_t> thinned(size_t count, size_t max) {
  std::vector<size_t> picked;
  if (count == 0 || max == 0) return picked;
  if (count <= max) {
    for (size_t i = 0; i < count; ++i) picked.push_back(i);
    return picked;
  }
  size_t stride = max > 1 ? (count - 1 + max - 2) / (max - 1) : count;
  for (size_t i = 0; i < count; i += stride) picked.push_back(i);
  if (picked.back() != count - 1) {
    if (picked.size() < max) {
      picked.push_back(count - 1);
    } else {
      picked.back() = count - 1;
    }
  }
  return picked;
}

std::vector<size_t> all(size_t count) { return thinned(count, count); }

bool is_words(const std::string& cell) {
  return !cell.empty() && std::isalpha(static_cast<unsigned char>(cell.back()));
}
// A label with a word too long for a narrow column may break inside the word (else Chromium
// shrinks the whole page to fit its width, text below 8 pt).
bool has_long_word(const std::string& cell) {
  size_t run = 0;
  for (char c : cell) {
    run = c == ' ' ? 0 : run + 1;
    if (run > 12) return true;
  }
  return false;
}
bool is_extrapolated(const std::string& cell) {
  return !cell.empty() && cell.back() == extrapolated_mark[0];
}

// `headers`: shorter headings for a narrow side (empty: the table's own).
std::string table_html(const Table& t, const std::vector<size_t>& rows, const std::vector<size_t>& cols,
                       const std::vector<std::string>& headers = {}) {
  std::string html = "<table data-table=\"" + t.id + "\">\n<tr>";
  for (size_t i = 0; i < cols.size(); ++i) {
    html += "<th>" + html_escape(headers.empty() ? t.header[cols[i]] : headers[i]) + "</th>";
  }
  html += "</tr>\n";
  for (size_t r : rows) {
    html += "<tr>";
    for (size_t c : cols) {
      const std::string& cell = t.rows[r][c];
      const char* cls = c == cols.front() ? (has_long_word(cell) ? " class=\"long\"" : "")
                        : is_extrapolated(cell) ? " class=\"ext\""
                                                 : is_words(cell)       ? " class=\"note\"" : "";
      html += std::string("<td") + cls + ">" + html_escape(cell) + "</td>";
    }
    html += "</tr>\n";
  }
  return html + "</table>\n";
}

// The rows split into two side-by-side blocks (a narrow table on a short side).
std::string two_blocks(const Table& t, const std::vector<size_t>& rows, const std::vector<size_t>& cols,
                       const std::vector<std::string>& headers) {
  size_t half = (rows.size() + 1) / 2;
  return "<div class=\"blocks\">" +
         table_html(t, std::vector<size_t>(rows.begin(), rows.begin() + half), cols, headers) +
         table_html(t, std::vector<size_t>(rows.begin() + half, rows.end()), cols, headers) + "</div>\n";
}

std::string footnotes_html(const std::vector<std::string>& notes) {
  std::string html;
  for (const std::string& note : notes) html += "<p class=\"small\">" + html_escape(note) + "</p>\n";
  return html;
}

std::string title_html(const std::string& title) { return "<h2>" + html_escape(title) + "</h2>\n"; }

std::string cautions_html() {
  std::string html = "<ul class=\"small\">";
  for (std::string_view c : cautions::full_text) html += "<li>" + html_escape(c) + "</li>";
  return html + "</ul>\n";
}

// Team name (cut with an ellipsis when long: it is in full on the reference sheet) and DEMO.
std::string top_line(const Card& card) {
  std::string html = "<div class=\"top\"><span class=\"name\">" + html_escape(card.profile.team_name) + "</span>";
  if (card.profile.demo) html += "<span class=\"demo\">DEMO DATA</span>";
  return html + "</div>\n";
}

std::string identity(const Card& card) {
  return card.date + " \xC2\xB7 Firn " + card.version + (card.profile.demo ? " \xC2\xB7 DEMO" : "");
}

// Columns of the altitude table a medic reads at the casualty: altitude, PB of the team's
// model, PiO2, the two bands.
std::vector<size_t> air_columns(const Card& card) {
  size_t pb = card.profile.atmosphere_model == atmosphere::Model::Isa ? 2 : 1;
  return {0, pb, 3, 4, 5};
}

// Printed lines of a cylinder row: a long label wraps.
size_t lines_of(const team_profile::CylinderType& c) {
  return 1 + (c.label.size() > 14 ? 1 : 0) + (c.label.size() > 22 ? 1 : 0);
}

// Full-cylinder rows (the table alternates full and half) of the types that fit in `lines`,
// in the profile's order.
std::vector<size_t> full_cylinder_rows(const Card& card, size_t lines) {
  std::vector<size_t> rows;
  size_t used = 0;
  for (size_t i = 0; i < card.profile.cylinders.size(); ++i) {
    used += lines_of(card.profile.cylinders[i]);
    if (used > lines) break;
    rows.push_back(2 * i);
  }
  return rows;
}
std::vector<size_t> first_columns(const Table& t, size_t count) {
  std::vector<size_t> cols;
  for (size_t c = 0; c < std::min(t.header.size(), count); ++c) cols.push_back(c);
  return cols;
}

// "Rows every 500 m here; all 19 on the team reference sheet." (from the printed altitudes).
std::string thinned_note(const Table& t, const std::vector<size_t>& rows) {
  if (rows.size() >= t.rows.size() || rows.size() < 2) return "";
  std::string unit = t.header[0].substr(t.header[0].find(' ') + 1);
  double step = std::stod(t.rows[rows[1]][0]) - std::stod(t.rows[rows[0]][0]);
  return "Rows every " + format_number(step, 0) + " " + unit + " here; all " +
         std::to_string(t.rows.size()) + " on the team reference sheet.";
}

std::vector<std::string> with_note(std::vector<std::string> notes, const std::string& more) {
  if (!more.empty()) notes.push_back(more);
  return notes;
}

std::string definitions(const Card& card) {
  return "<p class=\"def\">" + html_escape(card.exposure_definitions) + "</p>\n";
}

// A6 side 1: expected SpO2 (with PB and PiO2), the definitions, its notes.
std::string a6_air(const Card& card, const Layout& l) {
  const Table& air = table(card, "altitude");
  std::vector<size_t> rows = thinned(air.rows.size(), l.air_rows);
  return title_html("Expected SpO2 on air, at rest") + table_html(air, rows, air_columns(card)) +
         definitions(card) + footnotes_html(with_note(air.footnotes, thinned_note(air, rows)));
}

std::string cylinder_block(const Card& card, const Layout& l, size_t lines) {
  const Table& cyl = table(card, "cylinders");
  std::vector<size_t> rows = full_cylinder_rows(card, lines);
  std::vector<std::string> notes = cyl.pocket_notes;
  size_t left_out = card.profile.cylinders.size() - rows.size();
  if (left_out > 0) notes.back() += " " + std::to_string(left_out) + " more types on the team reference sheet.";
  if (card.profile.flows.size() > l.flows) notes.back() += " Other flows: team reference sheet.";
  return title_html(cyl.title) + table_html(cyl, rows, first_columns(cyl, 2 + l.flows)) +
         footnotes_html(notes);
}

// The bag in two blocks: altitude, equivalent altitude, flush, strokes.
std::string bag_block(const Card& card, size_t max_rows) {
  const Table& bag = table(card, "bag");
  std::vector<size_t> rows = thinned(bag.rows.size(), max_rows);
  std::string unit = bag.header[0].substr(bag.header[0].find(' ') + 1);
  std::vector<std::string> headers{"Alt " + unit, "Equiv. " + unit, "Flush L/min", "Strokes /min"};
  return title_html(bag.title) + two_blocks(bag, rows, {0, 2, 3, 4}, headers) +
         footnotes_html(bag.pocket_notes);
}

// A6 side 2 shares its lines between the cylinders (first) and the bag (at least 4 rows, two
// per line in two blocks).
std::vector<std::string> a6_pages(const Card& card) {
  Layout l = layout_for(Size::A6);
  const size_t min_bag_lines = 2;
  std::vector<size_t> cylinders = full_cylinder_rows(card, l.lines - min_bag_lines);
  size_t cylinder_lines = 0;
  for (size_t r : cylinders) cylinder_lines += lines_of(card.profile.cylinders[r / 2]);
  size_t bag_rows = std::min(l.bag_rows, 2 * (l.lines - cylinder_lines));
  std::string side1 = top_line(card) + a6_air(card, l);
  std::string side2 = top_line(card) + cylinder_block(card, l, l.lines - min_bag_lines) +
                      bag_block(card, bag_rows) + title_html("Cautions") + cautions_html();
  return {side1, side2};
}

// Wallet: card 1 = SpO2 (front) and the bag (back); card 2 = oxygen (front) and the cautions
// (back). Each card carries the short caution line, card 2 the full cautions too.
std::vector<std::string> wallet_pages(const Card& card) {
  Layout l = layout_for(Size::Wallet);
  const Table& air = table(card, "altitude");
  std::vector<size_t> rows = thinned(air.rows.size(), l.air_rows);
  std::string unit = air.header[0].substr(air.header[0].find(' ') + 1);
  std::string side1 = title_html("Expected SpO2 % on air, at rest") +
                      two_blocks(air, rows, {0, 4, 5}, {"Alt " + unit, "Acute", "Acclim."}) +
                      "<p class=\"def\">" + html_escape(card.exposure_definitions_short) + "</p>\n" +
                      footnotes_html(air.pocket_notes);
  std::string side2 = bag_block(card, l.bag_rows);
  std::string side3 = top_line(card) + cylinder_block(card, l, l.lines);
  std::string side4 = cautions_html();
  return {side1, side2, side3, side4};
}

std::vector<std::string> reference_pages(const Card& card) {
  Layout l = layout_for(Size::Reference);
  const auto& p = card.profile;
  std::string intro = "<h1>Team reference sheet</h1>\n" + top_line(card) + "<p>" +
                      html_escape(identity(card)) + "</p>\n";
  for (const std::string& a : card.assumptions) intro += "<p>" + html_escape(a) + "</p>\n";
  if (!p.card.notes.empty()) {
    intro += "<ul>";
    for (const std::string& n : p.card.notes) intro += "<li>" + html_escape(n) + "</li>";
    intro += "</ul>\n";
  }
  const Table& air = table(card, "altitude");
  const Table& oxygen = table(card, "oxygen");
  std::string page1 = intro + title_html(air.title) +
                      table_html(air, all(air.rows.size()), all(air.header.size())) +
                      definitions(card) + footnotes_html(air.footnotes) + title_html(oxygen.title) +
                      table_html(oxygen, all(oxygen.rows.size()), all(oxygen.header.size())) +
                      footnotes_html(oxygen.footnotes);
  const Table& cyl = table(card, "cylinders");
  const Table& bag = table(card, "bag");
  std::string page2 = top_line(card) + title_html(cyl.title) +
                      table_html(cyl, all(cyl.rows.size()), first_columns(cyl, 2 + l.flows)) +
                      footnotes_html(cyl.footnotes) + title_html(bag.title) +
                      table_html(bag, thinned(bag.rows.size(), l.bag_rows), all(bag.header.size())) +
                      footnotes_html(bag.footnotes) + title_html("Cautions") + cautions_html();
  return {page1, page2};
}

std::vector<std::string> pages_for(const Card& card, Size size) {
  switch (size) {
    case Size::A6: return a6_pages(card);
    case Size::Wallet: return wallet_pages(card);
    case Size::Reference: return reference_pages(card);
  }
  return a6_pages(card);
}

const char* paper_hint(Size size) {
  switch (size) {
    case Size::A6: return "Print at 100 % scale on A6, both sides (flip on the long edge)";
    case Size::Wallet: return "Print at 100 % scale on card-size pages (85.6 \xC3\x97 54 mm), both sides";
    case Size::Reference: return "Print at 100 % scale on A4";
  }
  return "";
}

}  // namespace

int page_count(const Card& card, Size size) {
  return static_cast<int>(pages_for(card, size).size());
}

std::string render_html(const Card& card, Size size) {
  Layout l = layout_for(size);
  std::vector<std::string> pages = pages_for(card, size);
  std::string kind = size == Size::Reference ? "team reference sheet" : "pocket card";
  std::string html =
      "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
      "<meta name=\"viewport\" content=\"width=device-width,initial-scale=1\">\n"
      "<meta name=\"firn-card-size\" content=\"" + std::string(size_key(size)) + "\">\n"
      "<meta name=\"firn-card-pages\" content=\"" + std::to_string(pages.size()) + "\">\n"
      "<title>Firn " + kind + " \xE2\x80\x93 " + html_escape(card.profile.team_name) + "</title>\n"
      "<style>\n" + css(l) + "</style>\n</head>\n<body>\n"
      "<p class=\"hint\">" + paper_hint(size) + "; black and white is fine.</p>\n";
  for (size_t i = 0; i < pages.size(); ++i) {
    // A wallet side is too small for the caution line on each: card 1 carries it on its back
    // (side 2), card 2 the full cautions (side 4).
    bool caution_line = size != Size::Wallet || i == 1;
    std::string where = std::string(size == Size::Reference ? "page " : "side ") +
                        std::to_string(i + 1) + "/" + std::to_string(pages.size());
    html += "<section class=\"page\">\n" + pages[i] + "<p class=\"foot\">" +
            (caution_line ? html_escape(cautions::short_line) + " \xC2\xB7 " : std::string()) +
            "<span class=\"nw\">" + html_escape(identity(card)) + " \xC2\xB7 " + where + "</span></p>\n</section>\n";
  }
  html += "</body>\n</html>\n";
  return html;
}

}  // namespace firn::pocket_card
