package org.targetbench.cli;

import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** The stand-off, in millimetres on every command ({@code --standoff-mm}); mixed into check, sweep and shootout. */
final class StandoffOption {
    @Spec(Spec.Target.MIXEE) CommandSpec spec;

    @Option(names = "--standoff-mm", paramLabel = "MM", description = "Distance from the camera to the target's centre, mm.")
    Double mm;

    /** The stand-off in mm, or null when not given. */
    Double mm() { return mm; }

    /** The stand-off in mm; a one-line error when it was not given or is not positive. */
    double required() {
        if (mm == null) throw new UserError("--standoff-mm is required: the distance from the camera to the target, mm");
        return positive();
    }

    double positive() {
        if (!(mm > 0) || !Double.isFinite(mm)) throw new UserError("--standoff-mm must be > 0 mm, got " + mm);
        return mm;
    }
}
