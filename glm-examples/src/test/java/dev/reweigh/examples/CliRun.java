package dev.reweigh.examples;

import java.io.PrintWriter;
import java.io.StringWriter;

/** One in-process run of the command line with its captured output. */
final class CliRun {
    final int status;
    final String out;
    final String err;

    private CliRun(int status, String out, String err) {
        this.status = status;
        this.out = out;
        this.err = err;
    }

    static CliRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = ReweighCli.run(args, new PrintWriter(out), new PrintWriter(err));
        return new CliRun(status, out.toString(), err.toString());
    }

    @Override
    public String toString() {
        return "status " + status + "\nstdout:\n" + out + "\nstderr:\n" + err;
    }
}
