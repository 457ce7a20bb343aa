package rdstab.solver.casefile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.error.InputException;
import rdstab.solver.model.BoundarySpec;
import rdstab.solver.model.Case;

/** Case-file reading: what a good file gives, and that each bad input names file, place and expectation. */
class CaseReaderTest {

    static final String GOOD = String.join("\n",
            "title: t",
            "geometry: {shape: slab, from: 0, to: L}",
            "mesh: {cells: 50}",
            "parameters: {delta: 0.5, Bi: 3, L: 2}",
            "fields:",
            "  - name: u",
            "    diffusivity: 1",
            "    source: delta*exp(u)",
            "    initial: 0",
            "boundaries:",
            "  left:",
            "    u: insulated",
            "  right:",
            "    u: {convective: {h: Bi, ambient: 0}}",
            "");

    static InputException bad(String text) {
        return assertThrows(InputException.class, () -> CaseReader.parse(text, "bad.yaml"));
    }

    @Test
    void readsAGoodCase() {
        Case c = CaseReader.parse(GOOD, "good.yaml");
        assertEquals(2.0, c.toValue());
        assertEquals(50, c.mesh().cells());
        assertEquals(BoundarySpec.Kind.CONVECTIVE, c.boundaries().get("right").get("u").kind());
        assertEquals(3.0, c.boundaries().get("right").get("u").numbers().get("h").value(c.parameters()));
        assertEquals(0.8, c.withParameter("delta", 0.8).parameter("delta"));
    }

    @Test
    void unknownKeyIsNamedWithLineAndSuggestion() {
        InputException e = bad(GOOD.replace("mesh: {cells: 50}", "mesh: {cels: 50}"));
        assertEquals("bad.yaml", e.source());
        assertTrue(e.place().startsWith("3:"), e.getMessage());
        assertTrue(e.problem().contains("unknown key 'cels'") && e.problem().contains("cells"), e.getMessage());
    }

    @Test
    void missingFieldsSection() {
        String t = GOOD.substring(0, GOOD.indexOf("fields:")) + GOOD.substring(GOOD.indexOf("boundaries:"));
        InputException e = bad(t);
        assertTrue(e.problem().contains("missing key 'fields'"), e.getMessage());
    }

    @Test
    void formulaSyntaxErrorPointsAtTheColumn() {
        InputException e = bad(GOOD.replace("source: delta*exp(u)", "source: delta*exp(u"));
        assertTrue(e.place().startsWith("8:"), e.getMessage());
        assertTrue(e.place().contains("fields[0].source"), e.getMessage());
    }

    @Test
    void unknownNameInFormula() {
        InputException e = bad(GOOD.replace("source: delta*exp(u)", "source: delta*exp(T)"));
        assertTrue(e.problem().contains("unknown name 'T'"), e.getMessage());
        assertEquals("8:23 (fields[0].source)", e.place(), "column of T");
    }

    @Test
    void zeroOrNegativeDiffusivity() {
        assertTrue(bad(GOOD.replace("diffusivity: 1", "diffusivity: 0")).problem().contains("must be > 0"));
        assertTrue(bad(GOOD.replace("diffusivity: 1", "diffusivity: -2")).problem().contains("must be > 0"));
    }

    @Test
    void boundaryWithoutCondition() {
        String t = GOOD.replace("  right:\n    u: {convective: {h: Bi, ambient: 0}}\n", "");
        InputException e = bad(t);
        assertTrue(e.problem().contains("boundary 'right' has no condition"), e.getMessage());
    }

    @Test
    void nonNumericParameter() {
        InputException e = bad(GOOD.replace("delta: 0.5", "delta: hot"));
        assertTrue(e.problem().contains("parameter 'delta' must be a number"), e.getMessage());
    }

    @Test
    void unknownParameterOverride() {
        Case c = CaseReader.parse(GOOD, "good.yaml");
        InputException e = assertThrows(InputException.class, () -> c.withParameter("gamma", 1));
        assertTrue(e.problem().contains("no parameter 'gamma'") && e.problem().contains("delta"), e.getMessage());
    }

    @Test
    void invalidYamlAndAliasBombAreRefused() {
        assertTrue(bad("title: [unclosed").problem().startsWith("not valid YAML"));
        StringBuilder bomb = new StringBuilder("a: &a [x, x, x, x, x, x, x, x, x]\n");
        for (int i = 0; i < 30; i++) {
            char prev = (char) ('a' + (i % 26));
            bomb.append("b").append(i).append(": &b").append(i).append(" [*").append(i == 0 ? "a" : "b" + (i - 1))
                .append(", *").append(i == 0 ? "a" : "b" + (i - 1)).append("]\n");
        }
        InputException e = bad(bomb.toString());
        assertTrue(e.problem().toLowerCase().contains("yaml") || e.problem().contains("alias"), e.getMessage());
    }

    @Test
    void unknownShapeAndBadCondition() {
        assertTrue(bad(GOOD.replace("shape: slab", "shape: cube")).problem().contains("unknown shape 'cube'"));
        assertTrue(bad(GOOD.replace("u: insulated", "u: {convection: 3}")).problem().contains("unknown condition 'convection'"));
    }

    @Test
    void duplicateKeysAreRefused() {
        InputException e = bad(GOOD.replace("mesh: {cells: 50}", "mesh: {cells: 50}\nmesh: {cells: 60}"));
        assertTrue(e.problem().contains("duplicate key 'mesh'"), e.getMessage());
    }

    @Test
    void writtenBackAndReadAgainGivesTheSameCase() {
        Case c = CaseReader.parse(GOOD, "good.yaml");
        Case back = CaseReader.parse(CaseWriter.toYaml(c), "back.yaml");
        assertEquals(c.parameters(), back.parameters());
        assertEquals(c.fields().get(0).source().toString(), back.fields().get(0).source().toString());
        assertEquals(c.boundaries().get("right").get("u").kind(), back.boundaries().get("right").get("u").kind());
        assertEquals(c.mesh(), back.mesh());
        assertEquals(c.toValue(), back.toValue());
    }
}
