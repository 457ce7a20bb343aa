package rdstab.solver.setup;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import rdstab.mesh.assembly.Discretization;
import rdstab.mesh.assembly.DriftScheme;
import rdstab.mesh.assembly.FaceAverage;
import rdstab.mesh.assembly.FiniteVolume1D;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;
import rdstab.solver.error.InputException;
import rdstab.solver.formula.CompiledFormula;
import rdstab.solver.model.BoundarySpec;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;
import rdstab.solver.model.MeshSpec;

/**
 * Turns a {@link Case} into a {@link Problem}: the grid, the compiled formulas as a point kernel,
 * the boundary conditions with their numbers evaluated at the case's parameter values, and the
 * initial guess.
 */
public final class ProblemBuilder {

    private ProblemBuilder() {
    }

    /** Builds the problem of a case at its current parameters. */
    public static Problem build(Case c) {
        if (c.shape().dimension() == 2) {
            return PlaneProblems.build(c);
        }
        checkDiffusivities(c);
        Grid1D grid = grid(c);
        FormulaKernel kernel = new FormulaKernel(c);
        int nf = c.fields().size();
        BoundaryCondition[] left = new BoundaryCondition[nf];
        BoundaryCondition[] right = new BoundaryCondition[nf];
        boolean centre = grid.hasCentre();
        String leftName = c.shape().radial() ? "inner" : "left";
        String rightName = c.shape().radial() ? "outer" : "right";
        for (int f = 0; f < nf; f++) {
            FieldSpec fs = c.fields().get(f);
            if (!centre) {
                left[f] = condition(c, leftName, fs);
            }
            right[f] = condition(c, rightName, fs);
        }
        Discretization full = discretize(c, grid, kernel, left, right);
        Discretization transport = discretize(c, grid, new NoSourceKernel(kernel.copy()), left, right);
        return new Problem(c, full, transport, initialGuess(c, full));
    }

    private static Discretization discretize(Case c, Grid1D grid, PointKernel k, BoundaryCondition[] l, BoundaryCondition[] r) {
        try {
            DriftScheme scheme = "upwind".equals(c.analysis().driftScheme()) ? DriftScheme.UPWIND : DriftScheme.CENTRED;
            return new FiniteVolume1D(grid, k, l, r, FaceAverage.ARITHMETIC, scheme);
        } catch (IllegalArgumentException e) {
            if (e instanceof InputException) {
                throw e;
            }
            throw new InputException(c.source(), null, e.getMessage());
        }
    }

    /** The 1D grid of a case. */
    public static Grid1D grid(Case c) {
        Geometry1D g = switch (c.shape()) {
            case SLAB -> Geometry1D.SLAB;
            case CYLINDER -> Geometry1D.CYLINDER;
            case SPHERE -> Geometry1D.SPHERE;
            default -> throw new IllegalStateException("not a 1D shape: " + c.shape());
        };
        MeshSpec m = c.mesh();
        double a = c.fromValue();
        double b = c.toValue();
        try {
            if (m.stretch() <= 0 || "none".equals(m.stretchTo())) {
                return Grid1D.uniform(g, a, b, m.cells());
            }
            Grid1D.Cluster end = switch (m.stretchTo()) {
                case "left" -> Grid1D.Cluster.LEFT;
                case "right" -> Grid1D.Cluster.RIGHT;
                default -> Grid1D.Cluster.BOTH;
            };
            return Grid1D.tanh(g, a, b, m.cells(), m.stretch(), end);
        } catch (IllegalArgumentException e) {
            throw new InputException(c.source(), "geometry/mesh", e.getMessage());
        }
    }

    static BoundaryCondition condition(Case c, String part, FieldSpec field) {
        BoundarySpec s = c.boundaries().get(part).get(field.name());
        Map<String, Double> p = c.parameters();
        try {
            return switch (s.kind()) {
                case FIXED -> new BoundaryCondition.FixedValue(s.numbers().get("value").value(p));
                case FLUX -> new BoundaryCondition.FixedFlux(s.numbers().get("flux").value(p));
                case INSULATED -> new BoundaryCondition.FixedFlux(0.0);
                case CONVECTIVE -> new BoundaryCondition.Convective(s.numbers().get("h").value(p),
                        s.numbers().get("ambient").value(p));
                case INLET -> {
                    requireDrift(c, s, field, "an inlet");
                    yield new BoundaryCondition.Inlet(s.numbers().get("value").value(p));
                }
                case OUTLET -> {
                    requireDrift(c, s, field, "an outlet");
                    yield new BoundaryCondition.FixedFlux(0.0);
                }
            };
        } catch (IllegalArgumentException e) {
            if (e instanceof InputException) {
                throw e;
            }
            throw new InputException(c.source(), s.place(), e.getMessage());
        }
    }

    private static void requireDrift(Case c, BoundarySpec s, FieldSpec field, String what) {
        if (field.drift() == null) {
            throw new InputException(c.source(), s.place(), what + " condition needs a field with drift; field '"
                    + field.name() + "' has none");
        }
    }

    /** Diffusivities that are numbers or formulas of parameters must be &gt; 0 at the current values (after --set). */
    private static void checkDiffusivities(Case c) {
        for (FieldSpec f : c.fields()) {
            rdstab.solver.formula.Formula k = f.diffusivity().substitute(c.parameters());
            if (k.isConstant() && !(k.constantValue() > 0 && Double.isFinite(k.constantValue()))) {
                throw new InputException(c.source(), f.placeOf("diffusivity"), "the diffusivity of field '" + f.name()
                        + "' (" + f.diffusivity() + ") is " + k.constantValue() + " at the current parameters; it must be a finite number > 0");
            }
        }
    }

    /** The initial guess: each field's 'initial' formula at every node (fixed values are taken from the conditions). */
    public static double[] initialGuess(Case c, Discretization d) {
        int nf = c.fields().size();
        List<String> vars = new ArrayList<>(c.coordinateNames());
        double[][] nodal = new double[nf][d.nodes()];
        double[] slot = new double[vars.size()];
        for (int f = 0; f < nf; f++) {
            CompiledFormula g = c.fields().get(f).initial().compile(vars, c.parameters());
            for (int i = 0; i < d.nodes(); i++) {
                slot[0] = d.coordinate(i, 0);
                if (slot.length > 1) {
                    slot[1] = d.dimension() == 2 ? d.coordinate(i, 1) : slot[0];
                }
                nodal[f][i] = g.evaluate(slot);
                if (!Double.isFinite(nodal[f][i])) {
                    throw new InputException(c.source(), c.fields().get(f).placeOf("initial"), "the initial guess of field '"
                            + c.fields().get(f).name() + "' is " + nodal[f][i] + " at x = " + slot[0]);
                }
            }
        }
        return d.unknownsFromNodal(nodal);
    }
}
