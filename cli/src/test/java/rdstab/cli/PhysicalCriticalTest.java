package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** critical and sweep on dimensional parameters, answered in the case's units. */
class PhysicalCriticalTest {

    @TempDir
    Path tmp;

    static final String BODY = String.join("\n",
            "title: t",
            "geometry: {shape: slab}",
            "mesh: {cells: 200}",
            "self-heating:",
            "  density: 600 kg/m^3",
            "  heat-capacity: 1800 J/(kg*K)",
            "  conductivity: 0.12 W/(m*K)",
            "  size: 0.5 m",
            "  activation-energy: 110 kJ/mol",
            "  pre-exponential-factor: 5e9 1/s",
            "  heat-of-reaction: 3.0e6 J/kg",
            "  ambient-temperature: 30 degC",
            "  kinetics: exponential",
            "");

    @Test
    void criticalHalfThicknessReproducesTheFrankKamenetskiiDelta() throws IOException {
        Path f = tmp.resolve("body.yaml");
        Files.writeString(f, BODY);
        CliRun r = CliRun.of("critical", f.toString(), "--vary", "L=20cm:2m", "--json", "--tolerance", "1e-6");
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertEquals("fold", j.get("critical").get("kind").asText());
        double lc = j.get("critical").get("value").asDouble();
        assertEquals("m", j.get("critical").get("in_case_units").get("unit").asText());
        // delta scales with L^2 (its definition); at the critical half-thickness it must be the fixed-surface slab
        // value 0.87845768 (Frank-Kamenetskii). Grid error at 200 cells ~1e-5 relative (second order), tolerance 1e-6 m.
        CliRun base = CliRun.of("check", f.toString(), "--json");
        double delta05 = new ObjectMapper().readTree(base.out()).get("parameters").get("delta").asDouble();
        double deltaC = delta05 * (lc / 0.5) * (lc / 0.5);
        assertEquals(0.87845768, deltaC, 1e-4, "critical L = " + lc + " m");
    }

    @Test
    void criticalAmbientTemperatureIsReportedInDegreesCelsius() throws IOException {
        Path f = tmp.resolve("body.yaml");
        Files.writeString(f, BODY.replace("  kinetics: exponential", "  surface-heat-transfer: 8 W/(m^2*K)\n  kinetics: arrhenius"));
        CliRun r = CliRun.of("critical", f.toString(), "--vary", "Ta=20:60");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("searching Ta from 20 °C to 60 °C"), r.out());
        assertTrue(r.out().matches("(?s).*CRITICAL VALUE: Ta = 3\\d\\.\\d+ °C.*"), r.out());
        assertTrue(r.out().contains("licensed engineer"), "cautions printed");
        CliRun bad = CliRun.of("critical", f.toString(), "--vary", "Ta=20m:60m");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("dimension"), bad.err());
    }

    @Test
    void sweepAndCriticalDrawTheirPictures() throws IOException {
        Path f = tmp.resolve("body.yaml");
        Files.writeString(f, BODY.replace("mesh: {cells: 200}", "mesh: {cells: 40}"));
        Path pics = tmp.resolve("pics");
        CliRun s = CliRun.of("sweep", f.toString(), "--vary", "Ta=20:50:7", "--out", tmp.resolve("s.csv").toString(),
                "--quiet", "--plots", pics.toString());
        assertEquals(0, s.code(), s.err());
        // the sweep crosses the critical ambient temperature: both stable points and points without a steady state
        String csv = Files.readString(tmp.resolve("s.csv"));
        assertTrue(csv.contains(",stable,") && csv.contains("no steady state"), csv);
        for (String name : new String[] {"growth.png", "growth.svg"}) {
            assertTrue(Files.size(pics.resolve(name)) > 1000, name);
        }
        java.awt.image.BufferedImage img = javax.imageio.ImageIO.read(pics.resolve("growth.png").toFile());
        assertTrue(img.getWidth() > 200 && img.getHeight() > 200);
        Path pc = tmp.resolve("pc");
        CliRun c = CliRun.of("critical", f.toString(), "--vary", "Ta=20:50", "--plots", pc.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(javax.imageio.ImageIO.read(pc.resolve("growth.png").toFile()) != null);
    }
}
