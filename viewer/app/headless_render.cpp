#include "headless_render.hpp"

#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTexture.hpp>
#include <SFML/Graphics/Texture.hpp>

#include <cstdio>
#include <ostream>

#include "data/frame_analysis.hpp"
#include "data/wait_for_frame.hpp"
#include "font_lookup.hpp"
#include "frame_view.hpp"
#include "io/message_text.hpp"
#include "png_output.hpp"
#include "run_view_data.hpp"
#include "viewer_errors.hpp"

namespace brownfloc::viewer {

namespace {

LoadedFrame load_now(const LiveTrajectory& trajectory, std::size_t k, std::uint64_t seed) {
    try {
        return load_frame_now(trajectory, k, seed);
    } catch (const std::exception& error) {
        throw ViewerInputError(io::message("frame ", k, " cannot be read: ", error.what()));
    }
}

ViewSettings settings_from(const ViewOptions& options, const FrameAnalysis& analysis) {
    ViewSettings settings;
    settings.colour = options.colour;
    settings.wrap = options.wrap;
    settings.only_largest = options.only_largest;
    settings.plots = options.plots;
    settings.camera = options.camera;
    if (options.select.largest) settings.selected_cluster = analysis.largest_cluster_id;
    if (options.select.cluster_id) {
        if (analysis.find(*options.select.cluster_id) == nullptr)
            throw ViewerUsageError(io::message("--select ", *options.select.cluster_id,
                                               ": no cluster has this id in the frame (a cluster's id is its smallest "
                                               "particle id; the largest cluster is ",
                                               analysis.largest_cluster_id, ")"));
        settings.selected_cluster = options.select.cluster_id;
    }
    return settings;
}

sf::Image draw_frame(FrameView& view, sf::RenderTexture& canvas, const LiveTrajectory& trajectory,
                     const LoadedFrame& shown, const CountSeries& counts, const ViewSettings& settings) {
    SceneText text = describe_frame(trajectory.header(), shown, trajectory.frame_count(), settings);
    text.warnings = trajectory_notes(trajectory);
    if (auto status = run_status_note(trajectory)) text.warnings.push_back(*status);
    view.draw(canvas, trajectory.header(), shown, counts, settings, text);
    canvas.display();
    return canvas.getTexture().copyToImage();
}

}  // namespace

int render_headless(const ViewOptions& options, std::ostream& out, std::ostream& messages) {
    sf::Font font;
    load_viewer_font(font, options.font);
    const unsigned max_edge = sf::Texture::getMaximumSize();
    if (unsigned(options.size.width_px) > max_edge || unsigned(options.size.height_px) > max_edge)
        throw ViewerUsageError(io::message("--size ", options.size.width_px, 'x', options.size.height_px,
                                           ": larger than this display's maximum texture size of ", max_edge, " pixels"));

    std::shared_ptr<LiveTrajectory> trajectory = open_run(options.run);
    const std::size_t wanted = options.frame.last ? 0 : options.frame.index;
    if (options.wait_s > 0) (void)wait_for_frame(*trajectory, wanted, options.wait_s);  // then checked below
    const std::size_t count = trajectory->frame_count();
    for (const std::string& warning : trajectory->warnings()) messages << "warning: " << warning << '\n';
    if (count == 0)
        throw ViewerInputError(io::message(trajectory->location().trajectory.string(),
                                           ": no intact frame yet (the run may still be starting; --wait S waits)"));
    if (!options.frame.last && options.frame.index >= count)
        throw ViewerInputError(io::message("--frame ", options.frame.index, ": ",
                                           trajectory->location().trajectory.string(), " has ", count,
                                           count == 1 ? " intact frame (0)" : " intact frames (0 to ",
                                           count == 1 ? std::string() : io::message(count - 1, ")")));

    const std::uint64_t seed = run_seed_from_scenario_text(trajectory->header().scenario_toml);
    const CountSeries counts = options.plots ? load_count_series(*trajectory) : CountSeries{};
    sf::RenderTexture canvas;
    if (!canvas.create(unsigned(options.size.width_px), unsigned(options.size.height_px)))
        throw ViewerEnvironmentError("cannot create an off-screen image of that size (graphics driver refused)");
    FrameView view(font);

    if (!options.sequence_dir) {
        const LoadedFrame shown = load_now(*trajectory, options.frame.last ? count - 1 : options.frame.index, seed);
        const ViewSettings settings = settings_from(options, *shown.analysis);
        save_png(draw_frame(view, canvas, *trajectory, shown, counts, settings), *options.render_png,
                 ExistingFile::replace);
        out << options.render_png->string() << '\n';
        return exit_ok;
    }

    const std::filesystem::path& dir = *options.sequence_dir;
    std::error_code error;
    std::filesystem::create_directories(dir, error);
    if (error || !std::filesystem::is_directory(dir))
        throw ViewerEnvironmentError(io::message("--sequence ", io::quoted(dir.string()), ": cannot create the directory: ",
                                                 error ? error.message() : std::string("not a directory")));
    std::size_t written = 0;
    for (std::size_t k = 0; k < count; k += options.sequence_every) {
        const LoadedFrame shown = load_now(*trajectory, k, seed);
        const ViewSettings settings = settings_from(options, *shown.analysis);
        char name[32];
        std::snprintf(name, sizeof name, "frame_%06zu.png", k);
        save_png(draw_frame(view, canvas, *trajectory, shown, counts, settings), dir / name, ExistingFile::refuse);
        ++written;
        messages << "\rframe " << k << " of " << count - 1 << std::flush;
    }
    messages << '\n';
    out << dir.string() << " (" << written << " PNG files)\n";
    // The single image too, when asked for besides the sequence: the chosen frame.
    if (options.render_png) {
        const LoadedFrame shown = load_now(*trajectory, options.frame.last ? count - 1 : options.frame.index, seed);
        save_png(draw_frame(view, canvas, *trajectory, shown, counts, settings_from(options, *shown.analysis)),
                 *options.render_png, ExistingFile::replace);
        out << options.render_png->string() << '\n';
    }
    return exit_ok;
}

}  // namespace brownfloc::viewer
