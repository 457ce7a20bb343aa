package rdstab.solver.eigen;

class ShiftInvertArnoldiContractTest extends EigenSolverContractTest {
    @Override
    EigenSolver solver() {
        return new ShiftInvertArnoldi();
    }
}
