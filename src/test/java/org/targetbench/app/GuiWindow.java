package org.targetbench.app;

import org.assertj.swing.core.BasicRobot;
import org.assertj.swing.core.Robot;
import org.assertj.swing.edt.GuiActionRunner;
import org.assertj.swing.fixture.FrameFixture;
import org.assertj.swing.timing.Condition;

import javax.imageio.ImageIO;
import java.awt.GraphicsEnvironment;
import java.awt.image.BufferedImage;
import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.function.Consumer;
import java.util.function.Supplier;
import java.util.prefs.Preferences;

import static org.assertj.swing.timing.Pause.pause;
import static org.assertj.swing.timing.Timeout.timeout;
import static org.junit.jupiter.api.Assumptions.assumeFalse;

/**
 * One workbench window under the (virtual) display for a GUI test class: fresh preferences, a robot of its own, and
 * with {@link #open} the demo loaded and scored before the tests start. {@link GuiTestBase} keeps one for each class
 * that extends it.
 */
final class GuiWindow implements AutoCloseable {
    /** Longest wait for background work in the window, milliseconds. */
    static final long WAIT_MS = 60_000;
    static final Path SHOTS = Path.of("target/screenshots");

    final Robot robot;
    final FrameFixture window;
    final Workbench workbench;
    private final Preferences prefs;
    /** Longest wait of {@link #waitFor}, milliseconds. */
    private final long waitMs;

    private GuiWindow(Robot robot, FrameFixture window, Workbench workbench, Preferences prefs, long waitMs) {
        this.robot = robot;
        this.window = window;
        this.workbench = workbench;
        this.prefs = prefs;
        this.waitMs = waitMs;
    }

    /** Opens the window at {@code width} x {@code height} and waits for the demo to be loaded and scored. */
    static GuiWindow open(int width, int height) throws Exception {
        GuiWindow w = launch(WAIT_MS, prefs -> { });
        w.size(width, height);
        w.waitFor("demo loaded and scored", () -> w.workbench.session().detections() != null && w.workbench.session().hasFrames());
        return w;
    }

    /**
     * Opens the window at the size it chooses itself, without waiting for anything: {@code seed} fills the fresh
     * preferences first (a view to start on, say); {@link #waitFor} waits up to {@code waitMs} milliseconds.
     */
    static GuiWindow launch(long waitMs, Consumer<Preferences> seed) throws Exception {
        assumeFalse(GraphicsEnvironment.isHeadless(), "no display: GUI tests need one (CI runs them under Xvfb)");
        Preferences prefs = Preferences.userRoot().node("org/targetbench/gui-test-" + ProcessHandle.current().pid() + "-" + System.nanoTime());
        seed.accept(prefs);
        Robot robot = BasicRobot.robotWithNewAwtHierarchy();
        Workbench wb = WorkbenchApp.open(prefs);
        Files.createDirectories(SHOTS);
        return new GuiWindow(robot, new FrameFixture(robot, wb), wb, prefs, waitMs);
    }

    void size(int width, int height) {
        GuiActionRunner.execute(() -> {
            workbench.setSize(width, height);
            workbench.validate();
        });
        robot.waitForIdle();
    }

    void waitFor(String what, Supplier<Boolean> test) {
        pause(new Condition(what) {
            @Override public boolean test() { return GuiActionRunner.execute(test::get); }
        }, timeout(waitMs));
    }

    /** Shows a view of the navigation list and waits until its panel is on screen. */
    void show(String view) {
        window.list("nav").selectItem(view);
        String panel = workbench.panelName(view);
        waitFor(view + " showing", () -> window.panel(panel).target().isShowing());
        robot.waitForIdle();
    }

    void shot(String name) throws Exception {
        robot.waitForIdle();
        BufferedImage img = GuiActionRunner.execute(() -> {
            BufferedImage b = new BufferedImage(workbench.getWidth(), workbench.getHeight(), BufferedImage.TYPE_INT_RGB);
            workbench.getRootPane().paint(b.getGraphics());
            return b;
        });
        ImageIO.write(img, "png", new File(SHOTS.toFile(), name + ".png"));
    }

    @Override
    public void close() throws Exception {
        GuiActionRunner.execute(() -> workbench.dispose());
        robot.waitForIdle();
        window.cleanUp();
        prefs.removeNode();
    }
}
