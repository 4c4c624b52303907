package org.targetbench.app;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import javax.swing.AbstractButton;
import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JComponent;
import javax.swing.JSlider;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.JTextField;
import javax.swing.table.DefaultTableModel;
import java.awt.Component;
import java.awt.Container;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The settings of views, by component name, for a saved session: every named spinner, combo box, check box, slider and
 * text field under the views it is given (so a control a view gains later is kept without a change here), and the rows
 * of the tables it is told to keep (the rehearsal runs side by side). Restoring sets each control as a user would
 * (listeners run), skipping names the window no longer has and values a control no longer offers.
 */
final class ViewSettings {
    /** Components named like the views whose controls a session keeps. */
    static final List<String> VIEWS = List.of("view.live", "view.servo", "view.rehearse", "view.stress");
    /** Controls left out: the frame slider follows the frame index, which the session keeps on its own. */
    static final Set<String> SKIP = Set.of("play.slider");
    /** Tables whose rows a session keeps. */
    static final Set<String> TABLES = Set.of("rehearse.runs");
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ViewSettings() {}

    /** The views named in {@link #VIEWS} under the window. */
    static List<Component> views(Container window) {
        List<Component> out = new java.util.ArrayList<>();
        walk(window, c -> {
            if (c.getName() != null && VIEWS.contains(c.getName())) out.add(c);
        });
        return out;
    }

    private static void walk(Component c, java.util.function.Consumer<Component> f) {
        f.accept(c);
        if (c instanceof JSpinner || c instanceof JComboBox || c instanceof JTable) return; // their editors are not settings
        if (c instanceof Container k) for (Component x : k.getComponents()) walk(x, f);
    }

    static ObjectNode save(List<Component> views) {
        ObjectNode controls = MAPPER.createObjectNode(), tables = MAPPER.createObjectNode();
        for (Component v : views) walk(v, c -> {
            String n = c.getName();
            if (n == null || SKIP.contains(n) || !(c instanceof JComponent)) return;
            if (c instanceof JSpinner s) {
                Object val = s.getValue();
                if (val instanceof Integer i) controls.put(n, i);
                else if (val instanceof Long l) controls.put(n, l);
                else if (val instanceof Number x) controls.put(n, x.doubleValue());
                else controls.put(n, String.valueOf(val));
            } else if (c instanceof JComboBox<?> b) controls.put(n, String.valueOf(b.getSelectedItem()));
            else if (c instanceof AbstractButton b && !(c instanceof JButton)) controls.put(n, b.isSelected());
            else if (c instanceof JSlider s) controls.put(n, s.getValue());
            else if (c instanceof JTextField t && t.isEditable()) controls.put(n, t.getText());
            else if (c instanceof JTable t && TABLES.contains(n)) {
                ArrayNode rows = tables.putArray(n);
                for (int r = 0; r < t.getModel().getRowCount(); r++) {
                    ArrayNode row = rows.addArray();
                    for (int k = 0; k < t.getModel().getColumnCount(); k++) row.add(String.valueOf(t.getModel().getValueAt(r, k)));
                }
            }
        });
        ObjectNode out = MAPPER.createObjectNode();
        out.set("controls", controls);
        out.set("tables", tables);
        return out;
    }

    /** Sets the controls and tables of {@code saved} (as written by {@link #save}) on the views. */
    static void restore(List<Component> views, JsonNode saved) {
        JsonNode controls = saved.path("controls"), tables = saved.path("tables");
        for (Component v : views) walk(v, c -> {
            String n = c.getName();
            if (n == null || SKIP.contains(n)) return;
            JsonNode val = controls.get(n);
            if (c instanceof JTable t && TABLES.contains(n) && tables.path(n).isArray() && t.getModel() instanceof DefaultTableModel m) {
                m.setRowCount(0);
                for (JsonNode row : tables.get(n)) {
                    Object[] cells = new Object[m.getColumnCount()];
                    for (int k = 0; k < cells.length; k++) cells[k] = row.path(k).asText("");
                    m.addRow(cells);
                }
                return;
            }
            if (val == null) return;
            if (c instanceof JSpinner s) {
                Object now = s.getValue();
                Object next = now instanceof Integer ? (Object) val.asInt() : now instanceof Long ? (Object) val.asLong()
                        : now instanceof Double ? (Object) val.asDouble() : now instanceof Float ? (Object) (float) val.asDouble() : null;
                if (next != null && !next.equals(now)) {
                    try {
                        s.setValue(next);
                    } catch (IllegalArgumentException e) {
                        // a value the control no longer allows: left as it is
                    }
                }
            } else if (c instanceof JComboBox<?> b) {
                for (int i = 0; i < b.getItemCount(); i++)
                    if (String.valueOf(b.getItemAt(i)).equals(val.asText()) && b.getSelectedIndex() != i) b.setSelectedIndex(i);
            } else if (c instanceof AbstractButton b && !(c instanceof JButton)) {
                if (b.isSelected() != val.asBoolean()) b.doClick(0); // as a click, so the view's listeners follow
                if (b.isSelected() != val.asBoolean()) b.setSelected(val.asBoolean()); // a disabled control takes no click
            } else if (c instanceof JSlider s) s.setValue(val.asInt());
            else if (c instanceof JTextField t && t.isEditable()) t.setText(val.asText());
        });
    }

    /** The controls of {@code saved} as name and value text, for comparisons. */
    static Map<String, String> controls(JsonNode saved) {
        Map<String, String> out = new java.util.TreeMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = saved.path("controls").fields(); it.hasNext(); ) {
            var e = it.next();
            out.put(e.getKey(), e.getValue().asText());
        }
        return out;
    }
}
