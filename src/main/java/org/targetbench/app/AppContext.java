package org.targetbench.app;

import javax.swing.JFrame;
import java.util.function.Consumer;
import java.util.prefs.Preferences;

/**
 * What every view gets: the shared session, the status bar, the user's preferences, the main window (as the parent
 * of dialogs) and a way to bring another view forward by name.
 */
record AppContext(Session session, Consumer<String> status, Preferences prefs, JFrame window, Consumer<String> showView) {}
