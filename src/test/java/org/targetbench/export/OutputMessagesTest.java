package org.targetbench.export;

import org.junit.jupiter.api.Test;

import java.nio.file.AccessDeniedException;

import static org.junit.jupiter.api.Assertions.*;

/** File-system errors whose message is only a path say what went wrong with it ("cannot write output folder X: X" no more). */
class OutputMessagesTest {
    @Test
    void pathOnlyMessagesSayWhatWentWrong() {
        assertEquals("/data/out permission denied", AtomicOutput.oneLine(new AccessDeniedException("/data/out")));
        assertEquals("/data/x does not exist", AtomicOutput.oneLine(new java.nio.file.NoSuchFileException("/data/x")));
    }
}
