package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;

/**
 * Axial-dispersion tubular reactor with a first-order reaction, Danckwerts inlet and closed outlet:
 * D u'' − c u' − k u = 0 on (0, L), c (u − u_in) = D u' at x = 0, u' = 0 at x = L.
 *
 * <p>Source (from memory): the classical closed form of Danckwerts (1953) and Wehner &amp; Wilhelm (1956),
 * with Pe = cL/D, Da = kL/c, q = √(1 + 4 Da/Pe):
 * u(L)/u_in = 4q e^{Pe/2} / [(1+q)² e^{Pe q/2} − (1−q)² e^{−Pe q/2}]. The whole profile is checked
 * against the exponential solution A e^{m₁z} + B e^{m₂z}, m = Pe(1 ± q)/2, with A, B from the two
 * boundary conditions (analytic), and the exit value against the closed form above as well, so a
 * misremembered formula would show up as a disagreement of the two analytic values.
 */
class DanckwertsReactorTest {

    static final double D = 0.05;
    static final double C = 1.0;
    static final double K = 2.0;
    static final double L = 1.0;
    static final double UIN = 1.0;

    /** The exit value from the closed form. */
    static double closedFormExit() {
        double pe = C * L / D;
        double da = K * L / C;
        double q = Math.sqrt(1 + 4 * da / pe);
        return UIN * 4 * q * Math.exp(pe / 2)
                / ((1 + q) * (1 + q) * Math.exp(pe * q / 2) - (1 - q) * (1 - q) * Math.exp(-pe * q / 2));
    }

    /** The analytic profile at z = x/L. */
    static double profile(double z) {
        double pe = C * L / D;
        double q = Math.sqrt(1 + 4 * (K * L / C) / pe);
        double m1 = pe * (1 + q) / 2;
        double m2 = pe * (1 - q) / 2;
        // u = A e^{m1 (z-1)} + B e^{m2 z} (scaled to avoid overflow): u'(1) = 0 and u(0) - u'(0)/Pe = UIN
        double e1 = Math.exp(-m1);
        double e2 = Math.exp(m2);
        // rows: [m1, m2 e2] (A, B) = 0; [e1 (1 - m1/Pe), (1 - m2/Pe)] (A, B) = UIN
        double a11 = m1;
        double a12 = m2 * e2;
        double a21 = e1 * (1 - m1 / pe);
        double a22 = 1 - m2 / pe;
        double det = a11 * a22 - a12 * a21;
        double a = -a12 * UIN / det;
        double b = a11 * UIN / det;
        return a * Math.exp(m1 * (z - 1)) + b * Math.exp(m2 * z);
    }

    static double[] solve(int cells, DriftScheme scheme) {
        Grid1D g = Grid1D.uniform(Geometry1D.SLAB, 0, L, cells);
        FiniteVolume1D d = new FiniteVolume1D(g, Kernels.linearDrift(D, -K, 0, C),
                new BoundaryCondition[] {new BoundaryCondition.Inlet(UIN)},
                new BoundaryCondition[] {new BoundaryCondition.FixedFlux(0)}, FaceAverage.ARITHMETIC, scheme);
        int n = d.unknowns();
        double[] f0 = new double[n];
        d.residual(new double[n], f0);       // F is affine: F(u) = F(0) + J u
        DMatrixRMaj j = DConvertMatrixStruct.convert(d.jacobian(new double[n]), (DMatrixRMaj) null);
        DMatrixRMaj rhs = new DMatrixRMaj(n, 1);
        for (int i = 0; i < n; i++) {
            rhs.set(i, 0, -f0[i]);
        }
        DMatrixRMaj u = new DMatrixRMaj(n, 1);
        assertTrue(CommonOps_DDRM.solve(j, rhs, u));
        return u.data;
    }

    @Test
    void closedFormAgreesWithTheExponentialProfile() {
        assertEquals(profile(1.0), closedFormExit(), 1e-12 * closedFormExit());
        // inlet condition and outlet condition of the analytic profile (finite differences, common practice)
        double h = 1e-6;
        double pe = C * L / D;
        double du0 = (profile(h) - profile(-h)) / (2 * h);
        assertEquals(UIN, profile(0) - du0 / pe, 1e-7);
    }

    @Test
    void centredSchemeConvergesAtSecondOrderToTheClosedForm() {
        double exact = closedFormExit();
        double e1 = Math.abs(solve(50, DriftScheme.CENTRED)[50] - exact);
        double e2 = Math.abs(solve(100, DriftScheme.CENTRED)[100] - exact);
        double e3 = Math.abs(solve(200, DriftScheme.CENTRED)[200] - exact);
        double p1 = Math.log(e1 / e2) / Math.log(2);
        double p2 = Math.log(e2 / e3) / Math.log(2);
        assertTrue(e3 < 2e-3 * exact, "exit error " + e3 + " of " + exact);
        assertTrue(p2 > 1.8 && p2 < 2.3, "observed order " + p1 + ", " + p2);
        double[] u = solve(200, DriftScheme.CENTRED);
        double worst = 0;
        for (int i = 0; i <= 200; i++) {
            worst = Math.max(worst, Math.abs(u[i] - profile(i / 200.0)));
        }
        assertTrue(worst < 5e-3, "profile error " + worst);
    }

    @Test
    void upwindSchemeConvergesAtFirstOrder() {
        double exact = closedFormExit();
        double e1 = Math.abs(solve(100, DriftScheme.UPWIND)[100] - exact);
        double e2 = Math.abs(solve(200, DriftScheme.UPWIND)[200] - exact);
        double p = Math.log(e1 / e2) / Math.log(2);
        assertTrue(p > 0.8 && p < 1.3, "observed order " + p + " errors " + e1 + ", " + e2);
    }

    @Test
    void inletNeedsInflowingDrift() {
        Grid1D g = Grid1D.uniform(Geometry1D.SLAB, 0, 1, 10);
        BoundaryCondition[] in = {new BoundaryCondition.Inlet(1)};
        BoundaryCondition[] out = {new BoundaryCondition.FixedFlux(0)};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FiniteVolume1D(g, Kernels.linear(1, 0), in, out));
        assertTrue(e.getMessage().contains("drift into the body"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new FiniteVolume1D(g, Kernels.linearDrift(1, 0, 0, -1), in, out));
    }
}
