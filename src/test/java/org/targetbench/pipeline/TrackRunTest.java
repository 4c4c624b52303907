package org.targetbench.pipeline;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.detect.ShiTomasiConfig;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.TrackWriter;
import org.targetbench.source.FakeCamera;
import org.targetbench.source.WebcamSource;
import org.targetbench.track.KltConfig;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.*;

/** Live runs: a camera that goes away ends the run cleanly and what was measured is written; a stop keeps it too. */
class TrackRunTest {
    @TempDir Path tmp;

    static TrackRun run(int maxFrames) {
        return new TrackRun(new KltConfig(), new ShiTomasiConfig(), 3, false, maxFrames);
    }

    @Test
    void aCameraThatDisappearsEndsTheRunAndKeepsWhatWasMeasured() throws Exception {
        for (boolean failHard : new boolean[]{false, true}) {
            FakeCamera cam = new FakeCamera(320, 240, 9, failHard);
            Path out = tmp.resolve("cam-" + failHard);
            TrackResult r;
            try (WebcamSource src = new WebcamSource(cam, "simulated camera"); AtomicOutput o = AtomicOutput.open(out); TrackWriter w = new TrackWriter(o)) {
                r = run(0).run(src, w, Progress.NONE, () -> false);
                w.finish(r);
                o.commit();
            }
            assertTrue(cam.closed(), "camera released");
            assertEquals(TrackResult.Stop.SOURCE_LOST, r.stop());
            assertTrue(r.endNote().orElseThrow().contains("after 9 frames"), r.endNote().toString());
            assertEquals(9, r.score().frames());
            List<String> survival = Files.readAllLines(out.resolve("survival.csv"));
            assertEquals(1 + 9, survival.size());
            JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
            assertEquals("source_lost", s.get("stopped_by").asText());
            assertTrue(s.get("end_note").asText().contains("simulated camera"), s.toString());
            assertTrue(s.get("drift_px").isNull(), "a camera has no truth");
        }
    }

    @Test
    void frameLimitAndCancellationStopTheRun() throws Exception {
        TrackResult limited = run(4).run(new WebcamSource(new FakeCamera(320, 240, 100, false), "cam"), TrackSink.NONE, Progress.NONE, () -> false);
        assertEquals(TrackResult.Stop.FRAME_LIMIT, limited.stop());
        assertEquals(4, limited.score().frames());
        AtomicInteger polls = new AtomicInteger();
        TrackResult stopped = run(0).run(new WebcamSource(new FakeCamera(320, 240, 100, false), "cam"), TrackSink.NONE, Progress.NONE,
                () -> polls.incrementAndGet() > 6);
        assertEquals(TrackResult.Stop.CANCELLED, stopped.stop());
        assertEquals(6, stopped.score().frames());
    }

    @Test
    void aSourceWithNoFramesIsAnError() {
        var e = assertThrows(org.targetbench.source.SourceException.class,
                () -> run(0).run(new WebcamSource(new FakeCamera(320, 240, 0, false), "cam"), TrackSink.NONE, Progress.NONE, () -> false));
        assertTrue(e.getMessage().contains("no frames"), e.getMessage());
    }
}
