package rdstab.solver.pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.eigen.EigenPair;

/**
 * A two-field reacting case whose rightmost eigenvalues are complex pairs (Brusselator above its Hopf
 * threshold, equal diffusion): rdstab's shift-invert Arnoldi against EJML's dense eigen-decomposition of
 * M⁻¹J on the same matrices (an independent algorithm, general reference library), to 1e-8 relative,
 * rightmost first with conjugates adjacent.
 */
class ComplexPairOracleTest {

    @Test
    void arnoldiMatchesDenseEjml() {
        String text = BrusselatorTest.brusselator(2, 5.5, 1, 1, 10, 40);
        CheckResult r = StabilityCheck.run(CaseReader.parse(text, "b.yaml"));
        DMatrixSparseCSC j = r.problem().full().jacobian(r.base().u());
        DMatrixSparseCSC m = r.problem().full().mass();
        int n = j.numRows;
        assertTrue(n >= 80, "large enough for the Arnoldi path: " + n);
        DMatrixRMaj a = DConvertMatrixStruct.convert(j, (DMatrixRMaj) null);
        for (int i = 0; i < n; i++) {
            double mi = m.get(i, i);
            for (int c = 0; c < n; c++) {
                a.set(i, c, a.get(i, c) / mi);
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, false);
        assertTrue(eig.decompose(a));
        List<Complex_F64> ref = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            ref.add(eig.getEigenvalue(i));
        }
        ref.sort(Comparator.comparingDouble((Complex_F64 z) -> -z.real).thenComparingDouble(z -> -z.imaginary));
        List<EigenPair> got = r.modes();
        assertTrue(got.size() >= 6);
        assertTrue(Math.abs(got.get(0).im()) > 1, "the rightmost pair is complex");
        for (int i = 0; i < got.size(); i++) {
            EigenPair e = got.get(i);
            Complex_F64 z = ref.get(i);
            double scale = Math.hypot(z.real, z.imaginary);
            assertEquals(z.real, e.re(), 1e-8 * scale, "Re λ_" + i);
            assertEquals(z.imaginary, e.im(), 1e-8 * scale, "Im λ_" + i);
            assertTrue(e.residual() < 1e-10, "residual " + e.residual());
        }
        for (int i = 0; i + 1 < got.size(); i += 2) {
            assertEquals(got.get(i).re(), got.get(i + 1).re(), 1e-12 * Math.abs(got.get(i).im()), "conjugates adjacent");
            assertEquals(-got.get(i).im(), got.get(i + 1).im(), 1e-10 * Math.abs(got.get(i).im()));
            assertTrue(got.get(i).im() > 0, "positive imaginary part first");
        }
    }
}
