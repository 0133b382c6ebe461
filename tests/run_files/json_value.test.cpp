// parse_json: strict RFC 8259 (run_files/json_value.hpp). Every refusal must name the file,
// the line and the column of the offending byte (columns count bytes from 1).
#include <cmath>
#include <string>

#include "run_files/json_value.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using run_files::JsonKind;
using run_files::JsonValue;
using run_files::parse_json;
using test::bytes_of;
using test::check_refused;
using test::message;

namespace {

JsonValue parse(std::string_view text) { return parse_json(bytes_of(text), "s.json"); }

void check_json_refused(std::string_view text, std::string_view place, std::string_view fragment) {
    check_refused([&] { (void)parse(text); }, place, fragment);
}

std::string parse_string(std::string_view text) { return parse(text).as_string(); }

}  // namespace

TEST_CASE("a summary-style document parses with its members in file order", "[run_files][json]") {
    const JsonValue doc = parse(
        "{\n"
        "  \"barrier_kT\": 12.5,\n"
        "  \"cluster_gap_nm\": null,\n"
        "  \"percolating\": false,\n"
        "  \"status\": \"running\",\n"
        "  \"ci95\": [1e-17, 2E+3, -0.5],\n"
        "  \"pairs\": [{\"species\": [1, 1], \"names\": [\"a\", \"b\"]}],\n"
        "  \"empty\": {}, \"none\": []\n"
        "}\n");
    REQUIRE(doc.is_object());
    const auto& members = doc.as_object();
    REQUIRE(members.size() == 8);
    CHECK(members[0].key == "barrier_kT");
    CHECK(members[7].key == "none");
    CHECK(doc.find("barrier_kT")->as_number() == 12.5);
    CHECK(doc.find("cluster_gap_nm")->is_null());
    CHECK(doc.find("percolating")->is_bool());
    CHECK_FALSE(doc.find("percolating")->as_bool());
    CHECK(doc.find("status")->as_string() == "running");
    const auto& ci = doc.find("ci95")->as_array();
    REQUIRE(ci.size() == 3);
    CHECK(ci[0].as_number() == 1e-17);
    CHECK(ci[1].as_number() == 2e3);
    CHECK(ci[2].as_number() == -0.5);
    const JsonValue& pair = doc.find("pairs")->as_array().at(0);
    CHECK(pair.find("names")->as_array()[1].as_string() == "b");
    CHECK(doc.find("empty")->as_object().empty());
    CHECK(doc.find("none")->as_array().empty());
    CHECK(doc.find("missing") == nullptr);
    CHECK(doc.find("barrier_kT")->find("x") == nullptr);  // not an object
    CHECK(doc.find("pairs")->kind() == JsonKind::array);
    // Positions of the values' first bytes.
    CHECK(doc.line() == 1);
    CHECK(doc.column() == 1);
    CHECK(doc.find("barrier_kT")->line() == 2);
    CHECK(doc.find("barrier_kT")->column() == 17);
    CHECK(doc.find("none")->line() == 8);
    CHECK(doc.find("none")->column() == 24);
}

TEST_CASE("whitespace may surround the value and nothing else may follow it", "[run_files][json]") {
    CHECK(parse(" \t\r\n{}\r\n ").is_object());
    CHECK(parse("7").as_number() == 7.0);
    CHECK(parse("\"x\"").as_string() == "x");
    CHECK(parse("null").is_null());
    CHECK(parse("true").as_bool());
    check_json_refused("", "s.json:1:1:", "the file ends where a value should start");
    check_json_refused(" \n  ", "s.json:2:3:", "the file ends where a value should start");
    check_json_refused("{} x", "s.json:1:4:", "unexpected \"x\" after the JSON value; only whitespace may follow it");
    check_json_refused("{}{}", "s.json:1:3:", "after the JSON value");
    check_json_refused("1 2", "s.json:1:3:", "after the JSON value");
    check_json_refused("{}\n\x0C", "s.json:2:1:", "unexpected \"\\x0C\" after the JSON value");
    check_json_refused("\xEF\xBB\xBF{}", "s.json:1:1:", "unexpected \"\\xEF\"; a JSON value is");
}

TEST_CASE("arrays and objects nest at most 64 deep", "[run_files][json]") {
    const std::string deepest = std::string(64, '[') + std::string(64, ']');
    CHECK(parse(deepest).is_array());
    const std::string too_deep = std::string(65, '[') + std::string(65, ']');
    check_json_refused(too_deep, "s.json:1:65:", "more than 64 nested arrays and objects; 64 is the limit");
    std::string objects;
    for (int k = 0; k < 65; ++k) objects += "{\"a\":";
    check_json_refused(objects, message("s.json:1:", 64 * 5 + 1, ":"), "more than 64 nested");
    // A million brackets are refused just as early: no deep recursion.
    check_json_refused(std::string(1'000'000, '['), "s.json:1:65:", "more than 64 nested");
}

TEST_CASE("strings are well-formed UTF-8", "[run_files][json]") {
    CHECK(parse_string("\"\xC3\xA9\"") == "\xC3\xA9");                  // U+00E9
    CHECK(parse_string("\"\xE2\x82\xAC\"") == "\xE2\x82\xAC");          // U+20AC
    CHECK(parse_string("\"\xED\x9F\xBF\"") == "\xED\x9F\xBF");          // U+D7FF, below the surrogates
    CHECK(parse_string("\"\xF0\x9F\x98\x80\"") == "\xF0\x9F\x98\x80");  // U+1F600
    CHECK(parse_string("\"\xF4\x8F\xBF\xBF\"") == "\xF4\x8F\xBF\xBF");  // U+10FFFF, the last
    CHECK(parse_string("\"\x7F\"") == "\x7F");                          // DEL needs no escape
    struct Case {
        std::string_view text, place, byte;
    };
    const Case cases[] = {
        {"\"\xC0\x80\"", "s.json:1:2:", "\\xC0"},          // overlong NUL
        {"\"\xC1\xBF\"", "s.json:1:2:", "\\xC1"},          // overlong
        {"\"\xE0\x80\xAF\"", "s.json:1:3:", "\\x80"},      // overlong '/'
        {"\"\xF0\x8F\xBF\xBF\"", "s.json:1:3:", "\\x8F"},  // overlong U+FFFF
        {"\"\xED\xA0\x80\"", "s.json:1:3:", "\\xA0"},      // U+D800, a surrogate
        {"\"\xED\xBF\xBF\"", "s.json:1:3:", "\\xBF"},      // U+DFFF
        {"\"\xF4\x90\x80\x80\"", "s.json:1:3:", "\\x90"},  // U+110000
        {"\"\xF5\x80\x80\x80\"", "s.json:1:2:", "\\xF5"},  // beyond any code point
        {"\"\xFF\"", "s.json:1:2:", "\\xFF"},
        {"\"a\x80\"", "s.json:1:3:", "\\x80"},  // a lone continuation byte
        {"\"\xC3(\"", "s.json:1:3:", "("},      // a sequence cut short
        {"\"\xE2\x82\"", "s.json:1:4:", "\\\""},
    };
    for (const Case& c : cases)
        check_json_refused(c.text, c.place,
                           message("byte \"", c.byte, "\" is not valid UTF-8 here; strings are UTF-8 without"));
    check_json_refused("\"\xF0\x9F\x98", "s.json:1:5:", "the file ends inside the string opened at line 1 column 1");
}

TEST_CASE("escapes decode to UTF-8 and surrogate pairs join", "[run_files][json]") {
    CHECK(parse_string(R"("\" \\ \/ \b \f \n \r \t")") == "\" \\ / \b \f \n \r \t");
    CHECK(parse_string(R"("\u0041\u00e9\u20AC")") == "A\xC3\xA9\xE2\x82\xAC");
    CHECK(parse_string(R"("\ud83d\ude00")") == "\xF0\x9F\x98\x80");
    CHECK(parse_string(R"("\uDBFF\uDFFF")") == "\xF4\x8F\xBF\xBF");
    CHECK(parse_string(R"("a\u0000b")") == std::string("a\0b", 3));
}

TEST_CASE("lone surrogates and unknown escapes are refused", "[run_files][json]") {
    check_json_refused(R"("ab\ud800")", "s.json:1:4:", "lone high surrogate \"\\\\ud800\"");
    check_json_refused(R"("\ud800x")", "s.json:1:2:", "lone high surrogate");
    check_json_refused(R"("\ud800\u0041")", "s.json:1:8:", "high surrogate \"\\\\ud800\" followed by \"\\\\u0041\"");
    check_json_refused(R"("\ud800\ud800")", "s.json:1:8:", "it must be followed by a \\uDC00-\\uDFFF escape");
    check_json_refused(R"("\udc00\ud800")", "s.json:1:2:", "lone low surrogate \"\\\\udc00\"");
    check_json_refused(R"("\x41")", "s.json:1:2:", "unknown escape \"\\\\x\"; escapes are");
    check_json_refused(R"("\U0041")", "s.json:1:2:", "unknown escape \"\\\\U\"");
    check_json_refused(R"("\u12g4")", "s.json:1:6:", "found \"g\" in a \\u escape; \\u takes 4 hex digits");
    check_json_refused(R"("\u12)", "s.json:1:6:", "the file ends inside the string");
}

TEST_CASE("control characters in strings must be escaped", "[run_files][json]") {
    check_json_refused("\"a\tb\"", "s.json:1:3:", "control character \"\\x09\" in a string; strings escape them");
    check_json_refused("{\"k\":\n\"line\nbreak\"}", "s.json:2:6:", "control character \"\\x0A\"");
    check_json_refused(std::string_view("\"\0\"", 3), "s.json:1:2:", "control character \"\\x00\"");
    check_json_refused("\"open", "s.json:1:6:", "the file ends inside the string opened at line 1 column 1");
}

TEST_CASE("numbers follow the JSON grammar", "[run_files][json]") {
    CHECK(parse("0").as_number() == 0.0);
    CHECK(std::signbit(parse("-0").as_number()));
    CHECK(parse("-1.25e-3").as_number() == -1.25e-3);
    CHECK(parse("1E+5").as_number() == 1e5);
    CHECK(parse("0.5e0").as_number() == 0.5);
    CHECK(parse("[10,-7]").as_array()[1].as_number() == -7.0);
    CHECK(parse("1.7976931348623157e308").as_number() == 1.7976931348623157e308);
    CHECK(parse("4.9406564584124654e-324").as_number() == 4.9406564584124654e-324);
    struct Case {
        std::string_view text, place, fragment;
    };
    const Case cases[] = {
        {"01", "s.json:1:1:", "leading zero in \"01\""},
        {"-007", "s.json:1:1:", "leading zero in \"-007\""},
        {"+1", "s.json:1:1:", "unexpected \"+\"; a JSON value is"},
        {".5", "s.json:1:1:", "unexpected \".\""},
        {"1.", "s.json:1:3:", "the file ends after the decimal point"},
        {"1.e5", "s.json:1:3:", "expected a digit after the decimal point, found \"e\""},
        {"1e", "s.json:1:3:", "the file ends in the exponent"},
        {"1e+", "s.json:1:4:", "the file ends in the exponent"},
        {"[1ex]", "s.json:1:4:", "expected a digit in the exponent, found \"x\""},
        {"-", "s.json:1:2:", "the file ends where the digits of a number start"},
        {"-x", "s.json:1:2:", "expected a digit where the digits of a number start, found \"x\""},
        {"NaN", "s.json:1:1:", "unexpected \"N\""},
        {"Infinity", "s.json:1:1:", "unexpected \"I\""},
        {"-Infinity", "s.json:1:2:", "found \"I\""},
        {"0x10", "s.json:1:2:", "unexpected \"x\" after the JSON value"},
        {"1 .5", "s.json:1:3:", "after the JSON value"},
    };
    for (const Case& c : cases) check_json_refused(c.text, c.place, c.fragment);
}

TEST_CASE("a number beyond the range of a double is refused and one below it is zero", "[run_files][json]") {
    check_json_refused("1e309", "s.json:1:1:", "the number \"1e309\" is beyond the range of a double");
    check_json_refused("[0, -2e308]", "s.json:1:5:", "the number \"-2e308\" is beyond the range of a double");
    check_json_refused("1.7976931348623159e308", "s.json:1:1:", "beyond the range of a double");
    check_json_refused("10000000000e99999999999999999999", "s.json:1:1:", "beyond the range");
    check_json_refused(std::string(400, '9'), "s.json:1:1:", "beyond the range");
    // IEEE 754 rounds these to zero; RFC 8259 leaves it to the reader, and zero is the nearest.
    CHECK(parse("1e-400").as_number() == 0.0);
    CHECK(std::signbit(parse("-1e-400").as_number()));
    CHECK(parse("0.000001e-99999999999999999999").as_number() == 0.0);
    CHECK(parse(message("0.", std::string(400, '0'), "1")).as_number() == 0.0);
}

TEST_CASE("integer literals within int64 keep their exact value", "[run_files][json]") {
    const JsonValue big = parse("9007199254740993");  // 2^53 + 1: no double holds it
    CHECK(big.exact_integer() == 9007199254740993);
    CHECK(big.as_number() == 9007199254740992.0);
    CHECK(parse("-9223372036854775808").exact_integer() == INT64_MIN);
    CHECK_FALSE(parse("9223372036854775808").exact_integer());
    CHECK_FALSE(parse("1.0").exact_integer());
    CHECK_FALSE(parse("1e2").exact_integer());
    CHECK(parse("-0").exact_integer() == 0);
}

TEST_CASE("a key repeated in one object is refused", "[run_files][json]") {
    check_json_refused("{\"a\": 1,\n \"b\": 2,\n \"a\": 3}",
                       "s.json:3:2:", "the key \"a\" repeats the key at line 1 column 2; keys in an object are unique");
    // The first repeat in the file is named, whichever key sorts first.
    check_json_refused(R"({"z":1,"a":1,"z":2,"a":2})",
                       "s.json:1:14:", "the key \"z\" repeats the key at line 1 column 2");
    check_json_refused(R"({"b":1,"a":1,"b":2,"b":3,"a":2})", "s.json:1:14:", "the key \"b\" repeats");
    // Equal after decoding the escapes is equal.
    check_json_refused(R"({"A":1,"\u0041":2})", "s.json:1:8:", "the key \"A\" repeats");
    // The same key in different objects, and keys that differ only in case, are fine.
    CHECK(parse(R"({"a":{"a":1},"b":{"a":2},"A":3})").as_object().size() == 3);
}

TEST_CASE("structural errors name the line and column of the offending byte", "[run_files][json]") {
    check_json_refused("[1,]", "s.json:1:4:", "unexpected \"]\"; a JSON value is");
    check_json_refused(
        "[1 2]", "s.json:1:4:", "expected , or ] after an element of the array opened at line 1 column 1, found \"2\"");
    check_json_refused("[1", "s.json:1:3:", "the file ends inside the array opened at line 1 column 1");
    check_json_refused("{\"a\" 1}", "s.json:1:6:", "expected : after the key \"a\", found \"1\"");
    check_json_refused("{\"a\":1,}",
                       "s.json:1:8:", "expected a key (a string) in the object opened at line 1 column 1, found \"}\"");
    check_json_refused("{1:2}", "s.json:1:2:", "expected a key (a string)");
    check_json_refused("{\"a\":1 \"b\":2}", "s.json:1:8:", "expected , or } after a member of the object");
    check_json_refused("{\n  \"a\": [\n    tru\n  ]}", "s.json:3:8:", "expected \"true\", found \"\\x0A\"");
    check_json_refused("[nul", "s.json:1:5:", "the file ends inside \"null\"");
    check_json_refused("[False]", "s.json:1:2:", "unexpected \"F\"");
    check_json_refused("{\"a\":\n\n   }", "s.json:3:4:", "unexpected \"}\"");
    check_json_refused("['a']", "s.json:1:2:", "unexpected \"'\"");
}
