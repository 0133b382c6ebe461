// One OpenGL context kept for the whole test run. SFML 2.5 opens its X display connection when
// the first context is made and closes it when the last one goes; every render here makes and
// drops its own off-screen contexts, so without this each render opened and closed the
// connection several times, and under load an X server refuses many such quick reconnections
// (a third of 300 open/close cycles failed against Xvfb on 2 busy cores), which SFML answers
// with "Failed to open X11 display" and an abort. Holding one context keeps a single
// connection open (brownfloc-view's main does the same). Never destroyed: it must outlive
// every other SFML object, including static ones.
#define CATCH_CONFIG_EXTERNAL_INTERFACES
#include <catch2/catch.hpp>

#include <SFML/Window/Context.hpp>

namespace {

struct KeepDisplayOpen : Catch::TestEventListenerBase {
    using TestEventListenerBase::TestEventListenerBase;
    void testRunStarting(const Catch::TestRunInfo&) override { static sf::Context* const context = new sf::Context; (void)context; }
};

}  // namespace

CATCH_REGISTER_LISTENER(KeepDisplayOpen)
