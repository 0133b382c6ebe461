#include <catch2/catch.hpp>
#include <algorithm>
#include <cctype>
#include <cmath>
#include <initializer_list>
#include <limits>
#include <map>
#include <sstream>
#include <stdexcept>
#include <string>
#include <tuple>
#include <vector>

#include "sim/shelf_life_plot.hpp"

using namespace brownfloc::sim;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

constexpr double day_s = 86400.0;
constexpr double inf = std::numeric_limits<double>::infinity();

// A document of plain elements, read by a small checker of well-formedness: every start tag
// closed in order, one root, attributes quoted, no raw '<' in attribute values or text and no
// '&' outside the five predefined entities and character references (XML 1.0, sections 2.1,
// 2.3, 2.4, 4.1; common practice to check only the subset our writer produces).
struct Element {
    std::string name;
    std::map<std::string, std::string> attributes;
    std::string text;  // character data directly inside, still escaped
};

struct Document {
    std::vector<Element> elements;  // in document order
    std::string error;              // empty when well-formed
};

// Pieces joined with +=: g++ 12 at -O3 gives a false -Wrestrict error on "literal" + std::string.
std::string cat(std::initializer_list<std::string> pieces) {
    std::string s;
    for (const std::string& p : pieces) s += p;
    return s;
}

// Coordinates are written with 2 decimals, so one read back is within 0.005 px of its value.
constexpr double written_px = 0.005;

bool entity_at(const std::string& s, std::size_t i) {
    for (const char* e : {"&amp;", "&lt;", "&gt;", "&quot;", "&apos;"})
        if (s.compare(i, std::string(e).size(), e) == 0) return true;
    if (s.compare(i, 2, "&#") != 0) return false;
    const std::size_t semi = s.find(';', i);
    return semi != std::string::npos && semi > i + 2 && semi < i + 10;
}

bool clean_text(const std::string& s) {
    for (std::size_t i = 0; i < s.size(); ++i) {
        if (s[i] == '<') return false;
        if (s[i] == '&' && !entity_at(s, i)) return false;
        if (static_cast<unsigned char>(s[i]) < 0x20 && s[i] != '\n' && s[i] != '\t' && s[i] != '\r') return false;
    }
    return true;
}

// Attributes of a tag body such as `line class="a" x1="3"`; false when malformed.
bool read_attributes(const std::string& body, std::size_t i, std::map<std::string, std::string>& out) {
    while (true) {
        while (i < body.size() && std::isspace(static_cast<unsigned char>(body[i]))) ++i;
        if (i == body.size()) return true;
        const std::size_t eq = body.find('=', i);
        if (eq == std::string::npos || eq + 1 >= body.size() || body[eq + 1] != '"') return false;
        const std::string name = body.substr(i, eq - i);
        const std::size_t close = body.find('"', eq + 2);
        if (close == std::string::npos || name.empty() || out.count(name)) return false;
        const std::string value = body.substr(eq + 2, close - eq - 2);
        if (!clean_text(value)) return false;
        out[name] = value;
        i = close + 1;
        if (i < body.size() && !std::isspace(static_cast<unsigned char>(body[i]))) return false;
    }
}

Document parse(const std::string& xml) {
    Document doc;
    std::vector<std::size_t> open;  // indices into doc.elements
    std::size_t i = 0, roots = 0;
    const std::string prolog = "<?xml version=\"1.0\" encoding=\"UTF-8\"";
    if (xml.compare(0, prolog.size(), prolog) != 0) return {{}, "no XML declaration with UTF-8"};
    i = xml.find("?>") + 2;
    while (i < xml.size()) {
        const std::size_t lt = xml.find('<', i);
        const std::string text = xml.substr(i, (lt == std::string::npos ? xml.size() : lt) - i);
        if (!clean_text(text)) return {{}, cat({"bad character data: ", text})};
        if (open.empty() && text.find_first_not_of(" \n\r\t") != std::string::npos) return {{}, "text outside the root"};
        if (!open.empty()) doc.elements[open.back()].text += text;
        if (lt == std::string::npos) break;
        const std::size_t gt = xml.find('>', lt);
        if (gt == std::string::npos) return {{}, "unclosed tag"};
        std::string body = xml.substr(lt + 1, gt - lt - 1);
        i = gt + 1;
        if (body.size() > 0 && body[0] == '/') {
            const std::string name = body.substr(1);
            if (open.empty() || doc.elements[open.back()].name != name) return {{}, cat({"mismatched </", name, ">"})};
            open.pop_back();
            continue;
        }
        const bool self_closing = !body.empty() && body.back() == '/';
        if (self_closing) body.pop_back();
        const std::size_t name_end = std::min(body.find_first_of(" \n\t"), body.size());
        Element e;
        e.name = body.substr(0, name_end);
        if (e.name.empty() || !std::isalpha(static_cast<unsigned char>(e.name[0]))) return {{}, cat({"bad tag <", body, ">"})};
        if (!read_attributes(body, name_end, e.attributes)) return {{}, cat({"bad attributes in <", body, ">"})};
        if (open.empty() && ++roots > 1) return {{}, "more than one root element"};
        doc.elements.push_back(e);
        if (!self_closing) open.push_back(doc.elements.size() - 1);
    }
    if (!open.empty()) return {{}, cat({"unclosed <", doc.elements[open.back()].name, ">"})};
    if (roots != 1) return {{}, "no root element"};
    return doc;
}

std::vector<Element> with_class(const Document& doc, const std::string& cls) {
    std::vector<Element> out;
    for (const Element& e : doc.elements)
        if (e.attributes.count("class") && e.attributes.at("class") == cls) out.push_back(e);
    return out;
}

double number(const Element& e, const std::string& attribute) { return std::stod(e.attributes.at(attribute)); }

std::vector<std::pair<double, double>> points(const Element& e) {
    std::vector<std::pair<double, double>> out;
    std::istringstream in(e.attributes.at("points"));
    std::string pair;
    while (in >> pair) {
        const std::size_t comma = pair.find(',');
        out.emplace_back(std::stod(pair.substr(0, comma)), std::stod(pair.substr(comma + 1)));
    }
    return out;
}

// Decade ticks of one axis: (value, pixel) from the tick lines and their labels, in order.
std::vector<std::pair<double, double>> decade_ticks(const Document& doc, const std::string& axis) {
    const auto lines = with_class(doc, cat({axis, "-tick"}));
    const auto labels = with_class(doc, cat({axis, "-tick-label"}));
    REQUIRE(lines.size() == labels.size());
    std::vector<std::pair<double, double>> ticks;
    for (std::size_t k = 0; k < lines.size(); ++k)
        ticks.emplace_back(std::stod(labels[k].text), number(lines[k], axis == "x" ? "x1" : "y1"));
    return ticks;
}

// A dispersion that holds at low salt and fails fast near the CCC, with an open top end.
ShelfLifePlotData example() {
    ShelfLifePlotData d;
    d.title = "Time to count-drop 0.1 at 25 degC";
    d.salt_name = "NaCl";
    d.criterion_label = "count-drop 0.1";
    d.salt_mM = {1, 3, 10, 30, 100, 300};
    d.p50_s = {inf, 5e11, 2e9, 4e7, 3e5, 2e3};
    d.p5_s = {3e11, 1e11, 5e8, 1e7, 1e5, 1e3};
    d.p95_s = {inf, 1e30, 8e9, 2e8, 1e6, 5e3};
    d.present_salt_mM = 5;
    d.ccc_mM = 120;
    d.target_s = 730 * day_s;
    d.caption_lines = {"The p5-p95 band reflects the uncertainty of the inputs only, not model error."};
    return d;
}

std::string lower(std::string s) {
    for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return s;
}

}  // namespace

TEST_CASE("the shelf-life plot is a well-formed standalone SVG 1.1 document", "[sim][shelf_life_plot]") {
    const std::string svg = shelf_life_svg(example());
    const Document doc = parse(svg);
    INFO(doc.error);
    REQUIRE(doc.error.empty());
    const Element& root = doc.elements.front();
    CHECK(root.name == "svg");
    CHECK(root.attributes.at("xmlns") == "http://www.w3.org/2000/svg");
    CHECK(root.attributes.at("version") == "1.1");
    CHECK(root.attributes.at("font-family") == "sans-serif");
    const ShelfLifePlotFrame f = shelf_life_plot_frame(example());
    CHECK_THAT(number(root, "width"), WithinAbs(f.width_px, written_px));
    CHECK_THAT(number(root, "height"), WithinAbs(f.height_px, written_px));
    CHECK(root.attributes.at("viewBox") == cat({"0 0 ", root.attributes.at("width"), " ", root.attributes.at("height")}));
    CHECK(doc.elements[1].name == "title");
}

TEST_CASE("every coordinate in the shelf-life plot is a finite number", "[sim][shelf_life_plot]") {
    const Document doc = parse(shelf_life_svg(example()));
    REQUIRE(doc.error.empty());
    for (const Element& e : doc.elements) {
        for (const char* a : {"x", "y", "x1", "y1", "x2", "y2", "width", "height"})
            if (e.attributes.count(a)) CHECK(std::isfinite(number(e, a)));
        if (e.attributes.count("points"))
            for (const auto& [x, y] : points(e)) CHECK((std::isfinite(x) && std::isfinite(y)));
    }
}

TEST_CASE("text in the shelf-life plot appears only XML-escaped", "[sim][shelf_life_plot]") {
    ShelfLifePlotData d = example();
    d.title = "<script>&\"'";
    d.salt_name = "Na\x01" "Cl \xC3\xA9 \xFF";  // a control character, e-acute, an invalid byte
    d.caption_lines = {"a < b & c > d"};
    const std::string svg = shelf_life_svg(d);
    const Document doc = parse(svg);
    INFO(doc.error);
    REQUIRE(doc.error.empty());
    CHECK_THAT(svg, !Contains("<script>"));
    CHECK_THAT(svg, !Contains("&\"'"));
    CHECK_THAT(svg, Contains("&lt;script&gt;&amp;&quot;&apos;"));
    CHECK_THAT(svg, !Contains("\x01"));
    CHECK_THAT(svg, Contains("Na Cl \xC3\xA9 \xEF\xBF\xBD concentration (mM)"));
    CHECK_THAT(svg, Contains("a &lt; b &amp; c &gt; d"));
}

TEST_CASE("xml_escaped replaces what XML cannot hold", "[sim][shelf_life_plot]") {
    CHECK(xml_escaped("plain 25 degC") == "plain 25 degC");
    CHECK(xml_escaped("a&b<c>d\"e'f") == "a&amp;b&lt;c&gt;d&quot;e&apos;f");
    CHECK(xml_escaped("tab\there\nline") == "tab here line");
    CHECK(xml_escaped("\xE2\x82\xAC 5") == "\xE2\x82\xAC 5");               // euro sign kept
    CHECK(xml_escaped("\xC0\xAF") == "\xEF\xBF\xBD\xEF\xBF\xBD");           // overlong '/' refused
    CHECK(xml_escaped("\xED\xA0\x80") == "\xEF\xBF\xBD\xEF\xBF\xBD\xEF\xBF\xBD");  // a surrogate
    CHECK(xml_escaped("\xEF\xBF\xBF") == "\xEF\xBF\xBD");                   // U+FFFF is not an XML character
    CHECK(xml_escaped("cut \xE2\x82") == "cut \xEF\xBF\xBD\xEF\xBF\xBD");
}

TEST_CASE("infinite and huge times are clipped to the top edge and never written as inf or nan",
          "[sim][shelf_life_plot]") {
    const ShelfLifePlotData d = example();  // p95 holds +inf and 1e30 s, p50 one +inf
    const std::string svg = shelf_life_svg(d);
    CHECK_THAT(lower(svg), !Contains("inf"));
    CHECK_THAT(lower(svg), !Contains("nan"));
    const Document doc = parse(svg);
    REQUIRE(doc.error.empty());
    const double top = shelf_life_plot_frame(d).time_axis.high_px;
    const auto band = points(with_class(doc, "band").at(0));
    CHECK_THAT(band[0].second, WithinAbs(top, written_px));  // p95 = inf at the first salt
    CHECK_THAT(band[1].second, WithinAbs(top, written_px));  // p95 = 1e30 s
    CHECK_THAT(points(with_class(doc, "median").at(0))[0].second, WithinAbs(top, written_px));
    // The one median point beyond range (salt 1 mM) gets one arrow.
    const auto arrows = with_class(doc, "beyond-range");
    REQUIRE(arrows.size() == 1);
    CHECK_THAT(points(arrows[0])[2].first, WithinAbs(shelf_life_plot_frame(d).salt_axis.to_px(1.0), written_px));
    REQUIRE(with_class(doc, "beyond-range-label").size() == 1);
    CHECK(with_class(doc, "beyond-range-label")[0].text == "beyond 1e12 s");
}

TEST_CASE("the present salt the CCC and the target are drawn with their values", "[sim][shelf_life_plot]") {
    const Document doc = parse(shelf_life_svg(example()));
    REQUIRE(doc.error.empty());
    CHECK(with_class(doc, "present-salt").size() == 1);
    CHECK(with_class(doc, "present-salt-label").at(0).text == "present NaCl: 5 mM");
    CHECK(with_class(doc, "ccc").size() == 1);
    CHECK(with_class(doc, "ccc-label").at(0).text == "CCC: 120 mM");
    CHECK(with_class(doc, "target").size() == 1);
    CHECK(with_class(doc, "target-label").at(0).text == "target: 730 days");
    std::vector<std::string> legend;
    for (const Element& e : with_class(doc, "legend-label")) legend.push_back(e.text);
    CHECK(std::count(legend.begin(), legend.end(),
                     "p5-p95 pointwise Monte Carlo band (input uncertainty only, not model error)") == 1);
    CHECK(std::count(legend.begin(), legend.end(), "target: 730 days") == 1);
    CHECK(with_class(doc, "caption").size() == 1);
    CHECK(with_class(doc, "x-title").at(0).text == "NaCl concentration (mM)");
    CHECK(with_class(doc, "y-title").at(0).text == "time to count-drop 0.1 (days)");
}

TEST_CASE("markers that are absent or not positive are left out", "[sim][shelf_life_plot]") {
    ShelfLifePlotData d = example();
    d.present_salt_mM.reset();
    d.ccc_mM = 0.0;
    d.target_s = 0;
    const Document doc = parse(shelf_life_svg(d));
    REQUIRE(doc.error.empty());
    CHECK(with_class(doc, "present-salt").empty());
    CHECK(with_class(doc, "ccc").empty());
    CHECK(with_class(doc, "target").empty());
    CHECK(with_class(doc, "legend-label").size() == 3);  // median, band, beyond range
}

TEST_CASE("points at salt 0 are skipped and the band has two vertices per usable point", "[sim][shelf_life_plot]") {
    ShelfLifePlotData d = example();
    d.salt_mM[0] = 0;
    d.salt_mM.insert(d.salt_mM.begin(), -1.0);
    for (auto* v : {&d.p50_s, &d.p5_s, &d.p95_s}) v->insert(v->begin(), 1e4);
    const std::size_t usable = d.salt_mM.size() - 2;
    const Document doc = parse(shelf_life_svg(d));
    REQUIRE(doc.error.empty());
    const auto median = points(with_class(doc, "median").at(0));
    CHECK(median.size() == usable);
    CHECK(points(with_class(doc, "band").at(0)).size() == 2 * usable);
    // The first drawn point is the salt of 3 mM.
    CHECK_THAT(median[0].first, WithinAbs(shelf_life_plot_frame(d).salt_axis.to_px(3.0), written_px));
}

TEST_CASE("input the plot cannot draw is refused", "[sim][shelf_life_plot]") {
    ShelfLifePlotData ragged = example();
    ragged.p5_s.pop_back();
    CHECK_THROWS_AS(shelf_life_svg(ragged), std::invalid_argument);
    CHECK_THROWS_WITH(shelf_life_svg(ragged), Contains("same length") && Contains("6, 6, 5, 6"));
    ShelfLifePlotData one = example();
    for (std::size_t k = 1; k < one.salt_mM.size(); ++k) one.salt_mM[k] = 0;
    CHECK_THROWS_WITH(shelf_life_svg(one), Contains("at least 2 points with salt_mM > 0, got 1"));
    ShelfLifePlotData descending = example();
    std::swap(descending.salt_mM[2], descending.salt_mM[3]);
    CHECK_THROWS_WITH(shelf_life_svg(descending), Contains("must ascend") && Contains("point 3"));
    ShelfLifePlotData nan_time = example();
    nan_time.p50_s[2] = std::nan("");
    CHECK_THROWS_WITH(shelf_life_svg(nan_time), Contains("point 2 has a NaN time"));
    ShelfLifePlotData inf_target = example();
    inf_target.target_s = inf;
    CHECK_THROWS_AS(shelf_life_svg(inf_target), std::invalid_argument);
}

TEST_CASE("decade tick labels cover the salts the markers and every finite time", "[sim][shelf_life_plot]") {
    const ShelfLifePlotData d = example();
    const Document doc = parse(shelf_life_svg(d));
    REQUIRE(doc.error.empty());
    const auto x = decade_ticks(doc, "x");
    const auto y = decade_ticks(doc, "y");
    REQUIRE(x.size() >= 2);
    REQUIRE(y.size() >= 2);
    CHECK(x.front().first <= 1.0);    // smallest salt, mM
    CHECK(x.back().first >= 300.0);   // largest salt
    CHECK(y.front().first <= 1e3 / day_s);             // smallest time, days
    CHECK(y.back().first >= 5e11 / day_s);             // largest time below 1e12 s
    // Labels such as "0.01" and "1e5" are exact decimal powers: only rounding of stod is allowed.
    for (std::size_t k = 1; k < x.size(); ++k) CHECK_THAT(x[k].first, WithinRel(10 * x[k - 1].first, 1e-12));
    for (std::size_t k = 1; k < y.size(); ++k) CHECK_THAT(y[k].first, WithinRel(10 * y[k - 1].first, 1e-12));
}

TEST_CASE("a marker sits between the decade ticks that bracket its value on the log axis",
          "[sim][shelf_life_plot]") {
    const ShelfLifePlotData d = example();
    const ShelfLifePlotFrame f = shelf_life_plot_frame(d);
    const Document doc = parse(shelf_life_svg(d));
    REQUIRE(doc.error.empty());
    // Pixel of a value from the two bracketing ticks, linear in log10 between them: an
    // independent computation of the mapping the header documents.
    const auto from_ticks = [](const std::vector<std::pair<double, double>>& ticks, double v) {
        for (std::size_t k = 1; k < ticks.size(); ++k)
            if (ticks[k - 1].first <= v && v <= ticks[k].first) {
                const double s = std::log10(v / ticks[k - 1].first);  // ticks are one decade apart
                return std::tuple{ticks[k - 1].second, ticks[k].second, ticks[k - 1].second + s * (ticks[k].second - ticks[k - 1].second)};
            }
        FAIL("no ticks bracket " << v);
        return std::tuple{0.0, 0.0, 0.0};
    };
    const auto x_ticks = decade_ticks(doc, "x");
    for (const auto& [cls, salt_mM] : {std::pair<std::string, double>{"present-salt", 5.0}, {"ccc", 120.0}}) {
        const double x = number(with_class(doc, cls).at(0), "x1");
        const auto [left, right, expected] = from_ticks(x_ticks, salt_mM);
        INFO(cls);
        CHECK(left < x);
        CHECK(x < right);
        CHECK_THAT(x, WithinAbs(expected, 4 * written_px));  // three rounded coordinates combined
        CHECK_THAT(x, WithinAbs(f.salt_axis.to_px(salt_mM), written_px));
    }
    const double y = number(with_class(doc, "target").at(0), "y1");
    const auto [below, above, expected] = from_ticks(decade_ticks(doc, "y"), 730.0);
    CHECK(above < y);  // SVG y grows downwards
    CHECK(y < below);
    CHECK_THAT(y, WithinAbs(expected, 4 * written_px));
}

TEST_CASE("axis ranges are whole decades padded around the data", "[sim][shelf_life_plot]") {
    ShelfLifePlotData d = example();
    d.salt_mM = {20, 40};
    d.p50_s = d.p5_s = d.p95_s = {2 * day_s, 3 * day_s};
    d.present_salt_mM.reset();
    d.ccc_mM.reset();
    d.target_s = 0;
    const ShelfLifePlotFrame f = shelf_life_plot_frame(d);
    CHECK(f.salt_axis.low_decade == 1);
    CHECK(f.salt_axis.high_decade == 2);
    CHECK(f.time_axis.low_decade == 0);
    CHECK(f.time_axis.high_decade == 1);
    d.ccc_mM = 1500;  // the CCC widens the salt axis
    d.target_s = 730 * day_s;
    const ShelfLifePlotFrame g = shelf_life_plot_frame(d);
    CHECK(g.salt_axis.high_decade == 4);
    CHECK(g.time_axis.high_decade == 3);
}

TEST_CASE("a range of many decades labels every k-th decade and no more than 13", "[sim][shelf_life_plot]") {
    ShelfLifePlotData d = example();
    d.salt_mM = {1e-20, 1, 1e20};  // 40 decades: every 4th labelled
    d.p50_s = d.p5_s = d.p95_s = {1e5, 1e5, 1e5};
    d.present_salt_mM.reset();
    d.ccc_mM.reset();
    const Document doc = parse(shelf_life_svg(d));
    REQUIRE(doc.error.empty());
    const auto x = decade_ticks(doc, "x");
    CHECK(x.size() == 11);
    CHECK(with_class(doc, "x-tick-label").front().text == "1e-20");
    CHECK(with_class(doc, "x-tick-label").back().text == "1e20");
    for (std::size_t k = 1; k < x.size(); ++k) CHECK_THAT(x[k].first, WithinRel(1e4 * x[k - 1].first, 1e-12));
}
