package org.targetbench.app;

import org.targetbench.detect.DetectorType;
import org.targetbench.report.Palette;

import javax.swing.BorderFactory;
import javax.swing.Icon;
import javax.swing.JButton;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JPanel;
import java.awt.Color;
import java.awt.Component;
import java.awt.FlowLayout;
import java.awt.Font;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.util.Locale;

/** Small Swing helpers shared by the views, and the one-sentence explanations shown as tooltips. */
final class Ui {
    private Ui() {}

    static final String TIP_REPEATABILITY = "Share of the reference frame's points found again within 1.5 px, after mapping by the known homography (Schmid et al. 2000).";
    static final String TIP_COUNT = "Points the detector returned on this frame (at most its feature limit).";
    static final String TIP_COVERAGE = "Share of a 4 x 4 grid of image cells that hold at least one point: how well the points spread over the view.";
    static final String TIP_LOCALISATION = "RMS distance from each true feature to the nearest point within 3 px, in pixels; needs ground truth.";
    static final String TIP_SURVIVAL = "Share of the first frame's tracks still alive at each frame.";
    static final String TIP_COND = "Condition number of the servo interaction matrix at the reference pose (translations scaled by depth); lower is better conditioned.";

    static JButton button(String name, String text, String tip, Runnable action) {
        JButton b = new JButton(text);
        b.setName(name);
        b.setToolTipText(tip);
        b.addActionListener(e -> action.run());
        return b;
    }

    static JPanel row(Component... parts) {
        JPanel p = new JPanel(new FlowLayout(FlowLayout.LEFT, 6, 2)) {
            @Override public java.awt.Dimension getMaximumSize() {
                return new java.awt.Dimension(Integer.MAX_VALUE, getPreferredSize().height);
            }
        };
        for (Component c : parts) p.add(c);
        return p;
    }

    static JLabel heading(String text) {
        JLabel l = new JLabel(text);
        l.setFont(l.getFont().deriveFont(Font.BOLD, l.getFont().getSize2D() + 1f));
        l.setBorder(BorderFactory.createEmptyBorder(6, 2, 2, 2));
        return l;
    }

    static <T extends JComponent> T named(T c, String name, String tip) {
        c.setName(name);
        if (tip != null) c.setToolTipText(tip);
        return c;
    }

    /** Shows detectors in lists and combo boxes by their label, with their colour. */
    static javax.swing.ListCellRenderer<Object> detectorRenderer() {
        return new javax.swing.DefaultListCellRenderer() {
            @Override public Component getListCellRendererComponent(javax.swing.JList<?> l, Object v, int i, boolean sel, boolean focus) {
                JLabel c = (JLabel) super.getListCellRendererComponent(l, v, i, sel, focus);
                if (v instanceof DetectorType t) {
                    c.setText(t.label());
                    c.setIcon(swatch(t));
                }
                return c;
            }
        };
    }

    static String fmt(double v, int decimals) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    static String pct(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.0f%%", 100 * v);
    }

    /** A round swatch in a detector's colour, with the dark outline used on the overlays. */
    static Icon swatch(DetectorType t) {
        return swatch(Palette.of(t));
    }

    static Icon swatch(Color c) {
        return new Icon() {
            @Override public void paintIcon(Component comp, Graphics g0, int x, int y) {
                Graphics2D g = (Graphics2D) g0.create();
                g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
                g.setColor(Color.BLACK);
                g.fillOval(x, y, 12, 12);
                g.setColor(c);
                g.fillOval(x + 2, y + 2, 8, 8);
                g.dispose();
            }
            @Override public int getIconWidth() { return 12; }
            @Override public int getIconHeight() { return 12; }
        };
    }
}
