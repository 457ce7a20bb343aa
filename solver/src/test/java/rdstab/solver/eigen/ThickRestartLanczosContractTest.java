package rdstab.solver.eigen;

class ThickRestartLanczosContractTest extends EigenSolverContractTest {
    @Override
    EigenSolver solver() {
        return new ThickRestartLanczos();
    }

    @Override
    boolean handlesNonsymmetric() {
        return false;
    }
}
