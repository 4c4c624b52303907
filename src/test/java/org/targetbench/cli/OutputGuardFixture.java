package org.targetbench.cli;

import java.nio.file.Path;

/** Makes files in a folder count as written by an earlier run of this tool. */
final class OutputGuardFixture {
    private OutputGuardFixture() {}

    static void adopt(Path folder, String... files) {
        // no output-folder guard yet: every file counts as the tool's own
    }
}
