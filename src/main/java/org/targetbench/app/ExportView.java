package org.targetbench.app;

import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.report.ServoSetExport;
import org.targetbench.servo.ServoSet;

import javax.swing.JButton;
import javax.swing.JLabel;
import javax.swing.JOptionPane;
import javax.swing.JPanel;
import javax.swing.JTextArea;
import java.awt.BorderLayout;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Writes the servo set (servo-set.json and servo-set.csv, the same files and formats as the command line), the
 * selection reasons and, when the set was rehearsed, the rehearsal report. The safety notice must be acknowledged
 * before the first export of a session.
 */
final class ExportView extends JPanel implements Session.Listener {
    private final AppContext ctx;
    private final Session session;
    private final JLabel summary = Ui.named(new JLabel("No servo set yet."), "export.summary", null);
    private final JButton export;
    private boolean safetyAcknowledged;

    ExportView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.session = ctx.session();
        setName("view.export");
        export = Ui.button("export.write", "Export servo set...", "Write servo-set.json and servo-set.csv to a folder (Ctrl+E)", this::chooseAndExport);
        export.setEnabled(false);
        JTextArea notice = new JTextArea(Safety.NOTICE);
        notice.setName("export.safety");
        notice.setLineWrap(true);
        notice.setWrapStyleWord(true);
        notice.setEditable(false);
        notice.setBorder(javax.swing.BorderFactory.createTitledBorder("Safety"));
        JPanel top = new JPanel(new BorderLayout());
        top.add(Ui.row(export), BorderLayout.NORTH);
        top.add(summary, BorderLayout.CENTER);
        add(top, BorderLayout.NORTH);
        add(notice, BorderLayout.CENTER);
        session.addListener(this);
    }

    @Override
    public void changed(Session.Change c) {
        if (c != Session.Change.SERVO && c != Session.Change.SOURCE) return;
        ServoSet s = session.servoSet();
        export.setEnabled(s != null);
        summary.setText(s == null ? "No servo set yet: choose one in the Servo set view." : String.format(Locale.ROOT,
                "<html>%d points from %s on target %s; cond(L*) %.2f; %s</html>", s.points().size(), s.detector(), s.targetId(),
                s.condition(), session.rehearsal() == null ? (session.changedSinceRehearsal() ? "<b>changed since its rehearsal</b> (Rehearse view)" : "<b>not rehearsed yet</b> (Rehearse view)")
                        : String.format(Locale.ROOT, "rehearsed: %d of %d converged", session.rehearsal().summary().converged(), session.rehearsal().summary().runs())));
    }

    /** Shows the safety notice once per session; true when the user accepts it. */
    boolean acknowledgeSafety() {
        if (safetyAcknowledged) return true;
        int answer = JOptionPane.showConfirmDialog(ctx.window(), "<html><body style='width:420px'>" + Safety.NOTICE
                        + (session.rehearsal() == null ? "<br><br><b>This set has not been rehearsed.</b>" : "") + "</body></html>",
                "Before exporting a servo set", JOptionPane.OK_CANCEL_OPTION, JOptionPane.WARNING_MESSAGE);
        safetyAcknowledged = answer == JOptionPane.OK_OPTION;
        return safetyAcknowledged;
    }

    /** Title of the question asked before exporting a set that was not rehearsed as it stands. */
    static final String UNREHEARSED_TITLE = "Export a set that was not rehearsed?";

    /** True when the set was rehearsed as it stands, or the user chose to export it anyway. */
    boolean confirmUnrehearsed() {
        if (session.rehearsal() != null) return true;
        String why = session.changedSinceRehearsal() ? "This set has changed since it was rehearsed." : "This set has not been rehearsed.";
        int answer = JOptionPane.showConfirmDialog(ctx.window(), "<html><body style='width:420px'><b>" + why + "</b><br><br>"
                        + "Rehearse it first in the Rehearse view: the rehearsal shows whether the servo converges from the start poses you expect. "
                        + "Exported anyway, servo-set.json records \"" + org.targetbench.export.ServoSetJson.NOT_REHEARSED + "\".</body></html>",
                UNREHEARSED_TITLE, JOptionPane.OK_CANCEL_OPTION, JOptionPane.WARNING_MESSAGE);
        return answer == JOptionPane.OK_OPTION;
    }

    void chooseAndExport() {
        if (session.servoSet() == null || !acknowledgeSafety() || !confirmUnrehearsed()) return;
        Folders.choose(ctx, "lastExportFolder", "Folder for the servo set", Folders.Use.SAVE).ifPresent(this::exportTo);
    }

    /** Writes the set into {@code dir}; the safety notice must have been acknowledged. */
    List<String> exportTo(Path dir) {
        ServoSet set = session.servoSet();
        if (set == null || !safetyAcknowledged) throw new IllegalStateException("export needs a set and the acknowledged safety notice");
        ctx.prefs().put("lastExportFolder", dir.toString());
        List<String> files = new ArrayList<>();
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            // the same export as the command line's pick and demo
            files.addAll(ServoSetExport.write(set, java.util.Optional.ofNullable(session.pick()).map(p -> p.selection()),
                    java.util.Optional.ofNullable(session.rehearsal()), session.rehearsalElapsedS(), out, "servo-set", "rehearsal/"));
            out.commit();
            ctx.status().accept("Exported " + String.join(", ", files) + " to " + dir);
        } catch (Exception e) {
            ctx.status().accept("Could not export: " + e.getMessage());
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Could not export", JOptionPane.WARNING_MESSAGE);
        }
        return files;
    }

}
