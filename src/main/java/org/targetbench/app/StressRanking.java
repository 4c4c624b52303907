package org.targetbench.app;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRow;
import org.targetbench.pipeline.SweepRun;
import org.targetbench.pipeline.SweepSummary;

import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JTable;
import javax.swing.table.DefaultTableModel;
import javax.swing.table.JTableHeader;
import java.awt.BorderLayout;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * The detectors of a finished sweep ranked as the command line ranks them ({@code SweepSummary.rankEnvelope}, the
 * list {@code targetbench sweep} prints and the "envelope" rows of ranking.csv), with each condition's own score (the
 * per-condition rows of ranking.csv) and, when the sweep tracked, the mean KLT survival. An incomplete sweep gives no
 * ranking, only how far it got. One tooltip per column says what the figure is, its unit and where any threshold comes
 * from.
 */
final class StressRanking extends JPanel {
    private final JTable table = Ui.named(new JTable(), "stress.ranking", null);
    private final JLabel note = Ui.named(new JLabel("No sweep yet: the ranking appears when a sweep has run every cell."), "stress.ranking.note", null);
    private List<String> tips = List.of();

    StressRanking() {
        super(new BorderLayout(0, 2));
        table.setTableHeader(new JTableHeader(table.getColumnModel()) {
            @Override public String getToolTipText(java.awt.event.MouseEvent e) {
                int c = columnAtPoint(e.getPoint());
                if (c < 0) return null;
                int m = table.convertColumnIndexToModel(c);
                return m < tips.size() ? "<html><body style='width:340px'>" + tips.get(m).replace("&", "&amp;").replace("<", "&lt;") + "</body></html>" : null;
            }
        });
        javax.swing.ToolTipManager.sharedInstance().registerComponent(table.getTableHeader());
        table.setDefaultRenderer(Object.class, DetailPane.renderer(table.getDefaultRenderer(Object.class)));
        table.setAutoCreateRowSorter(false);
        table.setFillsViewportHeight(true);
        add(Ui.row(Ui.heading("Ranking"), note), BorderLayout.NORTH);
        add(Ui.fitColumns(new JScrollPane(table)), BorderLayout.CENTER);
        clear("No sweep yet: the ranking appears when a sweep has run every cell.");
    }

    /** An empty table with a line saying why. */
    void clear(String why) {
        note.setText(why);
        tips = List.of();
        table.setModel(new DefaultTableModel());
    }

    /** The ranking of a complete sweep over the operating envelope {@code env} (empty: the whole swept range). */
    void show(SweepResult r, Map<Perturbation, Double> env, int trackFrames) {
        List<String> names = new ArrayList<>(List.of("Rank", "Detector", "Score", "Weakest condition"));
        List<String> t = new ArrayList<>(List.of(
                "Rank by score, highest first; ties keep detector order. The same order as the command line's sweep prints and "
                        + "ranking.csv's \"envelope\" rows (SweepSummary.rankEnvelope).",
                "The detector, with the settings from the detector settings table.",
                "Mean repeatability (fraction 0..1, no unit) at the swept levels inside the operating envelope, under the "
                        + "detector's weakest condition: a cell is as good as its detector under its weakest condition. "
                        + (env.isEmpty() ? "No envelope was set, so every swept level counts. " : "Envelope: " + envelopeWords(env) + ". ")
                        + "The envelope limits come from the \"up to\" values (or an envelope file). Threshold: none, a ranking and not a pass mark. "
                        + "Repeatability: " + Ui.TIP_REPEATABILITY.replace("1.5 px", Ui.fmt(r.epsilon(), 2) + " px"),
                "The condition under which this detector's mean repeatability is lowest; its score comes from there."));
        for (Perturbation p : r.parameters()) {
            double[] v = r.values().get(p);
            names.add(p.id());
            t.add("Mean repeatability (fraction 0..1) over every swept level of " + p.id() + ", " + StressControls.num(v[0]) + " .. "
                    + StressControls.num(v[v.length - 1]) + (p.unit().isEmpty() ? "" : " " + p.unit())
                    + ", envelope or not (ranking.csv's \"" + p.id() + "\" rows). No threshold: higher is better.");
        }
        boolean tracked = trackFrames > 0;
        if (tracked) {
            names.add("KLT survival");
            t.add("Share of tracks (fraction 0..1) still alive after the " + trackFrames + "-frame slow motion ("
                    + SweepRun.MOTION_PX_PER_FRAME + " px and " + SweepRun.MOTION_DEG_PER_FRAME + " deg per frame, each frame degraded afresh), "
                    + "mean over every cell; at most " + SweepRun.MAX_SURVIVAL_TRACKS + " tracks per detector. Not part of the score; no threshold.");
        }
        names.add("Refinement");
        t.add("Sub-pixel refinement the detector ran with (ranking.csv's refinement column).");
        Map<Perturbation, Map<DetectorType, Double>> per = new java.util.LinkedHashMap<>();
        for (Perturbation p : r.parameters()) {
            Map<DetectorType, Double> m = new EnumMap<>(DetectorType.class);
            for (var x : SweepSummary.rankParameter(r, p)) m.put(x.detector(), x.score());
            per.put(p, m);
        }
        Map<DetectorType, String> refine = new EnumMap<>(DetectorType.class);
        for (DetectorConfig c : r.detectors()) refine.put(c.type(), c.refine.describe());
        DefaultTableModel model = new DefaultTableModel(names.toArray(), 0) {
            @Override public boolean isCellEditable(int row, int col) { return false; }
        };
        for (var x : SweepSummary.rankEnvelope(r, env)) {
            List<Object> row = new ArrayList<>(List.of(x.rank(), x.detector().label(), Ui.fmt(x.score(), 3), x.weakest() == null ? "-" : x.weakest().id()));
            for (Perturbation p : r.parameters()) row.add(Ui.fmt(per.get(p).getOrDefault(x.detector(), Double.NaN), 3));
            if (tracked) row.add(Ui.fmt(survival(r.rows(), x.detector()), 3));
            row.add(refine.get(x.detector()));
            model.addRow(row.toArray());
        }
        tips = List.copyOf(t);
        table.setModel(model);
        table.getColumnModel().getColumn(0).setPreferredWidth(40);
        table.getColumnModel().getColumn(1).setPreferredWidth(100);
        table.getColumnModel().getColumn(3).setPreferredWidth(110);
        table.getColumnModel().getColumn(names.size() - 1).setPreferredWidth(240);
        note.setText("over " + (env.isEmpty() ? "the whole swept range" : "the operating envelope (" + envelopeWords(env) + ")")
                + "; score = mean repeatability under the weakest condition");
    }

    private static String envelopeWords(Map<Perturbation, Double> env) {
        List<String> parts = new ArrayList<>();
        for (var e : env.entrySet()) parts.add(e.getKey().id() + " up to " + StressControls.num(e.getValue()) + (e.getKey().unit().isEmpty() ? "" : " " + e.getKey().unit()));
        return String.join(", ", parts);
    }

    private static double survival(List<SweepRow> rows, DetectorType d) {
        return rows.stream().filter(x -> x.detector() == d).mapToDouble(SweepRow::kltSurvival).filter(v -> !Double.isNaN(v)).average().orElse(Double.NaN);
    }

    JTable table() { return table; }

    String note() { return note.getText(); }

    /** Header tooltip of a model column, for tests. */
    String tip(int column) { return column < tips.size() ? tips.get(column) : null; }
}
