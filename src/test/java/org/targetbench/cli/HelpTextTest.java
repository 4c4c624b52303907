package org.targetbench.cli;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * --help of every command renders cleanly: exit 0, usage on stdout, and nothing at all on stderr (picocli prints
 * format warnings there, for example for a lone % in an option description, to System.err, so that is captured too).
 */
class HelpTextTest {
    static Stream<String> commands() {
        return Stream.concat(Stream.of(""), Main.commandLine().getSubcommands().keySet().stream().filter(n -> !n.equals("help")));
    }

    @ParameterizedTest(name = "{0} --help")
    @MethodSource("commands")
    void helpPrintsNothingOnStderr(String command) {
        PrintStream saved = System.err;
        ByteArrayOutputStream sysErr = new ByteArrayOutputStream();
        Cli.Result r;
        try {
            System.setErr(new PrintStream(sysErr, true, StandardCharsets.UTF_8));
            r = command.isEmpty() ? Cli.run("--help") : Cli.run(command, "--help");
        } finally {
            System.setErr(saved);
        }
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("Usage:"), r.out());
        assertEquals("", r.err(), "stderr of the command line");
        assertEquals("", sysErr.toString(StandardCharsets.UTF_8), "System.err");
    }
}
