#include "run_files/run_summary_view.hpp"

#include <cmath>
#include <limits>

#include "io/message_text.hpp"
#include "run_files/run_file_error.hpp"

namespace brownfloc::run_files {

namespace {

using io::message;

enum class Range { any, positive };

// Typed look-ups of the summary's members; each failure names the key and its place.
class SummaryReader {
public:
    SummaryReader(const JsonValue& summary, std::string_view source) : summary_{summary}, source_{source} {
        if (!summary.is_object())
            throw RunFileError(
                source_, summary.line(), summary.column(),
                message("the summary is ", json_kind_name(summary.kind()), "; it must be a JSON object"));
    }

    std::optional<double> number(std::string_view key, Range range) const {
        const JsonValue* value = get(key);
        if (value == nullptr) return std::nullopt;
        const std::string_view allowed = range == Range::positive ? "a finite number > 0" : "a finite number";
        if (!value->is_number()) refuse(*value, key, allowed);
        const double x = value->as_number();
        if (!std::isfinite(x) || (range == Range::positive && !(x > 0))) refuse(*value, key, allowed);
        return x;
    }

    std::optional<std::int64_t> integer(std::string_view key, std::int64_t minimum) const {
        const JsonValue* value = get(key);
        if (value == nullptr) return std::nullopt;
        const std::string allowed = message("an integer >= ", minimum);
        if (!value->is_number()) refuse(*value, key, allowed);
        std::int64_t n = 0;
        if (const auto exact = value->exact_integer()) {
            n = *exact;
        } else {
            // 1e3 or 5.0: integer-valued doubles within int64 are exact integers too.
            const double x = value->as_number();
            constexpr double two_to_63 = 9223372036854775808.0;
            if (!(std::isfinite(x) && std::floor(x) == x && x >= -two_to_63 && x < two_to_63))
                refuse(*value, key, allowed);
            n = static_cast<std::int64_t>(x);
        }
        if (n < minimum) refuse(*value, key, allowed);
        return n;
    }

    std::optional<std::string> string(std::string_view key) const {
        const JsonValue* value = get(key);
        if (value == nullptr) return std::nullopt;
        if (!value->is_string()) refuse(*value, key, "a string");
        return value->as_string();
    }

    std::optional<bool> boolean(std::string_view key) const {
        const JsonValue* value = get(key);
        if (value == nullptr) return std::nullopt;
        if (!value->is_bool()) refuse(*value, key, "true or false");
        return value->as_bool();
    }

    std::optional<RunStatus> status(std::string_view key) const {
        const JsonValue* value = get(key);
        if (value == nullptr) return std::nullopt;
        constexpr std::string_view allowed = "\"running\", \"interrupted\" or \"complete\"";
        if (!value->is_string()) refuse(*value, key, allowed);
        for (const RunStatus s : {RunStatus::running, RunStatus::interrupted, RunStatus::complete})
            if (value->as_string() == run_status_name(s)) return s;
        refuse(*value, key, allowed);
    }

private:
    // The member, or nullptr when it is missing or null.
    const JsonValue* get(std::string_view key) const {
        const JsonValue* value = summary_.find(key);
        return value == nullptr || value->is_null() ? nullptr : value;
    }

    [[noreturn]] void refuse(const JsonValue& value, std::string_view key, std::string_view allowed) const {
        throw RunFileError(source_, value.line(), value.column(),
                           message(io::quoted(key), " is ", describe(value), "; it must be ", allowed));
    }

    static std::string describe(const JsonValue& value) {
        switch (value.kind()) {
            case JsonKind::number: return message("the number ", value.as_number());
            case JsonKind::string: return message("the string ", io::quoted(value.as_string()));
            case JsonKind::boolean: return value.as_bool() ? "true" : "false";
            default: return std::string(json_kind_name(value.kind()));
        }
    }

    const JsonValue& summary_;
    std::string_view source_;
};

}  // namespace

std::string_view run_status_name(RunStatus status) {
    switch (status) {
        case RunStatus::running: return "running";
        case RunStatus::interrupted: return "interrupted";
        case RunStatus::complete: return "complete";
    }
    return "unknown";
}

RunSummaryView run_summary_from_json(const JsonValue& summary, std::string_view source_name) {
    const SummaryReader r(summary, source_name);
    RunSummaryView v;
    v.status = r.status("status");
    v.particles = r.integer("particles", 1);
    if (const auto seed = r.integer("seed", 0)) v.seed = static_cast<std::uint64_t>(*seed);
    v.steps = r.integer("steps", 0);
    v.half_life_fast_s = r.number("half_life_fast_s", Range::positive);
    v.time_step_s = r.number("time_step_s", Range::positive);
    v.box_length_nm = r.number("box_length_nm", Range::positive);
    v.debye_length_nm = r.number("debye_length_nm", Range::positive);
    v.barrier_kT = r.number("barrier_kT", Range::any);
    v.stability_ratio = r.number("stability_ratio", Range::any);
    v.measured_stability_ratio = r.number("measured_stability_ratio", Range::any);
    v.fractal_dimension = r.number("fractal_dimension", Range::any);
    v.fractal_dimension_error = r.number("fractal_dimension_error", Range::any);
    v.fractal_prefactor = r.number("fractal_prefactor", Range::any);
    v.fractal_dimension_note = r.string("fractal_dimension_note");
    v.percolating = r.boolean("percolating");
    v.gel_time_s = r.number("gel_time_s", Range::any);
    v.wall_time_s = r.number("wall_time_s", Range::any);
    v.brownfloc_version = r.string("brownfloc_version");
    return v;
}

RunSummaryView read_run_summary(const std::filesystem::path& path) {
    return run_summary_from_json(read_json_file(path), path.string());
}

}  // namespace brownfloc::run_files
