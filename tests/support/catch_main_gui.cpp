// Catch2 main for GUI tests: one QApplication, offscreen unless a platform is set, so test
// discovery at build time works on machines without a display.
#define CATCH_CONFIG_RUNNER
#include <catch2/catch.hpp>

#include <QApplication>
#include <QFile>
#include <QTemporaryDir>

#include <cstdlib>

int main(int argc, char* argv[]) {
    if (std::getenv("QT_QPA_PLATFORM") == nullptr) {
        setenv("QT_QPA_PLATFORM", "offscreen", 1);
    }
    // The window keeps recent workbooks in the user's settings: tests keep theirs apart.
    const QTemporaryDir config;
    setenv("XDG_CONFIG_HOME", QFile::encodeName(config.path()).constData(), 1);
    QApplication app(argc, argv);
    return Catch::Session().run(argc, argv);
}
