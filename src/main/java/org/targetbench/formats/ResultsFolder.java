package org.targetbench.formats;

import org.targetbench.source.TruthFile;
import org.targetbench.source.TargetFile;
import org.targetbench.source.PosesFile;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.CsvIn;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.JsonIn;
import org.targetbench.source.Missing;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.SourceException;
import com.fasterxml.jackson.databind.JsonNode;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.detect.Detection;
import org.targetbench.pipeline.PickRun;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Stream;

/**
 * Reads a results folder written by {@code demo} or {@code compare}: {@code summary.json} and {@code detections.csv}
 * (required), and when present {@code frames/truth.json}, {@code camera.json}, {@code target.json} and
 * {@code poses.json}. Each of the optional files can be given explicitly instead; an explicit file that is missing is
 * an error, a default one that is missing is simply absent.
 */
public final class ResultsFolder {
    private ResultsFolder() {}

    /**
     * What a results folder holds.
     *
     * @param ranking          detector names, best first
     * @param detectorSettings per detector name, its settings as JSON text
     * @param detections       per detector name, per frame name (in file order), the detections
     */
    public record Data(Path folder, String referenceFrame, int width, int height, double epsilonPx, List<String> ranking,
                       Map<String, String> detectorSettings, Map<String, Map<String, List<Detection>>> detections,
                       Optional<TruthFile.Truth> truth, Optional<CameraModel> camera, Optional<TargetDesign> target,
                       Optional<List<Pose>> poses, Optional<Path> cameraFile, Optional<Path> targetFile, Optional<Path> posesFile,
                       Path truthFile, String folderName, Map<String, Pose> registeredPoses) {
        /** What a pick starts from: this folder's detections and scene, the files named as the set records them. */
        public PickRun.Input pickInput() {
            return new PickRun.Input(referenceFrame, epsilonPx, ranking, detectorSettings, detections, truth.map(TruthFile.Truth::frames),
                    camera, target, poses.map(p -> p.get(0)), posesFile.map(this::shortName).orElse("poses.json"),
                    targetFile.map(this::shortName).orElse("target.json"),
                    camera.isPresent() && !registeredPoses.isEmpty()
                            ? PickRun.Input.planeInduced(camera.get(), referenceFrame, registeredPoses) : Map.of());
        }

        /** Names for the sentences that explain a refused pick. */
        public PickRefusals.Where where() {
            return new PickRefusals.Where(folderName, shortName(truthFile), posesFile.map(this::shortName).orElse("poses.json"), referenceFrame);
        }

        /** A file's name relative to the results folder when it lies inside it, else its full path. */
        public String shortName(Path file) {
            Path f = file.toAbsolutePath().normalize(), d = folder.toAbsolutePath().normalize();
            return f.startsWith(d) ? d.relativize(f).toString() : file.toString();
        }
    }

    /** Optional explicit files; null means "the default inside the folder". */
    public record Overrides(Path truth, Path camera, Path target, Path poses) {
        public static Overrides none() { return new Overrides(null, null, null, null); }
    }

    public static Data read(Path folder, Overrides o) throws SourceException {
        return read(folder, o, folder.toString());
    }

    /** @param folderName how to name the folder in messages (a staged folder is named as the user will see it) */
    public static Data read(Path folder, Overrides o, String folderName) throws SourceException {
        if (!Files.isDirectory(folder)) throw Missing.folder(folder, "results folder");
        Path summaryFile = folder.resolve("summary.json"), detFile = folder.resolve("detections.csv");
        if (!Files.isRegularFile(summaryFile))
            throw new SourceException("file not found: " + summaryFile + " (give a folder written by 'targetbench demo' or 'compare')");
        if (!Files.isRegularFile(detFile)) throw new SourceException("file not found: " + detFile + " (give a folder written by 'targetbench demo' or 'compare')");
        JsonIn.Parsed sp = JsonIn.parse(summaryFile);
        JsonIn in = sp.in();
        JsonNode root = sp.root();
        in.expectFormat(root, "targetbench-compare-summary", 1);
        String ref = in.text(root, "reference_frame", "summary");
        int w = in.integer(root, "image_width", "summary"), h = in.integer(root, "image_height", "summary");
        double eps = in.number(root, "epsilon_px", "summary");
        List<String> ranking = new ArrayList<>();
        JsonNode rk = in.array(root, "ranking", "summary");
        for (int i = 0; i < rk.size(); i++) ranking.add(in.text(rk.get(i), "detector", "ranking[" + i + "]"));
        Map<String, String> settings = new LinkedHashMap<>();
        JsonNode ds = root.path("detectors");
        ds.fields().forEachRemaining(e -> settings.put(e.getKey(), e.getValue().toString()));
        Map<String, Map<String, List<Detection>>> dets = readDetections(detFile);

        Path truthFile = o.truth() != null ? o.truth() : folder.resolve("frames").resolve("truth.json");
        // a comparison run with --target keeps its registered truth in registration/
        if (o.truth() == null && !Files.isRegularFile(truthFile) && Files.isRegularFile(folder.resolve("registration").resolve("truth.json")))
            truthFile = folder.resolve("registration").resolve("truth.json");
        Optional<TruthFile.Truth> truth = Optional.empty();
        if (o.truth() != null || Files.isRegularFile(truthFile)) {
            Set<String> names = new LinkedHashSet<>(imageNames(truthFile.toAbsolutePath().getParent()));
            dets.values().forEach(m -> names.addAll(m.keySet()));
            names.add(ref);
            truth = Optional.of(TruthFile.read(truthFile, names));
        }
        Path camF = pick(o.camera(), folder.resolve("camera.json"));
        Path tgtF = pick(o.target(), folder.resolve("target.json"));
        Path posF = pick(o.poses(), folder.resolve("poses.json"));
        Optional<CameraModel> camera = camF == null ? Optional.empty() : Optional.of(CameraFiles.read(camF));
        Optional<TargetDesign> target = tgtF == null ? Optional.empty() : Optional.of(TargetFile.read(tgtF));
        Optional<List<Pose>> poses = Optional.empty();
        if (posF != null) {
            if (target.isEmpty()) throw new SourceException(posF + " needs the target design to be read: target.json is missing in " + folder + " (give --target)");
            poses = Optional.of(PosesFile.read(posF, target.get()));
        }
        if (camera.isPresent() && (camera.get().width() != w || camera.get().height() != h))
            throw new SourceException(camF + ": image size " + camera.get().width() + "x" + camera.get().height()
                    + " does not match the results' " + w + "x" + h);
        // registered truth carries per-frame poses when intrinsics were given (for repeatability under distortion)
        Map<String, Pose> registeredPoses = truth.isPresent() ? org.targetbench.source.RegisteredPoses.read(truthFile) : Map.of();
        return new Data(folder, ref, w, h, eps, ranking, settings, dets, truth, camera, target, poses,
                Optional.ofNullable(camF), Optional.ofNullable(tgtF), Optional.ofNullable(posF), truthFile, folderName, registeredPoses);
    }

    /** The explicit file (which must exist), else the default when it exists, else null. */
    private static Path pick(Path explicit, Path fallback) throws SourceException {
        if (explicit != null) {
            if (!Files.isRegularFile(explicit)) throw Missing.file(explicit, "file");
            return explicit;
        }
        return Files.isRegularFile(fallback) ? fallback : null;
    }

    private static List<String> imageNames(Path dir) {
        if (dir == null || !Files.isDirectory(dir)) return List.of();
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString())
                    .filter(n -> n.toLowerCase(Locale.ROOT).matches(".*\\.(png|jpe?g)$")).sorted().toList();
        } catch (IOException e) {
            return List.of();
        }
    }

    static Map<String, Map<String, List<Detection>>> readDetections(Path file) throws SourceException {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + ImageFiles.oneLine(e));
        }
        if (lines.isEmpty() || !lines.get(0).strip().equals("detector,frame,x,y,response,scale"))
            throw new SourceException(file + ": line 1 must be the header detector,frame,x,y,response,scale");
        Map<String, Map<String, List<Detection>>> out = new LinkedHashMap<>();
        for (int i = 1; i < lines.size(); i++) {
            String line = lines.get(i);
            if (line.isBlank()) continue;
            List<String> c;
            try {
                c = CsvIn.split(line);
            } catch (IllegalArgumentException e) {
                throw new SourceException(file + ": line " + (i + 1) + ": " + e.getMessage());
            }
            if (c.size() != 6) throw new SourceException(file + ": line " + (i + 1) + " has " + c.size() + " cells, expected 6");
            double[] v = new double[4];
            for (int k = 0; k < 4; k++) {
                try {
                    v[k] = Double.parseDouble(c.get(k + 2));
                } catch (NumberFormatException e) {
                    throw new SourceException(file + ": line " + (i + 1) + ": \"" + c.get(k + 2) + "\" is not a number");
                }
                if (!Double.isFinite(v[k])) throw new SourceException(file + ": line " + (i + 1) + ": values must be finite, got " + c.get(k + 2));
            }
            out.computeIfAbsent(c.get(0), k -> new LinkedHashMap<>()).computeIfAbsent(c.get(1), k -> new ArrayList<>())
                    .add(new Detection(v[0], v[1], v[2], v[3]));
        }
        return out;
    }
}
