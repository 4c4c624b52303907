package org.targetbench.cli;

import picocli.CommandLine.Model.CommandSpec;

/**
 * Old option spellings that keep working for one release: each use prints one line on stderr naming the new
 * spelling. The old options are hidden, so {@code --help} and the README show only the new ones.
 */
final class OldSpelling {
    private OldSpelling() {}

    static void note(CommandSpec spec, String old, String now) {
        var err = spec.commandLine().getErr();
        err.println("targetbench: note: " + old + " is deprecated and will be removed in the next release; use " + now);
        err.flush();
    }
}
