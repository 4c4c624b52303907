package org.targetbench.app;

import org.assertj.swing.core.BasicComponentFinder;
import org.assertj.swing.core.GenericTypeMatcher;
import org.assertj.swing.core.Robot;
import org.assertj.swing.edt.GuiActionRunner;
import org.assertj.swing.exception.WaitTimedOutError;
import org.assertj.swing.fixture.FrameFixture;
import org.assertj.swing.fixture.JButtonFixture;
import org.assertj.swing.timing.Condition;
import org.junit.jupiter.api.AfterAll;

import javax.swing.JDialog;
import javax.swing.JOptionPane;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import java.util.function.Supplier;
import java.util.prefs.Preferences;

import static org.assertj.swing.timing.Pause.pause;
import static org.assertj.swing.timing.Timeout.timeout;

/**
 * What the GUI test classes share: one {@link GuiWindow} a class (opened by the class's own {@code @BeforeAll} through
 * {@link #start}, closed here after its last test), its robot, fixture and workbench as static fields, and the helpers
 * for waiting, dialogs and screenshots. GUI test classes run one after another, so one set of fields serves them all.
 */
abstract class GuiTestBase {
    /** Longest wait for background work in the window, milliseconds (a class may name a longer one for {@link #start}). */
    static final long WAIT_MS = GuiWindow.WAIT_MS;
    static final Path SHOTS = GuiWindow.SHOTS;

    static GuiWindow gui;
    static Robot robot;
    static FrameFixture window;
    static Workbench workbench;

    /** Opens the window (see {@link GuiWindow#launch}), {@link #waitFor} waiting up to {@code waitMs} milliseconds. */
    static void start(long waitMs, Consumer<Preferences> seed) throws Exception {
        gui = GuiWindow.launch(waitMs, seed);
        robot = gui.robot;
        window = gui.window;
        workbench = gui.workbench;
    }

    static void start(long waitMs) throws Exception {
        start(waitMs, prefs -> { });
    }

    @AfterAll
    static void closeWindow() throws Exception {
        try {
            if (gui != null) gui.close();
        } finally {
            gui = null;
            robot = null;
            window = null;
            workbench = null;
        }
    }

    static void waitFor(String what, Supplier<Boolean> test) {
        gui.waitFor(what, test);
    }

    static void size(int width, int height) {
        gui.size(width, height);
    }

    /** The window as it is drawn, at its current size, as target/screenshots/NAME.png for review. */
    static void shot(String name) throws Exception {
        gui.shot(name);
    }

    /**
     * Presses a dialog button the way its mnemonic or the keyboard would (doClick on the event-dispatch thread):
     * mouse clicks on a dialog that a window-manager-less virtual display is still placing can be lost.
     */
    static void press(JButtonFixture b) {
        GuiActionRunner.execute(() -> b.target().doClick());
    }

    /** True when no dialog of the workbench is on screen (a closed one may take a moment to go). */
    static boolean noDialogShowing() {
        return showingDialogs().isEmpty();
    }

    /**
     * Waits until no dialog shows. A click on a dialog that is still being realised can be lost on a loaded machine;
     * after a few seconds the option panes still up are answered with OK directly (what their OK button does).
     */
    static void awaitDialogsClosed() {
        try {
            pause(new Condition("dialogs closed") {
                @Override public boolean test() { return GuiActionRunner.execute(GuiTestBase::noDialogShowing); }
            }, timeout(5_000));
        } catch (WaitTimedOutError e) {
            GuiActionRunner.execute(() -> {
                for (java.awt.Window w : java.awt.Window.getWindows())
                    if (w instanceof JDialog d && d.isShowing())
                        for (JOptionPane p : BasicComponentFinder.finderWithCurrentAwtHierarchy()
                                .findAll(d, new GenericTypeMatcher<JOptionPane>(JOptionPane.class) {
                                    @Override protected boolean isMatching(JOptionPane c) { return true; }
                                }))
                            p.setValue(JOptionPane.OK_OPTION);
            });
            try {
                waitFor("dialogs closed", GuiTestBase::noDialogShowing);
            } catch (WaitTimedOutError e2) {
                throw new AssertionError("still showing: " + GuiActionRunner.execute(GuiTestBase::showingDialogs), e2);
            }
        }
    }

    static List<String> showingDialogs() {
        List<String> out = new ArrayList<>();
        for (java.awt.Window w : java.awt.Window.getWindows())
            if (w instanceof java.awt.Dialog d && d.isShowing()) out.add(d.getClass().getName() + " '" + d.getTitle() + "' owner " + d.getOwner());
        return out;
    }

    /** Waits for the file chooser and approves folder {@code dir} in it (set on the event-dispatch thread). */
    static void chooseFolder(Path dir) {
        var chooser = window.fileChooser(timeout(WAIT_MS)).target();
        GuiActionRunner.execute(() -> {
            chooser.setCurrentDirectory(dir.getParent().toFile());
            chooser.setSelectedFile(dir.toFile());
            chooser.approveSelection();
        });
    }

    /** Runs the stress sweep as set up in the stress view and cancels it once two of its cells are done. */
    static void runSweepThenCancel() {
        window.button("stress.run").click();
        waitFor("some cells done", () -> window.progressBar("stress.progress").target().getValue() >= 2);
        window.button("stress.cancel").click();
        waitFor("sweep stopped", () -> window.button("stress.run").target().isEnabled());
    }
}
