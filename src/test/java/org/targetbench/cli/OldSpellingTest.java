package org.targetbench.cli;

import org.junit.jupiter.api.Test;
import picocli.CommandLine;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The one command-line vocabulary: old spellings still work for one release, with exactly one deprecation line on
 * stderr, and give what the new spelling gives; --help shows only the new spellings.
 */
class OldSpellingTest {
    private static final Path CB15 = DesignCheckCalibrateCliTest.CB15;
    private static final Path YAML = DesignCheckCalibrateCliTest.YAML;

    @Test
    void oldStandoffGivesTheSameCheckWithOneNote() {
        Cli.Result now = Cli.run("check", "--target", CB15.toString(), "--camera", YAML.toString(), "--standoff-mm", "300", "--window-radius", "4");
        Cli.Result old = Cli.run("check", "--target", CB15.toString(), "--camera", YAML.toString(), "--standoff", "300", "--window", "4");
        assertEquals(now.exit(), old.exit(), old.err());
        assertEquals(now.out(), old.out());
        assertEquals("", now.err());
        List<String> lines = old.err().lines().toList();
        assertEquals(2, lines.size(), old.err());
        assertTrue(lines.get(0).contains("--standoff is deprecated") && lines.get(0).contains("--standoff-mm"), lines.get(0));
        assertTrue(lines.get(1).contains("--window is deprecated") && lines.get(1).contains("--window-radius"), lines.get(1));
    }

    @Test
    void trackAndCalibrateMapTheirOldOptions() {
        TrackCommand t = parse(new TrackCommand(), "--source", "synthetic:still", "--out", "x", "--frames", "12", "--levels", "3", "--window", "5");
        assertEquals(12, t.frames);
        assertEquals(3, t.levels);
        assertEquals(5, t.window);
        CalibrateCommand c = parse(new CalibrateCommand(), "--frames", "dir", "--board", "9x6", "--square", "25");
        assertEquals("9x6", c.board);
        assertEquals(25.0, c.squareMm);
        RecordCommand r = parse(new RecordCommand(), "--source", "synthetic:still", "--out", "x.avi", "--frames", "7");
        assertEquals(7, r.frames);
    }

    @Test
    void helpShowsOnlyTheNewSpellings() {
        for (String cmd : List.of("check", "track", "record", "calibrate", "sweep", "shootout", "rehearse")) {
            StringWriter out = new StringWriter();
            var cl = Main.commandLine();
            cl.setOut(new PrintWriter(out, true));
            cl.execute(cmd, "--help");
            String help = out.toString();
            for (String old : List.of("--standoff ", "--standoff=", "--board", "--square ", "--square=", "--window ", "--window=",
                    "desired", "or mean"))
                assertFalse(help.contains(old), cmd + " --help shows " + old + ":\n" + help);
            if (cmd.equals("track")) assertFalse(help.contains("--frames"), help);
        }
    }

    private static <T> T parse(T command, String... args) {
        CommandLine cl = new CommandLine(command);
        cl.setErr(new PrintWriter(new StringWriter(), true));
        cl.parseArgs(args);
        return command;
    }
}
