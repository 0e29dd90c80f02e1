// firn::json, the reader and writer of Firn's files, against the JSON standard (RFC 8259, IETF,
// 2017: §2 whitespace, §6 numbers, §7 strings, §13 examples) and against a general-purpose
// reference library from the package registry (nlohmann/json 3.11, Debian nlohmann-json3-dev):
// the same verdict on thousands of broken and mended files, and the same values.
#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <cmath>
#include <limits>
#include <random>
#include <string>
#include <vector>

#include "model/json.hpp"
#include "profile/route_file.hpp"
#include "profile/team_profile.hpp"

using firn::json::Value;
using Reference = nlohmann::ordered_json;

namespace {

bool accepts(std::string_view text) { return firn::json::parse(text).ok; }

Value parsed(std::string_view text) {
  firn::json::Parsed p = firn::json::parse(text);
  INFO(text);
  REQUIRE(p.ok);
  return p.value;
}

}  // namespace

TEST_CASE("RFC 8259 §13: the two example texts read as written", "[json]") {
  // The image object of §13, abridged to the members checked (RFC 8259, from the text).
  Value image = parsed(R"({
      "Image": {
          "Width":  800,
          "Height": 600,
          "Title":  "View from 15th Floor",
          "Thumbnail": {
              "Url":    "http://www.example.com/image/481989943",
              "Height": 125,
              "Width":  100
          },
          "Animated" : false,
          "IDs": [116, 943, 234, 38793]
        }
    })");
  const Value& i = image["Image"];
  CHECK(i["Width"].as_integer() == 800);
  CHECK(i["Title"].as_string() == "View from 15th Floor");
  CHECK(i["Thumbnail"]["Url"].as_string() == "http://www.example.com/image/481989943");
  CHECK(i["Animated"].is_boolean());
  CHECK_FALSE(i["Animated"].as_bool());
  CHECK(i["IDs"].size() == 4);
  CHECK(i["IDs"][3].as_integer() == 38793);
  CHECK(i.members().front().first == "Width");  // members keep the file's order
  CHECK(i.members().back().first == "IDs");

  const Value places = parsed(R"([
      {"precision": "zip", "Latitude":  37.7668, "Longitude": -122.3959,
       "Address": "", "City": "SAN FRANCISCO", "State": "CA", "Zip": "94107", "Country": "US"},
      {"precision": "zip", "Latitude":  37.371991, "Longitude": -122.026020,
       "Address": "", "City": "SUNNYVALE", "State": "CA", "Zip": "94085", "Country": "US"}
    ])");
  REQUIRE(places.size() == 2);
  CHECK(places[0]["Latitude"].as_double() == 37.7668);
  CHECK(places[1]["Longitude"].as_double() == -122.026020);
  CHECK(places[1]["Address"].is_string());
  CHECK(places[1]["Address"].as_string().empty());
  // §13 also gives bare values as JSON texts.
  CHECK(parsed("\"Hello world!\"").as_string() == "Hello world!");
  CHECK(parsed("42").as_integer() == 42);
  CHECK(parsed("true").as_bool());
}

TEST_CASE("RFC 8259 §6 and §7: numbers and strings, accepted and refused", "[json]") {
  // §6 grammar: minus? int frac? exp?, int = 0 / [1-9] digits.
  for (const char* good : {"0", "-0", "1E+2", "1e-7", "-12.5e3", "0.000001", "[1E22]"}) {
    INFO(good);
    CHECK(accepts(good));
  }
  for (const char* bad : {"01", "+1", ".5", "1.", "1.e3", "1e", "-", "0x10", "NaN", "Infinity",
                          "[1,]", "{\"a\":1,}", "[1 2]", "{\"a\" 1}", "{1: 2}", "'text'", "tru",
                          "nul", "[", "{", "", " ", "[1]x", "1e999"}) {
    INFO(bad);
    CHECK_FALSE(accepts(bad));
  }
  CHECK(parsed("1E+2").as_double() == 100.0);
  CHECK(parsed("-0").is_number_integer());
  CHECK_FALSE(parsed("2.0").is_number_integer());  // a fraction makes it a number, not a count
  CHECK(parsed("99999999999999999999").as_double() == 1e20);  // past int64: read as a number

  // §7: the two-character escapes, \u escapes and a UTF-16 surrogate pair (U+1D11E, the G clef,
  // is §7's own example: "\uD834\uDD1E").
  CHECK(parsed(R"("a\"b\\c\/d\b\f\n\r\t")").as_string() == "a\"b\\c/d\b\f\n\r\t");
  CHECK(parsed(R"("\u00e9\u00C9")").as_string() == "\xC3\xA9\xC3\x89");
  CHECK(parsed(R"("\uD834\uDD1E")").as_string() == "\xF0\x9D\x84\x9E");
  CHECK(parsed("\"5\xC2\xA0L/min \xE2\x89\xA5\"").as_string() == "5\xC2\xA0L/min \xE2\x89\xA5");
  for (const char* bad : {"\"\\uD834\"", "\"\\uDD1E\"", "\"\\u12G4\"", "\"\\x41\"", "\"tab\there\"",
                          "\"line\nbreak\"", "\"open", "\"\xFF\"", "\"\xC0\xAF\"", "\"\xED\xA0\x80\"",
                          "\"\xC3\""}) {
    INFO(bad);
    CHECK_FALSE(accepts(bad));
  }
}

TEST_CASE("RFC 8259 §8.1: a leading byte order mark is ignored, as the reference library does", "[json]") {
  // A team profile saved by a Windows editor starts with one; only at the start is it allowed.
  CHECK(parsed("\xEF\xBB\xBF{\"a\": 1}")["a"].as_integer() == 1);
  CHECK(Reference::parse("\xEF\xBB\xBF{\"a\": 1}", nullptr, false)["a"] == 1);
  CHECK_FALSE(accepts("{\"a\": \xEF\xBB\xBF" "1}"));  // not inside the text
  CHECK_FALSE(accepts("\xEF\xBB"));
  std::string with_mark = "\xEF\xBB\xBF" + std::string(firn::team_profile::demo_profile_json());
  CHECK(firn::team_profile::parse_profile(with_mark).ok());
}

TEST_CASE("A syntax error says where the text broke", "[json]") {
  std::string text = "{\n \"schema_version\": 2,\n oops\n}";
  firn::json::Parsed p = firn::json::parse(text);
  REQUIRE_FALSE(p.ok);
  CHECK(p.error.offset == text.find("oops"));
  CHECK(p.error.near == "o");
  p = firn::json::parse("[\"unfinished");
  REQUIRE_FALSE(p.ok);
  CHECK(p.error.offset == 12);
  CHECK(p.error.near == "\"unfinished");
  p = firn::json::parse("[1, \xC3\xA9]");
  REQUIRE_FALSE(p.ok);
  CHECK(p.error.near == "\xC3\xA9");  // the whole character, not half of it
}

TEST_CASE("Nesting past the limit is refused, not a stack overflow", "[json]") {
  auto nested = [](int depth) { return std::string(depth, '[') + std::string(depth, ']'); };
  CHECK(accepts(nested(firn::json::kMaxDepth)));
  CHECK_FALSE(accepts(nested(firn::json::kMaxDepth + 1)));
  CHECK_FALSE(accepts(std::string(1'000'000, '[')));
  CHECK_FALSE(accepts(std::string(1'000'000, '{')));
}

TEST_CASE("Texts past the limits are refused with the reason, quickly", "[json]") {
  // A wrong file picked on a phone (a photo, a large export) must not hang or exhaust the page;
  // Firn's own files stay far inside (limits in model/json.hpp, checked against the demo files).
  std::string large = "[" + std::string(firn::json::kMaxTextBytes, ' ') + "]";
  firn::json::Parsed p = firn::json::parse(large);
  CHECK_FALSE(p.ok);
  CHECK(p.error.limit == "it is larger than 4 MB");
  std::string wide = "{";
  for (std::size_t i = 0; i <= firn::json::kMaxMembers; ++i) wide += (i ? ",\"k" : "\"k") + std::to_string(i) + "\":0";
  p = firn::json::parse(wide + "}");
  CHECK_FALSE(p.ok);
  CHECK(p.error.limit == "an object has more than 256 fields");
  // 256 fields, each repeated: still read (a repeated key does not count twice).
  std::string full = "{";
  for (std::size_t i = 0; i < firn::json::kMaxMembers; ++i) full += (i ? ",\"k" : "\"k") + std::to_string(i) + "\":0";
  CHECK(accepts(full + ",\"k0\":1}"));
  p = firn::json::parse(std::string(300, '['));
  CHECK(p.error.limit == "it is nested more than 256 deep");
  CHECK(firn::json::parse("[1,]").error.limit.empty());  // a plain syntax error names no limit
  // The messages users see.
  firn::team_profile::Problems problems = firn::team_profile::check_profile(wide + "}");
  REQUIRE_FALSE(problems.lines.empty());
  CHECK(problems.lines.front() == "the file is not a Firn file: an object has more than 256 fields");
}

TEST_CASE("Writing: escapes, layout, numbers that read back the same", "[json]") {
  Value v = Value::object();
  v["text"] = "quote \" backslash \\ newline \n bell \x07 é";
  v["list"] = Value::array();
  v["list"].push_back(1);
  v["list"].push_back(0.1);
  v["list"].push_back(2.0);
  v["empty"] = Value::object();
  v["none"] = Value::array();
  CHECK(v.dump() == R"({"text":"quote \" backslash \\ newline \n bell \u0007 é","list":[1,0.1,2.0],"empty":{},"none":[]})");
  CHECK(v.dump(2) == "{\n  \"text\": \"quote \\\" backslash \\\\ newline \\n bell \\u0007 é\",\n"
                     "  \"list\": [\n    1,\n    0.1,\n    2.0\n  ],\n  \"empty\": {},\n  \"none\": []\n}");
  // Shortest text that reads back to the same double (common practice, as reference libraries do).
  for (double d : {0.1, 1.0 / 3.0, 5200.0, 1e-7, -2.5e300, 4.9e-324, 123456789.125}) {
    Value back = parsed(Value(d).dump());
    CHECK(back.as_double() == d);
  }
  CHECK(Value(std::numeric_limits<double>::quiet_NaN()).dump() == "null");  // none reach a file
  CHECK(Value(std::numeric_limits<double>::infinity()).dump() == "null");
  CHECK(Value(std::string("bad \xFF byte")).dump() == "\"bad \xEF\xBF\xBD byte\"");
  // A repeated key: the last value counts, as in the reference library.
  CHECK(parsed(R"({"a": 1, "b": 2, "a": 3})")["a"].as_integer() == 3);
  // The keys a reader does not know, in the file's order (each file reader names them).
  CHECK(firn::json::unknown_keys(parsed(R"({"zz": 1, "a": 2, "colour": 3})"), {"a", "b"}) ==
        std::vector<std::string>{"zz", "colour"});
  CHECK(firn::json::unknown_keys(parsed("[1]"), {"a"}).empty());  // not an object: no keys
}

TEST_CASE("Same verdict and same values as the reference library on broken and mended files",
          "[json]") {
  std::vector<std::string> seeds = {
      std::string(firn::team_profile::demo_profile_json()),
      std::string(firn::route::demo_route_json()),
      R"({"firn_record": 1, "incident": "Demo \u00e9 \"q\"", "entries": [{"time": "2026-07-14T13:40",)"
      R"( "spo2": "78%", "n": -0.5e-3, "ok": true, "x": null, "list": [[], {}, 1E2, 0]}]})",
  };
  // Bytes a mutation inserts: every JSON structural character, digits, escapes, UTF-8 pieces.
  const std::string pieces = "{}[],:\"\\0123456789.eE+-tfnulr \n\t\x01\xC3\xA9\xE2\x89\xA5\xFF\xED";
  std::mt19937 random(20261204);
  int agreed_valid = 0, agreed_invalid = 0;
  std::vector<std::string> disagreements;
  for (int round = 0; round < 6000; ++round) {
    std::string text = seeds[round % seeds.size()];
    for (int edits = 1 + static_cast<int>(random() % 3); edits > 0; --edits) {
      size_t at = random() % (text.size() + 1);
      switch (random() % 4) {
        case 0: if (at < text.size()) text.erase(at, 1); break;
        case 1: text.insert(at, 1, pieces[random() % pieces.size()]); break;
        case 2: if (at < text.size()) text[at] = pieces[random() % pieces.size()]; break;
        default: text.insert(at, text.substr(random() % text.size(), random() % 12)); break;
      }
    }
    firn::json::Parsed ours = firn::json::parse(text);
    Reference theirs = Reference::parse(text, nullptr, /*allow_exceptions=*/false);
    if (ours.ok != !theirs.is_discarded()) {
      disagreements.push_back(text);
      continue;
    }
    if (!ours.ok) {
      ++agreed_invalid;
      continue;
    }
    ++agreed_valid;
    // Our writing, read by the reference library, is the value the reference read.
    if (Reference::parse(ours.value.dump(2)) != theirs) disagreements.push_back("value: " + text);
  }
  INFO("first disagreement: " << (disagreements.empty() ? "" : disagreements.front()));
  CHECK(disagreements.empty());
  CHECK(agreed_valid > 300);  // both kinds really occurred
  CHECK(agreed_invalid > 3000);
}

TEST_CASE("Firn's own files are written as the reference library writes them", "[json]") {
  for (std::string_view seed : {firn::team_profile::demo_profile_json(), firn::route::demo_route_json()}) {
    Value ours = parsed(seed);
    CHECK(ours.dump(2) == Reference::parse(seed).dump(2));
    CHECK(ours.dump() == Reference::parse(seed).dump());
  }
}
