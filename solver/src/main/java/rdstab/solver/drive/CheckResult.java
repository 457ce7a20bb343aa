package rdstab.solver.drive;

import java.util.List;
import java.util.Map;
import rdstab.solver.assess.Assessment;
import rdstab.solver.eigen.EigenConditioning;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.energy.EnergyRates;
import rdstab.solver.newton.BaseState;
import rdstab.solver.pattern.DispersionRelation;
import rdstab.solver.pattern.PecletNumbers;
import rdstab.solver.setup.Problem;

/**
 * Everything one stability check found, with its evidence.
 *
 * @param problem          the discretized case
 * @param base             the steady state with Newton's evidence
 * @param baseNodal        nodal values of the base state, [field][node] (fixed values included)
 * @param baseMax          largest nodal value per field
 * @param modes            rightmost eigenpairs, rightmost first, each with its residual
 * @param conditioning     per mode (same order): condition number and error estimate of the eigenvalue
 * @param shift            the shift σ used by shift-invert
 * @param scalingSpan      max d / min d of the symmetrizing diagonal scaling the eigenvalues were computed under
 *                         (1 when none; then residuals are those of the scaled pencil)
 * @param rightmostCertified true when the returned set is guaranteed to contain the rightmost eigenvalues
 * @param energy           energy-method rates
 * @param assessment       verdict and what it means
 * @param seconds          wall time per stage: "base", "spectrum", "energy"
 * @param flow             Péclet numbers of the fields with drift and the drift scheme (null when not 1D)
 * @param dispersion       dispersion relation about a uniform base state (null when not 1D; applies() false
 *                         when the base state is not uniform or the domain does not allow it)
 */
public record CheckResult(Problem problem, BaseState base, double[][] baseNodal, Map<String, Double> baseMax,
                          List<EigenPair> modes, List<EigenConditioning.Estimate> conditioning, double shift, double scalingSpan, boolean rightmostCertified, EnergyRates energy,
                          Assessment assessment, Map<String, Double> seconds, PecletNumbers.Result flow,
                          DispersionRelation.Result dispersion) {

    public CheckResult {
        conditioning = List.copyOf(conditioning);
    }

    /** The same result with another assessment (a re-judged band). */
    public CheckResult withAssessment(Assessment other) {
        return new CheckResult(problem, base, baseNodal, baseMax, modes, conditioning, shift, scalingSpan, rightmostCertified, energy,
                other, seconds, flow, dispersion);
    }
}
