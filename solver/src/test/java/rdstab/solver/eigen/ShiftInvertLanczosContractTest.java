package rdstab.solver.eigen;

class ShiftInvertLanczosContractTest extends EigenSolverContractTest {
    @Override
    EigenSolver solver() {
        return new ShiftInvertLanczos();
    }

    @Override
    boolean handlesNonsymmetric() {
        return false;
    }
}
