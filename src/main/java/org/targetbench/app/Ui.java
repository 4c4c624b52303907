package org.targetbench.app;

import org.targetbench.detect.DetectorType;
import org.targetbench.report.Palette;

import javax.swing.BorderFactory;
import javax.swing.Icon;
import javax.swing.JButton;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
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

    /** A two-line table header: the name, and its unit beneath (a blank line when it has none, so headers align). */
    static String head(String name, String unit) {
        return "<html><center>" + name + "<br>" + (unit.isEmpty() ? "&nbsp;" : unit) + "</center></html>";
    }

    /** A panel that takes its scroll pane's width (scrolling only up and down), so charts in it fit beside a wide table. */
    static final class WidthPanel extends JPanel implements javax.swing.Scrollable {
        WidthPanel(java.awt.LayoutManager layout) { super(layout); }
        @Override public java.awt.Dimension getPreferredScrollableViewportSize() { return getPreferredSize(); }
        @Override public int getScrollableUnitIncrement(java.awt.Rectangle r, int o, int d) { return 16; }
        @Override public int getScrollableBlockIncrement(java.awt.Rectangle r, int o, int d) { return Math.max(16, r.height - 16); }
        @Override public boolean getScrollableTracksViewportWidth() { return true; }
        @Override public boolean getScrollableTracksViewportHeight() { return false; }
    }

    /** A header as plain text ({@link #head} joined by a comma), for lines that name a column. */
    static String plain(String header) {
        return header.replace("<br>&nbsp;", "").replace("<br>", ", ").replaceAll("<[^>]+>", "").replace("&nbsp;", " ").trim();
    }

    /** Room, px, left beside a column's widest text so it does not touch the grid line. */
    private static final int COLUMN_GAP = 8;

    /**
     * Sizes the columns of the table in {@code sp} from their content by font metrics (each renderer's preferred width):
     * header and cells for model columns below {@code cellsUpTo}, the header alone for the rest (long text a
     * {@link DetailPane} shows in full). Widths are minimums and only grow, now and whenever rows change, so figures
     * updating do not shift the layout; {@code samples} are rows measured as if present (the widest expected
     * content, before any row exists). The scroll pane asks for the table's full width; when the room is narrower
     * still, the table scrolls sideways (the last resort) rather than squeezing columns below their text.
     */
    static JScrollPane fitColumns(JScrollPane sp, int cellsUpTo, Object[]... samples) {
        javax.swing.JTable t = (javax.swing.JTable) sp.getViewport().getView();
        t.getTableHeader().setReorderingAllowed(false);
        Runnable fit = () -> {
            int total = 0;
            var cols = t.getColumnModel();
            for (int c = 0; c < cols.getColumnCount(); c++) {
                var col = cols.getColumn(c);
                int m = col.getModelIndex();
                var hr = col.getHeaderRenderer() != null ? col.getHeaderRenderer() : t.getTableHeader().getDefaultRenderer();
                int need = hr.getTableCellRendererComponent(t, col.getHeaderValue(), false, false, -1, c).getPreferredSize().width;
                int cells = 0;
                for (int r = 0; r < t.getModel().getRowCount(); r++) cells = Math.max(cells, cellWidth(t, t.getModel().getValueAt(r, m), r, c));
                for (Object[] row : samples) if (m < row.length) cells = Math.max(cells, cellWidth(t, row[m], 0, c));
                if (m < cellsUpTo) need = Math.max(need, cells);
                need += COLUMN_GAP;
                if (need > col.getMinWidth()) col.setMinWidth(need);
                // a column that may be narrower than its cells asks for their width, so spare room goes to it first
                int want = Math.max(col.getMinWidth(), m < cellsUpTo ? 0 : cells + COLUMN_GAP);
                if (want > col.getPreferredWidth()) col.setPreferredWidth(want);
                total += col.getMinWidth();
            }
            java.awt.Dimension vp = t.getPreferredScrollableViewportSize();
            if (vp.width < total) t.setPreferredScrollableViewportSize(new java.awt.Dimension(total, vp.height));
            java.awt.Insets in = sp.getInsets();
            int want = total + in.left + in.right + sp.getVerticalScrollBar().getPreferredSize().width;
            if (sp.isPreferredSizeSet() && sp.getPreferredSize().width < want) {
                sp.setPreferredSize(new java.awt.Dimension(want, sp.getPreferredSize().height));
                sp.revalidate();
            }
            scrollIfNarrow(sp, t);
        };
        fit.run();
        boolean[] pending = {false}; // one fit per burst of changes (a live table refills every frame), after the table has taken them
        javax.swing.event.TableModelListener refit = e -> {
            if (pending[0]) return;
            pending[0] = true;
            javax.swing.SwingUtilities.invokeLater(() -> {
                pending[0] = false;
                fit.run();
            });
        };
        t.getModel().addTableModelListener(refit);
        t.addPropertyChangeListener("model", e -> { // a view that replaces its model (new columns) is fitted again
            if (e.getOldValue() instanceof javax.swing.table.TableModel old) old.removeTableModelListener(refit);
            if (e.getNewValue() instanceof javax.swing.table.TableModel now) now.addTableModelListener(refit);
            refit.tableChanged(null);
        });
        sp.getViewport().addComponentListener(new java.awt.event.ComponentAdapter() {
            @Override public void componentResized(java.awt.event.ComponentEvent e) { scrollIfNarrow(sp, t); }
        });
        return sp;
    }

    /** {@link #fitColumns(JScrollPane, int, Object[]...)} on every column's cells. */
    static JScrollPane fitColumns(JScrollPane sp, Object[]... samples) {
        return fitColumns(sp, Integer.MAX_VALUE, samples);
    }

    private static int cellWidth(javax.swing.JTable t, Object value, int row, int col) {
        return t.getCellRenderer(Math.min(row, Math.max(0, t.getRowCount() - 1)), col)
                .getTableCellRendererComponent(t, value, false, false, row, col).getPreferredSize().width;
    }

    /** Columns fill the viewport when their minimum widths fit it; otherwise the table keeps them and scrolls sideways. */
    private static void scrollIfNarrow(JScrollPane sp, javax.swing.JTable t) {
        int min = 0;
        for (int c = 0; c < t.getColumnCount(); c++) min += t.getColumnModel().getColumn(c).getMinWidth();
        int mode = sp.getViewport().getWidth() >= min ? javax.swing.JTable.AUTO_RESIZE_SUBSEQUENT_COLUMNS : javax.swing.JTable.AUTO_RESIZE_OFF;
        if (t.getAutoResizeMode() != mode) t.setAutoResizeMode(mode);
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
