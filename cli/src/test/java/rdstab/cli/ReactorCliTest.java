package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Flow-reactor features through the command line: drift schemes, Péclet warning, energy weights, bad input. */
class ReactorCliTest {

    @TempDir
    Path tmp;

    static String convection(double d, double c, int cells, String scheme, String extra) {
        return "title: convection-diffusion\ngeometry: {shape: slab, from: 0, to: 1}\nmesh: {cells: " + cells + "}\n"
                + "parameters: {D: " + d + ", c: " + c + "}\n"
                + "fields:\n  - name: u\n    diffusivity: D\n    drift: c\n    source: 0\n"
                + "boundaries:\n  left: {u: {fixed: 0}}\n  right: {u: {fixed: 0}}\n"
                + "analysis: {modes: 4, drift-scheme: " + scheme + extra + "}\n";
    }

    JsonNode json(String name, String text, String... more) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text);
        String[] args = new String[3 + more.length];
        args[0] = "check";
        args[1] = p.toString();
        args[2] = "--json";
        System.arraycopy(more, 0, args, 3, more.length);
        CliRun r = CliRun.of(args);
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        for (JsonNode e : j.get("leading")) {
            assertTrue(e.get("residual").asDouble() < 1e-10, "residual " + e);
        }
        return j;
    }

    /**
     * Resolved drift (cell Pe 0.25): σ_n = −D(nπ)² − c²/(4D) (substitution u = e^{cx/2D} w, REFERENCE-CHECKS),
     * centred scheme to O(h²); no warning; the report states the scheme and Pe = cL/D.
     */
    @Test
    void resolvedDriftMatchesTheAnalyticSpectrum() throws IOException {
        JsonNode j = json("cd.yaml", convection(0.1, 1, 400, "centred", ""));
        for (int n = 1; n <= 3; n++) {
            double exact = -0.1 * n * n * Math.PI * Math.PI - 2.5;
            assertEquals(exact, j.get("leading").get(n - 1).get("re").asDouble(), 2e-4 * Math.abs(exact));
        }
        assertEquals("centred", j.get("transport").get("drift_scheme").asText());
        assertEquals(10.0, j.get("transport").get("fields").get(0).get("peclet").asDouble(), 1e-12);
        assertEquals(0.025, j.get("transport").get("fields").get(0).get("cell_peclet").asDouble(), 1e-12);
        assertFalse(j.get("warnings").toString().contains("Péclet"), j.get("warnings").toString());
    }

    /**
     * Under-resolved drift: D = 0.04, c = 1, 10 cells, cell Pe = ch/D = 2.5 &gt; 2. On a uniform grid with fixed
     * ends M⁻¹J is the tridiagonal Toeplitz matrix (sub b, diagonal a, super c) whose eigenvalues are
     * a + 2√(bc) cos(nπ/N) (standard result for tridiagonal Toeplitz matrices, from memory). Centred:
     * b = D/h² + c/2h, super = D/h² − c/2h &lt; 0, so the eigenvalues are spuriously complex with Re = −2D/h²,
     * and the report warns; upwind: b = D/h² + c/h, super = D/h², real eigenvalues, no warning.
     * (Few cells on purpose: the eigenvectors grow like |b/super|^{i/2} = 3^i along the grid, so the
     * eigenvalues of longer grids are too ill-conditioned for any eigen-solver in double precision.)
     */
    @Test
    void cellPecletAboveTwoWarnsAndUpwindRuns() throws IOException {
        double d = 0.04;
        double c = 1;
        int cells = 10;
        double h = 1.0 / cells;
        JsonNode centred = json("cen.yaml", convection(d, c, cells, "centred", ""));
        assertTrue(centred.get("warnings").toString().contains("cell Péclet number of field 'u' is 2.5"),
                centred.get("warnings").toString());
        assertTrue(centred.get("warnings").toString().contains("drift-scheme: upwind"));
        double offProduct = (d / (h * h) + c / (2 * h)) * (d / (h * h) - c / (2 * h));
        boolean complex = false;
        for (JsonNode e : centred.get("leading")) {
            // every eigenvalue has Re = −2D/h² (a tie: the order among them is arbitrary) and Im = ±2√|bc| cos(nπ/N)
            assertEquals(-2 * d / (h * h), e.get("re").asDouble(), 1e-9 * 2 * d / (h * h));
            double im = Math.abs(e.get("im").asDouble());
            double nearest = Double.MAX_VALUE;
            for (int n = 1; n < cells; n++) {
                nearest = Math.min(nearest, Math.abs(im - 2 * Math.sqrt(-offProduct) * Math.abs(Math.cos(n * Math.PI / cells))));
            }
            assertEquals(0.0, nearest, 1e-8, "Im λ = " + im);
            complex |= im > 1;
        }
        assertTrue(complex, "spurious complex eigenvalues");

        JsonNode upwind = json("up.yaml", convection(d, c, cells, "upwind", ""));
        assertEquals("upwind", upwind.get("transport").get("drift_scheme").asText());
        assertFalse(upwind.get("warnings").toString().contains("Péclet"));
        double a = -2 * d / (h * h) - c / h;
        double exact = a + 2 * Math.sqrt((d / (h * h) + c / h) * (d / (h * h))) * Math.cos(Math.PI / cells);
        assertEquals(exact, upwind.get("growth_rate").asDouble(), 1e-9 * Math.abs(exact));
        assertEquals(0.0, upwind.get("leading").get(0).get("im").asDouble(), 0.0);
    }

    /** Energy weights from the case file are used and stated; the transient-growth demo reports its peak. */
    @Test
    void givenWeightsAreReportedAndTheReactorDemoShowsTransientGrowth() throws IOException {
        Path demo = CasesTest.casesDir().resolve("tubular-reactor-cooled.yaml");
        String text = Files.readString(demo).replace("analysis:", "analysis_unused:")
                + "analysis:\n  energy-weights: [1, 0.5]\n";
        JsonNode j = json("w.yaml", text);
        assertEquals("given", j.get("energy").get("weight_choice").asText());
        assertEquals(0.5, j.get("energy").get("weights").get(1).asDouble(), 0.0);
        CliRun r = CliRun.of("check", demo.toString(), "--json");
        JsonNode d = new ObjectMapper().readTree(r.out());
        assertEquals("chosen to minimise the bound", d.get("energy").get("weight_choice").asText());
        assertTrue(d.get("energy").get("bound").asDouble() <= d.get("energy").get("unit_weight_bound").asDouble());
        assertTrue(d.get("energy").get("peak_amplification").asDouble() > 1, d.get("energy").toString());
        assertTrue(d.get("energy").get("peak_time").asDouble() > 0);
        CliRun text2 = CliRun.of("check", demo.toString());
        assertTrue(text2.out().contains("Danckwerts") || text2.out().contains("Transport (drift scheme centred"), text2.out());
        assertTrue(text2.out().contains("peak amplification"), text2.out());
        CliRun skipped = CliRun.of("check", demo.toString(), "--json", "--amplification-budget", "0");
        assertTrue(new ObjectMapper().readTree(skipped.out()).get("energy").get("peak_amplification").isNull());
    }

    /**
     * The reactor demo at Péclet 200 (--set): eigenvalue condition numbers near e^100 in the original coordinates.
     * The leading eigenvalues must come out real (the transport part is similar to a symmetric operator and the
     * couplings do not make this case oscillatory; before the symmetrizing scaling the solver returned −19.9 and
     * spurious complex pairs), with small error estimates, a huge sensitivity and its warning, in text and JSON.
     */
    @Test
    void convectionDominatedReactorIsComputedAccuratelyAndFlagged() throws IOException {
        Path demo = CasesTest.casesDir().resolve("tubular-reactor-cooled.yaml");
        CliRun r = CliRun.of("check", demo.toString(), "--json", "--set", "Pe_m=200", "--set", "Pe_h=200", "--cells", "400",
                "--amplification-budget", "0");
        assertEquals(0, r.code(), r.err());
        JsonNode d = new ObjectMapper().readTree(r.out());
        assertEquals("stable", d.get("verdict").asText());
        JsonNode lead = d.get("leading").get(0);
        assertEquals(0.0, lead.get("im").asDouble(), 0.0);
        // rdstab's own value, pinned as a regression check (the closed-form check is the solver's ConvectionDominatedTest)
        assertEquals(-32.625, lead.get("re").asDouble(), 1e-3);
        assertTrue(lead.get("error_estimate").asDouble() < 1e-9, lead.toString());
        assertTrue(lead.get("condition").asDouble() > 1e20, lead.toString());
        assertTrue(d.get("warnings").toString().contains("very sensitive"), d.get("warnings").toString());
        // the symmetrizing scaling spans about e^(Pe/2) (the exponential factor of the transport's eigenfunctions)
        assertTrue(d.get("scaling_span").asDouble() > 1e40, "scaling span " + d.get("scaling_span"));
        CliRun text = CliRun.of("check", demo.toString(), "--set", "Pe_m=200", "--set", "Pe_h=200", "--cells", "400",
                "--amplification-budget", "0");
        assertTrue(text.out().contains("error est.  sensitivity"), text.out());
        assertTrue(text.out().contains("very sensitive"), text.out());
        assertTrue(text.out().contains("solved under a symmetrizing diagonal scaling"), text.out());
    }

    /**
     * Different Péclet numbers for the two fields (Pe_m = 60 or 200, Pe_h = 6): a scaling that symmetrized each field
     * but ignored the reactant–temperature coupling once blew that coupling up by e^27, placed the shift at 2.5e12 and
     * returned a wrong eigenvalue (+23) or crashed ARPACK. The scaling must now be refused unless it lowers ‖J‖_F, and
     * the answer must match the unscaled computation, whose leading eigenvalue is well conditioned here (κ about 5;
     * -0.66362505 and -0.55200646 are rdstab's own values, pinned as regression checks).
     */
    @Test
    void scalingNeverWorsensACoupledReactor() throws IOException {
        Path demo = CasesTest.casesDir().resolve("tubular-reactor-cooled.yaml");
        double[][] cases = {{60, -0.66362505}, {200, -0.55200646}};
        for (double[] c : cases) {
            CliRun r = CliRun.of("check", demo.toString(), "--json", "--set", "Pe_m=" + (int) c[0], "--amplification-budget", "0");
            assertEquals(0, r.code(), r.err());
            JsonNode d = new ObjectMapper().readTree(r.out());
            assertEquals("stable", d.get("verdict").asText(), "Pe_m = " + c[0]);
            JsonNode lead = d.get("leading").get(0);
            assertEquals(c[1], lead.get("re").asDouble(), 1e-7, "Pe_m = " + c[0]);
            assertTrue(lead.get("error_estimate").asDouble() < 1e-8, lead.toString());
            assertTrue(d.get("shift").asDouble() < 100, "shift " + d.get("shift"));
        }
    }

    void badInput(String name, String text, String expected, String... more) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text);
        String[] args = new String[2 + more.length];
        args[0] = "check";
        args[1] = p.toString();
        System.arraycopy(more, 0, args, 2, more.length);
        CliRun r = CliRun.of(args);
        assertEquals(2, r.code(), r.out() + r.err());
        assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
        assertTrue(r.err().contains(expected), r.err());
        assertTrue(r.err().contains(name), "names the file: " + r.err());
        assertFalse(r.err().contains("\tat "), "no stack trace");
    }

    @Test
    void driftThatNamesAFieldIsRefused() throws IOException {
        badInput("drift.yaml", convection(0.1, 1, 20, "centred", "").replace("drift: c", "drift: c*u"),
                "drift formula names the field 'u'; a drift may depend on position and parameters only");
    }

    @Test
    void inletOnAFieldWithoutDriftIsRefused() throws IOException {
        String text = convection(0.1, 1, 20, "centred", "").replace("    drift: c\n", "")
                .replace("left: {u: {fixed: 0}}", "left: {u: {inlet: 1}}");
        badInput("inlet.yaml", text, "an inlet condition needs a field with drift; field 'u' has none");
    }

    @Test
    void nonPositiveLewisNumberIsRefused() throws IOException {
        String text = Files.readString(CasesTest.casesDir().resolve("tubular-reactor-cooled.yaml"));
        badInput("reactor.yaml", text, "the diffusivity of field 'T'", "--set", "Le=-1");
        badInput("reactor2.yaml", text, "must be a finite number > 0", "--set", "Le=0");
        badInput("reactor3.yaml", text.replace("Le: 1.5 ", "Le: -2  "), "diffusivity of field 'T' must be > 0");
    }

    @Test
    void badDriftSchemeAndWeightsAreRefused() throws IOException {
        badInput("scheme.yaml", convection(0.1, 1, 20, "sideways", ""), "drift-scheme must be centred or upwind");
        badInput("weights.yaml", convection(0.1, 1, 20, "centred", ", energy-weights: [1, 2]"),
                "energy-weights needs one weight per field (1), found 2");
    }
}
