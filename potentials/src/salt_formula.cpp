// Salt formulas: one known cation, an optional count, one known anion (optionally in
// parentheses), an optional count. "Na2SO4", "CaCl2", "Al2(SO4)3", "NH4NO3".
#include <array>
#include <cctype>
#include <string>
#include <string_view>

#include "potentials/electrolyte.hpp"
#include "potentials/input_error.hpp"

namespace brownfloc::potentials {
namespace {

struct KnownIon {
    std::string_view symbol;
    int valence;
};

// Common inorganic ions of colloid practice (Schulze-Hardy series, buffers, hard water).
constexpr std::array<KnownIon, 20> cations{{
    {"H", 1}, {"Li", 1}, {"Na", 1}, {"K", 1}, {"Rb", 1}, {"Cs", 1}, {"NH4", 1}, {"Ag", 1},
    {"Mg", 2}, {"Ca", 2}, {"Sr", 2}, {"Ba", 2}, {"Zn", 2}, {"Cu", 2}, {"Ni", 2}, {"Co", 2},
    {"La", 3}, {"Al", 3}, {"Ce", 3}, {"Fe", 3},
}};
constexpr std::array<KnownIon, 14> anions{{
    {"F", -1}, {"Cl", -1}, {"Br", -1}, {"I", -1}, {"NO3", -1}, {"ClO4", -1}, {"SCN", -1},
    {"OH", -1}, {"H2PO4", -1}, {"HCO3", -1}, {"CH3COO", -1},
    {"SO4", -2}, {"CO3", -2}, {"PO4", -3},
}};

template <std::size_t N>
const KnownIon* longest_prefix(const std::array<KnownIon, N>& table, std::string_view text) {
    const KnownIon* best = nullptr;
    for (const auto& ion : table)
        if (text.substr(0, ion.symbol.size()) == ion.symbol &&
            (!best || ion.symbol.size() > best->symbol.size()))
            best = &ion;
    return best;
}

// Reads an optional positive count at pos; 1 when absent.
int read_count(std::string_view text, std::size_t& pos) {
    int count = 0;
    std::size_t start = pos;
    while (pos < text.size() && std::isdigit(static_cast<unsigned char>(text[pos])) && pos - start < 2)
        count = 10 * count + (text[pos++] - '0');
    return pos == start ? 1 : count;
}

[[noreturn]] void reject(const std::string& formula, const std::string& why) {
    throw InputError("unknown salt formula \"" + formula + "\": " + why +
                     "; write one cation and one anion, e.g. \"NaCl\", \"CaCl2\", \"Al2(SO4)3\" (known ions: " +
                     known_salt_ions() + "), or give [electrolyte] ions instead");
}

}  // namespace

std::string known_salt_ions() {
    std::string out;
    auto add = [&](const KnownIon& ion) {
        if (!out.empty()) out += ' ';
        out += ion.symbol;
        const int z = ion.valence < 0 ? -ion.valence : ion.valence;
        if (z > 1) out += std::to_string(z);
        out += ion.valence > 0 ? '+' : '-';
    };
    for (const auto& ion : cations) add(ion);
    for (const auto& ion : anions) add(ion);
    return out;
}

SaltFormula parse_salt_formula(const std::string& formula) {
    const std::string_view text = formula;
    const KnownIon* cation = longest_prefix(cations, text);
    if (!cation) reject(formula, "it does not start with a known cation");
    std::size_t pos = cation->symbol.size();
    const int cation_count = read_count(text, pos);
    const bool bracketed = pos < text.size() && text[pos] == '(';
    if (bracketed) ++pos;
    const KnownIon* anion = longest_prefix(anions, text.substr(pos));
    if (!anion) reject(formula, "no known anion after the cation");
    pos += anion->symbol.size();
    if (bracketed) {
        if (pos >= text.size() || text[pos] != ')') reject(formula, "unclosed parenthesis");
        ++pos;
    }
    const int anion_count = read_count(text, pos);
    if (pos != text.size()) reject(formula, "unexpected text after the anion");
    if (cation_count * cation->valence != anion_count * -anion->valence)
        reject(formula, "it is not electroneutral (" + std::to_string(cation_count) + " x " +
                            std::to_string(cation->valence) + " + " + std::to_string(anion_count) +
                            " x " + std::to_string(anion->valence) + " != 0)");
    return SaltFormula{formula,       std::string(cation->symbol), std::string(anion->symbol),
                       cation->valence, anion->valence,            cation_count,
                       anion_count};
}

}  // namespace brownfloc::potentials
