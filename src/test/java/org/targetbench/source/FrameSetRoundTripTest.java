package org.targetbench.source;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.pipeline.Progress;

import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.*;

/** Frames written by the render path read back through the folder source with the same pixels and truth. */
class FrameSetRoundTripTest {
    /** Truth is written as decimal JSON; doubles survive exactly with Jackson's shortest round-trip form. */
    private static final double EXACT = 0;

    @Test
    void pixelsAndTruthSurviveTheFolderFormat(@TempDir Path tmp) throws Exception {
        try (AtomicOutput out = AtomicOutput.open(tmp.resolve("set"))) {
            FrameSetWriter.write(SourceContractTest.synthetic(), out, "", Progress.NONE);
            out.commit();
        }
        try (SyntheticSource a = SourceContractTest.synthetic(); ImageFolderSource b = ImageFolderSource.open(tmp.resolve("set"), null)) {
            for (int i = 0; i < 3; i++) {
                SourceFrame fa = a.next().orElseThrow(), fb = b.next().orElseThrow();
                assertEquals(fa.name(), fb.name());
                assertArrayEquals(fa.image().data, fb.image().data, "8-bit PNG must hold the quantised render exactly");
                assertArrayEquals(fa.truth().fromReference().orElseThrow().toArray(), fb.truth().fromReference().orElseThrow().toArray(), EXACT);
                assertEquals(fa.truth().features(), fb.truth().features());
            }
        }
    }
}
