package org.targetbench.app;

import org.targetbench.pipeline.Threads;
import com.formdev.flatlaf.FlatDarkLaf;
import com.formdev.flatlaf.FlatLightLaf;

import javax.swing.SwingUtilities;
import java.awt.GraphicsEnvironment;
import java.util.prefs.Preferences;

/** Starts the workbench window on the demo scene. */
public final class WorkbenchApp {
    /** Where the workbench keeps its settings (java.util.prefs, per user). */
    public static final String PREFS_NODE = "org/targetbench/workbench";

    private WorkbenchApp() {}

    /** True when a window can be shown here. */
    public static boolean canShowWindows() {
        return !GraphicsEnvironment.isHeadless();
    }

    static void applyTheme(boolean dark) {
        if (dark) FlatDarkLaf.setup();
        else FlatLightLaf.setup();
    }

    /** Opens the workbench and loads the demo scene; returns the window (created on the event-dispatch thread). */
    public static Workbench open(Preferences prefs) throws Exception {
        Workbench[] out = new Workbench[1];
        SwingUtilities.invokeAndWait(() -> {
            applyTheme(prefs.getBoolean("dark", false));
            Workbench w = new Workbench(prefs);
            w.setVisible(true);
            w.live().loadDemo();
            out[0] = w;
        });
        return out[0];
    }

    public static void main(String[] args) throws Exception {
        Threads.coarseOnly(); // the process's thread policy, chosen once by the shell (see Threads)
        open(Preferences.userRoot().node(PREFS_NODE));
    }
}
