package rdstab.solver.setup;

import rdstab.mesh.assembly.Discretization;
import rdstab.solver.model.Case;

/**
 * A case turned into numbers: the discretization of the full model, the same discretization with
 * the sources removed (the transport operator, for the energy bound), and the initial guess.
 *
 * @param theCase     the case at its current parameter values
 * @param full        F, J, M of the full model
 * @param transport   the same mesh, diffusivities, drift and boundary conditions with every source set to 0
 * @param initial     initial guess for Newton (unknown vector)
 */
public record Problem(Case theCase, Discretization full, Discretization transport, double[] initial) {
}
