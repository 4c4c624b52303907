package org.targetbench.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Runs the command line in-process, capturing what it prints. */
final class Cli {
    record Result(int exit, String out, String err) {}

    private Cli() {}

    static Result run(String... args) {
        StringWriter out = new StringWriter(), err = new StringWriter();
        var cl = Main.commandLine();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        return new Result(code, out.toString(), err.toString());
    }
}
