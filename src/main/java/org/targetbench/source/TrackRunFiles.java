package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads a tracking run's folder for {@code pick --tracks}: {@code tracks.csv}, the source named in
 * {@code summary.json}, and the registered truth of {@code track --target} in {@code registration/} (frame i of the
 * run is row i of registration.csv; registered.csv gives each designed feature's pixel per frame).
 */
public final class TrackRunFiles {
    private TrackRunFiles() {}

    /** One row of tracks.csv. */
    public record Row(int track, int frame, double x, double y, String outcome) {}

    /**
     * @param source      the footage the run tracked, as summary.json names it
     * @param rows        tracks.csv in file order
     * @param truePx      per frame index, designed feature id to its registered pixel {x, y}
     */
    public record Data(Path folder, String source, List<Row> rows, Map<Integer, Map<Integer, double[]>> truePx) {}

    public static Data read(Path dir) throws SourceException {
        Path tracks = dir.resolve("tracks.csv"), summary = dir.resolve("summary.json");
        Path registration = dir.resolve("registration").resolve("registration.csv"), registered = dir.resolve("registration").resolve("registered.csv");
        for (Path p : List.of(tracks, summary, registration, registered))
            if (!Files.isRegularFile(p))
                throw new SourceException("--tracks " + dir + ": " + dir.relativize(p) + " not found (give the output of track --target on the same design)");
        JsonNode root = JsonIn.parse(summary).root();
        String source = root.path("source").asText("unknown");
        List<Row> rows = new ArrayList<>();
        Map<String, Integer> frameIndex = new HashMap<>();
        Map<Integer, Map<Integer, double[]>> truth = new HashMap<>();
        try {
            List<String> reg = Files.readAllLines(registration, StandardCharsets.UTF_8);
            for (int i = 1; i < reg.size(); i++) frameIndex.put(CsvIn.split(reg.get(i)).get(0), i - 1);
            try (BufferedReader r = Files.newBufferedReader(tracks, StandardCharsets.UTF_8)) {
                String line = r.readLine();
                int n = 1;
                while ((line = r.readLine()) != null) {
                    n++;
                    List<String> c = CsvIn.split(line);
                    if (c.size() < 5) throw new SourceException(tracks + " line " + n + ": expected track,frame,x,y,outcome,fb_error");
                    rows.add(new Row(Integer.parseInt(c.get(0)), Integer.parseInt(c.get(1)), Double.parseDouble(c.get(2)), Double.parseDouble(c.get(3)), c.get(4)));
                }
            }
            List<String> pts = Files.readAllLines(registered, StandardCharsets.UTF_8);
            for (int i = 1; i < pts.size(); i++) {
                List<String> c = CsvIn.split(pts.get(i));
                Integer f = frameIndex.get(c.get(0));
                if (f == null) throw new SourceException(registered + " line " + (i + 1) + ": frame " + c.get(0) + " is not in registration.csv");
                truth.computeIfAbsent(f, k -> new HashMap<>()).put(Integer.parseInt(c.get(1)), new double[]{Double.parseDouble(c.get(4)), Double.parseDouble(c.get(5))});
            }
        } catch (IOException e) {
            throw new SourceException("--tracks " + dir + ": cannot read (" + e.getMessage() + ")");
        } catch (NumberFormatException | IndexOutOfBoundsException e) {
            throw new SourceException("--tracks " + dir + ": a malformed number or row in tracks.csv or registration/ (" + e.getMessage() + ")");
        }
        return new Data(dir, source, rows, truth);
    }
}
