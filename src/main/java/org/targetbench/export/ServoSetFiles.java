package org.targetbench.export;

import org.targetbench.servo.ServoSet;

import java.io.IOException;
import java.nio.file.Path;

/** Export of servo sets in both formats (reading is {@code formats.ServoSetReader}), chosen by file extension. */
public final class ServoSetFiles {
    private ServoSetFiles() {}

    /** Writes {@code stem.json} and {@code stem.csv} into the output; returns their names. */
    public static String[] write(ServoSet set, AtomicOutput out, String stem) throws IOException {
        ServoSetJson.write(set, out.file(stem + ".json"));
        ServoSetCsv.write(set, out.file(stem + ".csv"));
        return new String[]{stem + ".json", stem + ".csv"};
    }
}
