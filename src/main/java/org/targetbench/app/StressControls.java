package org.targetbench.app;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepSummary;
import org.targetbench.source.EnvelopeFile;
import org.targetbench.source.SourceException;

import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComboBox;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JSpinner;
import javax.swing.SpinnerNumberModel;
import java.awt.BorderLayout;
import java.awt.Component;
import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The settings of a stress sweep, in the command line's terms ({@code targetbench sweep}): the detectors that take
 * part ({@code --detectors}), the conditions and their parameter ({@code --kinds}), per condition the operating
 * envelope, the harshest value the cell will meet ({@code --envelope}; without one the whole swept range counts), the
 * levels per condition ({@code --levels}), the base views ({@code --views}), the seed ({@code --seed}) and the frames of
 * KLT tracking per cell ({@code --track-frames}). Builds the {@link SweepConfig} that {@code SweepRun} takes.
 */
final class StressControls extends JPanel {
    private final Map<PerturbKind, JCheckBox> kindBoxes = new EnumMap<>(PerturbKind.class);
    private final Map<PerturbKind, JComboBox<Perturbation>> paramBoxes = new EnumMap<>(PerturbKind.class);
    private final Map<PerturbKind, JLabel> ranges = new EnumMap<>(PerturbKind.class);
    private final Map<PerturbKind, JCheckBox> limitBoxes = new EnumMap<>(PerturbKind.class);
    private final Map<PerturbKind, JSpinner> limits = new EnumMap<>(PerturbKind.class);
    private final Map<PerturbKind, JLabel> units = new EnumMap<>(PerturbKind.class);
    private final Map<DetectorType, JCheckBox> detectorBoxes = new EnumMap<>(DetectorType.class);
    private final JSpinner levels = Ui.named(new JSpinner(new SpinnerNumberModel(5, 2, 32, 1)), "stress.levels",
            "Levels per condition, 2..32, evenly spaced over the parameter's range (command line: --levels)");
    private final JSpinner views = Ui.named(new JSpinner(new SpinnerNumberModel(3, 1, 1000, 1)), "stress.views",
            "Base frames: rendered views of the scene's target, or the first loaded frames (command line: --views)");
    private final JSpinner seed = Ui.named(new JSpinner(new SpinnerNumberModel(1, 0, Integer.MAX_VALUE, 1)), "stress.seed",
            "Seed of every random choice (base poses, noise): the same seed gives the same figures (command line: --seed)");
    private final JSpinner trackFrames = Ui.named(new JSpinner(new SpinnerNumberModel(0, 0, 100, 1)), "stress.trackFrames",
            "Also measure KLT survival in every cell over a slow motion of this many frames, 0..100; 0 is off, 4 to 8 is plenty "
                    + "(command line: --track-frames)");
    private final JComboBox<String> base = Ui.named(new JComboBox<>(new String[]{RENDERED, LOADED}), "stress.base",
            "Base frames: rendered views of the loaded design scene, with truth (command line: --target), or the loaded frames "
                    + "themselves, each its own reference (command line: --frames); without a design scene the loaded frames are used");
    private final JButton envelopeFile;
    static final String RENDERED = "rendered views", LOADED = "loaded frames";

    StressControls(Runnable chooseEnvelope) {
        super(new BorderLayout(12, 0));
        JPanel cond = new JPanel(new GridBagLayout());
        GridBagConstraints g = new GridBagConstraints();
        g.insets = new Insets(1, 2, 1, 2);
        g.anchor = GridBagConstraints.WEST;
        g.gridy = 0;
        cell(cond, g, 0, Ui.heading("Conditions"));
        cell(cond, g, 1, header("parameter", "Which parameter of the condition is swept (command line: --kinds kind.parameter)"));
        cell(cond, g, 2, header("swept range", "The parameter's default range, from mildest to harshest; the levels are spread evenly over it"));
        g.gridwidth = 2;
        g.insets = new Insets(1, 14, 1, 2);
        cell(cond, g, 3, header("envelope: harshest in your cell", "Operating envelope (command line: --envelope FILE): the ranking "
                + "counts only the levels from no degradation up to this value; unticked, the whole swept range counts"));
        g.gridwidth = 1;
        g.insets = new Insets(1, 2, 1, 2);
        for (PerturbKind k : PerturbKind.values()) {
            g.gridy++;
            JCheckBox box = Ui.named(new JCheckBox(k.cliName(), true), "stress.kind." + k.cliName(), "Sweep this kind of condition");
            JComboBox<Perturbation> param = Ui.named(new JComboBox<>(Perturbation.ofKind(k).toArray(Perturbation[]::new)),
                    "stress.param." + k.cliName(), "Which parameter of " + k.cliName() + " to sweep over its range");
            param.setRenderer(new javax.swing.DefaultListCellRenderer() {
                @Override public Component getListCellRendererComponent(javax.swing.JList<?> l, Object v, int i, boolean sel, boolean focus) {
                    return super.getListCellRendererComponent(l, v instanceof Perturbation p ? p.parameterName() : v, i, sel, focus);
                }
            });
            JCheckBox limit = Ui.named(new JCheckBox("up to"), "stress.limit." + k.cliName(),
                    "Rank over an operating envelope: only levels from no degradation up to this value count");
            JSpinner value = Ui.named(new JSpinner(), "stress.limitValue." + k.cliName(), "Harshest value of this parameter your cell will meet");
            JLabel range = Ui.named(new JLabel(), "stress.range." + k.cliName(), null), unit = new JLabel();
            kindBoxes.put(k, box);
            paramBoxes.put(k, param);
            limitBoxes.put(k, limit);
            limits.put(k, value);
            ranges.put(k, range);
            units.put(k, unit);
            param.addActionListener(e -> parameterChanged(k));
            limit.addActionListener(e -> value.setEnabled(limit.isSelected() && limit.isEnabled()));
            box.addActionListener(e -> {
                param.setEnabled(box.isSelected());
                limit.setEnabled(box.isSelected());
                value.setEnabled(box.isSelected() && limit.isSelected());
            });
            parameterChanged(k);
            cell(cond, g, 0, box);
            cell(cond, g, 1, param);
            cell(cond, g, 2, range);
            cell(cond, g, 3, limit);
            cell(cond, g, 4, Ui.row(value, unit));
        }
        add(cond, BorderLayout.WEST);

        JPanel dets = new JPanel(new GridBagLayout());
        GridBagConstraints d = new GridBagConstraints();
        d.anchor = GridBagConstraints.WEST;
        d.gridy = 0;
        d.gridwidth = 2;
        cell(dets, d, 0, Ui.heading("Detectors"));
        d.gridwidth = 1;
        for (DetectorType t : DetectorType.values()) {
            JCheckBox b = Ui.named(new JCheckBox(t.label(), true), "stress.detector." + t.cliName(),
                    "Let " + t.label() + " take part in the sweep (command line: --detectors " + t.cliName() + ")"
                            + (t.designMatched() ? "; built for one kind of designed feature" : ""));
            b.setBorder(BorderFactory.createEmptyBorder(0, 2, 0, 2));
            detectorBoxes.put(t, b);
            d.gridy++;
            cell(dets, d, 0, new JLabel(Ui.swatch(t)));
            cell(dets, d, 1, b);
        }
        JPanel detPanel = new JPanel(new BorderLayout());
        detPanel.add(dets, BorderLayout.NORTH);

        envelopeFile = Ui.button("stress.envelopeFile", "Envelope file...", "Read the harshest values from an envelope file "
                + "(the same JSON as the command line's --envelope) into the conditions above", chooseEnvelope);
        JPanel settings = new JPanel(new GridBagLayout());
        GridBagConstraints s = new GridBagConstraints();
        s.insets = new Insets(1, 2, 1, 2);
        s.anchor = GridBagConstraints.WEST;
        s.gridy = 0;
        cell(settings, s, 0, Ui.heading("Sweep"));
        for (Object[] row : new Object[][]{{"Base", base}, {"Levels", levels}, {"Views", views}, {"Seed", seed}, {"Track frames", trackFrames}}) {
            s.gridy++;
            JLabel l = new JLabel((String) row[0]);
            JComponent c = (JComponent) row[1];
            l.setToolTipText(c.getToolTipText());
            l.setLabelFor(c);
            if (c instanceof JSpinner sp) ((JSpinner.DefaultEditor) sp.getEditor()).getTextField().setColumns(5);
            cell(settings, s, 0, l);
            cell(settings, s, 1, c);
        }
        s.gridy++;
        s.gridwidth = 2;
        cell(settings, s, 0, envelopeFile);
        JPanel right = new JPanel(new BorderLayout(12, 0));
        right.add(detPanel, BorderLayout.WEST);
        JPanel settingsTop = new JPanel(new java.awt.FlowLayout(java.awt.FlowLayout.LEFT, 0, 0)); // packed to the left, at the top
        settingsTop.add(settings);
        right.add(settingsTop, BorderLayout.CENTER);
        add(right, BorderLayout.CENTER);
        setBorder(BorderFactory.createEmptyBorder(0, 4, 0, 4));
    }

    private static JLabel header(String text, String tip) {
        JLabel l = new JLabel(text);
        l.setToolTipText(tip);
        l.setFont(l.getFont().deriveFont(java.awt.Font.ITALIC));
        return l;
    }

    private static void cell(JPanel p, GridBagConstraints g, int x, JComponent c) {
        g.gridx = x;
        p.add(c, g);
    }

    /** A new parameter: its range, unit and an envelope spinner over its accepted values, starting at its harshest default. */
    private void parameterChanged(PerturbKind k) {
        Perturbation p = (Perturbation) paramBoxes.get(k).getSelectedItem();
        if (p == null) return;
        String unit = p.unit().isEmpty() ? "" : " " + p.unit();
        ranges.get(k).setText(num(p.from()) + " .. " + num(p.to()));
        ranges.get(k).setToolTipText("Swept from " + num(p.from()) + " to " + num(p.to()) + unit + " in evenly spaced levels");
        units.get(k).setText(p.unit().isEmpty() ? "(no unit)" : p.unit());
        double[] valid = p.validRange();
        double step = Math.abs(p.to() - p.from()) / 10;
        JSpinner sp = limits.get(k);
        sp.setModel(new SpinnerNumberModel(p.to(), valid[0], valid[1], step > 0 ? step : 1));
        JSpinner.NumberEditor ed = new JSpinner.NumberEditor(sp, "0.###");
        ed.getTextField().setColumns(5);
        sp.setEditor(ed);
        sp.setToolTipText("Harshest value of " + p.id() + " your cell will meet, " + num(valid[0]) + " .. " + num(valid[1]) + unit
                + "; the ranking counts the levels from " + num(p.neutral()) + " (no degradation) up to it");
        sp.setEnabled(kindBoxes.containsKey(k) && kindBoxes.get(k).isSelected() && limitBoxes.get(k).isSelected());
    }

    static String num(double v) {
        return new java.text.DecimalFormat("0.###", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)).format(v);
    }

    /** The sweep these controls describe, with the session's detector settings for the chosen detectors. */
    SweepConfig config(List<DetectorConfig> sessionDetectors) {
        SweepConfig c = new SweepConfig();
        for (DetectorConfig d : sessionDetectors) if (detectorBoxes.get(d.type()).isSelected()) c.detectors.add(d);
        c.parameters = new ArrayList<>(chosenParameters());
        c.levels = (Integer) levels.getValue();
        c.syntheticFrames = (Integer) views.getValue();
        c.seed = ((Number) seed.getValue()).longValue();
        c.trackFrames = (Integer) trackFrames.getValue();
        return c;
    }

    private List<Perturbation> chosenParameters() {
        List<Perturbation> out = new ArrayList<>();
        for (PerturbKind k : PerturbKind.values())
            if (kindBoxes.get(k).isSelected()) out.add((Perturbation) paramBoxes.get(k).getSelectedItem());
        return out;
    }

    /** The operating envelope: harshest value per chosen parameter whose "up to" is ticked, as {@code --envelope} gives it. */
    Map<Perturbation, Double> envelope() {
        Map<Perturbation, Double> out = new LinkedHashMap<>();
        for (PerturbKind k : PerturbKind.values())
            if (kindBoxes.get(k).isSelected() && limitBoxes.get(k).isSelected())
                out.put((Perturbation) paramBoxes.get(k).getSelectedItem(), ((Number) limits.get(k).getValue()).doubleValue());
        return out;
    }

    /**
     * Reads an envelope file (the command line's {@code --envelope}) into the conditions: each named parameter becomes
     * its kind's swept parameter, ticked, with its harshest value. Returns what was applied, in words.
     *
     * @throws SourceException when the file cannot be read
     * @throws IllegalArgumentException naming an unknown parameter or a value out of range
     */
    String loadEnvelope(Path file) throws SourceException {
        Map<Perturbation, Double> env = SweepSummary.envelope(EnvelopeFile.read(file));
        return applyEnvelope(env);
    }

    /** Sets the envelope of each named parameter; one parameter per kind (a later one of the same kind replaces an earlier). */
    String applyEnvelope(Map<Perturbation, Double> env) {
        List<String> parts = new ArrayList<>();
        for (var e : env.entrySet()) {
            PerturbKind k = e.getKey().kind();
            kindBoxes.get(k).setSelected(true);
            paramBoxes.get(k).setEnabled(true);
            paramBoxes.get(k).setSelectedItem(e.getKey());
            limitBoxes.get(k).setEnabled(true);
            limitBoxes.get(k).setSelected(true);
            limits.get(k).setValue(e.getValue());
            limits.get(k).setEnabled(true);
            parts.add(e.getKey().id() + " up to " + num(e.getValue()));
        }
        return String.join("; ", parts);
    }

    /**
     * With no design scene (frames from files or a camera) only the loaded frames can be the base. Footage registered
     * to its design has a scene too, but the user's own frames are what they came to degrade, so they are the default
     * there; rendered views of the design stay a choice.
     */
    void sceneAvailable(boolean yes, boolean registeredFootage) {
        if (!yes || registeredFootage) base.setSelectedItem(LOADED);
        else if (!sceneKnown || footage) base.setSelectedItem(RENDERED);
        sceneKnown = yes;
        footage = registeredFootage;
        base.setEnabled(yes && levels.isEnabled());
    }

    private boolean sceneKnown = true, footage;

    /** True to render base views of the design scene (when there is one), false to degrade the loaded frames. */
    boolean renderBase() { return RENDERED.equals(base.getSelectedItem()); }

    /** Locks the controls while a sweep runs. */
    void setRunning(boolean running) {
        for (PerturbKind k : PerturbKind.values()) {
            boolean on = !running && kindBoxes.get(k).isSelected();
            kindBoxes.get(k).setEnabled(!running);
            paramBoxes.get(k).setEnabled(on);
            limitBoxes.get(k).setEnabled(on);
            limits.get(k).setEnabled(on && limitBoxes.get(k).isSelected());
        }
        for (JCheckBox b : detectorBoxes.values()) b.setEnabled(!running);
        for (JComponent c : List.of(levels, views, seed, trackFrames)) c.setEnabled(!running);
        base.setEnabled(!running && sceneKnown);
        envelopeFile.setEnabled(!running);
    }
}
