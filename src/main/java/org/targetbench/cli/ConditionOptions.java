package org.targetbench.cli;

import picocli.CommandLine.Option;

import java.nio.file.Path;
import java.util.List;

/** The conditions a sweep degrades by, its operating envelope and its seed; mixed into sweep and shootout. */
final class ConditionOptions {
    @Option(names = "--kinds", split = ",", paramLabel = "KIND",
            description = "What to sweep: lighting, blur, noise, jpeg, viewpoint (each its main parameter), a parameter such as "
                    + "blur.motion or lighting.gamma, a kind followed by .all, or all (default: the five kinds).")
    List<String> kinds;

    @Option(names = "--envelope", paramLabel = "FILE", description = "Operating envelope: the harshest value of each parameter your cell will see (JSON).")
    Path envelope;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed of every random choice (default: ${DEFAULT-VALUE}).")
    long seed;
}
