// The pocket card as one self-contained, print-ready HTML page. Black on white, no colour
// needed, large bold figures for a headlamp; CSS @page sizes the sheet (A6 or credit card).
#include <algorithm>
#include <cctype>

#include "model/cautions.hpp"
#include "model/pocket_card.hpp"

namespace firn::pocket_card {
namespace {

std::string escape(std::string_view text) {
  std::string out;
  for (char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      default: out += c;
    }
  }
  return out;
}

// How much fits on one page of each size (checked by tests/cli/card_pdf.test.mjs: the PDF must
// have exactly one page per section).
struct Layout {
  const char* page_size;  // CSS @page size
  const char* margin;
  const char* body_pt;    // running text
  const char* table_pt;   // figures
  size_t table_rows;      // altitude rows per page
  size_t cylinder_types;  // cylinder types (2 rows each) per page
  bool footnotes_apart;   // footnotes on their own page (too small to sit under a table)
};

Layout layout_for(Size size) {
  if (size == Size::A6) return {"105mm 148mm", "5mm", "9.5pt", "10.5pt", 20, 6, false};
  return {"85.6mm 54mm", "2.5mm", "6.5pt", "7.5pt", 7, 2, true};
}

std::string css(const Layout& l) {
  return std::string("@page{size:") + l.page_size + ";margin:" + l.margin + "}\n" +
         "html,body{margin:0;padding:0;background:#fff;color:#000}\n"
         "body{font-family:'DejaVu Sans','Liberation Sans',Arial,sans-serif;font-size:" +
         l.body_pt + ";line-height:1.2}\n"
         "section.page{break-after:page;page-break-after:always}\n"
         "section.page:last-of-type{break-after:auto;page-break-after:auto}\n"
         "h1{font-size:1.5em;margin:0 0 .3em}h2{font-size:1.1em;margin:0 0 .25em}\n"
         "p{margin:0 0 .3em}ul{margin:0 0 .3em;padding-left:1.1em}li{margin:0 0 .15em}\n"
         ".demo{border:.6mm solid #000;padding:.5mm 1mm;font-weight:bold;margin:0 0 .4em}\n"
         "table{border-collapse:collapse;width:100%;font-size:" + l.table_pt + "}\n"
         "th{font-size:.78em;font-weight:bold;text-align:right;border-bottom:.5mm solid #000;"
         "padding:.2mm .6mm;vertical-align:bottom}\n"
         "td{font-weight:bold;text-align:right;padding:.25mm .6mm;border-bottom:.15mm solid #000;"
         "font-variant-numeric:tabular-nums;white-space:nowrap}\n"
         "th:first-child,td:first-child{text-align:left}\n"
         "td.note{font-weight:normal;font-size:.75em}\n"
         ".foot{font-size:.8em;margin-top:.4em;border-top:.2mm solid #000;padding-top:.2em}\n"
         ".small{font-size:.85em}\n"
         "@media screen{body{background:#ccc}section.page{background:#fff;margin:4mm auto;"
         "padding:3mm;width:max-content;max-width:100%;box-shadow:0 0 2mm #0006}"
         ".hint{font:14px sans-serif;text-align:center;padding:4px}}\n"
         "@media print{.hint{display:none}}\n";
}

struct Page {
  std::string body;
};

std::string table_html(const Table& t, size_t first, size_t count, bool with_footnotes) {
  std::string html = "<h2>" + escape(t.title) + "</h2>\n<table data-table=\"" + t.id + "\">\n<tr>";
  for (const std::string& h : t.header) html += "<th>" + escape(h) + "</th>";
  html += "</tr>\n";
  for (size_t i = first; i < std::min(first + count, t.rows.size()); ++i) {
    html += "<tr>";
    for (const std::string& cell : t.rows[i]) {
      bool words = !cell.empty() && std::isalpha(static_cast<unsigned char>(cell.back())) &&
                   &cell != &t.rows[i].front();
      html += std::string(words ? "<td class=\"note\">" : "<td>") + escape(cell) + "</td>";
    }
    html += "</tr>\n";
  }
  html += "</table>\n";
  if (with_footnotes) {
    for (const std::string& note : t.footnotes) html += "<p class=\"small\">" + escape(note) + "</p>\n";
  }
  return html;
}

std::vector<Page> pages_for(const Card& card, Size size) {
  Layout l = layout_for(size);
  const auto& p = card.profile;
  std::vector<Page> pages;

  Page cover;
  if (p.demo) cover.body += "<p class=\"demo\">DEMO DATA \xE2\x80\x93 fictional team. Not for use.</p>\n";
  cover.body += "<h1>" + escape(p.team_name) + "</h1>\n";
  cover.body += "<p>Firn pocket card \xC2\xB7 " + escape(card.date) + " \xC2\xB7 Firn " +
                escape(card.version) + "</p>\n";
  for (const std::string& a : card.assumptions) cover.body += "<p>" + escape(a) + "</p>\n";
  if (!p.card.notes.empty()) {
    cover.body += "<ul>";
    for (const std::string& n : p.card.notes) cover.body += "<li>" + escape(n) + "</li>";
    cover.body += "</ul>\n";
  }
  pages.push_back(cover);

  Page cautions_page;
  cautions_page.body += "<h2>Cautions</h2>\n<ul>";
  for (std::string_view c : cautions::full_text) cautions_page.body += "<li>" + escape(c) + "</li>";
  cautions_page.body += "</ul>\n";
  pages.push_back(cautions_page);

  std::vector<std::string> apart_notes;
  for (const Table& t : card.tables) {
    size_t per_page = t.id == "cylinders" ? l.cylinder_types * 2 : l.table_rows;
    for (size_t first = 0; first < t.rows.size(); first += per_page) {
      bool last = first + per_page >= t.rows.size();
      pages.push_back({table_html(t, first, per_page, last && !l.footnotes_apart)});
    }
    if (l.footnotes_apart) {
      for (const std::string& note : t.footnotes) apart_notes.push_back(note);
    }
  }
  // Wallet: the footnotes, a few per page, after the tables.
  for (size_t first = 0; first < apart_notes.size(); first += 3) {
    Page notes;
    notes.body += "<h2>Notes</h2>\n";
    for (size_t i = first; i < std::min(first + 3, apart_notes.size()); ++i) {
      notes.body += "<p class=\"small\">" + escape(apart_notes[i]) + "</p>\n";
    }
    pages.push_back(notes);
  }
  return pages;
}

}  // namespace

int page_count(const Card& card, Size size) {
  return static_cast<int>(pages_for(card, size).size());
}

std::string render_html(const Card& card, Size size) {
  Layout l = layout_for(size);
  std::vector<Page> pages = pages_for(card, size);
  std::string html =
      "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
      "<meta name=\"viewport\" content=\"width=device-width,initial-scale=1\">\n"
      "<meta name=\"firn-card-size\" content=\"" + std::string(size_key(size)) + "\">\n"
      "<meta name=\"firn-card-pages\" content=\"" + std::to_string(pages.size()) + "\">\n"
      "<title>Firn pocket card \xE2\x80\x93 " + escape(card.profile.team_name) + "</title>\n"
      "<style>\n" + css(l) + "</style>\n</head>\n<body>\n"
      "<p class=\"hint\">Print at 100 % scale on " +
      std::string(size == Size::A6 ? "A6 paper" : "card-size pages (85.6 \xC3\x97 54 mm)") +
      ", black and white is fine.</p>\n";
  for (size_t i = 0; i < pages.size(); ++i) {
    html += "<section class=\"page\">\n" + pages[i].body;
    html += "<p class=\"foot\">" + escape(cautions::short_line) + " \xC2\xB7 " +
            (card.profile.demo ? "DEMO \xC2\xB7 " : "") + "page " + std::to_string(i + 1) + "/" +
            std::to_string(pages.size()) + "</p>\n</section>\n";
  }
  html += "</body>\n</html>\n";
  return html;
}

}  // namespace firn::pocket_card
