#include "model/json.hpp"

#include <algorithm>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace firn::json {

namespace {

const Value kNull;
const std::string kNoText;
const std::vector<Value> kNoElements;
const std::vector<Member> kNoMembers;

// Length of the UTF-8 sequence at text[i] (1…4), or 0 when it is not well-formed (a stray
// continuation byte, a cut sequence, an overlong form, a surrogate or a code point past U+10FFFF).
std::size_t utf8_length(std::string_view text, std::size_t i) {
  auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[k]); };
  unsigned char lead = byte(i);
  std::size_t n = lead < 0x80 ? 1 : lead >= 0xC2 && lead <= 0xDF ? 2 : (lead & 0xF0) == 0xE0 ? 3
                : lead >= 0xF0 && lead <= 0xF4 ? 4 : 0;
  if (n <= 1 || i + n > text.size()) return i + n > text.size() ? 0 : n;
  for (std::size_t k = 1; k < n; ++k) {
    if ((byte(i + k) & 0xC0) != 0x80) return 0;
  }
  unsigned char second = byte(i + 1);
  if (lead == 0xE0 && second < 0xA0) return 0;   // overlong
  if (lead == 0xED && second > 0x9F) return 0;   // UTF-16 surrogate
  if (lead == 0xF0 && second < 0x90) return 0;   // overlong
  if (lead == 0xF4 && second > 0x8F) return 0;   // past U+10FFFF
  return n;
}

void append_utf8(std::string& out, std::uint32_t code) {
  if (code < 0x80) {
    out += static_cast<char>(code);
  } else if (code < 0x800) {
    out += static_cast<char>(0xC0 | (code >> 6));
    out += static_cast<char>(0x80 | (code & 0x3F));
  } else if (code < 0x10000) {
    out += static_cast<char>(0xE0 | (code >> 12));
    out += static_cast<char>(0x80 | ((code >> 6) & 0x3F));
    out += static_cast<char>(0x80 | (code & 0x3F));
  } else {
    out += static_cast<char>(0xF0 | (code >> 18));
    out += static_cast<char>(0x80 | ((code >> 12) & 0x3F));
    out += static_cast<char>(0x80 | ((code >> 6) & 0x3F));
    out += static_cast<char>(0x80 | (code & 0x3F));
  }
}

class Reader {
 public:
  explicit Reader(std::string_view text) : text_(text) {}

  Parsed read() {
    Parsed parsed;
    if (text_.size() > kMaxTextBytes) return refused(0, "it is larger than 4 MB");
    // RFC 8259 §8.1 lets a reader ignore a leading byte order mark: Windows editors write one.
    if (text_.substr(0, 3) == "\xEF\xBB\xBF") at_ = 3;
    skip_space();
    if (!value(parsed.value, 0)) return failed();
    skip_space();
    if (at_ < text_.size()) {
      fail_at(at_, at_);
      return failed();
    }
    parsed.ok = true;
    return parsed;
  }

 private:
  Parsed failed() {
    Parsed parsed;
    parsed.error = error_;
    return parsed;
  }

  Parsed refused(std::size_t at, std::string why) {
    fail_at(at, at);
    error_.limit = std::move(why);
    return failed();
  }
  bool refuse(std::string why) {
    fail_at(at_, at_);
    error_.limit = std::move(why);
    return false;
  }

  // The token from `start` through the character at `at` (the whole UTF-8 sequence there).
  bool fail_at(std::size_t start, std::size_t at) {
    std::size_t n = at < text_.size() ? std::max<std::size_t>(utf8_length(text_, at), 1) : 0;
    error_.offset = at;
    error_.near = std::string(text_.substr(start, at - start + n));
    return false;
  }

  void skip_space() {
    while (at_ < text_.size() && (text_[at_] == ' ' || text_[at_] == '\t' || text_[at_] == '\n' ||
                                  text_[at_] == '\r')) {
      ++at_;
    }
  }
  bool next_is(char c) const { return at_ < text_.size() && text_[at_] == c; }

  bool value(Value& out, int depth) {
    if (at_ >= text_.size()) return fail_at(at_, at_);
    switch (text_[at_]) {
      case '{': return depth < kMaxDepth ? object(out, depth + 1) : refuse("it is nested more than 256 deep");
      case '[': return depth < kMaxDepth ? array(out, depth + 1) : refuse("it is nested more than 256 deep");
      case '"': {
        std::string s;
        if (!string(s)) return false;
        out = Value(std::move(s));
        return true;
      }
      case 't': return literal("true", Value(true), out);
      case 'f': return literal("false", Value(false), out);
      case 'n': return literal("null", Value(), out);
      default: return number(out);
    }
  }

  bool literal(std::string_view word, Value v, Value& out) {
    std::size_t start = at_;
    for (char c : word) {
      if (!next_is(c)) return fail_at(start, at_);
      ++at_;
    }
    out = std::move(v);
    return true;
  }

  bool object(Value& out, int depth) {
    out = Value::object();
    ++at_;  // '{'
    skip_space();
    if (next_is('}')) return ++at_, true;
    while (true) {
      skip_space();
      if (!next_is('"')) return fail_at(at_, at_);
      std::string key;
      if (!string(key)) return false;
      skip_space();
      if (!next_is(':')) return fail_at(at_, at_);
      ++at_;
      skip_space();
      Value member;
      if (!value(member, depth)) return false;
      if (out.size() == kMaxMembers && !out.contains(key)) return refuse("an object has more than 256 fields");
      out[key] = std::move(member);  // a repeated key: the last one counts
      skip_space();
      if (next_is(',')) { ++at_; continue; }
      if (next_is('}')) return ++at_, true;
      return fail_at(at_, at_);
    }
  }

  bool array(Value& out, int depth) {
    out = Value::array();
    ++at_;  // '['
    skip_space();
    if (next_is(']')) return ++at_, true;
    while (true) {
      skip_space();
      Value element;
      if (!value(element, depth)) return false;
      out.push_back(std::move(element));
      skip_space();
      if (next_is(',')) { ++at_; continue; }
      if (next_is(']')) return ++at_, true;
      return fail_at(at_, at_);
    }
  }

  bool hex4(std::size_t start, std::uint32_t& code) {
    code = 0;
    for (int k = 0; k < 4; ++k) {
      if (at_ >= text_.size()) return fail_at(start, at_);
      char c = text_[at_];
      int digit = c >= '0' && c <= '9' ? c - '0' : c >= 'a' && c <= 'f' ? c - 'a' + 10
                : c >= 'A' && c <= 'F' ? c - 'A' + 10 : -1;
      if (digit < 0) return fail_at(start, at_);
      code = code * 16 + static_cast<std::uint32_t>(digit);
      ++at_;
    }
    return true;
  }

  bool string(std::string& out) {
    std::size_t start = at_++;  // '"'
    while (true) {
      if (at_ >= text_.size()) return fail_at(start, at_);
      unsigned char c = static_cast<unsigned char>(text_[at_]);
      if (c == '"') return ++at_, true;
      if (c < 0x20) return fail_at(start, at_);
      if (c >= 0x80) {
        std::size_t n = utf8_length(text_, at_);
        if (n == 0) return fail_at(start, at_);
        out += text_.substr(at_, n);
        at_ += n;
        continue;
      }
      if (c != '\\') {
        out += static_cast<char>(c);
        ++at_;
        continue;
      }
      if (++at_ >= text_.size()) return fail_at(start, at_);
      char e = text_[at_++];
      switch (e) {
        case '"': out += '"'; break;
        case '\\': out += '\\'; break;
        case '/': out += '/'; break;
        case 'b': out += '\b'; break;
        case 'f': out += '\f'; break;
        case 'n': out += '\n'; break;
        case 'r': out += '\r'; break;
        case 't': out += '\t'; break;
        case 'u': {
          std::uint32_t code = 0;
          if (!hex4(start, code)) return false;
          if (code >= 0xDC00 && code <= 0xDFFF) return fail_at(start, at_ - 1);
          if (code >= 0xD800 && code <= 0xDBFF) {  // must be followed by its low half
            std::uint32_t low = 0;
            if (!next_is('\\')) return fail_at(start, at_);
            ++at_;
            if (!next_is('u')) return fail_at(start, at_);
            ++at_;
            if (!hex4(start, low)) return false;
            if (low < 0xDC00 || low > 0xDFFF) return fail_at(start, at_ - 1);
            code = 0x10000 + ((code - 0xD800) << 10) + (low - 0xDC00);
          }
          append_utf8(out, code);
          break;
        }
        default: return fail_at(start, at_ - 1);
      }
    }
  }

  bool digits(std::size_t start) {
    if (at_ >= text_.size() || text_[at_] < '0' || text_[at_] > '9') return fail_at(start, at_);
    while (at_ < text_.size() && text_[at_] >= '0' && text_[at_] <= '9') ++at_;
    return true;
  }

  bool number(Value& out) {
    std::size_t start = at_;
    if (next_is('-')) ++at_;
    if (next_is('0')) {
      ++at_;
    } else if (!digits(start)) {
      return false;
    }
    bool integral = true;
    if (next_is('.')) {
      integral = false;
      ++at_;
      if (!digits(start)) return false;
    }
    if (next_is('e') || next_is('E')) {
      integral = false;
      ++at_;
      if (next_is('+') || next_is('-')) ++at_;
      if (!digits(start)) return false;
    }
    std::string lexeme(text_.substr(start, at_ - start));
    errno = 0;
    if (integral) {
      long long i = std::strtoll(lexeme.c_str(), nullptr, 10);
      if (errno == 0) {
        out = Value(i);
        return true;
      }
      errno = 0;  // too large for an integer: read as a number, as other readers do
    }
    double d = std::strtod(lexeme.c_str(), nullptr);
    if (!std::isfinite(d)) return fail_at(start, at_ - 1);  // 1e999: no such number
    out = Value(d);
    return true;
  }

  std::string_view text_;
  std::size_t at_ = 0;
  SyntaxError error_;
};

// The shortest decimal that reads back as the same double; "2.0", not "2", so it reads back as
// a number and not an integer. Not finite: null (JSON has no NaN; none may reach a file).
void write_number(std::string& out, double d) {
  if (!std::isfinite(d)) {
    out += "null";
    return;
  }
  // From 15 digits: a double that reads back from fewer prints the same at 15 (%g drops the
  // trailing zeros), and the saved state is written after every gesture.
  char buffer[32];
  for (int precision = 15; precision <= 17; ++precision) {
    std::snprintf(buffer, sizeof buffer, "%.*g", precision, d);
    if (std::strtod(buffer, nullptr) == d) break;
  }
  std::string_view text(buffer);
  out += text;
  if (text.find_first_not_of("-0123456789") == std::string_view::npos) out += ".0";
}

void write_string(std::string& out, std::string_view s) {
  static constexpr char kHex[] = "0123456789abcdef";
  out += '"';
  for (std::size_t i = 0; i < s.size();) {
    unsigned char c = static_cast<unsigned char>(s[i]);
    if (c >= 0x80) {
      std::size_t n = utf8_length(s, i);
      out += n ? s.substr(i, n) : std::string_view("\xEF\xBF\xBD");  // U+FFFD for a bad byte
      i += n ? n : 1;
      continue;
    }
    switch (c) {
      case '"': out += "\\\""; break;
      case '\\': out += "\\\\"; break;
      case '\b': out += "\\b"; break;
      case '\f': out += "\\f"; break;
      case '\n': out += "\\n"; break;
      case '\r': out += "\\r"; break;
      case '\t': out += "\\t"; break;
      default:
        if (c < 0x20) {
          out += "\\u00";
          out += kHex[c >> 4];
          out += kHex[c & 15];
        } else {
          out += static_cast<char>(c);
        }
    }
    ++i;
  }
  out += '"';
}

void write(std::string& out, const Value& v, int indent, int level) {
  auto new_line = [&](int at_level) {
    if (indent < 0) return;
    out += '\n';
    out.append(static_cast<std::size_t>(indent * at_level), ' ');
  };
  switch (v.kind()) {
    case Value::Kind::Null: out += "null"; return;
    case Value::Kind::Boolean: out += v.as_bool() ? "true" : "false"; return;
    case Value::Kind::Integer: out += std::to_string(v.as_integer()); return;
    case Value::Kind::Number: write_number(out, v.as_double()); return;
    case Value::Kind::String: write_string(out, v.as_string()); return;
    case Value::Kind::Array:
      out += '[';
      for (std::size_t i = 0; i < v.size(); ++i) {
        if (i) out += ',';
        new_line(level + 1);
        write(out, v.elements()[i], indent, level + 1);
      }
      if (!v.empty()) new_line(level);
      out += ']';
      return;
    case Value::Kind::Object:
      out += '{';
      for (std::size_t i = 0; i < v.size(); ++i) {
        if (i) out += ',';
        new_line(level + 1);
        write_string(out, v.members()[i].first);
        out += indent < 0 ? ":" : ": ";
        write(out, v.members()[i].second, indent, level + 1);
      }
      if (!v.empty()) new_line(level);
      out += '}';
      return;
  }
}

}  // namespace

Value::Value(std::initializer_list<Member> members) : kind_(Kind::Object) {
  for (const Member& m : members) (*this)[m.first] = m.second;
}

double Value::as_double() const {
  return kind_ == Kind::Integer ? static_cast<double>(integer_) : kind_ == Kind::Number ? number_ : 0.0;
}

std::int64_t Value::as_integer() const {
  if (kind_ == Kind::Integer) return integer_;
  if (kind_ != Kind::Number || !std::isfinite(number_)) return 0;
  constexpr double kLimit = 9.2e18;  // inside int64 with room for rounding
  return static_cast<std::int64_t>(std::fmax(-kLimit, std::fmin(kLimit, number_)));
}

const std::string& Value::as_string() const { return kind_ == Kind::String ? string_ : kNoText; }

std::size_t Value::size() const {
  return kind_ == Kind::Array ? elements_.size() : kind_ == Kind::Object ? members_.size() : 0;
}

const std::vector<Value>& Value::elements() const {
  return kind_ == Kind::Array ? elements_ : kNoElements;
}

const Value& Value::operator[](std::size_t index) const {
  return index < elements().size() ? elements_[index] : kNull;
}

void Value::push_back(Value v) {
  if (kind_ == Kind::Null) kind_ = Kind::Array;
  if (kind_ == Kind::Array) elements_.push_back(std::move(v));
}

const std::vector<Member>& Value::members() const {
  return kind_ == Kind::Object ? members_ : kNoMembers;
}

const Value* Value::find(std::string_view key) const {
  for (const Member& m : members()) {
    if (m.first == key) return &m.second;
  }
  return nullptr;
}

const Value& Value::operator[](std::string_view key) const {
  const Value* v = find(key);
  return v ? *v : kNull;
}

Value& Value::operator[](std::string_view key) {
  if (kind_ == Kind::Null) kind_ = Kind::Object;
  for (Member& m : members_) {
    if (m.first == key) return m.second;
  }
  members_.emplace_back(std::string(key), Value());
  return members_.back().second;
}

std::string Value::dump(int indent) const {
  std::string out;
  write(out, *this, indent, 0);
  return out;
}

std::vector<std::string> unknown_keys(const Value& object, std::initializer_list<std::string_view> known) {
  std::vector<std::string> unknown;
  for (const Member& m : object.members()) {
    if (std::find(known.begin(), known.end(), m.first) == known.end()) unknown.push_back(m.first);
  }
  return unknown;
}

std::string shown(const Value& v) {
  constexpr std::size_t kMax = 40, kCut = 37;
  std::string text = v.dump();
  if (text.size() <= kMax) return text;
  std::size_t end = 0;
  while (end < text.size()) {  // dump() wrote UTF-8 only
    std::size_t n = std::max<std::size_t>(utf8_length(text, end), 1);
    if (end + n > kCut) break;
    end += n;
  }
  return text.substr(0, end) + "...";
}

Parsed parse(std::string_view text) { return Reader(text).read(); }

}  // namespace firn::json
