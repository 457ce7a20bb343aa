package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.casefile.CaseWriter;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;

/**
 * A case written back to YAML and read again gives the same results (every demo case), and hostile
 * inputs are refused quickly and safely with exit 2. The time limits below are guards against a hang
 * (generous, minutes-scale safety nets), not speed targets.
 */
class RoundTripAndHostileInputTest {

    @TempDir
    Path tmp;

    static java.util.stream.Stream<Path> cases() throws IOException {
        return CasesTest.cases();
    }

    @ParameterizedTest
    @MethodSource("cases")
    void writtenBackTheCaseGivesTheSameResults(Path file) {
        Case c = CaseReader.read(file);
        // read back under the original name, so that a mesh file is found in the same folder
        Case back = CaseReader.parse(CaseWriter.toYaml(c), file.toString());
        CheckResult a = StabilityCheck.run(c);
        CheckResult b = StabilityCheck.run(back);
        assertEquals(a.modes().size(), b.modes().size());
        for (int i = 0; i < a.modes().size(); i++) {
            EigenPair x = a.modes().get(i);
            EigenPair y = b.modes().get(i);
            assertEquals(x.re(), y.re(), 1e-10 * Math.max(1, Math.abs(x.re())), file + " mode " + i);
            assertEquals(x.im(), y.im(), 1e-10 * Math.max(1, Math.abs(x.im())), file + " mode " + i);
            assertTrue(y.residual() < 1e-8);
        }
        assertEquals(a.assessment().verdict(), b.assessment().verdict());
    }

    CliRun checkText(String caseText) throws IOException {
        Path p = tmp.resolve("hostile.yaml");
        Files.writeString(p, caseText);
        return CliRun.of("check", p.toString());
    }

    static String withSource(String source) {
        return "title: t\ngeometry: {shape: slab, from: 0, to: 1}\nmesh: {cells: 10}\nparameters: {d: 1}\n"
                + "fields:\n  - name: u\n    diffusivity: 1\n    source: " + source + "\n    initial: 0\n"
                + "boundaries:\n  left: {u: insulated}\n  right: {u: {fixed: 0}}\n";
    }

    @Test
    void hostileInputsAreRefusedQuicklyWithExitTwo() {
        assertTimeoutPreemptively(Duration.ofSeconds(60), () -> {
            // deeply nested formula
            CliRun deep = checkText(withSource("(".repeat(3000) + "u" + ")".repeat(3000)));
            assertEquals(2, deep.code(), deep.err());
            assertTrue(deep.err().contains("fields[0].source"), deep.err());
            // a formula of about 1 MB: the file itself is at the size limit
            CliRun huge = checkText(withSource("u+".repeat(600_000) + "u"));
            assertEquals(2, huge.code(), huge.err());
            // a long formula under the file limit but over the formula limit
            CliRun longer = checkText(withSource("u+".repeat(20_000) + "u"));
            assertEquals(2, longer.code(), longer.err());
            // names with odd Unicode
            CliRun uni = checkText(withSource("d*exp(\u00fc)"));
            assertEquals(2, uni.code(), uni.err());
            // billion-laughs alias expansion
            StringBuilder bomb = new StringBuilder("a: &a [\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\",\"lol\"]\n");
            String prev = "a";
            for (int i = 0; i < 9; i++) {
                String name = "b" + i;
                bomb.append(name).append(": &").append(name).append(" [");
                for (int j = 0; j < 9; j++) {
                    bomb.append(j == 0 ? "" : ",").append('*').append(prev);
                }
                bomb.append("]\n");
                prev = name;
            }
            CliRun laughs = checkText(bomb.toString());
            assertEquals(2, laughs.code(), laughs.err());
            assertEquals(1, laughs.err().strip().lines().count(), laughs.err());
        });
    }

    @Test
    void noStackTraceUnlessDebug() throws IOException {
        CliRun r = checkText(withSource("d*exp(u"));
        assertEquals(2, r.code());
        assertTrue(!r.err().contains("\tat "), r.err());
        Path p = tmp.resolve("hostile.yaml");
        CliRun dbg = CliRun.of("check", p.toString(), "--debug");
        assertEquals(2, dbg.code());
        assertTrue(dbg.err().contains("\tat "), "stack trace with --debug");
    }
}
