package org.targetbench.app;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Feasibility;
import org.targetbench.camera.FeasibilityConfig;
import org.targetbench.camera.FeasibilityReport;
import org.targetbench.camera.Pose;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.TargetPreview;
import org.targetbench.export.TargetSheetWriter;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.SweepBase;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.SyntheticSource;
import org.targetbench.source.TargetFile;
import org.targetbench.target.DesignRecipe;
import org.targetbench.target.PageSize;
import org.targetbench.target.PrintConfig;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.TargetDesign;

import javax.swing.DefaultListModel;
import javax.swing.ImageIcon;
import javax.swing.JComboBox;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JList;
import javax.swing.JOptionPane;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.JTextField;
import javax.swing.SpinnerNumberModel;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.Image;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;

/**
 * Target designs: browse the candidates in target-designs/, make a new one, check whether the current camera resolves
 * it at a stand-off and tilt (the same check as the command line), print its sheet, and look at it in the live view.
 */
final class DesignsView extends JPanel {
    /** Folder of candidate designs, relative to where the workbench was started. */
    static final Path DESIGNS = Path.of("target-designs");

    private final AppContext ctx;
    private final DefaultListModel<TargetDesign> designs = new DefaultListModel<>();
    private final JList<TargetDesign> list = Ui.named(new JList<>(designs), "designs.list", "Candidate targets");
    private final JLabel preview = Ui.named(new JLabel(), "designs.preview", null);
    private final JLabel cameraLabel = Ui.named(new JLabel(), "designs.camera", null);
    private final JSpinner standoff = Ui.named(new JSpinner(new SpinnerNumberModel(250.0, 20.0, 5000.0, 10.0)), "designs.standoff", "Stand-off, mm");
    private final JSpinner tilt = Ui.named(new JSpinner(new SpinnerNumberModel(20.0, 0.0, 80.0, 5.0)), "designs.tilt", "Largest tilt of the target, degrees");
    private final JComboBox<String> page = Ui.named(new JComboBox<>(PageSize.NAMED.stream().map(PageSize::name).toArray(String[]::new)), "designs.page", "Sheet size");
    private final DefaultTableModel checks = new DefaultTableModel(new Object[]{"Check", "Result", "Measured", "Threshold", "Basis"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private CameraModel camera = DemoScenario.camera();

    DesignsView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("view.designs");
        list.setCellRenderer(new javax.swing.DefaultListCellRenderer() {
            @Override public java.awt.Component getListCellRendererComponent(JList<?> l, Object v, int i, boolean s, boolean f) {
                JLabel c = (JLabel) super.getListCellRendererComponent(l, v, i, s, f);
                if (v instanceof TargetDesign d) c.setText("<html><b>" + d.id() + "</b><br>" + d.name() + "</html>");
                return c;
            }
        });
        list.addListSelectionListener(e -> {
            if (!e.getValueIsAdjusting()) showSelected();
        });
        JScrollPane ls = new JScrollPane(list);
        ls.setPreferredSize(new Dimension(300, 400));
        JPanel left = new JPanel(new BorderLayout());
        left.add(ls, BorderLayout.CENTER);
        left.add(Ui.row(Ui.button("designs.new", "New design...", "Make a new design from a pattern and sizes", this::newDesign),
                Ui.button("designs.open", "Open...", "Add a target.json from anywhere", this::openDesign)), BorderLayout.SOUTH);
        add(left, BorderLayout.WEST);
        add(new JScrollPane(preview), BorderLayout.CENTER);
        JPanel bottom = new JPanel(new BorderLayout());
        bottom.add(Ui.row(cameraLabel, Ui.button("designs.camera.open", "Camera...", "Intrinsics: camera.json, OpenCV or ROS YAML", this::chooseCamera),
                new JLabel("Stand-off mm"), standoff, new JLabel("Tilt up to deg"), tilt,
                Ui.button("designs.check", "Check", "Will this camera resolve the target at this stand-off and tilt?", this::check),
                new JLabel("   Sheet"), page, Ui.button("designs.print", "Write sheet...", "PDF, SVG and preview at exact scale", this::print),
                Ui.button("designs.use", "Use in live view", "Render this target from the arm positions of the demo and look at it live", this::useLive)),
                BorderLayout.NORTH);
        JTable t = Ui.named(new JTable(checks), "designs.checks", null);
        DetailPane.columnTips(t, "What is checked", "PASS, WARN or FAIL against the threshold (coloured, and always in words)",
                "The measured or computed figure, with its unit", "The limit it is held against, with its unit",
                "Where the threshold comes from: a published source, derived, or common practice");
        JScrollPane ts = new JScrollPane(t);
        ts.setPreferredSize(new Dimension(800, 180));
        Ui.fitColumns(ts, 2); // Check and Result whole; Measured, Threshold and Basis in full in the detail pane beside
        bottom.add(ts, BorderLayout.CENTER);
        DetailPane detail = new DetailPane("designs.detail", "Select a check line to read it in full.", t);
        detail.setPreferredSize(new Dimension(440, 180)); // the longest check line, wrapped, in view whole
        bottom.add(detail, BorderLayout.EAST);
        add(bottom, BorderLayout.SOUTH);
        updateCameraLabel();
        loadFolder();
        ctx.session().addListener(c -> { // a camera chosen for the session (e.g. "Use this camera" after a calibration) is checked against here too
            if (c != Session.Change.CAMERA || ctx.session().camera() == null) return;
            camera = ctx.session().camera();
            updateCameraLabel();
            check();
        });
    }

    /** The designs listed, in order (the shoot-out compares among them). */
    List<TargetDesign> designs() {
        List<TargetDesign> out = new ArrayList<>();
        for (int i = 0; i < designs.size(); i++) out.add(designs.get(i));
        return out;
    }

    private void loadFolder() {
        List<TargetDesign> found = new ArrayList<>();
        if (Files.isDirectory(DESIGNS)) {
            try (Stream<Path> s = Files.list(DESIGNS)) {
                for (Path d : s.sorted().toList()) {
                    Path f = d.resolve("target.json");
                    if (Files.isRegularFile(f)) {
                        try {
                            found.add(TargetFile.read(f));
                        } catch (Exception e) {
                            ctx.status().accept("Skipped " + f + ": " + e.getMessage());
                        }
                    }
                }
            } catch (Exception e) {
                ctx.status().accept("Cannot list " + DESIGNS + ": " + e.getMessage());
            }
        }
        if (found.isEmpty()) found.add(DemoScenario.target());
        found.forEach(designs::addElement);
        list.setSelectedIndex(0);
    }

    private TargetDesign selected() { return list.getSelectedValue(); }

    private Optional<PrintLayout> layout(TargetDesign d) {
        PageSize p = PageSize.parse((String) page.getSelectedItem());
        return PrintLayout.of(d, p, new PrintConfig());
    }

    private void showSelected() {
        TargetDesign d = selected();
        if (d == null) return;
        Optional<PrintLayout> l = Optional.empty();
        for (PageSize p : PageSize.NAMED) {
            l = PrintLayout.of(d, p, new PrintConfig());
            if (l.isPresent()) break;
        }
        if (l.isPresent()) {
            BufferedImage img = TargetPreview.draw(l.get(), 2);
            preview.setIcon(new ImageIcon(img.getScaledInstance(img.getWidth(), img.getHeight(), Image.SCALE_SMOOTH)));
        }
        standoff.setValue(10.0 * Math.round(100 * SweepBase.defaultStandoff(d, camera)));
        check();
    }

    void check() {
        TargetDesign d = selected();
        if (d == null) return;
        FeasibilityReport r = Feasibility.check(d, camera, (Double) standoff.getValue() / 1000.0, (Double) tilt.getValue(), new FeasibilityConfig());
        checks.setRowCount(0);
        for (var c : r.checks()) checks.addRow(new Object[]{c.name(), c.status(), c.measured(), c.threshold(), c.basis()});
        ctx.status().accept("Check of " + d.id() + ": " + r.overall() + " (" + r.count(FeasibilityReport.Status.WARN) + " warnings, "
                + r.count(FeasibilityReport.Status.FAIL) + " failures)");
    }

    private void newDesign() {
        JComboBox<String> pattern = new JComboBox<>(DesignRecipe.PATTERNS);
        JTextField rows = new JTextField(), cols = new JTextField(), size = new JTextField();
        Object[] form = {"Pattern", pattern, "Rows (blank: default)", rows, "Columns", cols,
                "Square side, pitch or arm, mm (blank: default)", size};
        if (JOptionPane.showConfirmDialog(ctx.window(), form, "New design", JOptionPane.OK_CANCEL_OPTION) != JOptionPane.OK_OPTION) return;
        try {
            DesignRecipe r = new DesignRecipe();
            r.pattern = (String) pattern.getSelectedItem();
            r.rows = blankOrInt(rows.getText());
            r.cols = blankOrInt(cols.getText());
            Double s = blankOrDouble(size.getText());
            switch (r.pattern) {
                case "checkerboard", "squares" -> r.squareMm = s;
                case "dots" -> r.pitchMm = s;
                default -> r.armMm = s;
            }
            if (r.pattern.equals("xcorners")) { r.count = r.rows; r.rows = null; r.cols = null; }
            addDesign(r.build());
        } catch (IllegalArgumentException e) {
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Cannot make that design", JOptionPane.WARNING_MESSAGE);
        }
    }

    private static Integer blankOrInt(String s) { return s.isBlank() ? null : Integer.valueOf(s.trim()); }

    private static Double blankOrDouble(String s) { return s.isBlank() ? null : Double.valueOf(s.trim()); }

    /**
     * Adds a design to the list, or selects the one already listed when the same design (equal id, sizes and features)
     * is opened again; a different design under a listed id is added.
     */
    TargetDesign addDesign(TargetDesign d) {
        for (int i = 0; i < designs.size(); i++)
            if (designs.get(i).equals(d)) {
                list.setSelectedIndex(i);
                list.ensureIndexIsVisible(i);
                ctx.status().accept("Design " + d.id() + " is already listed; selected it");
                return designs.get(i);
            }
        designs.addElement(d);
        list.setSelectedValue(d, true);
        return d;
    }

    int designCount() { return designs.size(); }

    private void openDesign() {
        JFileChooser fc = new JFileChooser(DESIGNS.toFile());
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        try {
            addDesign(TargetFile.read(fc.getSelectedFile().toPath()));
        } catch (Exception e) {
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Cannot read the design", JOptionPane.WARNING_MESSAGE);
        }
    }

    private void chooseCamera() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastCamera", DESIGNS.toString()));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        try {
            camera = CameraFiles.read(fc.getSelectedFile().toPath());
            ctx.prefs().put("lastCamera", fc.getSelectedFile().toString());
            updateCameraLabel();
            check();
        } catch (Exception e) {
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Cannot read the camera", JOptionPane.WARNING_MESSAGE);
        }
    }

    private void updateCameraLabel() {
        cameraLabel.setText(String.format(java.util.Locale.ROOT, "Camera %dx%d, f %.0f px", camera.width(), camera.height(), camera.fx()));
    }

    private void print() {
        TargetDesign d = selected();
        if (d == null) return;
        Optional<PrintLayout> l = layout(d);
        if (l.isEmpty()) {
            JOptionPane.showMessageDialog(ctx.window(), PrintLayout.doesNotFit(d, PageSize.parse((String) page.getSelectedItem()), new PrintConfig()),
                    "Does not fit", JOptionPane.WARNING_MESSAGE);
            return;
        }
        java.util.Optional<java.nio.file.Path> chosen = Folders.choose(ctx, "lastSheetFolder", "Folder for the sheet of " + d.id(), Folders.Use.SAVE);
        if (chosen.isEmpty()) return;
        Path dir = chosen.get();
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            TargetSheetWriter.write(l.get(), out, "");
            out.commit();
            ctx.status().accept("Sheet written to " + dir + ": print the PDF at 100 %, no 'fit to page', and measure the 100 mm bar");
        } catch (Exception e) {
            ctx.status().accept("Could not write the sheet: " + e.getMessage());
        }
    }

    private void useLive() {
        TargetDesign d = selected();
        if (d == null) return;
        double dist = (Double) standoff.getValue() / 1000.0;
        List<Pose> poses = new ArrayList<>();
        for (double[] v : new double[][]{{0, 0, 0}, {10, 0, 0}, {0, 20, 0}, {-15, 15, 0}, {30, 0, 0}, {0, 0, 30}, {0, 0, 90}})
            poses.add(Pose.facing(d.widthMm(), d.heightMm(), dist, v[0], v[1], v[2], 0, 0));
        Session.Scene scene = new Session.Scene(d, camera, DemoScenario.lighting(), dist, poses);
        LiveLoad.load(ctx, d.id(), () -> SourceLoader.read(d.id() + " rendered at " + Math.round(dist * 1000) + " mm",
                new SyntheticSource(d, camera, poses, DemoScenario.lighting()), Optional.of(scene)));
    }
}
