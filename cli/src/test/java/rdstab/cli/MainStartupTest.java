package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * The start-up shortcuts in {@link Main} change nothing a user sees: the subcommand table matches the
 * annotations, no option needs the picocli converters that are switched off, and netlib's fallback warning
 * stays off stderr although java.util.logging is no longer configured at start-up.
 */
class MainStartupTest {

    @Test
    void subcommandNamesAreTheAnnotatedNamesInHelpOrder() {
        List<String> annotated = new ArrayList<>();
        for (String name : Main.SUBCOMMAND_NAMES) {
            annotated.add(Main.subcommand(name).getAnnotation(CommandLine.Command.class).name());
        }
        assertEquals(Main.SUBCOMMAND_NAMES, annotated);
        assertEquals(Main.SUBCOMMAND_NAMES, new ArrayList<>(Main.commandLine().getSubcommands().keySet()));
        // a known first argument builds that command only; anything else, the whole tree
        assertEquals(List.of("check"), new ArrayList<>(Main.commandLine("check").getSubcommands().keySet()));
        assertEquals(Main.SUBCOMMAND_NAMES, new ArrayList<>(Main.commandLine("help").getSubcommands().keySet()));
        assertEquals(Main.SUBCOMMAND_NAMES, new ArrayList<>(Main.commandLine("chek").getSubcommands().keySet()));
    }

    @Test
    void noOptionHasATypeWhoseConverterIsSwitchedOff() {
        assertTrue("java.time.Duration".matches(Main.UNUSED_CONVERTERS));
        assertTrue("java.sql.Timestamp".matches(Main.UNUSED_CONVERTERS));
        assertFalse("java.nio.file.Path".matches(Main.UNUSED_CONVERTERS));
        assertEquals(Main.UNUSED_CONVERTERS, System.getProperty("picocli.converters.excludes"));
        List<String> types = new ArrayList<>();
        collectTypes(Main.commandLine().getCommandSpec(), types);
        assertTrue(types.contains("java.nio.file.Path"), "the walk reaches the options: " + types);
        for (String t : types) {
            assertFalse(t.matches(Main.UNUSED_CONVERTERS), "an option of type " + t + " needs a converter that is off");
        }
    }

    private static void collectTypes(CommandSpec spec, List<String> into) {
        for (ArgSpec a : spec.args()) {
            into.add(a.type().getName());
            for (Class<?> c : a.auxiliaryTypes()) {
                into.add(c.getName());
            }
        }
        for (CommandLine sub : spec.subcommands().values()) {
            collectTypes(sub.getCommandSpec(), into);
        }
    }

    /**
     * A non-symmetric case goes through netlib's ARPACK, which logs a warning (java.util.logging, straight to
     * System.err) when its native build cannot be loaded. A fresh JVM is needed: the logging configuration is
     * read once per JVM. -Dos.arch=none makes netlib's native load fail whether or not libarpack is installed
     * here. Run once more with the configuration class replaced by a missing one, the warning appears, so the
     * check can fail.
     */
    @Test
    void netlibFallbackWarningStaysOffStderr() throws Exception {
        Path c = Path.of("..", "cases", "brusselator-turing.yaml").toAbsolutePath().normalize();
        String quiet = run(List.of("-Dos.arch=none"), "check", c.toString());
        assertEquals("", quiet);
        String loud = run(List.of("-Dos.arch=none", "-Djava.util.logging.config.class=rdstab.cli.NoSuchClass"),
                "check", c.toString());
        assertTrue(loud.contains("dev.ludovic.netlib"), "control run shows netlib's warning: " + loud);
    }

    private static String run(List<String> jvm, String... args) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Xss8m", "-XX:+UseSerialGC", "-cp", System.getProperty("java.class.path")));
        cmd.addAll(jvm);
        cmd.add("rdstab.cli.Main");
        cmd.addAll(List.of(args));
        Process p = new ProcessBuilder(cmd).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        byte[] err = p.getErrorStream().readAllBytes();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "finished");
        assertEquals(0, p.exitValue(), new String(err, StandardCharsets.UTF_8));
        return new String(err, StandardCharsets.UTF_8);
    }
}
