package rdstab.cli.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;

/** The HTML report: well-formed, verdict first, eigenvalue table with residuals, nothing loaded from outside. */
class HtmlReportTest {

    @TempDir
    Path tmp;

    CheckResult check(double delta) throws Exception {
        Path c = tmp.resolve("fk.yaml");
        Files.writeString(c, String.join("\n", "title: FK slab <&> test", "geometry: {shape: slab, from: 0, to: 1}",
                "mesh: {cells: 60}", "parameters: {delta: " + delta + "}", "fields:", "  - name: u", "    unit: K",
                "    diffusivity: 1", "    source: delta*exp(u)", "    initial: 0", "boundaries:", "  left: {u: insulated}",
                "  right: {u: {fixed: 0}}", "analysis: {modes: 4}", ""));
        return StabilityCheck.run(CaseReader.read(c));
    }

    static Document parse(String html) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", false);
        return f.newDocumentBuilder().parse(new ByteArrayInputStream(html.getBytes(StandardCharsets.UTF_8)));
    }

    /**
     * Frank-Kamenetskii slab, symmetric half with insulated centre, delta = 0.5: below the critical 0.878
     * (Frank-Kamenetskii's slab value, from memory), so stable.
     */
    @Test
    void reportParsesAndCarriesVerdictAndEigenvalues() throws Exception {
        CheckResult r = check(0.5);
        Path file = tmp.resolve("report.html");
        HtmlReport.write(r, file, false);
        String html = Files.readString(file);
        Document d = parse(html);
        Element body = (Element) d.getElementsByTagName("body").item(0);
        assertTrue(body.getTextContent().contains("FK slab <&> test"), "escaped title lost");
        String first = ((Element) d.getElementsByTagName("div").item(0)).getTextContent();
        assertTrue(first.contains("Verdict: STABLE"), first);
        assertTrue(html.indexOf("Verdict: STABLE") < html.indexOf("<h2>"), "verdict is not first");
        Element table = null;
        NodeList tables = d.getElementsByTagName("table");
        for (int i = 0; i < tables.getLength(); i++) {
            Element t = (Element) tables.item(i);
            if ("eigenvalues".equals(t.getAttribute("class"))) {
                table = t;
            }
        }
        assertTrue(table != null, "no eigenvalue table");
        NodeList rows = table.getElementsByTagName("tr");
        assertEquals(r.modes().size() + 1, rows.getLength());
        NodeList cells = ((Element) rows.item(1)).getElementsByTagName("td");
        assertEquals(TextReport.sig(r.modes().get(0).re(), 10), cells.item(1).getTextContent());
        assertTrue(r.modes().get(0).re() < 0);
        assertTrue(r.modes().get(0).residual() < 1e-8, "eigen residual " + r.modes().get(0).residual());
        assertEquals(String.format(java.util.Locale.ROOT, "%.1e", r.modes().get(0).residual()), cells.item(3).getTextContent());
        // pictures embedded, nothing external
        NodeList imgs = d.getElementsByTagName("img");
        assertTrue(imgs.getLength() >= 3, "pictures missing");
        for (int i = 0; i < imgs.getLength(); i++) {
            String src = ((Element) imgs.item(i)).getAttribute("src");
            assertTrue(src.startsWith("data:image/png;base64,"), "external picture: " + src.substring(0, Math.min(40, src.length())));
            byte[] png = java.util.Base64.getDecoder().decode(src.substring("data:image/png;base64,".length()));
            assertTrue(javax.imageio.ImageIO.read(new ByteArrayInputStream(png)) != null, "embedded picture does not decode");
        }
        assertFalse(html.contains("http://") || html.contains("https://"), "a URL in the report");
        assertFalse(html.contains("<script") || html.contains("<link") || html.contains("@import") || html.contains("url("),
                "an external resource in the report");
        for (String s : r.assessment().cautions()) {
            assertTrue(body.getTextContent().contains(s), "caution missing: " + s);
        }
    }

    /** Past the critical value on the unstable (upper) branch the verdict word changes with the result. */
    @Test
    void unstableVerdictIsShown() throws Exception {
        Path c = tmp.resolve("up.yaml");
        Files.writeString(c, String.join("\n", "title: upper", "geometry: {shape: slab, from: 0, to: 1}",
                "mesh: {cells: 60}", "parameters: {delta: 0.5}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: delta*exp(u)", "    initial: 4*(1-x*x)", "boundaries:", "  left: {u: insulated}",
                "  right: {u: {fixed: 0}}", ""));
        CheckResult r = StabilityCheck.run(CaseReader.read(c));
        String html = HtmlReport.html(r, false);
        parse(html);
        assertTrue(r.assessment().growthRate() > 0, "expected the upper branch");
        assertTrue(html.contains("Verdict: UNSTABLE"));
    }
}
