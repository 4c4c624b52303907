package org.targetbench.cli;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import picocli.CommandLine.Option;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/** Detector choice and shared detector settings, mixed into the commands that detect. */
final class DetectorOptions {
    @Option(names = "--detectors", split = ",", paramLabel = "NAME",
            description = "Detectors to run, comma separated: harris, shi-tomasi, fast, surf, sift (default: all).")
    List<String> detectors;

    @Option(names = "--max-features", paramLabel = "N", description = "Most points kept per frame per detector (default: ${DEFAULT-VALUE}).",
            defaultValue = "500")
    int maxFeatures;

    @Option(names = "--epsilon", paramLabel = "PX", description = "Repeatability match radius in pixels (default: ${DEFAULT-VALUE}).",
            defaultValue = "1.5")
    double epsilon;

    List<DetectorConfig> configs() {
        Set<DetectorType> types = new LinkedHashSet<>();
        if (detectors == null || detectors.isEmpty()) types.addAll(List.of(DetectorType.values()));
        else for (String d : detectors) {
            if (d.isBlank()) continue;
            try {
                types.add(DetectorType.parse(d));
            } catch (IllegalArgumentException e) {
                throw new UserError(e.getMessage());
            }
        }
        if (types.isEmpty()) throw new UserError("--detectors names no detector; choose from " + DetectorType.allNames());
        if (maxFeatures < 1) throw new UserError("--max-features must be >= 1, got " + maxFeatures);
        if (!(epsilon > 0) || !Double.isFinite(epsilon)) throw new UserError("--epsilon must be > 0 px, got " + epsilon);
        List<DetectorConfig> out = new ArrayList<>();
        for (DetectorType t : types) {
            DetectorConfig c = DetectorConfig.defaults(t);
            c.maxFeatures = maxFeatures;
            out.add(c);
        }
        return out;
    }
}
