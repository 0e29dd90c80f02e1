// firn::json: the JSON Firn's own small files need (team profile, route, casualty record, saved
// state) — a value tree with objects in insertion order, a strict RFC 8259 reader that says where
// the text broke, and a writer. Replaces a general-purpose library that was a tenth of the page's
// code (docs/BENCHMARKS.md, issue 17). No exceptions: a wrong kind reads as empty or zero.
#pragma once

#include <cstddef>
#include <cstdint>
#include <initializer_list>
#include <string>
#include <string_view>
#include <type_traits>
#include <utility>
#include <vector>

namespace firn::json {

class Value;
using Member = std::pair<std::string, Value>;

class Value {
 public:
  enum class Kind : std::uint8_t { Null, Boolean, Integer, Number, String, Array, Object };

  Value() = default;
  Value(std::nullptr_t) {}
  Value(bool b) : kind_(Kind::Boolean), boolean_(b) {}
  template <class Integer, std::enable_if_t<std::is_integral_v<Integer> &&
                                            !std::is_same_v<Integer, bool>, int> = 0>
  Value(Integer i) : kind_(Kind::Integer), integer_(static_cast<std::int64_t>(i)) {}
  Value(double d) : kind_(Kind::Number), number_(d) {}
  Value(const char* s) : kind_(Kind::String), string_(s) {}
  Value(std::string s) : kind_(Kind::String), string_(std::move(s)) {}
  Value(std::string_view s) : kind_(Kind::String), string_(s) {}
  template <class T>
  Value(const std::vector<T>& list) : kind_(Kind::Array) {  // an array of the list's values
    for (const T& x : list) elements_.emplace_back(x);
  }
  // {{"flow", "15L/min"}, {"minutes", 30}}: an object, members in the order written.
  Value(std::initializer_list<Member> members);

  static Value array() { Value v; v.kind_ = Kind::Array; return v; }
  static Value object() { Value v; v.kind_ = Kind::Object; return v; }

  Kind kind() const { return kind_; }
  bool is_null() const { return kind_ == Kind::Null; }
  bool is_boolean() const { return kind_ == Kind::Boolean; }
  bool is_number() const { return kind_ == Kind::Integer || kind_ == Kind::Number; }
  bool is_number_integer() const { return kind_ == Kind::Integer; }
  bool is_string() const { return kind_ == Kind::String; }
  bool is_array() const { return kind_ == Kind::Array; }
  bool is_object() const { return kind_ == Kind::Object; }

  // Read-outs: the value when it is of that kind, else false / 0 / "" (check the kind first).
  bool as_bool() const { return kind_ == Kind::Boolean && boolean_; }
  double as_double() const;
  std::int64_t as_integer() const;  // a Number is truncated toward zero, clamped to int64
  const std::string& as_string() const;

  // Arrays and objects: element or member count; 0 for any other kind.
  std::size_t size() const;
  bool empty() const { return size() == 0; }

  // Arrays.
  const std::vector<Value>& elements() const;  // empty for any other kind
  const Value& operator[](std::size_t index) const;  // null past the end
  void push_back(Value v);  // a null becomes an array first

  // Objects.
  const std::vector<Member>& members() const;  // empty for any other kind
  const Value* find(std::string_view key) const;  // nullptr when absent (or not an object)
  bool contains(std::string_view key) const { return find(key) != nullptr; }
  const Value& operator[](std::string_view key) const;  // null when absent
  Value& operator[](std::string_view key);  // added (null) when absent; a null becomes an object

  // Arrays iterate their elements (range-for); other kinds iterate nothing.
  const Value* begin() const { return elements().data(); }
  const Value* end() const { return elements().data() + elements().size(); }

  // indent < 0: one line, no spaces; otherwise one member or element a line, `indent` spaces a
  // level. Text that is not UTF-8 is written with U+FFFD in place of each bad byte.
  std::string dump(int indent = -1) const;

 private:
  Kind kind_ = Kind::Null;
  bool boolean_ = false;
  std::int64_t integer_ = 0;
  double number_ = 0.0;
  std::string string_;
  std::vector<Value> elements_;
  std::vector<Member> members_;
};

// The keys of an object that are not in `known`, in the file's order: each file reader names
// them as "unknown field (a typo?)".
std::vector<std::string> unknown_keys(const Value& object, std::initializer_list<std::string_view> known);

// A value as a file would write it, for messages: at most 40 bytes, cut between characters and
// ending "..." when cut.
std::string shown(const Value& v);

// Where reading stopped: the byte offset of the offending character (0-based) and the token text
// up to it, as the parser saw it.
struct SyntaxError {
  std::size_t offset = 0;
  std::string near;
  // Empty for a syntax error; otherwise why a well-formed text was refused ("it is larger than
  // 4 MB"): past the limits below, no Firn file, and reading on could hang or exhaust a phone.
  std::string limit;
};

struct Parsed {
  Value value;
  bool ok = false;
  SyntaxError error;  // meaningful when !ok
};

// One JSON value and nothing but whitespace after it. Limits far above any Firn file (a record
// of 2000 entries is ~300 KB; no object has 30 fields): deeper nesting would overflow the stack,
// a larger text exhaust a phone's memory, a larger object take seconds (a repeated key is looked
// up among the fields before it).
inline constexpr int kMaxDepth = 256;
inline constexpr std::size_t kMaxTextBytes = 4 * 1024 * 1024;
inline constexpr std::size_t kMaxMembers = 256;
Parsed parse(std::string_view text);

}  // namespace firn::json
