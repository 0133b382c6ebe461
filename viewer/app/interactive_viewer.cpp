#include "interactive_viewer.hpp"

#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RectangleShape.hpp>
#include <SFML/Graphics/RenderTexture.hpp>
#include <SFML/Graphics/RenderWindow.hpp>
#include <SFML/Graphics/Text.hpp>
#include <SFML/Window/Event.hpp>
#include <SFML/Window/Keyboard.hpp>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <memory>
#include <optional>

#include "data/frame_analysis.hpp"
#include "data/frame_loader.hpp"
#include "font_lookup.hpp"
#include "frame_view.hpp"
#include "help_overlay.hpp"
#include "io/message_text.hpp"
#include "png_output.hpp"
#include "png_sequence_saver.hpp"
#include "run_view_data.hpp"
#include "timeline_bar.hpp"
#include "viewer_errors.hpp"

namespace brownfloc::viewer {

namespace {

using Clock = std::chrono::steady_clock;

// A file name in the current directory that does not exist yet: stem.png, stem-2.png, ...
std::filesystem::path unused_path(const std::string& stem, const std::string& extension) {
    for (int k = 1;; ++k) {
        std::string name = stem;
        if (k > 1) {
            name += '-';
            name += std::to_string(k);
        }
        name += extension;
        std::error_code error;
        if (!std::filesystem::exists(std::filesystem::symlink_status(name, error))) return name;
    }
}

struct ExportJob {
    std::filesystem::path directory;
    std::size_t next = 0, count = 0, skipped = 0;
    std::unique_ptr<PngSequenceSaver> saver;
    bool cancelled = false;
};

struct TransientNote {
    std::string text;
    Clock::time_point until{};
};

class Window {
public:
    explicit Window(const ViewOptions& options);
    int run();

private:
    void handle(const sf::Event& event);
    void handle_key(sf::Keyboard::Key key);
    void poll_file();
    void advance_playback(double elapsed_s);
    void go_to(std::size_t frame);
    void draw();
    void save_view();
    void start_export();
    void step_export();
    void note(std::string text);
    void refresh_counts(bool reloaded);

    ViewOptions options_;
    sf::Font font_;
    std::shared_ptr<LiveTrajectory> trajectory_;
    std::uint64_t seed_ = 0;
    sf::RenderWindow window_;
    std::unique_ptr<FrameLoader> loader_;
    FrameView view_;
    ViewSettings settings_;
    CountSeries counts_;
    FrameCountCollector collector_;  // without timeseries.csv: one count per frame, read once
    std::size_t counted_frames_ = 0;
    std::optional<std::string> status_note_;  // from summary.json, re-read when the file changes
    std::optional<LoadedFrame> shown_;
    std::size_t wanted_ = 0;
    bool follow_last_ = true;
    bool playing_ = false;
    double frames_per_s_ = 5.0, play_clock_s_ = 0.0;
    bool help_ = false;
    // mouse
    bool left_down_ = false, right_down_ = false, scrubbing_ = false, moved_ = false;
    sf::Vector2i press_at_{}, last_mouse_{};
    Clock::time_point next_poll_{};
    std::optional<ExportJob> export_;
    TransientNote note_;
    std::optional<std::string> loader_error_;
};

Window::Window(const ViewOptions& options) : options_(options), view_(font_) {
    load_viewer_font(font_, options.font);
    trajectory_ = open_run(options.run);
    seed_ = run_seed_from_scenario_text(trajectory_->header().scenario_toml);
    settings_.colour = options.colour;
    settings_.wrap = options.wrap;
    settings_.only_largest = options.only_largest;
    settings_.camera = options.camera;
    settings_.plots = true;
    refresh_counts(true);
    status_note_ = run_status_note(*trajectory_);
    const std::size_t count = trajectory_->frame_count();
    follow_last_ = options.frame.last;
    wanted_ = options.frame.last ? (count == 0 ? 0 : count - 1) : std::min(options.frame.index, count == 0 ? 0 : count - 1);
    std::string title = "brownfloc-view: ";
    title += options.run.filename().empty() ? options.run.parent_path().filename().string() : options.run.filename().string();
    window_.create(sf::VideoMode(unsigned(options.size.width_px), unsigned(options.size.height_px)), title);
    window_.setFramerateLimit(60);
    loader_ = std::make_unique<FrameLoader>(trajectory_);
    if (count > 0) loader_->request(wanted_);
}

void Window::note(std::string text) {
    note_.text = std::move(text);
    note_.until = Clock::now() + std::chrono::seconds(4);
}

// timeseries.csv is re-read whole (small); without it only the frames not yet counted are read.
void Window::refresh_counts(bool reloaded) {
    if (!trajectory_->location().timeseries_csv.empty()) {
        counts_ = load_count_series(*trajectory_);
        if (counts_.from_timeseries_csv) return;
    }
    if (reloaded) {
        collector_.clear();
        counted_frames_ = 0;
    }
    for (; counted_frames_ < trajectory_->frame_count(); ++counted_frames_) {
        try {
            const trajectory::TrajectoryFrame frame = trajectory_->read_frame(counted_frames_);
            collector_.add(frame.time_s, frame.cluster_count);
        } catch (const std::exception&) {
            break;  // the file changed under us: the next poll re-indexes it
        }
    }
    counts_ = collector_.series(trajectory_->header().fast_half_life_s, trajectory_->header().radius_nm.size());
}

void Window::go_to(std::size_t frame) {
    const std::size_t count = trajectory_->frame_count();
    if (count == 0) return;
    wanted_ = std::min(frame, count - 1);
    follow_last_ = wanted_ + 1 == count;
    loader_->request(wanted_);
}

void Window::poll_file() {
    if (Clock::now() < next_poll_) return;
    next_poll_ = Clock::now() + std::chrono::milliseconds(500);
    const PollResult result = trajectory_->poll();
    if (result.frames_added == 0 && !result.reloaded) return;
    refresh_counts(result.reloaded);
    status_note_ = run_status_note(*trajectory_);
    const std::size_t count = trajectory_->frame_count();
    if (count == 0) {
        shown_.reset();
        return;
    }
    if (follow_last_ || result.reloaded || wanted_ >= count) go_to(follow_last_ ? count - 1 : std::min(wanted_, count - 1));
}

void Window::advance_playback(double elapsed_s) {
    if (!playing_) return;
    const std::size_t count = trajectory_->frame_count();
    play_clock_s_ += elapsed_s * frames_per_s_;
    if (play_clock_s_ < 1.0) return;
    const auto steps = static_cast<std::size_t>(play_clock_s_);
    play_clock_s_ -= double(steps);
    if (count == 0) return;
    if (wanted_ + 1 >= count) {
        playing_ = false;  // stays at the end; new frames of a live run still advance the view
        follow_last_ = true;
        return;
    }
    go_to(std::min(wanted_ + steps, count - 1));
}

void Window::handle_key(sf::Keyboard::Key key) {
    using K = sf::Keyboard;
    const std::size_t count = trajectory_->frame_count();
    switch (key) {
        case K::Q: window_.close(); break;
        case K::Escape:
            if (help_) help_ = false;
            else if (export_) export_->cancelled = true;
            else settings_.selected_cluster.reset();
            break;
        case K::H:
        case K::F1: help_ = !help_; break;
        case K::Space: playing_ = !playing_; break;
        case K::Right: playing_ = false; go_to(wanted_ + 1); break;
        case K::Left: playing_ = false; go_to(wanted_ == 0 ? 0 : wanted_ - 1); break;
        case K::Home: go_to(0); break;
        case K::End: go_to(count == 0 ? 0 : count - 1); break;
        case K::Add:
        case K::Equal: frames_per_s_ = std::min(60.0, frames_per_s_ * 1.5); break;
        case K::Subtract:
        case K::Hyphen: frames_per_s_ = std::max(0.25, frames_per_s_ / 1.5); break;
        case K::C:
            settings_.colour = settings_.colour == ColourMode::cluster ? ColourMode::size
                               : settings_.colour == ColourMode::size  ? ColourMode::species
                                                                       : ColourMode::cluster;
            break;
        case K::W: settings_.wrap = !settings_.wrap; break;
        case K::L: settings_.only_largest = !settings_.only_largest; break;
        case K::G:
            if (shown_) settings_.selected_cluster = shown_->analysis->largest_cluster_id;
            break;
        case K::P: settings_.plots = !settings_.plots; break;
        case K::R: settings_.camera = options_.camera; break;
        case K::S: save_view(); break;
        case K::E: start_export(); break;
        default: break;
    }
}

void Window::handle(const sf::Event& event) {
    switch (event.type) {
        case sf::Event::Closed: window_.close(); break;
        case sf::Event::Resized:
            window_.setView(sf::View(sf::FloatRect(0, 0, float(event.size.width), float(event.size.height))));
            break;
        case sf::Event::KeyPressed: handle_key(event.key.code); break;
        case sf::Event::MouseWheelScrolled:
            settings_.camera = zoomed(settings_.camera, std::pow(0.9, double(event.mouseWheelScroll.delta)));
            break;
        case sf::Event::MouseButtonPressed: {
            const sf::Vector2i at{event.mouseButton.x, event.mouseButton.y};
            press_at_ = last_mouse_ = at;
            moved_ = false;
            if (event.mouseButton.button == sf::Mouse::Left) {
                if (auto frame = TimelineBar::frame_at(view_.layout().scene, trajectory_->frame_count(), at.x, at.y, false)) {
                    scrubbing_ = true;
                    playing_ = false;
                    go_to(*frame);
                } else {
                    left_down_ = true;
                }
            } else if (event.mouseButton.button == sf::Mouse::Right) {
                right_down_ = true;
            }
            break;
        }
        case sf::Event::MouseButtonReleased:
            if (event.mouseButton.button == sf::Mouse::Left && left_down_ && !moved_ && shown_) {
                if (auto particle = view_.particle_at(event.mouseButton.x, event.mouseButton.y))
                    settings_.selected_cluster = shown_->frame->cluster.at(*particle);
                else
                    settings_.selected_cluster.reset();
            }
            if (event.mouseButton.button == sf::Mouse::Left) left_down_ = scrubbing_ = false;
            if (event.mouseButton.button == sf::Mouse::Right) right_down_ = false;
            break;
        case sf::Event::MouseMoved: {
            const sf::Vector2i at{event.mouseMove.x, event.mouseMove.y};
            const sf::Vector2i delta = at - last_mouse_;
            last_mouse_ = at;
            if (std::abs(at.x - press_at_.x) + std::abs(at.y - press_at_.y) > 3) moved_ = true;
            if (scrubbing_) {
                if (auto frame = TimelineBar::frame_at(view_.layout().scene, trajectory_->frame_count(), at.x, at.y, true))
                    go_to(*frame);
            } else if (right_down_ || (left_down_ && sf::Keyboard::isKeyPressed(sf::Keyboard::LShift))) {
                const PixelRect& scene = view_.layout().scene;
                const Camera camera(settings_.camera, trajectory_->header().box_length_nm,
                                    Viewport{0, 0, scene.width_px, scene.height_px});
                settings_.camera = panned(settings_.camera, camera, double(delta.x), double(delta.y));
            } else if (left_down_) {
                settings_.camera = orbited(settings_.camera, -0.4 * double(delta.x), 0.4 * double(delta.y));
            }
            break;
        }
        default: break;
    }
}

void Window::save_view() {
    if (!shown_) return;
    char stem[64];
    std::snprintf(stem, sizeof stem, "brownfloc-view-frame%06zu", shown_->index);
    const std::filesystem::path path = unused_path(stem, ".png");
    sf::RenderTexture canvas;
    const sf::Vector2u size = window_.getSize();
    if (!canvas.create(size.x, size.y)) {
        note("cannot create an off-screen image to save");
        return;
    }
    FrameView still(font_);
    SceneText text = describe_frame(trajectory_->header(), *shown_, trajectory_->frame_count(), settings_);
    text.warnings = trajectory_notes(*trajectory_);
    still.draw(canvas, trajectory_->header(), *shown_, counts_, settings_, text);
    canvas.display();
    try {
        save_png(canvas.getTexture().copyToImage(), path, ExistingFile::refuse);
        note(io::message("saved ", path.string()));
    } catch (const std::exception& error) {
        note(error.what());
    }
}

void Window::start_export() {
    if (export_ || trajectory_->frame_count() == 0) return;
    std::string stem = options_.run.filename().empty() ? options_.run.parent_path().filename().string()
                                                       : options_.run.stem().string();
    stem += "-frames";
    const std::filesystem::path directory = unused_path(stem, "");
    std::error_code error;
    if (!std::filesystem::create_directory(directory, error)) {
        note(io::message("cannot create ", directory.string(), ": ", error.message()));
        return;
    }
    export_ = ExportJob{directory, 0, trajectory_->frame_count(), 0, std::make_unique<PngSequenceSaver>(), false};
}

void Window::step_export() {
    if (!export_) return;
    ExportJob& job = *export_;
    if (auto error = job.saver->take_error()) {
        note(*error);
        job.cancelled = true;
    }
    if (job.cancelled) {
        job.saver->drop_queued();
        note(io::message("export cancelled after ", job.saver->saved(), " frames in ", job.directory.string()));
        export_.reset();
        return;
    }
    if (job.next >= job.count) {
        if (job.saver->saved() + job.skipped >= job.count) {
            note(io::message("exported ", job.count, " frames to ", job.directory.string()));
            export_.reset();
        }
        return;
    }
    if (!job.saver->has_room()) return;
    LoadedFrame frame;
    try {
        frame = load_frame_now(*trajectory_, job.next, seed_);
    } catch (const std::exception& error) {
        note(io::message("frame ", job.next, " skipped in the export: ", error.what()));
        ++job.next;
        ++job.skipped;
        return;
    }
    sf::RenderTexture canvas;
    const sf::Vector2u size = window_.getSize();
    if (!canvas.create(size.x, size.y)) {
        note("cannot create an off-screen image for the export");
        job.cancelled = true;
        return;
    }
    FrameView still(font_);
    ViewSettings settings = settings_;
    if (settings.selected_cluster && frame.analysis->find(*settings.selected_cluster) == nullptr)
        settings.selected_cluster.reset();
    const SceneText text = describe_frame(trajectory_->header(), frame, trajectory_->frame_count(), settings);
    still.draw(canvas, trajectory_->header(), frame, counts_, settings, text);
    canvas.display();
    char name[32];
    std::snprintf(name, sizeof name, "frame_%06zu.png", job.next);
    job.saver->enqueue(canvas.getTexture().copyToImage(), job.directory / name);
    ++job.next;
}

void Window::draw() {
    if (auto ready = loader_->take_ready()) {
        shown_ = std::move(*ready);
        if (settings_.selected_cluster && shown_->analysis->find(*settings_.selected_cluster) == nullptr)
            settings_.selected_cluster.reset();
    }
    if (auto error = loader_->take_error()) note(*error);
    const sf::Vector2u size = window_.getSize();
    if (!shown_) {
        window_.clear(sf::Color(22, 24, 30));
        sf::Text waiting(trajectory_->frame_count() == 0 ? "no frame written yet: waiting for the run" : "reading the frame",
                         font_, 15);
        waiting.setFillColor(sf::Color(225, 228, 235));
        waiting.setPosition(20.0f, float(size.y) / 2);
        window_.draw(waiting);
    } else {
        SceneText text = describe_frame(trajectory_->header(), *shown_, trajectory_->frame_count(), settings_);
        text.warnings = trajectory_notes(*trajectory_);
        if (status_note_) text.warnings.push_back(*status_note_);
        text.bottom_reserved_px = TimelineBar::height_px;
        if (export_)
            text.warnings.push_back(io::message("exporting frame ", export_->next, " of ", export_->count, " to ",
                                                export_->directory.string(), " (Esc cancels)"));
        if (!note_.text.empty() && Clock::now() < note_.until) text.bottom_left.push_back(note_.text);
        view_.draw(window_, trajectory_->header(), *shown_, counts_, settings_, text);
        TimelineState timeline;
        timeline.frame = shown_->index;
        timeline.frame_count = trajectory_->frame_count();
        timeline.playing = playing_;
        timeline.frames_per_s = frames_per_s_;
        TimelineBar::draw(window_, view_.layout().scene, timeline, font_);
    }
    if (help_) draw_help_overlay(window_, view_.layout().scene, font_);
    window_.display();
}

int Window::run() {
    Clock::time_point last = Clock::now();
    while (window_.isOpen()) {
        sf::Event event;
        while (window_.pollEvent(event)) handle(event);
        const Clock::time_point now = Clock::now();
        advance_playback(std::chrono::duration<double>(now - last).count());
        last = now;
        poll_file();
        step_export();
        draw();
    }
    return exit_ok;
}

// A run that cannot be shown at all (missing, damaged header): the reason in a window until it
// is closed, then exit 2.
int show_refusal(const ViewOptions& options, const std::string& reason) {
    sf::Font font;
    load_viewer_font(font, options.font);
    sf::RenderWindow window(sf::VideoMode(unsigned(options.size.width_px), unsigned(options.size.height_px)),
                            "brownfloc-view: cannot show this run");
    window.setFramerateLimit(20);
    std::string text = "This run cannot be shown:\n\n";
    for (std::size_t at = 0; at < reason.size(); at += 90) {  // long paths: break the line
        text += reason.substr(at, 90);
        text += '\n';
    }
    text += "\nPress Q or Esc, or close the window.";
    while (window.isOpen()) {
        sf::Event event;
        while (window.pollEvent(event)) {
            if (event.type == sf::Event::Closed ||
                (event.type == sf::Event::KeyPressed &&
                 (event.key.code == sf::Keyboard::Q || event.key.code == sf::Keyboard::Escape)))
                window.close();
        }
        window.clear(sf::Color(22, 24, 30));
        sf::Text message(sf::String::fromUtf8(text.begin(), text.end()), font, 15);
        message.setFillColor(sf::Color(245, 190, 90));
        message.setPosition(30.0f, 30.0f);
        window.draw(message);
        window.display();
    }
    return exit_bad_input;
}

}  // namespace

int run_window(const ViewOptions& options) {
    try {
        (void)open_run(options.run);  // refusals first, in a window of their own
    } catch (const ViewerInputError& error) {
        std::fprintf(stderr, "error: %s\n", error.what());
        return show_refusal(options, error.what());
    }
    Window window(options);
    return window.run();
}

}  // namespace brownfloc::viewer
