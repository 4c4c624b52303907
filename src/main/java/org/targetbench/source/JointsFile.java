package org.targetbench.source;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads start joints: a CSV with one start per row, six joint angles in degrees (q1..q6); an optional header row
 * starting with a letter and lines starting with '#' are skipped. Returns radians.
 */
public final class JointsFile {
    private JointsFile() {}

    public static List<double[]> read(Path file) throws SourceException {
        if (!Files.isRegularFile(file)) throw new SourceException("start joints file not found: " + file);
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + ImageFiles.oneLine(e));
        }
        List<double[]> out = new ArrayList<>();
        for (int n = 0; n < lines.size(); n++) {
            String l = lines.get(n).strip();
            if (l.isEmpty() || l.startsWith("#")) continue;
            if (out.isEmpty() && Character.isLetter(l.charAt(0))) continue;
            List<String> cells = CsvIn.split(l);
            if (cells.size() != 6) throw new SourceException(file + " line " + (n + 1) + ": needs 6 joint angles in degrees, got " + cells.size() + " values");
            double[] q = new double[6];
            for (int i = 0; i < 6; i++) {
                try {
                    q[i] = Math.toRadians(Double.parseDouble(cells.get(i).trim()));
                } catch (NumberFormatException e) {
                    throw new SourceException(file + " line " + (n + 1) + ": joint " + (i + 1) + " is not a number: \"" + cells.get(i) + "\"");
                }
                if (!Double.isFinite(q[i])) throw new SourceException(file + " line " + (n + 1) + ": joint " + (i + 1) + " must be finite");
            }
            out.add(q);
        }
        if (out.isEmpty()) throw new SourceException(file + " holds no start joints");
        return out;
    }
}
