package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** cases/ is tested documentation: every case runs through 'check' and gives the verdict it promises. */
class CasesTest {

    static Path casesDir() {
        Path p = Path.of("").toAbsolutePath();
        while (p != null && !Files.isDirectory(p.resolve("cases"))) {
            p = p.getParent();
        }
        if (p == null) {
            throw new IllegalStateException("cases/ folder not found above " + Path.of("").toAbsolutePath());
        }
        return p.resolve("cases");
    }

    static Stream<Path> cases() throws IOException {
        List<Path> all;
        try (Stream<Path> s = Files.list(casesDir())) {
            all = s.filter(f -> f.toString().endsWith(".yaml")).sorted().toList();
        }
        assertFalse(all.isEmpty(), "no case files found");
        return all.stream();
    }

    @ParameterizedTest
    @MethodSource("cases")
    void everyCaseGivesTheVerdictItPromises(Path file) throws IOException {
        String text = Files.readString(file);
        assertTrue(text.startsWith("#"), file + " must start with a comment saying what it shows");
        assertTrue(text.toLowerCase().contains("invented values"), file + " must say its values are invented");
        String expect = text.lines().filter(l -> l.startsWith("# expect-verdict:")).findFirst()
                .map(l -> l.substring(l.indexOf(':') + 1).trim()).orElseThrow(() -> new AssertionError(file + " has no expect-verdict line"));
        CliRun r = CliRun.of("check", file.toString(), "--json");
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertEquals(expect, j.get("verdict").asText(), file.toString());
        for (JsonNode e : j.get("leading")) {
            assertTrue(e.get("residual").asDouble() < 1e-8, "eigenpair residual in " + file);
        }
        assertTrue(j.get("cautions").size() >= 3, "safety cautions present");
        // spectral abscissa <= numerical abscissa <= a-priori bound (Rayleigh quotient and Weyl's inequality;
        // common practice, no source), to round-off of the eigen-solvers
        JsonNode en = j.get("energy");
        double alpha = en.get("spectral_abscissa").asDouble();
        double omega = en.get("numerical_abscissa").asDouble();
        double bound = en.get("bound").asDouble();
        double tol = 1e-9 * Math.max(1, Math.abs(bound));
        assertTrue(alpha <= omega + tol && omega <= bound + tol, file + ": " + alpha + " <= " + omega + " <= " + bound);
    }
}
