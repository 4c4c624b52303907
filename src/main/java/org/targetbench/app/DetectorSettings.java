package org.targetbench.app;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;

import javax.swing.JOptionPane;
import javax.swing.JScrollPane;
import javax.swing.JTable;
import javax.swing.table.DefaultTableModel;
import java.awt.Dimension;
import java.util.ArrayList;
import java.util.List;

/**
 * Edits the shared settings of every detector (most points, threshold, suppression radius) in one table; the changes
 * go into the session, so every view and run uses them. Bad values are refused with the detector's own message.
 */
final class DetectorSettings {
    private DetectorSettings() {}

    static void edit(AppContext ctx) {
        Session s = ctx.session();
        DefaultTableModel m = new DefaultTableModel(new Object[]{"Detector", "Most points", "Threshold", "Relative?", "Suppression radius px"}, 0) {
            @Override public boolean isCellEditable(int r, int c) { return c > 0 && c != 3; }
        };
        for (DetectorConfig c : s.configs())
            m.addRow(new Object[]{c.type().label(), c.maxFeatures, c.threshold, c.thresholdMode.name().toLowerCase(java.util.Locale.ROOT), c.nmsRadius});
        JTable t = new JTable(m);
        t.setName("settings.table");
        JScrollPane sp = new JScrollPane(t);
        sp.setPreferredSize(new Dimension(620, 170));
        Object[] form = {"Threshold is a fraction of the frame's strongest response when relative. Every detector is scored with these settings.", sp};
        if (JOptionPane.showConfirmDialog(ctx.window(), form, "Detector settings", JOptionPane.OK_CANCEL_OPTION, JOptionPane.PLAIN_MESSAGE)
                != JOptionPane.OK_OPTION) return;
        if (t.isEditing()) t.getCellEditor().stopCellEditing();
        List<DetectorConfig> updated = new ArrayList<>();
        try {
            for (int r = 0; r < m.getRowCount(); r++) {
                DetectorConfig c = s.config(DetectorType.values()[r]);
                c.maxFeatures = Integer.parseInt(m.getValueAt(r, 1).toString().trim());
                c.threshold = Double.parseDouble(m.getValueAt(r, 2).toString().trim());
                c.nmsRadius = Integer.parseInt(m.getValueAt(r, 4).toString().trim());
                c.checkValidity();
                updated.add(c);
            }
        } catch (IllegalArgumentException e) {
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Settings not applied", JOptionPane.WARNING_MESSAGE);
            return;
        }
        updated.forEach(s::setConfig);
        ctx.status().accept("Detector settings applied");
    }
}
