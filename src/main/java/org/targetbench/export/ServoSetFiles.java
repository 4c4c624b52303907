package org.targetbench.export;

import org.targetbench.servo.ServoSet;

import java.io.IOException;
import java.nio.file.Path;

/** Export of servo sets in both formats (reading is {@code formats.ServoSetReader}), chosen by file extension. */
public final class ServoSetFiles {
    private ServoSetFiles() {}

    /** Writes {@code stem.json} (recording "not rehearsed") and {@code stem.csv} into the output; returns their names. */
    public static String[] write(ServoSet set, AtomicOutput out, String stem) throws IOException {
        write(set, java.util.Optional.empty(), 0, out, stem, ""); // no rehearsal: the JSON says "not rehearsed"
        return new String[]{stem + ".json", stem + ".csv"};
    }

    /**
     * Writes the set as {@link #write(ServoSet, AtomicOutput, String)} does, its JSON recording the rehearsal run on
     * exactly this set (or "not rehearsed"); with a rehearsal, also its files under {@code rehearsalPrefix}: the report,
     * rehearsal.csv and rehearsal-summary.json that the report links to. Returns the names written.
     */
    public static java.util.List<String> write(ServoSet set, java.util.Optional<org.targetbench.servo.RehearsalResult> rehearsal, double elapsedS,
                                               AtomicOutput out, String stem, String rehearsalPrefix) throws IOException {
        ServoSetJson.write(set, rehearsal, rehearsalPrefix, out.file(stem + ".json"));
        ServoSetCsv.write(set, out.file(stem + ".csv"));
        java.util.List<String> files = new java.util.ArrayList<>(java.util.List.of(stem + ".json", stem + ".csv"));
        if (rehearsal.isPresent()) {
            var r = rehearsal.get();
            ServoWriters.writeRehearsalCsv(r, out.file(rehearsalPrefix + "rehearsal.csv"));
            ServoWriters.writeRehearsalSummary(r, stem + ".json", elapsedS, out.file(rehearsalPrefix + "rehearsal-summary.json"));
            files.add(rehearsalPrefix + "rehearsal.csv");
            files.add(rehearsalPrefix + "rehearsal-summary.json");
        }
        return files;
    }
}
