package org.targetbench.app;

import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;

import javax.swing.BorderFactory;
import javax.swing.Box;
import javax.swing.BoxLayout;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComboBox;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSlider;
import javax.swing.JTable;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.nio.file.Path;

/**
 * The live view: choose a source, play and step through it, see every chosen detector's points on the frame, and
 * preview a degradation (lighting, blur, noise, JPEG, viewpoint) while the scores update.
 */
final class LiveView extends JPanel implements Session.Listener {
    /** Playback rate of stills (the demo scene, frame folders), frames per second. */
    static final int PLAY_FPS = 8;
    /** Playback rate of a video, frames per second (the usual camera rate; the file's own rate is not read yet). */
    static final int VIDEO_FPS = 30;
    /** Steps of the degradation slider over a parameter's default range. */
    static final int SLIDER_STEPS = 100;

    private final AppContext ctx;
    private final Session session;
    private final FrameCanvas canvas = new FrameCanvas("live.canvas");
    private final JSlider frameSlider = Ui.named(new JSlider(0, 0, 0), "play.slider", "Frame of the source");
    private final JLabel frameLabel = Ui.named(new JLabel("no source"), "play.label", null);
    private final JButton playButton;
    private final JButton reopen;
    private final JCheckBox loop = Ui.named(new JCheckBox("Loop", true), "play.loop", "Start again at the end");
    /** The running playback, or null. */
    private PlaybackRun playing;
    private final JLabel droppedLabel = Ui.named(new JLabel(" "), "play.dropped", "Frames of the clip that were not shown because preparing them "
            + "(degradation and the drawn detectors) could not keep up with the playback rate");
    private final JComboBox<Perturbation> degradeKind = Ui.named(new JComboBox<>(Perturbation.values()), "live.degrade.kind",
            "Condition to preview on the frame");
    private final JSlider degradeLevel = Ui.named(new JSlider(0, SLIDER_STEPS, 0), "live.degrade.level",
            "Strength of the condition, from none (left) to the harshest of its default range (right)");
    private final JLabel degradeLabel = new JLabel("off");
    private final DefaultTableModel scores = new DefaultTableModel(new Object[]{Ui.head("Detector", ""), Ui.head("Points", "n"),
            Ui.head("Repeatability", "0..1"), Ui.head("Coverage", "%"), Ui.head("Loc. RMS", "px")}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private boolean updating;

    LiveView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.session = ctx.session();
        setName("view.live");
        playButton = Ui.button("play.toggle", "Play", "Play or pause the source (Space)", this::togglePlay);

        String last = ctx.prefs().get("lastFolder", null);
        reopen = Ui.button("src.reopen", last == null ? "Reopen" : "Reopen " + Path.of(last).getFileName(),
                "Load the frame folder used last time: " + last, () -> {
                    String f = ctx.prefs().get("lastFolder", null);
                    if (f != null) loadFolder(Path.of(f));
                });
        reopen.setVisible(last != null && java.nio.file.Files.isDirectory(Path.of(last)));
        JPanel top = new JPanel(new BorderLayout());
        top.add(Ui.row(reopen, 
                Ui.button("src.demo", "Demo scene", "Load the built-in scene: a checkerboard on the fixture plate seen from twelve arm positions", this::loadDemo),
                Ui.button("src.folder", "Open frame folder...", "Load a folder of PNG/JPEG frames (with truth.json if present)", this::chooseFolder),
                Ui.button("src.video", "Open video...", "Load a video: MP4, MOV, MKV, WebM, AVI or MJPEG (with NAME.truth.json if present)", this::chooseVideo),
                Ui.button("src.camera", "Camera...", "Show a connected camera live", this::camera),
                Ui.button("src.register", "Register to design...", "Give the loaded frames truth from the printed design (target.json) and, optionally, the camera's intrinsics", this::chooseRegistration)),
                BorderLayout.WEST);
        add(top, BorderLayout.NORTH);

        add(canvas, BorderLayout.CENTER);
        JPanel playback = new JPanel(new BorderLayout());
        playback.add(Ui.row(Ui.button("play.back", "<", "Previous frame (Left)", () -> session.setFrameIndex(session.frameIndex() - 1)),
                playButton, Ui.button("play.step", ">", "Next frame (Right)", () -> session.setFrameIndex(session.frameIndex() + 1)), loop), BorderLayout.WEST);
        playback.add(frameSlider, BorderLayout.CENTER);
        JPanel labels = new JPanel(new java.awt.GridLayout(0, 1));
        labels.add(frameLabel);
        labels.add(droppedLabel);
        playback.add(labels, BorderLayout.EAST);
        frameSlider.addChangeListener(e -> {
            if (!updating) session.setFrameIndex(frameSlider.getValue());
        });
        add(playback, BorderLayout.SOUTH);
        add(sidePanel(), BorderLayout.EAST);
        session.addListener(this);
    }

    private JPanel sidePanel() {
        JPanel side = new JPanel();
        side.setLayout(new BoxLayout(side, BoxLayout.Y_AXIS));
        side.setBorder(BorderFactory.createEmptyBorder(0, 6, 0, 6));
        side.add(Ui.heading("Detectors"));
        for (DetectorType t : DetectorType.values()) {
            JCheckBox box = Ui.named(new JCheckBox(t.label(), session.shown().contains(t)), "det.show." + t.cliName(),
                    "Draw " + t.label() + " points on the frame (every detector is scored either way)");
            box.setIcon(null);
            box.addActionListener(e -> session.setShown(t, box.isSelected()));
            side.add(Ui.row(new JLabel(Ui.swatch(t)), box));
        }
        side.add(Ui.row(Ui.button("det.settings", "Settings...", "Most points, threshold and suppression radius of each detector", () -> DetectorSettings.edit(ctx))));
        side.add(Ui.heading("Preview a condition"));
        degradeKind.addActionListener(e -> applyDegrade());
        degradeLevel.addChangeListener(e -> applyDegrade());
        side.add(Ui.row(degradeKind));
        side.add(Ui.row(degradeLevel));
        side.add(Ui.row(degradeLabel, Ui.button("live.degrade.reset", "Reset", "Back to the frame as captured", () -> degradeLevel.setValue(0))));
        side.add(Ui.heading("This frame"));
        JTable table = Ui.named(new JTable(scores), "live.scores", null);
        DetailPane.columnTips(table, "Detector, with its default settings or those edited under Settings.",
                "Points, a count: " + Ui.TIP_COUNT, "Repeatability, 0..1 (no unit), against the first frame: " + Ui.TIP_REPEATABILITY
                        + " The 1.5 px radius is the command line's --epsilon default.",
                "Coverage, percent: " + Ui.TIP_COVERAGE, "Localisation RMS, px: " + Ui.TIP_LOCALISATION + " The 3 px radius is the scoring default.");
        JScrollPane sp = new JScrollPane(table);
        sp.setPreferredSize(new Dimension(380, 150));
        Ui.fitColumns(sp, LiveView.sampleRows(5));
        side.add(sp);
        side.add(Box.createVerticalGlue());
        return side;
    }

    /** The widest rows the score tables will hold (every detector's label, figures at their widest), {@code n} columns. */
    static Object[][] sampleRows(int n) {
        Object[] widest = {"", 99999, "0.000", "100%", "00.000", "100%", "000.0"};
        Object[][] rows = new Object[DetectorType.values().length][];
        for (int i = 0; i < rows.length; i++) {
            rows[i] = java.util.Arrays.copyOf(widest, n);
            rows[i][0] = DetectorType.values()[i].label();
        }
        return rows;
    }

    private void applyDegrade() {
        Perturbation p = (Perturbation) degradeKind.getSelectedItem();
        if (p == null) return;
        double t = degradeLevel.getValue() / (double) SLIDER_STEPS;
        double v = p.neutral() + t * (p.to() - p.neutral());
        if (p == Perturbation.JPEG_QUALITY) v = Math.rint(v);
        degradeLabel.setText(t == 0 ? "off" : p.id() + " = " + Ui.fmt(v, 2) + " " + p.unit());
        session.setDegrade(p, v);
    }

    void togglePlay() {
        if (!session.hasFrames()) return;
        if (playing != null) stopPlaying();
        else startPlaying();
    }

    /** True while playback runs. */
    boolean isPlaying() { return playing != null; }

    /** Frames shown and dropped by the running playback, or {0, 0}. */
    long[] playCounts() { return playing == null ? new long[2] : new long[]{playing.shown(), playing.dropped()}; }

    /** Playback rate of the loaded source, frames per second. */
    int playFps() {
        Session.Origin o = session.origin();
        return o != null && o.kind() == org.targetbench.formats.SessionFile.SourceKind.VIDEO ? VIDEO_FPS : PLAY_FPS;
    }

    private void startPlaying() {
        int fps = playFps();
        PlaybackRun[] run = new PlaybackRun[1];
        run[0] = new PlaybackRun(session, fps, loop.isSelected(), () -> showDropped(run[0], fps), () -> {
            if (playing == run[0]) {
                playing = null;
                playButton.setText("Play");
            }
        }, why -> ctx.status().accept("Playback stopped: " + why));
        playing = run[0];
        droppedLabel.setText(" playing at " + fps + " fps");
        playButton.setText("Pause");
        run[0].start();
    }

    private void stopPlaying() {
        PlaybackRun p = playing;
        playing = null;
        playButton.setText("Play");
        if (p != null) p.stop();
    }

    private void showDropped(PlaybackRun p, int fps) {
        long d = p.dropped();
        droppedLabel.setText(" " + fps + " fps: dropped " + d + (d == 1 ? " frame" : " frames") + " of " + (d + p.shown())
                + (d > 0 ? " (preparing frames is slower than playback; fewer drawn detectors help)" : ""));
    }

    void loadDemo() {
        session.expectOrigin(new Session.Origin(org.targetbench.formats.SessionFile.SourceKind.DEMO, java.util.Optional.empty()));
        LiveLoad.load(ctx, "demo scene", SourceLoader::demo, false, takeFailureHook());
    }

    private void chooseFolder() {
        java.util.Optional<java.nio.file.Path> chosen = Folders.choose(ctx, "lastFolder", "Folder of frames", Folders.Use.OPEN);
        if (chosen.isEmpty()) return;
        Path dir = chosen.get();
        loadFolder(dir);
        reopen.setText("Reopen " + dir.getFileName());
        reopen.setVisible(true);
    }

    private void chooseVideo() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastVideoFolder", System.getProperty("user.dir")));
        fc.setFileFilter(new javax.swing.filechooser.FileNameExtensionFilter("Videos (MP4, MOV, MKV, WebM, AVI, MJPEG)", "mp4", "mov", "m4v", "mkv", "webm", "avi", "mjpeg", "mjpg"));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        Path f = fc.getSelectedFile().toPath();
        ctx.prefs().put("lastVideoFolder", String.valueOf(f.getParent()));
        loadVideo(f);
    }

    void loadVideo(Path f) {
        session.expectOrigin(new Session.Origin(org.targetbench.formats.SessionFile.SourceKind.VIDEO, java.util.Optional.of(f)));
        load(f.getFileName().toString(), () -> SourceLoader.video(f));
    }

    private java.util.function.Consumer<org.targetbench.source.Webcams.Discovery> camerasFound;

    /** Where "Camera..." hands the cameras it found (the camera view, which shows them live). */
    void onCamerasFound(java.util.function.Consumer<org.targetbench.source.Webcams.Discovery> c) { camerasFound = c; }

    /** Looks for cameras off the event-dispatch thread; says plainly when there is none. */
    void camera() {
        ctx.status().accept("Looking for cameras...");
        new javax.swing.SwingWorker<org.targetbench.source.Webcams.Discovery, Void>() {
            @Override protected org.targetbench.source.Webcams.Discovery doInBackground() {
                return org.targetbench.source.Webcams.discover(org.targetbench.source.Webcams.DISCOVERY_TIMEOUT);
            }
            @Override protected void done() {
                try {
                    var d = get();
                    if (d.cameras().isEmpty()) {
                        ctx.status().accept("No camera found: " + d.problem());
                        javax.swing.JOptionPane.showMessageDialog(ctx.window(), "No camera found: " + d.problem()
                                + ".\nEverything else works on the demo scene, frame folders and videos.", "Camera", javax.swing.JOptionPane.INFORMATION_MESSAGE);
                        return;
                    }
                    if (camerasFound != null) camerasFound.accept(d);
                } catch (Exception e) {
                    ctx.status().accept("Camera: " + e.getMessage());
                }
            }
        }.execute();
    }

    /** Frames of the registered source that did not register, with the reason (shown in the frame label). */
    private java.util.Map<String, String> notRegistered = java.util.Map.of();

    void chooseRegistration() {
        if (!session.hasFrames()) {
            ctx.status().accept("Load a frame folder or a video first, then register it to its design");
            return;
        }
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastTargetFolder", System.getProperty("user.dir")));
        fc.setDialogTitle("The printed design (target.json)");
        fc.setFileFilter(new javax.swing.filechooser.FileNameExtensionFilter("Target designs (target.json)", "json"));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        Path target = fc.getSelectedFile().toPath();
        ctx.prefs().put("lastTargetFolder", String.valueOf(target.getParent()));
        JFileChooser cc = new JFileChooser(String.valueOf(target.getParent()));
        cc.setDialogTitle("Camera intrinsics (camera.json, OpenCV or ROS YAML); Cancel for none");
        Path camera = cc.showOpenDialog(ctx.window()) == JFileChooser.APPROVE_OPTION ? cc.getSelectedFile().toPath() : null;
        registerTo(target, camera);
    }

    /** Registers the loaded frames to a design (and camera); the scores, track and servo views then use that truth. */
    void registerTo(Path target, Path camera) {
        String name = session.sourceName();
        java.util.List<org.targetbench.source.SourceFrame> frames = java.util.List.copyOf(session.frames());
        notRegistered = java.util.Map.of();
        // the same frames with truth from the design: a session keeps the source and reopens it registered again
        session.expectRegistration(new org.targetbench.formats.SessionFile.Registration(target, java.util.Optional.ofNullable(camera)));
        LiveLoad.load(ctx, "registration to " + target.getFileName(), () -> {
            var design = org.targetbench.source.TargetFile.read(target);
            var cam = camera == null ? java.util.Optional.<org.targetbench.camera.CameraModel>empty()
                    : java.util.Optional.of(org.targetbench.source.CameraFiles.read(camera));
            RegisteredLoad.Result r = RegisteredLoad.register(name, frames, design, cam);
            javax.swing.SwingUtilities.invokeLater(() -> notRegistered = r.notRegistered());
            return r.loaded();
        }, true, takeFailureHook());
    }

    private Runnable failureHook;

    /** Runs {@code r} if the next load (only that one) fails: an opened session then stops waiting for its source. */
    void onNextLoadFailure(Runnable r) { failureHook = r; }

    private Runnable takeFailureHook() {
        Runnable r = failureHook == null ? () -> { } : failureHook;
        failureHook = null;
        return r;
    }

    void loadFolder(Path dir) {
        session.expectOrigin(new Session.Origin(org.targetbench.formats.SessionFile.SourceKind.FOLDER, java.util.Optional.of(dir)));
        load(dir.toString(), () -> SourceLoader.folder(dir));
    }

    void load(String what, LiveLoad.Job job) {
        notRegistered = java.util.Map.of(); // a new source: only a registration run fills this in again
        LiveLoad.load(ctx, what, job, true, takeFailureHook());
    }

    @Override
    public void changed(Session.Change c) {
        switch (c) {
            case SOURCE -> {
                stopPlaying();
                droppedLabel.setText(" ");
                updating = true;
                frameSlider.setMaximum(session.frames().size() - 1);
                updating = false;
            }
            case FRAME -> {
                updating = true;
                frameSlider.setValue(session.frameIndex());
                updating = false;
                var f = session.frame();
                String nr = notRegistered.get(f.name());
                frameLabel.setText(" " + (session.frameIndex() + 1) + "/" + session.frames().size() + "  " + f.name()
                        + (session.frameIndex() == session.referenceIndex() ? " (reference)" : "")
                        + (nr != null ? "  NOT REGISTERED: " + nr + " (not scored)" : ""));
                // the picture always shows the frame the counter names: the raw frame until its detections arrive
                if (session.detections() == null || session.detections().frameIndex() != session.frameIndex()) {
                    canvas.setFrame(f.image());
                    canvas.setOverlay(java.util.Map.of(), java.util.List.of());
                }
            }
            case SHOWN, DETECTORS, DEGRADE -> {
                if (playing != null) { // playback prepares frames with the settings it started with: start again with the new ones
                    stopPlaying();
                    startPlaying();
                }
                if (c == Session.Change.SHOWN) drawOverlay();
            }
            case DETECTIONS -> {
                var d = session.detections();
                if (d.frameIndex() != session.frameIndex()) return;
                canvas.setFrame(d.shown());
                drawOverlay();
                scores.setRowCount(0);
                for (var e : d.figures().entrySet()) {
                    var f = e.getValue();
                    scores.addRow(new Object[]{e.getKey().label(), f.count(), Ui.fmt(f.repeatability(), 3), Ui.pct(f.coverage()), Ui.fmt(f.localisationPx(), 3)});
                }
            }
            default -> { }
        }
    }

    private void drawOverlay() {
        var d = session.detections();
        if (d == null) return;
        java.util.Map<DetectorType, java.util.List<org.targetbench.detect.Detection>> pts = new java.util.LinkedHashMap<>();
        for (var e : d.points().entrySet()) if (session.shown().contains(e.getKey())) pts.put(e.getKey(), e.getValue());
        canvas.setOverlay(pts, session.frames().get(d.frameIndex()).truth().features());
    }

    FrameCanvas canvas() { return canvas; }
}
