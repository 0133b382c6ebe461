// The checkpoint file (sim/include/sim/checkpoint.hpp): a round trip keeps every bit, and a
// damaged or hostile file (cut at any byte, any bit of its headers flipped, counts that
// claim more than the file holds) is refused with CheckpointFormatError, never a crash.
#include <catch2/catch.hpp>

#include <cstring>
#include <limits>
#include <string>

#include "sim/checkpoint.hpp"
#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/run_recorder.hpp"
#include "sim/scenario.hpp"

using namespace brownfloc::sim;

namespace {

// A small run's checkpoint after some aggregation: 30 sticky spheres, 3000 steps.
Checkpoint small_checkpoint() {
    const std::string toml = R"([particle]
radius_nm = 50
hamaker_J = 0
surface_potential_mV = 0
[suspension]
volume_fraction = 0.1
[electrolyte]
salt = "NaCl"
concentration_mM = 10
[run]
particles = 30
steps = 3000
)";
    const Scenario s = parse_scenario(toml, "<test>");
    const RunPlan plan = plan_run(s, 7);
    Engine engine(plan.model, plan.particles);
    RunRecorder recorder(plan, engine);
    for (int k = 0; k < 3000; ++k) {
        engine.step();
        recorder.after_step(engine);
    }
    Checkpoint c;
    c.build_id = "test build";
    c.scenario_toml = toml;
    c.seed = 7;
    c.engine = engine.state();
    c.recorder = recorder.state();
    c.next_output = 3;
    c.next_snapshot = 2;
    c.files = {1000, 2, 300, 4, 500, 9};
    c.wall_time_s = 1.5;
    c.resumes = 1;
    return c;
}

}  // namespace

TEST_CASE("a checkpoint round trip keeps every bit of the state", "[sim]") {
    const Checkpoint c = small_checkpoint();
    REQUIRE(c.engine.captures.size() > 0);  // clusters formed: member lists are exercised
    const std::vector<std::byte> bytes = encode_checkpoint(c);
    const Checkpoint back = decode_checkpoint(bytes, "<memory>");
    CHECK(back.engine == c.engine);
    CHECK(back.recorder.counts.size() == c.recorder.counts.size());
    CHECK(encode_checkpoint_state(back) == encode_checkpoint_state(c));
    CHECK(back.files == c.files);
    CHECK(back.build_id == c.build_id);
    CHECK(back.scenario_toml == c.scenario_toml);
    CHECK(back.resumes == 1);
    CHECK(!back.complete);
}

TEST_CASE("a checkpoint cut short at any byte is refused", "[sim]") {
    const std::vector<std::byte> bytes = encode_checkpoint(small_checkpoint());
    for (std::size_t length = 0; length < bytes.size(); ++length) {
        const std::span<const std::byte> cut(bytes.data(), length);
        CHECK_THROWS_AS(decode_checkpoint(cut, "<cut>"), CheckpointFormatError);
    }
}

TEST_CASE("a checkpoint with any bit of its headers or first payload bytes flipped is refused", "[sim]") {
    std::vector<std::byte> bytes = encode_checkpoint(small_checkpoint());
    // The file header, the first section's header and 200 bytes of payload.
    const std::size_t span = std::min<std::size_t>(bytes.size(), 16 + 20 + 200);
    for (std::size_t at = 0; at < span; ++at)
        for (int bit = 0; bit < 8; ++bit) {
            bytes[at] ^= std::byte(1u << bit);
            CHECK_THROWS_AS(decode_checkpoint(bytes, "<flipped>"), CheckpointFormatError);
            bytes[at] ^= std::byte(1u << bit);
        }
}

TEST_CASE("checkpoint states that break the rules are refused with the reason", "[sim]") {
    Checkpoint c = small_checkpoint();
    c.engine.x_m[4] = std::numeric_limits<double>::quiet_NaN();
    CHECK_THROWS_WITH(decode_checkpoint(encode_checkpoint(c), "<bad>"), Catch::Contains("particle 4"));
    c = small_checkpoint();
    c.engine.next_member[0] = 0;  // a member list that loops
    CHECK_THROWS_AS(decode_checkpoint(encode_checkpoint(c), "<bad>"), CheckpointFormatError);
    c = small_checkpoint();
    c.engine.body_size[c.engine.bodies[0]] += 1;
    CHECK_THROWS_WITH(decode_checkpoint(encode_checkpoint(c), "<bad>"), Catch::Contains("members listed"));
    c = small_checkpoint();
    c.engine.radius_m.push_back(1e-7);  // one more radius than positions
    CHECK_THROWS_WITH(decode_checkpoint(encode_checkpoint(c), "<bad>"), Catch::Contains("entries for"));
}
