package org.targetbench.app;

import javax.swing.JFileChooser;
import java.nio.file.Path;
import java.util.Optional;

/** The one folder chooser of the workbench: starts where the user last chose for the same purpose and remembers it. */
final class Folders {
    private Folders() {}

    /** What the folder is for: an existing one to read, or one to write into (created if need be). */
    enum Use { OPEN, SAVE }

    /**
     * Asks for a folder; empty when the user cancels.
     *
     * @param prefKey the preference under which the last folder for this purpose is kept
     * @param title   the dialog's title, saying what goes in or comes from the folder
     */
    static Optional<Path> choose(AppContext ctx, String prefKey, String title, Use use) {
        JFileChooser fc = new JFileChooser(ctx.prefs().get(prefKey, System.getProperty("user.dir")));
        fc.setFileSelectionMode(JFileChooser.DIRECTORIES_ONLY);
        fc.setDialogTitle(title);
        int answer = use == Use.OPEN ? fc.showOpenDialog(ctx.window()) : fc.showSaveDialog(ctx.window());
        if (answer != JFileChooser.APPROVE_OPTION) return Optional.empty();
        Path dir = fc.getSelectedFile().toPath();
        ctx.prefs().put(prefKey, dir.toString());
        return Optional.of(dir);
    }
}
