package org.targetbench.cli;

import org.targetbench.source.ImageFolderSource;
import org.targetbench.camera.CameraModel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.SweepWriter;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.SweepBase;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRun;
import org.targetbench.pipeline.SweepSummary;
import org.targetbench.report.SweepReport;
import org.targetbench.source.EnvelopeFile;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

@Command(name = "sweep", mixinStandardHelpOptions = true,
        description = {"Stress sweep: degrades frames by lighting, blur, noise, JPEG and viewpoint in graded levels and scores "
                + "every detector at each level against the undegraded frame.",
                "Writes sweep.csv, ranking.csv and a self-contained report.html. Ctrl-C stops early and keeps what is done."})
final class SweepCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    /** Where the base views come from: --target alone renders them; --frames degrades yours (with --target, registered to it). */
    static final class Input {
        @Option(names = "--target", paramLabel = "FILE", description = "Target design (target.json): base views are rendered with truth; with --frames, the frames are registered to it for truth.")
        Path target;

        @Option(names = "--frames", paramLabel = "DIR", description = "Folder of PNG/JPEG frames to degrade instead.")
        Path frames;
    }

    @ArgGroup(exclusive = false, multiplicity = "1")
    Input input;

    /** Camera for --target (default: the demo's 640x480 flange camera). */
    @Mixin CameraOption camera;

    /** Distance of the rendered views (default: where the target fills half the view). */
    @Mixin StandoffOption standoff;

    /** A stand-off given in metres by the old spelling. */
    private Double oldStandoffM;

    @Option(names = "--standoff", hidden = true, paramLabel = "M")
    void oldStandoff(double metres) {
        OldSpelling.note(spec, "--standoff (metres)", "--standoff-mm MM (millimetres)");
        oldStandoffM = metres;
    }

    @Option(names = "--truth", paramLabel = "FILE", description = "truth.json for --frames (true points are carried through the degradations).")
    Path truth;

    @Option(names = "--levels", paramLabel = "N", defaultValue = "8", description = "Levels per parameter, 2..32 (default: ${DEFAULT-VALUE}).")
    int levels;

    @Option(names = "--views", paramLabel = "N", defaultValue = "30", description = "Rendered base views for --target, or the most frames used from --frames (default: ${DEFAULT-VALUE}).")
    int views;

    @Option(names = "--track-frames", paramLabel = "N", defaultValue = "0",
            description = "Also measure KLT survival in every cell over a slow motion of N frames, 0..100 (default: ${DEFAULT-VALUE}, off; 4 to 8 is plenty).")
    int trackFrames;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Mixin ConditionOptions conditions;

    @Mixin DetectorOptions detectorOptions;

    @Override
    public Integer call() throws Exception {
        SweepConfig cfg = config(detectorOptions, conditions.kinds, levels, views, conditions.seed);
        cfg.trackFrames = trackFrames;
        try {
            cfg.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage().replace("trackFrames must", "--track-frames must"));
        }
        Map<Perturbation, Double> env = envelope(conditions.envelope);
        if (input.target == null && input.frames == null) throw new UserError("give --target (render base views) or --frames (degrade your frames)");
        try (AtomicOutput output = AtomicOutput.open(out); SweepJob job = new SweepJob()) {
            Path registeredTruth = null;
            if (input.frames != null && input.target != null) {
                if (standoff.mm() != null || oldStandoffM != null)
                    throw new UserError("--standoff-mm goes with rendered views (--target alone), not --frames");
                try (ImageFolderSource footage = ImageFolderSource.open(input.frames, null)) {
                    registeredTruth = TargetTruth.register(footage, input.target, camera.file, truth, output);
                }
            }
            SweepBase base;
            if (registeredTruth != null)
                try (ImageFolderSource src = ImageFolderSource.open(input.frames, registeredTruth)) {
                    base = SweepBase.fromFrames(src, "frames of " + input.frames + " registered to " + input.target.getFileName(), views);
                }
            else base = base(cfg);
            SweepResult r = new SweepRun(cfg).run(base, new ConsoleProgress("sweeping"), job::cancelled);
            write(r, env, output);
            var dotBias = org.targetbench.pipeline.DotBiasTable.forSweep(base, cfg);
            if (!dotBias.isEmpty()) org.targetbench.export.DotBiasWriter.write(dotBias, output.file("dot-bias.csv"));
            output.commit();
            PrintWriter w = spec.commandLine().getOut();
            print(r, env, w);
            if (!dotBias.isEmpty()) w.println(DotBiasLine.of(dotBias, "dot-bias.csv"));
            w.println("Report: " + output.target().resolve("report.html"));
            w.flush();
            return r.cancelled() ? SweepJob.EXIT_CANCELLED : 0;
        }
    }

    /** Sweep settings from the options shared by sweep and shootout; bad values give one-line errors. */
    static SweepConfig config(DetectorOptions detectors, List<String> kinds, int levels, int views, long seed) {
        SweepConfig cfg = new SweepConfig();
        cfg.detectors = detectors.configs();
        cfg.parameters = parameters(kinds);
        cfg.levels = levels;
        cfg.seed = seed;
        cfg.epsilon = detectors.epsilon;
        cfg.syntheticFrames = views;
        try {
            cfg.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage().replace("levels must", "--levels must").replace("syntheticFrames must", "--views must"));
        }
        return cfg;
    }

    /** The operating envelope of an --envelope file, or none. */
    static Map<Perturbation, Double> envelope(Path file) throws org.targetbench.source.SourceException {
        if (file == null) return Map.of();
        try {
            return SweepSummary.envelope(EnvelopeFile.read(file));
        } catch (IllegalArgumentException e) {
            throw new UserError(file + ": " + e.getMessage());
        }
    }

    static void write(SweepResult r, Map<Perturbation, Double> env, AtomicOutput output) throws java.io.IOException {
        SweepWriter.write(r, env, output);
        SweepReport.write(r, env, output.file("report.html"));
    }

    static void print(SweepResult r, Map<Perturbation, Double> env, PrintWriter w) {
        if (r.cancelled()) w.println("Stopped early: kept " + r.cellsDone() + " of " + r.cellsTotal() + " cells; figures cover those only.");
        w.printf(java.util.Locale.ROOT, "%d cells (%d base frames) in %.1f s, %.1f cells/s%n", r.cellsDone(), r.baseFrames(), r.wallSeconds(),
                r.cellsDone() / Math.max(1e-9, r.wallSeconds()));
        w.println("Ranking over " + (env.isEmpty() ? "the whole swept range" : "the operating envelope") + " (score = mean repeatability under the weakest condition):");
        for (var x : SweepSummary.rankEnvelope(r, env))
            w.printf(java.util.Locale.ROOT, "  %d. %-11s %s   weakest: %s%n", x.rank(), x.detector().label(),
                    Double.isNaN(x.score()) ? "  -  " : String.format(java.util.Locale.ROOT, "%.3f", x.score()),
                    x.weakest() == null ? "-" : x.weakest().id());
    }

    private SweepBase base(SweepConfig cfg) throws Exception {
        if (input.target != null) {
            TargetDesign design = TargetFile.read(input.target);
            CameraModel cam = camera.read().orElse(DemoScenario.camera());
            double d;
            if (standoff.mm() != null) d = standoff.positive() / 1000.0;
            else if (oldStandoffM != null) d = oldStandoffM;
            else d = SweepBase.defaultStandoff(design, cam);
            if (!(d > 0) || !Double.isFinite(d)) throw new UserError("--standoff-mm must be > 0 mm, got " + d * 1000);
            return SweepBase.render(design, cam, DemoScenario.lighting(), d, views, conditions.seed);
        }
        if (camera.file != null || standoff.mm() != null || oldStandoffM != null)
            throw new UserError("--camera and --standoff-mm go with --target, not --frames");
        try (ImageFolderSource src = ImageFolderSource.open(input.frames, truth)) {
            return SweepBase.fromFrames(src, "frames of " + input.frames, views);
        }
    }

    /** Parses --kinds into parameters, in the order given. */
    static List<Perturbation> parameters(List<String> kinds) {
        LinkedHashSet<Perturbation> out = new LinkedHashSet<>();
        if (kinds == null || kinds.isEmpty()) {
            for (PerturbKind k : PerturbKind.values()) out.add(Perturbation.primary(k));
            return new ArrayList<>(out);
        }
        for (String k : kinds) {
            String s = k.trim();
            if (s.isEmpty()) continue;
            try {
                if (s.equalsIgnoreCase("all")) out.addAll(List.of(Perturbation.values()));
                else if (s.toLowerCase(java.util.Locale.ROOT).endsWith(".all")) out.addAll(Perturbation.ofKind(PerturbKind.parse(s.substring(0, s.length() - 4))));
                else out.add(Perturbation.parse(s));
            } catch (IllegalArgumentException e) {
                throw new UserError(e.getMessage());
            }
        }
        if (out.isEmpty()) throw new UserError("--kinds names nothing to sweep; choose from " + PerturbKind.allNames());
        return new ArrayList<>(out);
    }
}
