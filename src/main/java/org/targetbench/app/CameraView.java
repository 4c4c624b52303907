package org.targetbench.app;

import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;
import org.targetbench.pipeline.LiveScoring;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.Webcams;

import javax.swing.BorderFactory;
import javax.swing.Box;
import javax.swing.BoxLayout;
import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JTable;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.io.IOException;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * The camera, live. One thread takes every image the camera delivers (and writes it to the recording, when one is
 * running); another scores the newest image with every detector ({@link LiveScoring}) and shows it, so when the
 * detectors are slower than the camera the images in between are dropped, counted and never queued. The achieved
 * rates are shown: images scored and shown per second against images the camera delivered per second.
 *
 * <p>Freeze keeps the shown frame and its points (zoom and pan still work) while the camera and a recording go on.
 * A camera that stops delivering (unplugged, driver failure) ends the stream with a plain message, and a recording
 * is finished and kept. Truth: the {@link LiveScoring.Registration} hook ({@link #setRegistration}). With a design
 * (and optionally a camera file) chosen ("Target..."), every scored frame is registered to the design on the scoring
 * thread ({@link org.targetbench.pipeline.LiveRegistration}, a fresh registrar per stream), and the table shows
 * repeatability, localisation and found share against the target; a frame that does not register is shown as such
 * and not scored. Without a target, repeatability is measured against the previous scored frame.
 */
final class CameraView extends JPanel {
    /** Opens camera {@code index} at {@code size} (WxH, or null for its default); webcams here, a simulated camera in tests. */
    interface Opener {
        FrameSource open(int index, String size) throws SourceException;
    }

    static final Opener WEBCAMS = (index, size) -> Webcams.open(index, size, Webcams.DISCOVERY_TIMEOUT);
    /** Longest size offered by default: the largest at most this wide and high. */
    static final int DEFAULT_MAX_W = 640, DEFAULT_MAX_H = 480;

    private final AppContext ctx;
    private final FrameCanvas canvas = new FrameCanvas("camera.canvas");
    private final JComboBox<String> device = Ui.named(new JComboBox<>(), "camera.device", "Camera to show");
    private final JComboBox<String> size = Ui.named(new JComboBox<>(), "camera.size", "Image size, among those the camera offers");
    private final JButton startStop, freeze, record;
    private final JLabel rates = Ui.named(new JLabel(" "), "camera.rates", null);
    private final JLabel message = Ui.named(new JLabel("Press \"Find cameras\"."), "camera.message", null);
    private final JLabel against = Ui.named(new JLabel(" "), "camera.against", null);
    /** What the live frames are registered to, and how the shown frame fared. */
    private final JLabel registered = Ui.named(new JLabel("Target: none (choose one for scores against it)"), "camera.registration", null);
    private final DefaultTableModel scores = new DefaultTableModel(new Object[]{Ui.head("Detector", ""), Ui.head("Points", "n"),
            Ui.head("Repeatability", "0..1"), Ui.head("Coverage", "%"), Ui.head("Loc. RMS", "px"), Ui.head("Found", "%"), Ui.head("Time", "ms")}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private Webcams.Discovery discovery = new Webcams.Discovery(List.of(), "not looked for yet");
    private Opener opener = WEBCAMS;
    /** Makes the registration of one stream (a registrar follows its previous frame, so one per stream). */
    private volatile java.util.function.Supplier<LiveScoring.Registration> registrations = () -> LiveScoring.NO_REGISTRATION;
    /** The chosen design's name and camera file, for the label; null without a target. */
    private volatile String targetLabel;
    /** The running stream, null when stopped; {@code last} is the latest one, running or not. */
    private CameraStream stream, last;
    private final CameraStream.Listener listener = new CameraStream.Listener() {
        @Override public void scored(CameraStream from, LiveScoring.Scored s) { show(from, s); }
        @Override public void recordingFailed(String sentence) {
            say(sentence);
            updateButtons();
        }
        @Override public void ended(CameraStream from, String why, String kept) { CameraView.this.ended(from, why, kept); }
    };

    CameraView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("view.camera");
        startStop = Ui.button("camera.start", "Start", "Show the chosen camera live, or stop it", this::toggle);
        freeze = Ui.button("camera.freeze", "Freeze", "Hold the shown frame and its points; the camera and a recording go on", this::toggleFreeze);
        record = Ui.button("camera.record", "Record...", "Record every image the camera delivers to an MP4, AVI or MJPEG file while you watch", this::toggleRecord);
        JButton target = Ui.button("camera.target", "Target...", "Register every live frame to the printed design (target.json) and, optionally, "
                + "the camera's intrinsics, for scores against the target", this::chooseTarget);
        device.addActionListener(e -> fillSizes());
        add(Ui.row(Ui.button("camera.find", "Find cameras", "Look for connected cameras", this::find), device, size, startStop, freeze, record, target),
                BorderLayout.NORTH);
        add(canvas, BorderLayout.CENTER);
        JPanel bottom = new JPanel(new BorderLayout());
        bottom.add(Ui.row(message), BorderLayout.NORTH);
        bottom.add(Ui.row(rates), BorderLayout.SOUTH);
        add(bottom, BorderLayout.SOUTH);
        JPanel side = new JPanel();
        side.setLayout(new BoxLayout(side, BoxLayout.Y_AXIS));
        side.setBorder(BorderFactory.createEmptyBorder(0, 6, 0, 6));
        side.add(Ui.heading("This frame"));
        JTable table = Ui.named(new JTable(scores), "camera.scores", null);
        DetailPane.columnTips(table, "Detector, with its default settings or those edited in Live: Settings.",
                "Points, a count: " + Ui.TIP_COUNT,
                "Repeatability, 0..1 (no unit); what it is measured against is on the line below the table. " + Ui.TIP_REPEATABILITY
                        + " The 1.5 px radius is the command line's --epsilon default.",
                "Coverage, percent: " + Ui.TIP_COVERAGE,
                "Localisation RMS, px, against registered truth only: " + Ui.TIP_LOCALISATION,
                "Found, percent: share of the registered target's features with a point within 3 px; against registered truth only.",
                "Time, ms: the detector's time on this frame, on this machine as loaded now (a figure, not a benchmark).");
        JScrollPane sp = new JScrollPane(table);
        sp.setPreferredSize(new Dimension(420, 150));
        Ui.fitColumns(sp, LiveView.sampleRows(7));
        side.add(sp);
        side.add(Ui.row(against));
        side.add(Ui.row(registered));
        side.add(Box.createVerticalGlue());
        add(side, BorderLayout.EAST);
        updateButtons();
    }

    /** Cameras found by a discovery, opened with {@code opener}; says plainly when there is none. */
    void offer(Webcams.Discovery d, Opener opener) {
        this.discovery = d;
        this.opener = opener;
        device.removeAllItems();
        for (Webcams.CameraInfo c : d.cameras()) device.addItem(c.index() + ": " + c.name());
        fillSizes();
        if (d.cameras().isEmpty()) say("No camera found: " + d.problem() + ". Everything else works on the demo scene, frame folders and videos.");
        else say(d.cameras().size() + (d.cameras().size() == 1 ? " camera" : " cameras") + " found; press Start.");
        updateButtons();
    }

    /** The hook for live truth: frame-to-design registration, when a target is chosen. Applies from the next stream. */
    void setRegistration(LiveScoring.Registration r) {
        registrations = () -> r;
        targetLabel = r.active() ? "a target" : null;
    }

    private void chooseTarget() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastTargetFolder", System.getProperty("user.dir")));
        fc.setDialogTitle("The printed design (target.json); Cancel for none");
        fc.setFileFilter(new javax.swing.filechooser.FileNameExtensionFilter("Target designs (target.json)", "json"));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) {
            clearTarget();
            return;
        }
        Path t = fc.getSelectedFile().toPath();
        ctx.prefs().put("lastTargetFolder", String.valueOf(t.getParent()));
        JFileChooser cc = new JFileChooser(String.valueOf(t.getParent()));
        cc.setDialogTitle("Camera intrinsics (camera.json, OpenCV or ROS YAML); Cancel for none");
        registerTo(t, cc.showOpenDialog(ctx.window()) == JFileChooser.APPROVE_OPTION ? cc.getSelectedFile().toPath() : null);
    }

    /** No target: repeatability against the previous frame again (from the next stream). */
    void clearTarget() {
        setRegistration(LiveScoring.NO_REGISTRATION);
        registered.setText("Target: none (choose one for scores against it)");
    }

    /**
     * Registers live frames to the design in {@code target} with the intrinsics in {@code camera} (null: none) from the
     * next stream on (a running stream is restarted). A file that cannot be read is said plainly and changes nothing.
     */
    void registerTo(Path target, Path camera) {
        org.targetbench.target.TargetDesign design;
        Optional<org.targetbench.camera.CameraModel> cam;
        try {
            design = org.targetbench.source.TargetFile.read(target);
            cam = camera == null ? Optional.empty() : Optional.of(org.targetbench.source.CameraFiles.read(camera));
        } catch (SourceException e) {
            say("Target not set: " + e.getMessage());
            return;
        }
        org.targetbench.register.RegisterConfig rc = new org.targetbench.register.RegisterConfig();
        registrations = () -> new org.targetbench.pipeline.LiveRegistration(design, cam, rc);
        targetLabel = design.id() + (camera == null ? " (no camera file: homographies, exact only without lens distortion)" : " with " + camera.getFileName());
        registered.setText("Target: " + targetLabel);
        say("Live frames are registered to " + targetLabel + (stream != null ? " from the next start." : "."));
    }

    /** Frames registered to the target, and frames tried, in the current or last stream. */
    int[] registeredOfTried() { return last == null ? new int[]{0, 0} : new int[]{last.registeredFrames.get(), last.triedFrames.get()}; }

    private void find() {
        say("Looking for cameras...");
        new SwingWorker<Webcams.Discovery, Void>() {
            @Override protected Webcams.Discovery doInBackground() { return Webcams.discover(Webcams.DISCOVERY_TIMEOUT); }
            @Override protected void done() {
                try {
                    offer(get(), WEBCAMS);
                } catch (Exception e) {
                    say("Camera: " + e.getMessage());
                }
            }
        }.execute();
    }

    private void fillSizes() {
        size.removeAllItems();
        int i = device.getSelectedIndex();
        if (i < 0 || i >= discovery.cameras().size()) return;
        List<String> sizes = discovery.cameras().get(i).sizes();
        String best = null;
        long bestArea = -1;
        for (String s : sizes) {
            size.addItem(s);
            int[] wh = parse(s);
            if (wh != null && wh[0] <= DEFAULT_MAX_W && wh[1] <= DEFAULT_MAX_H && (long) wh[0] * wh[1] > bestArea) {
                best = s;
                bestArea = (long) wh[0] * wh[1];
            }
        }
        if (best != null) size.setSelectedItem(best);
        size.setEnabled(sizes.size() > 1);
    }

    private static int[] parse(String wxh) {
        String[] p = wxh.split("x");
        try {
            return p.length == 2 ? new int[]{Integer.parseInt(p[0].trim()), Integer.parseInt(p[1].trim())} : null;
        } catch (NumberFormatException e) {
            return null;
        }
    }

    private void say(String text) {
        message.setText(text);
        ctx.status().accept(text);
    }

    private void toggle() {
        if (stream != null) stop();
        else start();
    }

    /** Opens the chosen camera off the event-dispatch thread and starts the stream. */
    void start() {
        if (stream != null) return;
        int i = device.getSelectedIndex();
        if (i < 0) {
            offer(discovery, opener);
            return;
        }
        int index = discovery.cameras().get(i).index();
        String wxh = size.getItemCount() > 0 ? (String) size.getSelectedItem() : null;
        Opener o = opener;
        say("Opening camera " + index + (wxh == null ? "" : " at " + wxh) + "...");
        startStop.setEnabled(false);
        new SwingWorker<FrameSource, Void>() {
            @Override protected FrameSource doInBackground() throws SourceException { return o.open(index, wxh); }
            @Override protected void done() {
                startStop.setEnabled(true);
                try {
                    FrameSource s = get();
                    stream = new CameraStream(s, ctx, () -> registrations.get(), listener);
                    last = stream;
                    shown.set(0);
                    say("Live: " + s.description());
                    stream.begin();
                } catch (java.util.concurrent.ExecutionException e) {
                    say("Camera " + index + " could not be opened: " + (e.getCause() == null ? e : e.getCause()).getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
                updateButtons();
            }
        }.execute();
    }

    /** Stops the stream (a recording is finished and kept). */
    void stop() {
        if (stream != null) stream.halt(null);
    }

    private void toggleFreeze() {
        if (stream == null) return;
        stream.frozen = !stream.frozen;
        updateButtons();
    }

    private void toggleRecord() {
        if (stream == null) return;
        if (stream.recording() != null) {
            String note = stream.finishRecording();
            if (note != null) say(Character.toUpperCase(note.charAt(0)) + note.substring(1) + ".");
            updateButtons();
            return;
        }
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastRecordFolder", System.getProperty("user.dir")));
        fc.setDialogTitle("Record the camera to");
        fc.setSelectedFile(new java.io.File(fc.getCurrentDirectory(), "camera-" + LocalDateTime.now().format(DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss")) + ".mp4"));
        if (fc.showSaveDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        Path f = fc.getSelectedFile().toPath();
        ctx.prefs().put("lastRecordFolder", String.valueOf(f.getParent()));
        startRecording(f);
    }

    /** Starts recording every camera image to {@code file} (MP4, AVI or MJPEG by its extension). */
    void startRecording(Path file) {
        if (stream == null) return;
        try {
            stream.startRecording(file);
            say("Recording to " + file);
        } catch (IOException | IllegalArgumentException e) {
            say("Cannot record to " + file + ": " + e.getMessage());
        }
        updateButtons();
    }

    private void updateButtons() {
        boolean live = stream != null;
        startStop.setText(live ? "Stop" : "Start");
        startStop.setEnabled(live || !discovery.cameras().isEmpty());
        device.setEnabled(!live);
        size.setEnabled(!live && size.getItemCount() > 1);
        freeze.setEnabled(live);
        freeze.setText(live && stream.frozen ? "Resume" : "Freeze");
        record.setEnabled(live);
        record.setText(live && stream.recording() != null ? "Stop recording" : "Record...");
    }

    boolean running() { return stream != null; }

    /** Frames scored and shown in the current or last stream. */
    int shownFrames() { return shown.get(); }

    private final AtomicInteger shown = new AtomicInteger();

    private void show(CameraStream from, LiveScoring.Scored s) {
        if (stream != from || from.frozen) return;
        shown.incrementAndGet();
        canvas.setFrame(s.frame());
        Map<DetectorType, List<Detection>> pts = new LinkedHashMap<>();
        for (var e : s.points().entrySet()) if (ctx.session().shown().contains(e.getKey())) pts.put(e.getKey(), e.getValue());
        canvas.setOverlay(pts, s.truth().map(org.targetbench.source.FrameTruth::features).orElse(List.of()));
        scores.setRowCount(0);
        for (var e : s.figures().entrySet()) {
            var f = e.getValue();
            scores.addRow(new Object[]{e.getKey().label(), f.points(), Ui.fmt(f.repeatability(), 3), Ui.pct(f.coverage()),
                    Ui.fmt(f.localisationPx(), 3), Double.isNaN(f.foundShare()) ? "" : Ui.pct(f.foundShare()), Ui.fmt(f.detectMs(), 1)});
        }
        against.setText(switch (s.against()) {
            case NOTHING -> "Repeatability: first frame, nothing to compare with yet";
            case PREVIOUS_FRAME -> "Repeatability: against the previous shown frame, as if nothing moved (hold still)";
            case REGISTERED_REFERENCE -> "Repeatability: against the first registered frame, through the target";
        });
        if (s.against() == LiveScoring.Against.NOTHING && s.registration() != LiveScoring.RegistrationState.NONE
                && s.registration() != LiveScoring.RegistrationState.REGISTERED)
            against.setText("Repeatability: none, this frame did not register");
        registered.setText(registrationText(from, s));
        rates.setText(String.format(Locale.ROOT, "%.1f frames/s scored and shown of the camera's %.1f frames/s; %d of %d images dropped%s",
                from.shownRate.perSecond(), from.cameraRate.perSecond(), from.dropped.get(), from.delivered.get(),
                from.recording() == null ? "" : "; recording to " + from.recording().getFileName()));
    }

    /** The registration line under the table: the target, how this frame fared, and the count so far. */
    private String registrationText(CameraStream from, LiveScoring.Scored s) {
        String count = String.format(Locale.ROOT, " (%d of %d frames registered)", from.registeredFrames.get(), from.triedFrames.get());
        return switch (s.registration()) {
            case NONE -> "Target: none (choose one for scores against it)";
            case REGISTERED -> "Target " + targetLabel + ": this frame registered" + count;
            case NOT_REGISTERED -> "Target " + targetLabel + ": this frame NOT REGISTERED, "
                    + s.note().map(org.targetbench.register.RegistrationNote::sentence).orElse("not found") + " (not scored)" + count;
            case WRONG_SIZE -> "Target " + targetLabel + ": NOT REGISTERED, the camera file is for another image size than "
                    + s.frame().width + " x " + s.frame().height + " (choose its size or another file)" + count;
        };
    }

    /** On the event-dispatch thread once a stream has fully stopped. */
    private void ended(CameraStream s, String why, String kept) {
        if (stream != s) return;
        stream = null;
        String text = why == null ? "Camera stopped." : "The camera stream ended: " + why + ".";
        if (kept != null) text += " " + Character.toUpperCase(kept.charAt(0)) + kept.substring(1) + ".";
        say(text);
        updateButtons();
    }
}
