package rdstab.solver.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;
import rdstab.solver.setup.ProblemBuilder;

/** The grid study and grid transfer on 2D meshes. */
class PlaneGridStudyTest {

    static String square(String shape) {
        String geo = shape.equals("rectangle")
                ? "geometry: {shape: rectangle, from: 0, to: 1, y-from: 0, y-to: 1}\nmesh: {cells: 8}\n"
                : "geometry: {shape: disk, radius: 1}\nmesh: {cells: 8}\n";
        String parts = shape.equals("rectangle") ? "  left: {u: {fixed: 0}}\n  right: {u: {fixed: 0}}\n"
                + "  bottom: {u: {fixed: 0}}\n  top: {u: {fixed: 0}}\n" : "  edge: {u: {fixed: 0}}\n";
        return "title: t\n" + geo + "fields:\n  - name: u\n    diffusivity: 1\n    source: 0\n    initial: 0\n"
                + "boundaries:\n" + parts;
    }

    @Test
    void unitSquareLaplacianConvergesAtOrderTwoToMinusTwoPiSquared() {
        // u_t = Δu on the unit square with fixed edges: sigma_1 = -2 pi^2 (separation of variables)
        Case c = CaseReader.parse(square("rectangle"), "square.yaml");
        GridStudyResult r = GridStudy.run(c, new int[] {8, 16, 32}, 2, null);
        RichardsonEstimate q = r.tracked().get(0).estimate();
        assertEquals(2.0, q.observed(), 0.1);
        assertEquals(-2 * Math.PI * Math.PI, q.extrapolated(), 2e-3);
        for (GridStudyResult.Level l : r.levels()) {
            for (EigenPair e : l.check().modes()) {
                assertTrue(e.residual() < 1e-8);
            }
        }
    }

    @Test
    void linearFieldsTransferExactlyBetweenUnrelatedTriangleMeshes() {
        // common practice, no source: a piecewise-linear interpolant reproduces a linear function exactly
        Case c = CaseReader.parse(square("disk"), "disk.yaml");
        Discretization coarse = ProblemBuilder.build(c.withMesh(c.mesh().withCells(6))).full();
        Discretization fine = ProblemBuilder.build(c.withMesh(c.mesh().withCells(13))).full();
        double[][] v = new double[1][coarse.nodes()];
        for (int i = 0; i < coarse.nodes(); i++) {
            v[0][i] = 2 - 3 * coarse.coordinate(i, 0) + 0.5 * coarse.coordinate(i, 1);
        }
        double[][] out = NodalInterpolation.transfer(coarse, v, fine);
        int inside = 0;
        for (int k = 0; k < fine.nodes(); k++) {
            double x = fine.coordinate(k, 0);
            double y = fine.coordinate(k, 1);
            if (x * x + y * y < 0.8) {
                assertEquals(2 - 3 * x + 0.5 * y, out[0][k], 1e-12, "node " + k);
                inside++;
            }
        }
        assertTrue(inside > 50, "checked " + inside + " interior nodes");
    }
}
