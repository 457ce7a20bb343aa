package rdstab.solver.casefile;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;

/**
 * Mutation fuzzing of the case reader (common practice, no source): valid case texts are mutated at
 * random (seeded) — characters deleted, inserted, lines duplicated, swapped or re-indented, YAML
 * punctuation and odd Unicode sprinkled in, numbers replaced — and every result must be either a case
 * or an {@link InputException} that carries a place. Anything else (a NullPointerException, a
 * ClassCastException, a stack overflow, an IllegalStateException) is a defect.
 *
 * <p>{@code -Drdstab.fuzz.count=N} sets the number of inputs (default 10,000; scripts/fuzz.sh runs more).
 * Inputs that once broke the reader live in src/test/resources/casefile-corpus and are replayed by
 * {@link #corpusReplays()}.
 */
class CaseFileFuzzTest {

    static final String[] SEEDS = {
        CaseReaderTest.GOOD,
        String.join("\n", "title: sphere", "geometry: {shape: sphere, from: 0, to: 1}",
                "mesh: {cells: 20, stretch: {toward: right, strength: 2}}",
                "parameters: {delta: 2.6, eps: 0.03, Bi: 20, Ta: 30 degC}", "derived: {g: delta*Bi}",
                "fields:", "  - name: u", "    diffusivity: 1 + 0.1*u", "    source: delta*exp(u/(1 + eps*u))", "    initial: 0",
                "boundaries:", "  outer:", "    u: {convective: {h: Bi, ambient: 0}}",
                "analysis: {modes: 4, shift: auto, marginal-band: 1e-6}", ""),
        String.join("\n", "title: physical", "geometry: {shape: slab}", "self-heating:", "  density: 600 kg/m^3",
                "  heat-capacity: 1800 J/(kg*K)", "  conductivity: 0.12 W/(m*K)", "  size: 0.5 m",
                "  activation-energy: 110 kJ/mol", "  pre-exponential-factor: 5e9 1/s", "  heat-of-reaction: 3.0e6 J/kg",
                "  surface-heat-transfer: 8 W/(m^2*K)", "  ambient-temperature: 30 degC", "  kinetics: arrhenius", ""),
    };
    static final String[] SPRINKLE = {":", "-", "- ", "[", "]", "{", "}", "&a ", "*a", "!!str ", "!!float ", "%", "@", "`",
        "\"", "'", "#", "|", ">", "\t", "\n", "  ", ",", "?", "é", "Δ", "\u200b", "\u0000", "😀", "1e999", "-0", "NaN", ".inf",
        "~", "null", "<<: *a", "x", "u", "(", ")", "^", "*", "/"};

    static String mutate(String text, Random r) {
        StringBuilder sb = new StringBuilder(text);
        int edits = 1 + r.nextInt(4);
        for (int e = 0; e < edits && sb.length() > 0; e++) {
            int pos = r.nextInt(sb.length());
            switch (r.nextInt(6)) {
                case 0 -> sb.delete(pos, Math.min(sb.length(), pos + 1 + r.nextInt(8)));
                case 1 -> sb.insert(pos, SPRINKLE[r.nextInt(SPRINKLE.length)]);
                case 2 -> sb.setCharAt(pos, (char) (32 + r.nextInt(95)));
                case 3 -> {
                    String[] lines = sb.toString().split("\n", -1);
                    int a = r.nextInt(lines.length);
                    int b = r.nextInt(lines.length);
                    String t = lines[a];
                    lines[a] = lines[b];
                    lines[b] = r.nextBoolean() ? t : "  " + t;
                    sb = new StringBuilder(String.join("\n", lines));
                }
                case 4 -> {
                    String[] lines = sb.toString().split("\n", -1);
                    int a = r.nextInt(lines.length);
                    List<String> l = new ArrayList<>(List.of(lines));
                    l.add(a, lines[a]);
                    sb = new StringBuilder(String.join("\n", l));
                }
                default -> sb.replace(pos, Math.min(sb.length(), pos + 3), Integer.toString(r.nextInt(2000) - 1000));
            }
        }
        return sb.toString();
    }

    /** Parses; returns null when fine, else a description of the defect. */
    static String defect(String text) {
        try {
            Case c = CaseReader.parse(text, "fuzz.yaml");
            assertNotNull(c);
            rdstab.solver.setup.ProblemBuilder.build(c);
            return null;
        } catch (InputException e) {
            if (e.place() == null || e.place().isBlank()) {
                return "error without a place: " + e.getMessage();
            }
            if (e.getMessage().contains("\n")) {
                return "error on more than one line: " + e.getMessage();
            }
            return null;
        } catch (RuntimeException | StackOverflowError e) {
            return e.getClass().getName() + ": " + e.getMessage();
        }
    }

    @Test
    void mutatedCaseFilesGiveACaseOrAPlacedInputError() {
        int count = Integer.getInteger("rdstab.fuzz.count", 10_000);
        Random r = new Random(Long.getLong("rdstab.fuzz.seed", 20261202L));
        List<String> problems = new ArrayList<>();
        for (int i = 0; i < count && problems.size() < 5; i++) {
            String input = mutate(SEEDS[r.nextInt(SEEDS.length)], r);
            String d = defect(input);
            if (d != null) {
                problems.add(d + "\n--- input ---\n" + input);
            }
        }
        if (!problems.isEmpty()) {
            fail(problems.size() + " defects, first:\n" + problems.get(0));
        }
    }

    @Test
    void corpusReplays() throws IOException {
        Path dir = Path.of(java.util.Objects.requireNonNull(getClass().getResource("/casefile-corpus/"), "corpus").getPath());
        List<Path> files;
        try (Stream<Path> s = Files.list(dir)) {
            files = s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
        }
        assertFalse(files.isEmpty(), "the corpus of once-breaking inputs is kept");
        for (Path p : files) {
            String text = new String(Files.readAllBytes(p), StandardCharsets.UTF_8);
            String d = defect(text);
            assertTrue(d == null, p.getFileName() + ": " + d);
        }
    }

    static void save(Path dir, String name, String text) {
        try {
            Files.writeString(dir.resolve(name), text);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
