#pragma once
// SHA-256 (FIPS 180-4) of a byte string, as 64 lowercase hex digits. Used for the
// scenario_sha256 key of summary.json. Test vector: "abc" ->
// ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad (FIPS 180-4 examples).
#include <string>
#include <string_view>

namespace brownfloc::sim {

[[nodiscard]] std::string sha256_hex(std::string_view bytes);

}  // namespace brownfloc::sim
