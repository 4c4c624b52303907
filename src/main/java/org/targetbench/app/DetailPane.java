package org.targetbench.app;

import javax.swing.BorderFactory;
import javax.swing.JScrollPane;
import javax.swing.JTable;
import javax.swing.JTextArea;
import javax.swing.ScrollPaneConstants;
import javax.swing.table.TableCellRenderer;
import java.awt.Color;
import java.awt.Component;
import java.awt.Dimension;
import java.util.ArrayList;
import java.util.List;

/**
 * The full text of a table's selected row, wrapped to the pane's width so no reason, check line or figure is cut off:
 * one "Column: value" line per column. Cells also carry their full text as a tooltip, and PASS, WARN and FAIL cells are
 * coloured and keep their word (colour is never the only cue).
 */
final class DetailPane extends JScrollPane {
    static final Color PASS = new Color(0, 158, 115), WARN = new Color(230, 159, 0), FAIL = new Color(213, 94, 0);

    private final JTextArea text = new JTextArea(4, 30);

    DetailPane(String name, String hint, JTable... tables) {
        text.setName(name);
        text.setLineWrap(true);
        text.setWrapStyleWord(true);
        text.setEditable(false);
        text.setText(hint);
        setViewportView(text);
        setHorizontalScrollBarPolicy(ScrollPaneConstants.HORIZONTAL_SCROLLBAR_NEVER);
        setBorder(BorderFactory.createTitledBorder("Selected row in full"));
        setPreferredSize(new Dimension(300, 110));
        for (JTable table : tables) {
            table.putClientProperty(DetailPane.class, this); // this pane shows the table's selected row in full
            table.getSelectionModel().addListSelectionListener(e -> {
                if (!e.getValueIsAdjusting()) show(table);
            });
            table.setDefaultRenderer(Object.class, renderer(table.getDefaultRenderer(Object.class)));
        }
    }

    /** One tooltip per column header: what the column is, its unit and where its threshold comes from. */
    static void columnTips(JTable table, String... tips) {
        table.setTableHeader(new javax.swing.table.JTableHeader(table.getColumnModel()) {
            @Override public String getToolTipText(java.awt.event.MouseEvent e) {
                int c = columnAtPoint(e.getPoint());
                if (c < 0) return null;
                int m = table.convertColumnIndexToModel(c);
                return m < tips.length ? "<html><body style='width:320px'>" + escape(tips[m]) + "</body></html>" : null;
            }
        });
        javax.swing.ToolTipManager.sharedInstance().registerComponent(table.getTableHeader());
    }

    JTextArea text() { return text; }

    private void show(JTable t) {
        int r = t.getSelectedRow();
        if (r < 0) return;
        List<String> lines = new ArrayList<>();
        for (int c = 0; c < t.getColumnCount(); c++) lines.add(Ui.plain(t.getColumnName(c)) + ": " + t.getValueAt(r, c));
        text.setText(String.join("\n", lines));
        text.setCaretPosition(0);
    }

    /** Cell text as a tooltip; PASS/WARN/FAIL (and ERROR) cells in their colour, bold, with their word kept. */
    static TableCellRenderer renderer(TableCellRenderer base) {
        return (table, value, sel, focus, row, col) -> {
            Component c = base.getTableCellRendererComponent(table, value, sel, focus, row, col);
            if (c instanceof javax.swing.JComponent j) j.setToolTipText(value == null || value.toString().isEmpty() ? null
                    : "<html><body style='width:380px'>" + escape(value.toString()) + "</body></html>");
            Color verdict = verdict(value);
            if (!sel) c.setForeground(verdict != null ? verdict : table.getForeground());
            c.setFont(verdict != null ? table.getFont().deriveFont(java.awt.Font.BOLD) : table.getFont());
            return c;
        };
    }

    static Color verdict(Object v) {
        if (v == null) return null;
        String s = v.toString().trim();
        if (s.startsWith("PASS")) return PASS;
        if (s.startsWith("WARN")) return WARN;
        if (s.startsWith("FAIL") || s.startsWith("ERROR")) return FAIL;
        return null;
    }

    private static String escape(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;");
    }
}
