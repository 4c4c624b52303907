package org.targetbench.app;

import javax.swing.JFrame;
import java.util.function.Consumer;
import java.util.prefs.Preferences;

/**
 * What every view gets: the shared session, the status bar, the user's preferences and the main window (as the
 * parent of dialogs).
 */
record AppContext(Session session, Consumer<String> status, Preferences prefs, JFrame window) {}
