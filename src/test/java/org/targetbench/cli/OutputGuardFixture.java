package org.targetbench.cli;

import org.targetbench.export.AtomicOutput;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;

/** Makes files in a folder count as written by an earlier run of this tool (listed in its manifest). */
final class OutputGuardFixture {
    private OutputGuardFixture() {}

    static void adopt(Path folder, String... files) throws IOException {
        Files.write(folder.resolve(AtomicOutput.MANIFEST), List.of(files), StandardOpenOption.CREATE, StandardOpenOption.APPEND);
    }
}
