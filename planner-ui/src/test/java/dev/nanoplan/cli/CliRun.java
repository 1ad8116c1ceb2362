package dev.nanoplan.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** One run of the command line in-process: exit status and what went to stdout and stderr. */
record CliRun(int status, String out, String err) {

    static CliRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = NanoplanCommand.execute(new PrintWriter(out), new PrintWriter(err), args);
        return new CliRun(status, out.toString(), err.toString());
    }
}
