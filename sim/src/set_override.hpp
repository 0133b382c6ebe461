#pragma once
// `--set section.key=value` (private to brownfloc::sim): changes the parsed scenario table
// before it is validated, so an overridden value is checked exactly like one from the file.
#include <string>

#include <toml++/toml.h>

namespace brownfloc::sim::detail {

// Applies one override to root. The value is read as TOML ("5", "true", "[...]", "{...}");
// text that is not valid TOML, or any text for a string-valued key, is taken as a string.
// `species.N.key` addresses the N-th [[species]] (from 1). Setting one of a group of
// alternatives removes the others (setting ions also removes concentration_mM). The new value
// node's source path is "--set ARG", which later messages print in place of FILE:LINE.
// Throws InputError for a malformed argument or an unknown section or key.
void apply_set_override(toml::table& root, const std::string& arg);

}  // namespace brownfloc::sim::detail
