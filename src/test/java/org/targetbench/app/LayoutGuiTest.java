package org.targetbench.app;

import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import javax.swing.AbstractButton;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JViewport;
import javax.swing.SwingUtilities;
import java.awt.Component;
import java.awt.Container;
import java.awt.FontMetrics;
import java.awt.Insets;
import java.awt.Rectangle;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Every view of the window, at the smallest screen the views are laid out for (1280 x 800) and at full HD
 * (1920 x 1080): each named control lies inside the window with a size of its own, and the text of every label and
 * button fits its width (font metrics against the component's width, less its insets and icon), so nothing is pushed
 * off screen or cut off; in the views of {@link #TABLES_CHECKED}, every table header and visible cell fits its column or,
 * in a table with a detail pane, reads in full there. Screenshots of each view at each size go to target/screenshots/layout-*.png.
 */
class LayoutGuiTest {
    /** Names we give controls ("view.part[.more]"), plus the two window-wide ones; Swing's own parts are not ours. */
    static final Pattern OUR_NAME = Pattern.compile("[a-z]+(\\.[A-Za-z0-9_-]+)+|nav|status");

    /**
     * Views whose tables are also checked, header and visible cells: every view. A cell may be narrower than its text
     * only where the table has a {@link DetailPane} and the cell is not in the first column (which names the row, so
     * the row can be found): selecting that row must put the cell's full text in the pane, wrapped to the pane's width
     * (font metrics per wrapped line), the whole row in view without scrolling. Tables without rows here (a servo choice, a sweep, a shoot-out, a calibration
     * not yet run) have their headers checked only.
     */
    static final java.util.Set<String> TABLES_CHECKED = java.util.Set.of("Live", "Camera", "Compare", "Stress", "Track", "Servo set",
            "Rehearse", "Export", "Targets", "Shoot-out", "Calibration");

    static GuiWindow gui;

    @BeforeAll
    static void open() throws Exception {
        gui = GuiWindow.open(1280, 800);
        // the Track and Compare views with their results in, so their tables and charts are laid out full
        gui.show("Track");
        gui.window.spinner("track.frames").enterTextAndCommit("12");
        gui.window.button("track.run").click();
        gui.waitFor("tracked", () -> gui.window.button("track.save").target().isEnabled());
        gui.show("Compare");
        gui.window.button("compare.run").click();
        gui.waitFor("compared", () -> gui.window.button("compare.save").target().isEnabled());
        // a tiny sweep of every detector (two kinds, two levels, one view, two tracked frames), so the ranking has rows
        gui.show("Stress");
        for (var k : java.util.List.of("lighting", "jpeg", "viewpoint")) gui.window.checkBox("stress.kind." + k).uncheck();
        gui.window.spinner("stress.levels").enterTextAndCommit("2");
        gui.window.spinner("stress.views").enterTextAndCommit("1");
        gui.window.spinner("stress.trackFrames").enterTextAndCommit("2");
        gui.window.button("stress.run").click();
        gui.waitFor("swept", () -> gui.window.button("stress.run").target().isEnabled()
                && gui.window.table("stress.ranking").target().getRowCount() > 0);
        // a servo set with its reasons, and a short rehearsal of it, so those tables are checked with rows in them
        gui.show("Servo set");
        gui.window.button("servo.choose").click();
        gui.waitFor("set chosen", () -> gui.workbench.session().servoSet() != null);
        gui.show("Rehearse");
        gui.window.spinner("rehearse.starts").enterTextAndCommit("10");
        gui.window.button("rehearse.run").click();
        gui.waitFor("rehearsed", () -> GuiActionRunner.execute(() -> gui.window.table("rehearse.runs").target().getRowCount() > 0));
    }

    @AfterAll
    static void close() throws Exception {
        if (gui != null) gui.close();
    }

    @ParameterizedTest(name = "{0}x{1}")
    @CsvSource({"1280, 800", "1920, 1080"})
    void everyViewKeepsItsControlsOnScreenAndItsTextWhole(int width, int height) throws Exception {
        gui.size(width, height);
        List<String> problems = new ArrayList<>();
        for (String view : gui.workbench.viewNames()) {
            gui.show(view);
            gui.robot.waitForIdle();
            problems.addAll(GuiActionRunner.execute(() -> problems(view)));
            gui.shot("layout-" + view.toLowerCase().replace(' ', '-') + "-" + width);
        }
        assertEquals(List.of(), problems, "at " + width + "x" + height);
    }

    /** What is off screen or cut off in the showing view (on the event-dispatch thread). */
    static List<String> problems(String view) {
        List<String> out = new ArrayList<>();
        Container root = gui.workbench.getContentPane();
        Rectangle window = new Rectangle(0, 0, root.getWidth(), root.getHeight());
        walk(root, c -> {
            if (!c.isShowing()) return;
            String name = c.getName();
            boolean scrolled = SwingUtilities.getAncestorOfClass(JViewport.class, c) != null;
            if (name != null && OUR_NAME.matcher(name).matches() && !scrolled) {
                Rectangle r = SwingUtilities.convertRectangle(c.getParent(), c.getBounds(), root);
                if (r.width <= 0 || r.height <= 0 || !window.contains(r))
                    out.add(view + ": " + name + " at " + r.x + "," + r.y + " " + r.width + "x" + r.height + " is not inside the window " + window.width + "x" + window.height);
            }
            String cut = cutText(c);
            if (cut != null) out.add(view + ": " + cut);
            if (c instanceof javax.swing.JTable t && TABLES_CHECKED.contains(view)) out.addAll(cutCells(t).stream().map(p -> view + ": " + p).toList());
        });
        return out;
    }

    /** A label's or button's text that does not fit its width, or null (plain text; HTML text wraps). */
    static String cutText(Component c) {
        String text = c instanceof JLabel l ? l.getText() : c instanceof AbstractButton b && !(c.getParent() instanceof javax.swing.JComboBox) ? b.getText() : null;
        if (text == null || text.isBlank() || text.startsWith("<html")) return null;
        JComponent j = (JComponent) c;
        FontMetrics fm = j.getFontMetrics(j.getFont());
        Insets in = j.getInsets();
        javax.swing.Icon icon = c instanceof JLabel l ? l.getIcon() : ((AbstractButton) c).getIcon();
        int gap = c instanceof JLabel l ? l.getIconTextGap() : ((AbstractButton) c).getIconTextGap();
        int room = j.getWidth() - in.left - in.right - (icon == null ? 0 : icon.getIconWidth() + gap);
        return fm.stringWidth(text) <= room ? null
                : (c.getName() != null ? c.getName() + " " : "") + "'" + text + "' needs " + fm.stringWidth(text) + " px, has " + room + " px";
    }

    /** Headers and visible cells of a table whose text needs more than its column's width. */
    static List<String> cutCells(javax.swing.JTable t) {
        List<String> out = new ArrayList<>();
        String name = t.getName() == null ? "a table" : t.getName();
        Rectangle visible = t.getVisibleRect();
        for (int c = 0; c < t.getColumnCount(); c++) {
            int w = t.getColumnModel().getColumn(c).getWidth();
            if (t.getTableHeader() != null && t.getTableHeader().isShowing()) {
                var r = t.getTableHeader().getDefaultRenderer();
                var col = t.getColumnModel().getColumn(c);
                if (col.getHeaderRenderer() != null) r = col.getHeaderRenderer();
                int need = r.getTableCellRendererComponent(t, col.getHeaderValue(), false, false, -1, c).getPreferredSize().width;
                if (need > w) out.add(name + " header '" + col.getHeaderValue() + "' needs " + need + " px, has " + w + " px");
            }
            for (int row = 0; row < t.getRowCount(); row++) {
                if (!visible.intersects(t.getCellRect(row, c, true))) continue;
                Component cell = t.prepareRenderer(t.getCellRenderer(row, c), row, c);
                int need = cell.getPreferredSize().width;
                if (need <= w) continue;
                String pane = c > 0 && t.getClientProperty(DetailPane.class) instanceof DetailPane d ? inFull(t, d, row, c) : "no detail pane";
                if (pane != null) out.add(name + " cell '" + t.getValueAt(row, c) + "' needs " + need + " px, has " + w + " px (" + pane + ")");
            }
        }
        return out;
    }

    /**
     * Null when selecting {@code row} shows the full text of cell ({@code row}, {@code col}) in the table's detail pane,
     * every wrapped line within the pane's width; otherwise what is wrong. Leaves the row selected.
     */
    static String inFull(javax.swing.JTable t, DetailPane pane, int row, int col) {
        t.setRowSelectionInterval(row, row);
        javax.swing.JTextArea area = pane.text();
        String line = Ui.plain(t.getColumnName(col)) + ": " + t.getValueAt(row, col);
        if (!pane.isShowing() || !area.getText().contains(line)) return "the detail pane does not show '" + line + "'";
        if (!area.getLineWrap() || pane.getHorizontalScrollBar().isShowing()) return "the detail pane does not wrap";
        if (area.getPreferredSize().height > pane.getViewport().getHeight())
            return "the row needs " + area.getPreferredSize().height + " px of the detail pane's height, has " + pane.getViewport().getHeight() + " px";
        FontMetrics fm = area.getFontMetrics(area.getFont());
        int room = area.getWidth() - area.getInsets().left - area.getInsets().right;
        String text = area.getText();
        try {
            for (int p = 0; p < text.length(); ) {
                int end = javax.swing.text.Utilities.getRowEnd(area, p);
                if (end < p) return "the detail pane is not laid out";
                String wrapped = text.substring(p, Math.min(text.length(), end + 1)).replace("\n", "").stripTrailing();
                if (fm.stringWidth(wrapped) > room) return "detail line '" + wrapped + "' needs " + fm.stringWidth(wrapped) + " px, has " + room + " px";
                p = end + 1;
            }
        } catch (javax.swing.text.BadLocationException e) {
            return e.toString();
        }
        return null;
    }

    @org.junit.jupiter.api.Test
    void theCheckFindsCutText() {
        GuiActionRunner.execute(() -> {
            JLabel l = new JLabel("a label far too long for the width it is given");
            l.setSize(60, 20);
            org.junit.jupiter.api.Assertions.assertNotNull(cutText(l));
            l.setSize(l.getPreferredSize());
            org.junit.jupiter.api.Assertions.assertNull(cutText(l));
            javax.swing.JTable t = new javax.swing.JTable(new Object[][]{{"a cell far too long for its column"}}, new Object[]{"Header"});
            t.setSize(40, 100);
            t.doLayout();
            org.junit.jupiter.api.Assertions.assertEquals(1, cutCells(t).size(), cutCells(t).toString());
            // a detail pane excuses a cut cell only when it shows it in full: this one is not on screen
            javax.swing.JTable d = new javax.swing.JTable(new Object[][]{{"x", "a cell far too long for its column"}}, new Object[]{"Name", "Reason"});
            new DetailPane("test.detail", "", d);
            d.setSize(80, 100);
            d.doLayout();
            org.junit.jupiter.api.Assertions.assertEquals(1, cutCells(d).size(), cutCells(d).toString());
            org.junit.jupiter.api.Assertions.assertTrue(cutCells(d).get(0).contains("detail pane does not show"), cutCells(d).toString());
            return null;
        });
    }

    private static void walk(Component c, java.util.function.Consumer<Component> visit) {
        visit.accept(c);
        if (c instanceof Container k) for (Component child : k.getComponents()) walk(child, visit);
    }
}
