package rdstab.solver.eigen;

class DenseEigenSolverTest extends EigenSolverContractTest {
    @Override
    EigenSolver solver() {
        return new DenseEigenSolver();
    }
}
