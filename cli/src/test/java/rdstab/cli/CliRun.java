package rdstab.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Runs the command line in-process and captures exit status, stdout and stderr. */
record CliRun(int code, String out, String err) {

    static CliRun of(String... args) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = Main.execute(args, new PrintWriter(o), new PrintWriter(e));
        return new CliRun(code, o.toString(), e.toString());
    }
}
