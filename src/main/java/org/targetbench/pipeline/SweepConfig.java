package org.targetbench.pipeline;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.perturb.PerturbConfig;
import org.targetbench.perturb.Perturbation;
import org.targetbench.score.Repeatability;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Settings of a stress sweep. */
public final class SweepConfig {
    /** Detectors to run. */
    public List<DetectorConfig> detectors = new ArrayList<>();
    /** Swept parameters, in report order. */
    public List<Perturbation> parameters = new ArrayList<>();
    /** Levels per parameter, evenly spaced over each parameter's default range; 2..32. */
    public int levels = Perturbation.DEFAULT_LEVELS;
    /** Explicit values for some parameters (replacing the default range); each must be within the parameter's accepted range. */
    public Map<Perturbation, double[]> values = new LinkedHashMap<>();
    /** Base frames rendered when the sweep starts from a target design. */
    public int syntheticFrames = 30;
    /** Seed of every random choice (base poses, noise); the same seed gives the same CSV bytes. */
    public long seed = 1;
    /** Repeatability match radius, pixels. */
    public double epsilon = Repeatability.DEFAULT_EPSILON;
    /** Worker threads; cells are independent. */
    public int threads = Runtime.getRuntime().availableProcessors();
    /**
     * Frames of the short slow motion over which KLT survival is measured per cell (0 turns it off): the degraded
     * view drifts by {@value SweepRun#MOTION_PX_PER_FRAME} px and {@value SweepRun#MOTION_DEG_PER_FRAME} deg per frame,
     * each frame degraded afresh, and the detector's points are tracked through it.
     */
    public int trackFrames = 0;
    /** Tracker settings for the survival measurement. */
    public org.targetbench.track.KltConfig tracker = new org.targetbench.track.KltConfig();
    /** Fixed settings of the perturbations. */
    public PerturbConfig perturb = new PerturbConfig();

    /** A deep copy: lists, maps, arrays and nested configs are copied too. */
    public SweepConfig copy() {
        SweepConfig c = new SweepConfig();
        c.detectors = new ArrayList<>(detectors.stream().map(DetectorConfig::copy).toList());
        c.parameters = new ArrayList<>(parameters);
        c.levels = levels;
        c.values = new LinkedHashMap<>();
        values.forEach((k, v) -> c.values.put(k, v.clone()));
        c.syntheticFrames = syntheticFrames;
        c.seed = seed;
        c.epsilon = epsilon;
        c.threads = threads;
        c.trackFrames = trackFrames;
        c.tracker = tracker.copy();
        c.perturb = perturb.copy();
        return c;
    }

    /** The values swept for a parameter. */
    public double[] valuesOf(Perturbation p) {
        double[] v = values.get(p);
        return v != null ? v.clone() : p.defaultLevels(levels);
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (detectors.isEmpty()) throw new IllegalArgumentException("a sweep needs at least one detector");
        for (DetectorConfig d : detectors) d.checkValidity();
        if (parameters.isEmpty()) throw new IllegalArgumentException("a sweep needs at least one kind");
        if (levels < 2 || levels > 32) throw new IllegalArgumentException("levels must be 2..32, got " + levels);
        for (var e : values.entrySet()) for (double v : e.getValue()) e.getKey().checkValue(v);
        if (syntheticFrames < 1 || syntheticFrames > 1000) throw new IllegalArgumentException("syntheticFrames must be 1..1000, got " + syntheticFrames);
        if (!(epsilon > 0) || !Double.isFinite(epsilon)) throw new IllegalArgumentException("epsilon must be > 0 px, got " + epsilon);
        if (threads < 1) throw new IllegalArgumentException("threads must be >= 1, got " + threads);
        perturb.checkValidity();
        if (trackFrames < 0 || trackFrames > 100) throw new IllegalArgumentException("trackFrames must be 0..100, got " + trackFrames);
        tracker.checkValidity();
    }
}
