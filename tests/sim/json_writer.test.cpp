#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "sim/json_writer.hpp"

using brownfloc::sim::Json;

TEST_CASE("JSON numbers round-trip and non-finite numbers become null with a note", "[sim][json]") {
    Json j = Json::object();
    j.set("a", 0.1);
    j.set("b", 1e-20);
    j.set_number_or_null("c", std::numeric_limits<double>::infinity(), "too large");
    j.set_number_or_null("d", std::nullopt, "absent");
    j.set("e", std::numeric_limits<double>::quiet_NaN());
    const std::string text = j.dump(0);
    CHECK(text == R"({"a":0.1,"b":1e-20,"c":null,"c_note":"too large","d":null,"d_note":"absent","e":null})");
    CHECK(text.find("nan") == std::string::npos);
    CHECK(text.find("inf") == std::string::npos);
}

TEST_CASE("JSON strings are escaped", "[sim][json]") {
    Json j = Json::object();
    j.set("s", std::string("quote \" backslash \\ newline \n bell \x07"));
    CHECK(j.dump(0) == R"({"s":"quote \" backslash \\ newline \n bell \u0007"})");
}

TEST_CASE("JSON arrays and nesting keep their order", "[sim][json]") {
    Json j = Json::object();
    j.set("z", 1);
    j.set("list", Json(Json::Array{Json(true), Json(nullptr), Json("x")}));
    j.set("empty", Json::array());
    CHECK(j.dump(0) == R"({"z":1,"list":[true,null,"x"],"empty":[]})");
}
