package org.targetbench.cli;

import org.targetbench.app.WorkbenchApp;
import picocli.CommandLine.Command;

import java.util.concurrent.Callable;
import java.util.prefs.Preferences;

@Command(name = "app", mixinStandardHelpOptions = true,
        description = "Opens the workbench window on the built-in demo scene (needs a display).")
final class AppCommand implements Callable<Integer> {
    @Override
    public Integer call() throws Exception {
        if (!WorkbenchApp.canShowWindows())
            throw new UserError("no display to open a window on; set DISPLAY (or use the command-line tools)");
        org.targetbench.export.AtomicOutput.guardWholeFolders(false); // folders are picked in a save dialog; same-named files are still guarded
        var w = WorkbenchApp.open(Preferences.userRoot().node(WorkbenchApp.PREFS_NODE));
        // keep the command running until the window closes
        while (w.isDisplayable()) Thread.sleep(250);
        return 0;
    }
}
