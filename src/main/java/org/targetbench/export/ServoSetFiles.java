package org.targetbench.export;

import org.targetbench.servo.ServoSet;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;

/** Import and export of servo sets in both formats, chosen by file extension. */
public final class ServoSetFiles {
    private ServoSetFiles() {}

    /** Reads {@code .json} or {@code .csv}. */
    public static ServoSet read(Path file) throws SourceException {
        String n = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (n.endsWith(".csv")) return ServoSetCsv.read(file);
        if (n.endsWith(".json")) return ServoSetJson.read(file);
        throw new SourceException("cannot tell the format of " + file + ": a servo set ends in .json or .csv");
    }

    /** Writes {@code stem.json} and {@code stem.csv} into the output; returns their names. */
    public static String[] write(ServoSet set, AtomicOutput out, String stem) throws IOException {
        ServoSetJson.write(set, out.file(stem + ".json"));
        ServoSetCsv.write(set, out.file(stem + ".csv"));
        return new String[]{stem + ".json", stem + ".csv"};
    }
}
