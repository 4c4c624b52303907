package org.targetbench.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.ServoSetJson;
import org.targetbench.formats.ServoSetReader;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.ServoFixtures;
import org.targetbench.servo.ServoSet;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The one export of a servo set: the JSON records the rehearsal run on exactly the set (or "not rehearsed"), the files
 * the rehearsal report names are written beside it, and an exported set read back can be exported again unchanged.
 */
class ServoSetExportTest {
    @Test
    void aRehearsedSetRecordsItsRehearsalAndTheReportsFilesAreBesideIt(@TempDir Path tmp) throws Exception {
        ServoSet set = ServoFixtures.centredSquare(100, 0.5);
        RehearsalConfig c = new RehearsalConfig();
        c.starts = 10;
        c.threads = 1;
        RehearsalResult r = Rehearsal.run(set, c);
        Path dir = tmp.resolve("out");
        List<String> files;
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            files = ServoSetExport.write(set, Optional.empty(), Optional.of(r), 0.5, out, "servo-set", "rehearsal/");
            out.commit();
        }
        assertEquals(List.of("servo-set.json", "servo-set.csv"), files.subList(0, 2));
        for (String f : files) assertTrue(Files.isRegularFile(dir.resolve(f)), "listed and written: " + f);
        String html = Files.readString(dir.resolve("rehearsal/rehearsal.html"));
        for (String named : List.of("rehearsal.csv", "rehearsal-summary.json")) {
            assertTrue(html.contains(named), "the report names " + named);
            assertTrue(Files.isRegularFile(dir.resolve("rehearsal").resolve(named)), named + " is beside the report");
        }
        JsonNode json = new ObjectMapper().readTree(dir.resolve("servo-set.json").toFile());
        assertEquals("rehearsal/", json.at("/rehearsal/files").asText());
        assertEquals(r.summary().runs(), json.at("/rehearsal/summary/runs").asInt());
        assertEquals(c.starts, json.at("/rehearsal/settings/starts").asInt());

        // loaded back (to rehearse or re-export), the set is the same; exported without its rehearsal it says so
        ServoSet back = ServoSetReader.read(dir.resolve("servo-set.json"));
        assertEquals(set, back);
        Path again = tmp.resolve("again");
        try (AtomicOutput out = AtomicOutput.open(again)) {
            assertEquals(List.of("servo-set.json", "servo-set.csv", "servo-set-selection.csv"),
                    ServoSetExport.write(back, Optional.empty(), Optional.empty(), 0, out, "servo-set", "rehearsal/"));
            out.commit();
        }
        // the selection file comes from the set itself, so an older one in the folder cannot contradict it
        List<String> selection = Files.readAllLines(again.resolve("servo-set-selection.csv"));
        assertEquals(set.points().size(), selection.size() - 1, "one row per point of the set");
        assertTrue(selection.stream().skip(1).allMatch(l -> l.contains(",chosen,")), "every row is a chosen point");
        assertEquals(ServoSetJson.NOT_REHEARSED, new ObjectMapper().readTree(again.resolve("servo-set.json").toFile()).get("rehearsal").asText());
        assertFalse(Files.exists(again.resolve("rehearsal")));
        assertEquals(set, ServoSetReader.read(again.resolve("servo-set.json")));
    }
}
