// libFuzzer target: arbitrary bytes as a scenario file (everything after a line "--set" is
// taken as one override per line), then the dlvo report and its JSON. Any exception other
// than brownfloc::InputError, any sanitizer report, or a NaN/inf in the JSON is a finding.
// Build: cmake --preset fuzz && cmake --build --preset fuzz; run: build-fuzz/bin/scenario_fuzz
// -max_total_time=60 scenarios/ (the demo scenarios are the seed corpus).
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>
#include <vector>

#include "potentials/input_error.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    std::string text(reinterpret_cast<const char*>(data), size);
    std::vector<std::string> sets;
    if (const auto split = text.find("\n--set\n"); split != std::string::npos) {
        std::string rest = text.substr(split + 7);
        text.resize(split);
        for (std::size_t start = 0; start <= rest.size();) {
            const std::size_t end = rest.find('\n', start);
            sets.push_back(rest.substr(start, end == std::string::npos ? std::string::npos : end - start));
            if (end == std::string::npos) break;
            start = end + 1;
        }
    }
    try {
        const brownfloc::sim::Scenario scenario = brownfloc::sim::parse_scenario(text, "fuzz.toml", sets);
        const std::string json = brownfloc::sim::dlvo_json(brownfloc::sim::compute_dlvo_report(scenario), scenario).dump();
        if (json.find("nan") != std::string::npos || json.find("inf\"") != std::string::npos) std::abort();
    } catch (const brownfloc::InputError&) {
    }
    return 0;
}
