// run_summary_from_json: the summary keys the viewer shows, their types and ranges.
#include <limits>
#include <string>

#include "run_files/run_summary_view.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using run_files::RunStatus;
using run_files::RunSummaryView;
using test::bytes_of;
using test::check_refused;
using test::message;

namespace {

RunSummaryView view_of(std::string_view text) {
    return run_files::run_summary_from_json(run_files::parse_json(bytes_of(text), "summary.json"), "summary.json");
}

// A summary whose line 2 is `  "<key>": <value>,`, so the value starts at column key.size() + 7.
void check_key_refused(const std::string& key, const std::string& value, std::string_view fragment) {
    const std::string text = message("{\n  \"", key, "\": ", value, ",\n  \"threads\": 2\n}\n");
    const std::string place = message("summary.json:2:", key.size() + 7, ":");
    check_refused([&] { (void)view_of(text); }, place, message("\"", key, "\" is ", fragment));
}

}  // namespace

TEST_CASE("the summary of a real run is read into the view", "[run_files][summary]") {
    const RunSummaryView s = run_files::read_run_summary(BROWNFLOC_RUN_FILES_TEST_DATA "/summary.json");
    CHECK(s.status == RunStatus::complete);
    CHECK(s.particles == 200);
    CHECK(s.seed == 1u);
    CHECK(s.steps == 16000);
    CHECK(s.half_life_fast_s == 0.013584704762154934);
    CHECK(s.time_step_s == 2.5471321429040434e-06);
    CHECK(s.box_length_nm == 2558.8777235700195);
    CHECK(s.debye_length_nm == 3.0382445275109635);
    CHECK(s.barrier_kT == 0.0);
    CHECK(s.stability_ratio == 1.0);
    CHECK(s.measured_stability_ratio == 0.8308893244037513);
    CHECK_FALSE(s.fractal_dimension);  // null in the file, with a note
    CHECK_FALSE(s.fractal_dimension_error);
    CHECK_FALSE(s.fractal_prefactor);
    REQUIRE(s.fractal_dimension_note);
    CHECK(s.fractal_dimension_note->rfind("only 2 clusters qualify", 0) == 0);
    CHECK(s.percolating == true);
    CHECK(s.gel_time_s == 0.03545098516493848);
    CHECK(s.wall_time_s == 0.205314531);
    CHECK(s.brownfloc_version == "0.1.0");
}

TEST_CASE("missing and null keys leave their fields empty and unknown keys are ignored", "[run_files][summary]") {
    const RunSummaryView empty = view_of("{}");
    CHECK_FALSE(empty.status);
    CHECK_FALSE(empty.particles);
    CHECK_FALSE(empty.seed);
    CHECK_FALSE(empty.percolating);
    CHECK_FALSE(empty.brownfloc_version);
    const RunSummaryView nulls = view_of(
        R"({"status": null, "particles": null, "seed": null, "half_life_fast_s": null, "percolating": null,)"
        R"( "fractal_dimension_note": null, "gel_time_s": null, "gel_time_s_note": "no cluster met its own image",)"
        R"( "pairs": [{"x": "anything"}], "threads": "many"})");
    CHECK_FALSE(nulls.status);
    CHECK_FALSE(nulls.particles);
    CHECK_FALSE(nulls.seed);
    CHECK_FALSE(nulls.half_life_fast_s);
    CHECK_FALSE(nulls.percolating);
    CHECK_FALSE(nulls.fractal_dimension_note);
    CHECK_FALSE(nulls.gel_time_s);
}

TEST_CASE("status is running interrupted or complete", "[run_files][summary]") {
    CHECK(view_of(R"({"status": "running"})").status == RunStatus::running);
    CHECK(view_of(R"({"status": "interrupted"})").status == RunStatus::interrupted);
    CHECK(view_of(R"({"status": "complete"})").status == RunStatus::complete);
    CHECK(run_files::run_status_name(RunStatus::interrupted) == "interrupted");
    check_key_refused("status", "\"done\"",
                      "the string \"done\"; it must be \"running\", \"interrupted\" or \"complete\"");
    check_key_refused("status", "\"Complete\"", "the string \"Complete\"");
    check_key_refused("status", "1", "the number 1; it must be \"running\"");
}

TEST_CASE("a key of the wrong type is refused naming the key and the allowed type", "[run_files][summary]") {
    check_key_refused("particles", "\"200\"", "the string \"200\"; it must be an integer >= 1");
    check_key_refused("seed", "true", "true; it must be an integer >= 0");
    check_key_refused("steps", "[1]", "an array; it must be an integer >= 0");
    check_key_refused("half_life_fast_s", "{}", "an object; it must be a finite number > 0");
    check_key_refused("barrier_kT", "\"12\"", "the string \"12\"; it must be a finite number");
    check_key_refused("stability_ratio", "false", "false; it must be a finite number");
    check_key_refused("measured_stability_ratio", "[]", "an array; it must be a finite number");
    check_key_refused("fractal_dimension", "\"1.8\"", "the string \"1.8\"; it must be a finite number");
    check_key_refused("fractal_dimension_error", "{}", "an object; it must be a finite number");
    check_key_refused("fractal_prefactor", "true", "true; it must be a finite number");
    check_key_refused("fractal_dimension_note", "3", "the number 3; it must be a string");
    check_key_refused("percolating", "\"true\"", "the string \"true\"; it must be true or false");
    check_key_refused("percolating", "1", "the number 1; it must be true or false");
    check_key_refused("gel_time_s", "\"soon\"", "the string \"soon\"; it must be a finite number");
    check_key_refused("wall_time_s", "[0.2]", "an array; it must be a finite number");
    check_key_refused("brownfloc_version", "0.1", "the number 0.1; it must be a string");
}

TEST_CASE("physical quantities are finite and positive", "[run_files][summary]") {
    for (const std::string key : {"half_life_fast_s", "time_step_s", "box_length_nm", "debye_length_nm"}) {
        check_key_refused(key, "0", "the number 0; it must be a finite number > 0");
        check_key_refused(key, "-0", "the number -0; it must be a finite number > 0");
        check_key_refused(key, "-2.5e-9", "the number -2.5e-09; it must be a finite number > 0");
    }
    check_key_refused("particles", "0", "the number 0; it must be an integer >= 1");
    check_key_refused("particles", "-5", "the number -5; it must be an integer >= 1");
    const RunSummaryView s = view_of(R"({"half_life_fast_s": 5e-324, "barrier_kT": -3.5, "gel_time_s": 0})");
    CHECK(s.half_life_fast_s == 5e-324);
    CHECK(s.barrier_kT == -3.5);  // a net attraction: no range but finiteness
    CHECK(s.gel_time_s == 0.0);
}

TEST_CASE("non-finite numbers are refused where a view is built by hand", "[run_files][summary]") {
    // parse_json never yields inf or NaN, but a JsonValue built in code can.
    run_files::JsonValue::Object members;
    members.push_back({"barrier_kT", run_files::JsonValue(std::numeric_limits<double>::infinity())});
    const run_files::JsonValue summary{std::move(members)};
    check_refused([&] { (void)run_files::run_summary_from_json(summary, "made.json"); },
                  "made.json:0:0:", "\"barrier_kT\" is the number inf; it must be a finite number");
}

TEST_CASE("particles seed and steps are integers and keep every digit", "[run_files][summary]") {
    check_key_refused("particles", "1.5", "the number 1.5; it must be an integer >= 1");
    check_key_refused("seed", "-1", "the number -1; it must be an integer >= 0");
    check_key_refused("steps", "1e300", "the number 1e+300; it must be an integer >= 0");
    check_key_refused("seed", "18446744073709551615", "the number 18446744073709551616; it must be an integer >= 0");
    const RunSummaryView s = view_of(R"({"particles": 1e3, "seed": 9223372036854775807, "steps": 2.0})");
    CHECK(s.particles == 1000);
    CHECK(s.seed == 9223372036854775807u);  // not 2^63, which a double would give
    CHECK(s.steps == 2);
    CHECK(view_of(R"({"seed": 9007199254740993})").seed == 9007199254740993u);
}

TEST_CASE("the summary is a JSON object", "[run_files][summary]") {
    check_refused([] { (void)view_of("\n  [1, 2]"); },
                  "summary.json:2:3:", "the summary is an array; it must be a JSON object");
    check_refused([] { (void)view_of("null"); }, "summary.json:1:1:", "the summary is null; it must be a JSON object");
}
