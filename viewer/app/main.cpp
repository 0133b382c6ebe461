// brownfloc-view: replays a brownfloc run directory in a window, or renders frames to PNG
// with --render. The only file that includes CLI11. Exit codes: 0 ok, 2 bad input (options,
// a missing, damaged or still-empty trajectory), 3 environment (no X display, no font, an
// output that cannot be written), 1 internal error.
#include <CLI/CLI.hpp>

#include <SFML/Window/Context.hpp>

#include <exception>
#include <iostream>
#include <string>

#include "display_check.hpp"
#include "headless_render.hpp"
#include "interactive_viewer.hpp"
#include "view_options.hpp"
#include "viewer_errors.hpp"

namespace {

using namespace brownfloc::viewer;

struct RawOptions {
    std::string run, render, sequence, frame = "last", size, colour = "cluster", camera, select, font;
    std::size_t every = 1;
    bool plots = false, only_largest = false, wrap = false, whole = false;
    double wait_s = 0;
};

ViewOptions checked(const RawOptions& raw, const CLI::App& app) {
    ViewOptions options;
    options.run = raw.run;
    if (!raw.render.empty()) options.render_png = raw.render;
    if (!raw.sequence.empty()) options.sequence_dir = raw.sequence;
    options.sequence_every = raw.every;
    options.frame = parse_frame_choice(raw.frame);
    if (!raw.size.empty()) options.size = parse_image_size(raw.size);
    options.colour = parse_colour_mode(raw.colour);
    if (!raw.camera.empty()) options.camera = parse_camera(raw.camera);
    if (!raw.select.empty()) options.select = parse_cluster_choice(raw.select);
    options.plots = raw.plots;
    options.only_largest = raw.only_largest;
    options.wrap = !raw.whole;
    options.wait_s = raw.wait_s;
    if (!raw.font.empty()) options.font = raw.font;
    const bool headless = options.render_png.has_value();
    for (const char* only_headless : {"--sequence", "--every", "--wait", "--plots"})
        if (!headless && app.count(only_headless) > 0)
            throw ViewerUsageError(std::string(only_headless) + ": only with --render OUT.png (the window has its own keys)");
    if (options.sequence_dir && options.render_png && options.render_png->extension() != ".png")
        throw ViewerUsageError("--render " + options.render_png->string() + ": the file name must end in .png");
    if (headless && options.render_png->extension() != ".png")
        throw ViewerUsageError("--render " + options.render_png->string() + ": the file name must end in .png");
    return options;
}

}  // namespace

int main(int argc, char** argv) {
    CLI::App app{"brownfloc-view: replay a brownfloc run (its directory or trajectory.bftraj) in a window, "
                 "following it while it is written, or render frames to PNG with --render. Keys: press H in the window."};
    RawOptions raw;
    app.add_option("run", raw.run, "Run directory, or a trajectory file (.bftraj)")->required();
    app.add_option("--render", raw.render, "Render off screen to this PNG file and exit (needs an X display; "
                                           "on a headless machine run under xvfb-run -a)")
        ->type_name("OUT.png");
    app.add_option("--frame", raw.frame, "Frame to show: its number (0, 1, ...) or last (default)")->type_name("N|last");
    app.add_option("--size", raw.size, "Image or window size in pixels (default 1280x800)")->type_name("WxH");
    app.add_option("--color", raw.colour, "Colour particles by cluster (default), size or species")
        ->type_name("cluster|size|species");
    app.add_flag("--plots", raw.plots, "With --render: draw the four plots beside the scene");
    app.add_option("--camera", raw.camera, "Camera azimuth and elevation (degrees) and distance (box lengths); "
                                           "default 30,20,2.6")
        ->type_name("AZ,EL,DIST");
    app.add_option("--select", raw.select, "Highlight one cluster: its id (smallest particle id) or largest")
        ->type_name("ID|largest");
    app.add_flag("--only-largest", raw.only_largest, "Draw only the largest cluster");
    CLI::Option* wrap = app.add_flag("--wrap", raw.wrap, "Draw each particle wrapped into the periodic box (default)");
    CLI::Option* whole = app.add_flag("--whole", raw.whole, "Draw each cluster whole, as stored (it may stick out of the box)");
    wrap->excludes(whole);
    app.add_option("--sequence", raw.sequence, "With --render: also write every K-th frame to DIR/frame_NNNNNN.png "
                                               "(never overwriting)")
        ->type_name("DIR");
    app.add_option("--every", raw.every, "With --sequence: every K-th frame (default 1)")
        ->type_name("K")
        ->check(CLI::Range(std::size_t{1}, std::size_t{1} << 40));
    app.add_option("--wait", raw.wait_s, "With --render: wait up to S seconds for the frame to be written")
        ->type_name("S")
        ->check(CLI::Range(0.0, 86400.0));
    app.add_option("--font", raw.font, "Font file for labels (default DejaVu Sans from fonts-dejavu-core)")
        ->type_name("FILE");
    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& error) {
        const int code = app.exit(error);
        return code == 0 ? exit_ok : exit_bad_input;
    }
    try {
        const ViewOptions options = checked(raw, app);
        if (!x_display_named()) {
            std::cerr << "error: brownfloc-view " << no_display_message << '\n';
            return exit_environment;
        }
        // One context for the whole process keeps SFML's X connection open: SFML closes it
        // whenever its last context goes and reopens it for the next, and under load an X
        // server refuses a good share of such quick reconnections (measured with Xvfb on 2 busy
        // cores: a third of 300 open/close cycles failed), which SFML answers with an abort.
        const sf::Context keep_display_open;
        if (options.render_png) return render_headless(options, std::cout, std::cerr);
        return run_window(options);
    } catch (const ViewerUsageError& error) {
        std::cerr << "error: " << error.what() << '\n';
        return exit_bad_input;
    } catch (const ViewerInputError& error) {
        std::cerr << "error: " << error.what() << '\n';
        return exit_bad_input;
    } catch (const ViewerEnvironmentError& error) {
        std::cerr << "error: " << error.what() << '\n';
        return exit_environment;
    } catch (const std::exception& error) {
        std::cerr << "error: internal: " << error.what() << '\n';
        return exit_internal;
    }
}
