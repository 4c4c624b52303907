package org.targetbench.pipeline;

import org.targetbench.arm.ArmRehearsalConfig;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.DemoArm;
import org.targetbench.arm.HandEye;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.SelectConfig;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.FrameList;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticSource;
import org.targetbench.track.KltConfig;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * The demo scenario as one run ({@link DemoScenario}): render the frames with truth, compare the detectors on them,
 * a short stress sweep, pick a servo set from the comparison and rehearse it, track the arm's approach, and rehearse
 * the set on the invented demo arm with one period of image latency and the gain sweep. The command line writes and
 * prints what it returns; nothing here touches files.
 */
public final class DemoRun {
    /** Size of the demo's short stress sweep: every kind's main parameter at this many levels on this many views. */
    public static final int SWEEP_LEVELS = 5, SWEEP_VIEWS = 3;
    /** The demo sweep also measures KLT survival over this many frames of slow drift per cell. */
    public static final int SWEEP_TRACK_FRAMES = 4;
    /** Rehearsal starts in the demo: enough for a convergence rate, few enough to keep the demo quick. */
    public static final int REHEARSAL_STARTS = 100;
    /** The demo's tracking run: the last 3 s of a servo convergence (20° roll, 1.5x zoom, wide-angle lens) at 30 fps. */
    public static final String TRACK_MOTION = "converge,frames=90";
    /** Detector that seeds the demo's tracks. */
    public static final DetectorType TRACK_SEEDING = DetectorType.SHI_TOMASI;
    /** Frame at which the demo's tracking reports survival. */
    public static final int SURVIVAL_AT_FRAME = 30;
    /** Starts on the demo arm: few, so the gain sweep stays quick. */
    public static final int ARM_STARTS = 12;
    /** Runs of the arm rehearsal whose traces are kept for the charts. */
    public static final int ARM_TRACED_RUNS = 8;
    /** Image latency of the demo's arm rehearsal, controller periods. */
    public static final int ARM_LATENCY_FRAMES = 1;

    private DemoRun() {}

    /**
     * What the demo produced. {@code pick} holds a set (the demo scenario always yields one; a refusal is an error).
     *
     * @param rehearsalSeconds wall-clock time of the rehearsal, seconds
     */
    public record Result(List<SourceFrame> frames, CompareResult compare, SweepResult sweep, PickRun.Result pick,
                         RehearsalResult rehearsal, double rehearsalSeconds, TrackResult tracking, ArmRehearsalResult arm, int stagesDone) {
        /** True when a stop request ended the run before its last stage; the later fields are then null. */
        public boolean stoppedEarly() {
            return stagesDone < STAGES.size();
        }
    }

    /**
     * The demo's stages, in order. A stop request is honoured between stages (a sweep or tracking run cut short keeps
     * the part it finished and counts as done); the result then holds the stages done and null for the rest.
     */
    public static final List<String> STAGES = List.of("frames", "compare", "stress sweep", "servo set and rehearsal", "tracking", "arm rehearsal");

    /** Where the run reports and what it streams to. */
    public interface Steps {
        /** Progress of one step ("rendering", "detecting", "stress sweep", "tracking"). */
        Progress progress(String step);

        /** Asked between stages, sweep cells and tracked frames: stop early. */
        boolean cancelled();

        /** Takes the tracking rows as they come. */
        TrackSink trackSink();
    }

    /** The demo's sweep settings for these detectors and match radius (pixels). */
    public static SweepConfig sweepConfig(List<DetectorConfig> configs, double epsilon) {
        SweepConfig c = new SweepConfig();
        c.detectors = configs;
        c.epsilon = epsilon;
        for (PerturbKind k : PerturbKind.values()) c.parameters.add(Perturbation.primary(k));
        c.levels = SWEEP_LEVELS;
        c.seed = 1;
        c.trackFrames = SWEEP_TRACK_FRAMES;
        return c;
    }

    /**
     * @param framesDescription how the comparison names its frames (where the shell will write them)
     * @param pickInput         how a comparison of the rendered frames becomes a pick's input, exactly as its saved results would
     */
    public static Result run(List<DetectorConfig> configs, double epsilon, String framesDescription,
                             java.util.function.BiFunction<CompareResult, List<SourceFrame>, PickRun.Input> pickInput, Steps steps, String toolVersion, String created)
            throws SourceException, InterruptedException, IOException, PickRun.Refused {
        List<SourceFrame> frames = new ArrayList<>();
        try (SyntheticSource src = DemoScenario.source()) {
            Progress p = steps.progress("rendering");
            Optional<SourceFrame> f;
            while ((f = src.next()).isPresent()) {
                frames.add(f.get());
                p.update(frames.size(), src.frameCount(), f.get().name());
            }
        }
        if (steps.cancelled()) return new Result(frames, null, null, null, null, 0, null, null, 1);
        String reference = DemoScenario.source().referenceName();
        CompareResult compare = new CompareRun(configs, epsilon)
                .run(new FrameList(framesDescription, frames, reference), steps.progress("detecting"));
        if (steps.cancelled()) return new Result(frames, compare, null, null, null, 0, null, null, 2);
        SweepResult sweep = new SweepRun(sweepConfig(configs, epsilon)).run(SweepBase.render(DemoScenario.target(), DemoScenario.camera(),
                DemoScenario.lighting(), DemoScenario.STANDOFF_M, SWEEP_VIEWS, 1), steps.progress("stress sweep"), steps::cancelled);
        if (steps.cancelled()) return new Result(frames, compare, sweep, null, null, 0, null, null, 3);
        PickRun.Result pick = PickRun.run(pickInput.apply(compare, frames), null, new CandidateConfig(), new SelectConfig(), toolVersion, created);
        RehearsalConfig rc = new RehearsalConfig();
        rc.starts = REHEARSAL_STARTS;
        long t0 = System.nanoTime();
        RehearsalResult rehearsal = pick.set().isPresent() ? Rehearsal.run(pick.set().get(), rc) : null;
        double seconds = (System.nanoTime() - t0) / 1e9;
        if (steps.cancelled()) return new Result(frames, compare, sweep, pick, rehearsal, seconds, null, null, 4);
        TrackResult tracking = new TrackRun(new KltConfig(), DetectorConfig.defaults(TRACK_SEEDING), SURVIVAL_AT_FRAME, false, 0)
                .run(MotionScenarios.open(TRACK_MOTION), steps.trackSink(), steps.progress("tracking"), steps::cancelled);
        if (steps.cancelled() || pick.set().isEmpty()) return new Result(frames, compare, sweep, pick, rehearsal, seconds, tracking, null, 5);
        ArmRehearsalResult arm = ArmRun.run(armRequest(pick.set().get()));
        return new Result(frames, compare, sweep, pick, rehearsal, seconds, tracking, arm, 6);
    }

    /** The demo's rehearsal on the arm: the demo arm and mount, {@link #ARM_STARTS} starts, latency and the gain sweep. */
    public static ArmRun.Request armRequest(ServoSet set) {
        RehearsalConfig rc = new RehearsalConfig();
        rc.starts = ARM_STARTS;
        rc.tracedRuns = ARM_TRACED_RUNS;
        ArmRehearsalConfig c = new ArmRehearsalConfig();
        c.servo = rc;
        c.latencyFrames = ARM_LATENCY_FRAMES;
        c.referenceJointsRad = DemoArm.rad(DemoArm.REFERENCE_DEG);
        return new ArmRun.Request(set, DemoArm.model(), HandEye.demo(), c, null, true);
    }
}
