package org.targetbench.app;

import boofcv.struct.image.GrayF32;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;
import org.targetbench.source.SourceFrame;

import javax.swing.SwingUtilities;
import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * What the workbench is looking at: the loaded frames, the current and reference frame, the detectors and their
 * settings, the degradation being previewed, and the latest detections of the current frame. Views edit it and
 * listen to it; it holds no algorithm state and is touched on the event-dispatch thread only.
 */
public final class Session {
    /** What changed. */
    public enum Change { SOURCE, FRAME, DETECTORS, SHOWN, DEGRADE, DETECTIONS, SERVO, CAMERA }

    public interface Listener {
        void changed(Change change);
    }

    /** The detections of one displayed frame and their figures against the reference frame. */
    public record FrameDetections(int frameIndex, GrayF32 shown, Map<DetectorType, List<Detection>> points,
                                  Map<DetectorType, FrameFigures> figures) {}

    /**
     * Per-detector figures of the displayed frame: repeatability against the reference frame (NaN when no homography
     * is known), cell coverage, and the RMS localisation against true features (NaN without truth).
     */
    public record FrameFigures(int count, double repeatability, double coverage, double localisationPx) {}

    private final List<Listener> listeners = new CopyOnWriteArrayList<>();
    private List<SourceFrame> frames = List.of();
    private String sourceName = "";
    private int frameIndex;
    private int referenceIndex;
    private final EnumMap<DetectorType, DetectorConfig> configs = new EnumMap<>(DetectorType.class);
    /** Detectors drawn over the frame (all are scored); a readable few by default. */
    private final EnumSet<DetectorType> shown = EnumSet.of(DetectorType.SHI_TOMASI, DetectorType.FAST, DetectorType.SIFT);
    private Perturbation degrade = Perturbation.GAIN;
    private double degradeValue = Perturbation.GAIN.neutral();
    private FrameDetections detections;
    private int configVersion;

    public Session() {
        for (DetectorType t : DetectorType.values()) configs.put(t, DetectorConfig.defaults(t));
    }

    public void addListener(Listener l) { listeners.add(l); }

    public void removeListener(Listener l) { listeners.remove(l); }

    private void fire(Change c) {
        if (!SwingUtilities.isEventDispatchThread()) throw new IllegalStateException("session changed off the event-dispatch thread");
        for (Listener l : listeners) l.changed(c);
    }

    /** The design scene behind a rendered source, so that sweeps can re-render it. */
    public record Scene(org.targetbench.target.TargetDesign design, org.targetbench.camera.CameraModel camera,
                        org.targetbench.source.RenderConfig lighting, double standoffM, List<org.targetbench.camera.Pose> poses) {
        public Scene {
            poses = List.copyOf(poses);
        }
    }

    private java.util.Optional<Scene> scene = java.util.Optional.empty();

    /** The design scene of a rendered source, empty for frames from files or cameras. */
    public java.util.Optional<Scene> scene() { return scene; }

    /** Replaces the frames (all in memory); the first frame named {@code referenceName} becomes the reference. */
    public void setSource(String name, List<SourceFrame> newFrames, String referenceName) {
        setSource(name, newFrames, referenceName, java.util.Optional.empty());
    }

    /** Where the next source to be set comes from (the demo, a video or a folder), so that a session can be saved. */
    public record Origin(org.targetbench.formats.SessionFile.SourceKind kind, java.util.Optional<java.nio.file.Path> path) {}

    private Origin pendingOrigin, origin;

    /** Says where the source that is being loaded comes from; the next {@link #setSource} takes it. */
    public void expectOrigin(Origin o) {
        pendingOrigin = o == null ? null : new Origin(o.kind(), o.path().map(p -> p.toAbsolutePath().normalize())); // as a reopened session has it
        pendingRegistration = null;
    }

    /** Where the current frames came from, or null when they cannot be reopened from a file (e.g. a registration). */
    public Origin origin() { return origin; }

    private org.targetbench.formats.SessionFile.Registration pendingRegistration, registration;

    /**
     * Says that the source being loaded is the current one registered to a design (and camera): the next
     * {@link #setSource} keeps the current origin and takes this registration.
     */
    public void expectRegistration(org.targetbench.formats.SessionFile.Registration r) {
        pendingOrigin = origin;
        pendingRegistration = r == null ? null : new org.targetbench.formats.SessionFile.Registration(r.target().toAbsolutePath().normalize(),
                r.camera().map(p -> p.toAbsolutePath().normalize()));
    }

    /** The design and camera files the current frames were registered to, or null. */
    public org.targetbench.formats.SessionFile.Registration registration() { return registration; }

    public void setSource(String name, List<SourceFrame> newFrames, String referenceName, java.util.Optional<Scene> newScene) {
        if (newFrames.isEmpty()) throw new IllegalArgumentException("a source needs at least one frame");
        origin = pendingOrigin;
        pendingOrigin = null;
        registration = origin == null ? null : pendingRegistration;
        pendingRegistration = null;
        frames = List.copyOf(newFrames);
        sourceName = name;
        scene = newScene;
        referenceIndex = 0;
        for (int i = 0; i < frames.size(); i++) if (frames.get(i).name().equals(referenceName)) referenceIndex = i;
        frameIndex = referenceIndex;
        detections = null;
        pick = null;
        servoSet = null;
        rehearsal = null;
        rehearsedSet = null;
        lastRehearsal = null;
        undo.clear();
        redo.clear();
        fire(Change.SOURCE);
        fire(Change.FRAME);
    }

    public List<SourceFrame> frames() { return frames; }
    public String sourceName() { return sourceName; }
    public boolean hasFrames() { return !frames.isEmpty(); }
    public int frameIndex() { return frameIndex; }
    public int referenceIndex() { return referenceIndex; }
    public SourceFrame frame() { return frames.get(frameIndex); }
    public SourceFrame reference() { return frames.get(referenceIndex); }

    public void setFrameIndex(int i) {
        if (frames.isEmpty()) return;
        int clamped = Math.max(0, Math.min(frames.size() - 1, i));
        if (clamped == frameIndex) return;
        frameIndex = clamped;
        fire(Change.FRAME);
    }

    /** A copy of a detector's settings. */
    public DetectorConfig config(DetectorType t) { return configs.get(t).copy(); }

    public void setConfig(DetectorConfig c) {
        c.checkValidity();
        configs.put(c.type(), c.copy());
        configVersion++;
        fire(Change.DETECTORS);
    }

    public List<DetectorConfig> configs() {
        List<DetectorConfig> out = new ArrayList<>();
        for (DetectorType t : DetectorType.values()) out.add(configs.get(t).copy());
        return out;
    }

    /** Grows whenever a detector's settings change, so cached detectors can be rebuilt. */
    public int configVersion() { return configVersion; }

    public Set<DetectorType> shown() { return Collections.unmodifiableSet(shown); }

    public void setShown(DetectorType t, boolean on) {
        if (on ? shown.add(t) : shown.remove(t)) fire(Change.SHOWN);
    }

    public Perturbation degrade() { return degrade; }
    public double degradeValue() { return degradeValue; }

    /** Previews a degradation of the displayed frame; the parameter's neutral value turns it off. */
    public void setDegrade(Perturbation p, double value) {
        p.checkValue(value);
        if (p == degrade && value == degradeValue) return;
        degrade = p;
        degradeValue = value;
        fire(Change.DEGRADE);
    }

    public FrameDetections detections() { return detections; }

    private org.targetbench.pipeline.PickRun.Result pick;
    private org.targetbench.servo.ServoSet servoSet;
    private org.targetbench.servo.RehearsalResult rehearsal;

    /** The latest servo point choice (candidates and reasons), or null before one was made. */
    public org.targetbench.pipeline.PickRun.Result pick() { return pick; }

    /** The servo set as chosen and then edited by hand, or null. */
    public org.targetbench.servo.ServoSet servoSet() { return servoSet; }

    /** The latest rehearsal of the current set, or null. */
    public org.targetbench.servo.RehearsalResult rehearsal() { return rehearsal; }

    public void setPick(org.targetbench.pipeline.PickRun.Result p) {
        pick = p;
        servoSet = p.set().orElse(null);
        rehearsal = null;
        rehearsedSet = null;
        lastRehearsal = null;
        undo.clear();
        redo.clear();
        fire(Change.SERVO);
    }

    /**
     * A servo set read from a file (to rehearse or re-export it): there is no choice behind it, so no candidates and no
     * selection reasons; its hand-edit history starts empty.
     */
    public void loadServoSet(org.targetbench.servo.ServoSet set) {
        pick = null;
        servoSet = set;
        rehearsal = null;
        rehearsedSet = null;
        lastRehearsal = null;
        undo.clear();
        redo.clear();
        fire(Change.SERVO);
    }

    /** Sets before and after hand edits of the current choice, newest last. */
    private final java.util.ArrayDeque<org.targetbench.servo.ServoSet> undo = new java.util.ArrayDeque<>(), redo = new java.util.ArrayDeque<>();

    /** Replaces the set (after a hand edit, which can be undone); an older rehearsal no longer applies. */
    public void setServoSet(org.targetbench.servo.ServoSet set) {
        if (servoSet != null) undo.push(servoSet);
        redo.clear();
        servoSet = set;
        rehearsal = rehearsalOf(set);
        fire(Change.SERVO);
    }

    public boolean canUndo() { return !undo.isEmpty(); }
    public boolean canRedo() { return !redo.isEmpty(); }

    /** Takes back the latest hand edit of the set; false when there is none. */
    public boolean undoServoEdit() {
        if (undo.isEmpty()) return false;
        redo.push(servoSet);
        servoSet = undo.pop();
        rehearsal = rehearsalOf(servoSet);
        fire(Change.SERVO);
        return true;
    }

    /** Does again the latest undone hand edit; false when there is none. */
    public boolean redoServoEdit() {
        if (redo.isEmpty()) return false;
        undo.push(servoSet);
        servoSet = redo.pop();
        rehearsal = rehearsalOf(servoSet);
        fire(Change.SERVO);
        return true;
    }

    public void setRehearsal(org.targetbench.servo.RehearsalResult r) {
        setRehearsal(r, 0);
    }

    /** The rehearsal of the current set, and how long it took, seconds. */
    public void setRehearsal(org.targetbench.servo.RehearsalResult r, double elapsedS) {
        rehearsal = r;
        rehearsedSet = r == null ? null : servoSet;
        lastRehearsal = r;
        rehearsalElapsedS = elapsedS;
        fire(Change.SERVO);
    }

    /** The set the latest rehearsal ran on (it applies to the current set only when equal to it), or null. */
    private org.targetbench.servo.ServoSet rehearsedSet;
    private double rehearsalElapsedS;

    private org.targetbench.servo.RehearsalResult lastRehearsal;

    private org.targetbench.servo.RehearsalResult rehearsalOf(org.targetbench.servo.ServoSet set) {
        return set != null && set.equals(rehearsedSet) ? lastRehearsal : null;
    }

    /** True when a rehearsal was run on an earlier state of the set, which has changed since. */
    public boolean changedSinceRehearsal() { return rehearsal == null && rehearsedSet != null; }

    /** Seconds the current rehearsal took. */
    public double rehearsalElapsedS() { return rehearsalElapsedS; }

    /**
     * The hand edits of the set as candidate ids: those done since the choice (oldest first), those undone (the next to
     * redo first), and which state of the set the kept rehearsal ran on (0 the chosen set, i after the i-th edit, counted
     * on through the undone ones; -1 for none). Empty lists when there is no choice behind the set.
     */
    public record ServoEdits(List<Integer> done, List<Integer> undone, int rehearsedPosition) {
        public ServoEdits {
            done = List.copyOf(done);
            undone = List.copyOf(undone);
        }
    }

    /** The states of the set, oldest first: the chosen set, each edit, then the undone ones. */
    List<org.targetbench.servo.ServoSet> servoStates() {
        List<org.targetbench.servo.ServoSet> chain = new ArrayList<>();
        if (servoSet == null) return chain;
        undo.descendingIterator().forEachRemaining(chain::add);
        chain.add(servoSet);
        chain.addAll(redo);
        return chain;
    }

    public ServoEdits servoEdits() {
        List<org.targetbench.servo.ServoSet> chain = servoStates();
        List<Integer> ids = new ArrayList<>();
        for (int i = 1; i < chain.size(); i++) {
            Set<Integer> a = new java.util.HashSet<>(), b = new java.util.HashSet<>();
            chain.get(i - 1).points().forEach(p -> a.add(p.id()));
            chain.get(i).points().forEach(p -> b.add(p.id()));
            Set<Integer> diff = new java.util.HashSet<>(a);
            diff.addAll(b);
            a.retainAll(b);
            diff.removeAll(a);
            if (diff.size() != 1) return new ServoEdits(List.of(), List.of(), chain.indexOf(rehearsedSet)); // not one click apart
            ids.add(diff.iterator().next());
        }
        int now = undo.size();
        return new ServoEdits(ids.subList(0, now), ids.subList(now, ids.size()), rehearsedSet == null ? -1 : chain.indexOf(rehearsedSet));
    }

    /**
     * Puts back a rehearsal that ran on {@code on} (the current set or an earlier or undone state of it), as a reopened
     * session does; it applies to the current set only when that equals {@code on}.
     */
    public void restoreRehearsal(org.targetbench.servo.ServoSet on, org.targetbench.servo.RehearsalResult r, double elapsedS) {
        rehearsedSet = on;
        lastRehearsal = r;
        rehearsalElapsedS = elapsedS;
        rehearsal = rehearsalOf(servoSet);
        fire(Change.SERVO);
    }

    /** The set the kept rehearsal ran on (see {@link #changedSinceRehearsal()}), or null. */
    public org.targetbench.servo.ServoSet rehearsedSet() { return rehearsedSet; }

    /** The kept rehearsal, whether or not it applies to the current set, or null. */
    public org.targetbench.servo.RehearsalResult lastRehearsal() { return lastRehearsal; }

    private java.nio.file.Path stressResults;

    /** Records the folder the stress sweep's results were saved to (kept by a saved session). */
    public void setStressResults(java.nio.file.Path folder) { stressResults = folder; }

    /** The folder the stress sweep's results were last saved to, or null. */
    public java.nio.file.Path stressResults() { return stressResults; }

    private boolean playing;

    /** True while playback runs: it prepares and shows its own frames, and the detection runner waits. */
    public boolean playing() { return playing; }

    /** Starts or ends playback; at the end the shown frame is scored again by every detector (a FRAME change). */
    void setPlaying(boolean on) {
        if (on == playing) return;
        playing = on;
        if (!on && hasFrames()) fire(Change.FRAME);
    }

    /**
     * Shows a frame prepared by playback: the frame index and its detections change together, so the counter and the
     * picture name the same frame.
     */
    void showPlayed(FrameDetections d) {
        if (d.frameIndex() < 0 || d.frameIndex() >= frames.size()) return;
        frameIndex = d.frameIndex();
        detections = d;
        fire(Change.FRAME);
        fire(Change.DETECTIONS);
    }

    /** Called by the detection runner with results for the current state. */
    void setDetections(FrameDetections d) {
        detections = d;
        fire(Change.DETECTIONS);
    }

    private org.targetbench.camera.CameraModel camera;
    private String cameraName = "";

    /** The camera the views plan with (calibrated in the workbench or read from a file), or null for the demo's. */
    public org.targetbench.camera.CameraModel camera() { return camera; }

    /** Where {@link #camera()} came from, for labels and reports; empty when there is none. */
    public String cameraName() { return cameraName; }

    /** Makes {@code c} the camera the views plan with; {@code name} says where it came from. */
    public void setCamera(org.targetbench.camera.CameraModel c, String name) {
        camera = c;
        cameraName = c == null ? "" : name;
        fire(Change.CAMERA);
    }
}
