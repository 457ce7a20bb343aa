package rdstab.solver.verify;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;

/**
 * Grid-convergence study: the same case on L ≥ 3 systematically refined grids, each fully checked (base state,
 * rightmost eigenpairs with residuals, assessment), the finest level's rightmost eigenvalues followed down to the
 * coarser levels by mode overlap ({@link ModeOverlap}, never by list position), and the observed order,
 * Richardson extrapolation and GCI ({@link RichardsonEstimate}) of every followed eigenvalue and base-state maximum.
 *
 * <h2>Levels</h2>
 * {@link #refined}: the given cell count is the <em>coarsest</em> level and each further level has r times the cells
 * (rounded), so the finest is n·r^(L−1); it must not exceed {@link CaseReader#MAX_CELLS}. {@link #around}: three levels
 * n/r, n, n·r around a requested grid (the requested grid is the medium level; the finest when n·r is above the cap). The refinement ratio used in the formulas is the actual cell
 * ratio of consecutive levels (uniform and equally stretched grids refine every spacing by that ratio).
 *
 * <h2>Warm starts</h2>
 * The anchor level (the requested grid) starts from the case's initial guess; every other level starts from the
 * base state of its neighbour, interpolated ({@link NodalInterpolation}), so all levels stay on the same branch.
 *
 * <p>1D cases only for now: the grid transfer and overlap are 1D.
 */
public final class GridStudy {

    /** Formal order of the finite-volume scheme of the mesh module (second-order vertex-centred). */
    public static final double FORMAL_ORDER = 2.0;
    /** Number of rightmost eigenvalues of the finest level followed across levels (at most). */
    public static final int TRACKED = 3;
    /** A matched mode with a smaller overlap than this is reported as an unreliable match. */
    public static final double MIN_OVERLAP = 0.9;

    /** Told after each level is done (library code never prints). */
    public interface Listener {
        /** Level {@code index} of {@code count} (in the order they are computed) finished. */
        void levelDone(int index, int count, int cells);
    }

    private GridStudy() {
    }

    /** Cell counts n, n·r, ..., n·r^(L−1), rounded; the finest must stay within the cell cap. */
    public static int[] refined(int coarsest, int levels, double ratio) {
        checkRatio(ratio, levels);
        int[] cells = new int[levels];
        for (int k = 0; k < levels; k++) {
            double n = coarsest * Math.pow(ratio, k);
            if (n > CaseReader.MAX_CELLS) {
                throw new InputException("command line", "--levels", String.format(Locale.ROOT,
                        "the finest of %d levels from %d cells with ratio %.3g would have %.0f cells, above the cap of %d; "
                                + "use fewer levels, a smaller ratio or fewer --cells", levels, coarsest, ratio, n, CaseReader.MAX_CELLS));
            }
            cells[k] = (int) Math.round(n);
            if (k > 0 && cells[k] <= cells[k - 1]) {
                throw new InputException("command line", "--ratio", "ratio " + ratio + " does not refine " + cells[k - 1]
                        + " cells; use a larger ratio");
            }
        }
        return cells;
    }

    /**
     * Three levels around a requested grid: round(n/r), n, round(n·r) with the requested grid in the middle (index 1);
     * when n·r would exceed the cell cap, round(n/r²), round(n/r), n with the requested grid finest (index 2). The
     * ratios actually used are the cell ratios (unequal ratios are handled by {@link RichardsonEstimate}).
     *
     * @return {cells of the 3 levels, coarsest first, then the index of the requested level}
     * @throws InputException when the coarsest level would have fewer than 4 cells
     */
    public static int[] around(int requested, double ratio) {
        checkRatio(ratio, 3);
        boolean fineOk = requested * ratio <= CaseReader.MAX_CELLS;
        int[] c = fineOk ? new int[] {(int) Math.round(requested / ratio), requested, (int) Math.round(requested * ratio), 1}
                : new int[] {(int) Math.round(requested / (ratio * ratio)), (int) Math.round(requested / ratio), requested, 2};
        if (c[0] < 4 || c[0] >= c[1] || c[1] >= c[2]) {
            throw new InputException("command line", "--cells", "a grid check around " + requested + " cells needs a coarser "
                    + "level of at least 4 cells; use at least " + (int) Math.ceil(4 * ratio) + " cells");
        }
        return c;
    }

    private static void checkRatio(double ratio, int levels) {
        if (!(ratio >= 1.1) || ratio > 16) {
            throw new InputException("command line", "--ratio", "expected a refinement ratio from 1.1 to 16, found " + ratio);
        }
        if (levels < 3 || levels > 12) {
            throw new InputException("command line", "--levels", "expected 3 to 12 levels, found " + levels);
        }
    }

    /**
     * Runs the study.
     *
     * @param c        the case (its mesh cell count is replaced per level)
     * @param cells    cell counts, coarsest first, strictly increasing, at least 3
     * @param anchor   the level started from the case's initial guess (and reported: must be one of the two finest)
     * @param listener progress, may be null
     */
    public static GridStudyResult run(Case c, int[] cells, int anchor, Listener listener) {
        int n = cells.length;
        if (n < 3 || anchor < n - 2 || anchor >= n) {
            throw new IllegalArgumentException("need >= 3 levels and the reported level among the two finest, got "
                    + Arrays.toString(cells) + " anchor " + anchor);
        }
        if (c.shape() == rdstab.solver.model.Shape.MESH_FILE) {
            throw new InputException(c.source(), "geometry/shape", "a mesh read from a file cannot be refined by rdstab; "
                    + "a grid study needs a shape that rdstab meshes itself");
        }
        CheckResult[] checks = new CheckResult[n];
        int done = 0;
        checks[anchor] = StabilityCheck.run(c.withMesh(c.mesh().withCells(cells[anchor])));
        notify(listener, ++done, n, cells[anchor]);
        for (int k = anchor + 1; k < n; k++) {
            checks[k] = warm(c, cells[k], checks[k - 1]);
            notify(listener, ++done, n, cells[k]);
        }
        for (int k = anchor - 1; k >= 0; k--) {
            checks[k] = warm(c, cells[k], checks[k + 1]);
            notify(listener, ++done, n, cells[k]);
        }
        List<GridStudyResult.Level> levels = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            levels.add(new GridStudyResult.Level(cells[k], checks[k].problem().full().unknowns(), checks[k]));
        }
        double[] r = ratios(cells);
        List<String> warnings = new ArrayList<>();
        List<GridStudyResult.Tracked> tracked = track(checks, r, warnings);
        Map<String, GridStudyResult.Quantity> maxima = new LinkedHashMap<>();
        for (String field : c.fieldNames()) {
            double[] v = new double[n];
            for (int k = 0; k < n; k++) {
                v[k] = checks[k].baseMax().get(field);
            }
            maxima.put(field, quantity(v, r));
        }
        GridStudyResult.Tracked lead = tracked.get(0);
        RichardsonEstimate e = lead.estimate();
        double gci = anchor == n - 1 ? e.gciFine() : e.gciMedium();
        double band = gci + checks[anchor].assessment().band();
        double growth = lead.re()[anchor];
        if (Math.abs(growth - checks[anchor].assessment().growthRate()) > 1e-12 * Math.max(1, Math.abs(growth))) {
            warnings.add("the rightmost eigenvalue of the reported grid is not the one followed from the finest grid: "
                    + "the order of the eigenvalues changes between grids");
        }
        if (!e.orderConfirmed() && !e.note().isEmpty()) {
            warnings.add("growth rate: " + e.note());
        }
        return new GridStudyResult(levels, anchor, tracked, maxima, band, Math.abs(growth) > band, warnings);
    }

    private static void notify(Listener l, int i, int n, int cells) {
        if (l != null) {
            l.levelDone(i, n, cells);
        }
    }

    private static CheckResult warm(Case c, int cells, CheckResult neighbour) {
        Problem p = ProblemBuilder.build(c.withMesh(c.mesh().withCells(cells)));
        Discretization from = neighbour.problem().full();
        double[][] nodal = NodalInterpolation.transfer(from, neighbour.baseNodal(), p.full());
        return StabilityCheck.run(p, p.full().unknownsFromNodal(nodal));
    }

    /** Refinement ratio of each level to the next finer one: r[k] = cells[k+1]/cells[k]. */
    static double[] ratios(int[] cells) {
        double[] r = new double[cells.length - 1];
        for (int k = 0; k + 1 < cells.length; k++) {
            r[k] = (double) cells[k + 1] / cells[k];
        }
        return r;
    }

    /** Observed orders of every consecutive triple and the estimate from the finest three. */
    static GridStudyResult.Quantity quantity(double[] v, double[] r) {
        int n = v.length;
        double[] orders = new double[n - 2];
        RichardsonEstimate last = null;
        for (int k = 0; k + 2 < n; k++) {
            last = RichardsonEstimate.of(v[k + 2], v[k + 1], v[k], r[k + 1], r[k], FORMAL_ORDER);
            orders[k] = last.observed();
        }
        return new GridStudyResult.Quantity(v, orders, last);
    }

    private static List<GridStudyResult.Tracked> track(CheckResult[] checks, double[] r, List<String> warnings) {
        int n = checks.length;
        Discretization fine = checks[n - 1].problem().full();
        double[] w = fine.nodeWeights();
        List<ModeOverlap.Nodal[]> shapes = new ArrayList<>();
        for (CheckResult ck : checks) {
            Discretization d = ck.problem().full();
            ModeOverlap.Nodal[] s = new ModeOverlap.Nodal[ck.modes().size()];
            for (int m = 0; m < s.length; m++) {
                s[m] = ModeOverlap.onto(d, ck.modes().get(m), fine);
            }
            shapes.add(s);
        }
        List<GridStudyResult.Tracked> out = new ArrayList<>();
        List<EigenPair> fineModes = checks[n - 1].modes();
        for (int m = 0; m < fineModes.size() && out.size() < TRACKED; m++) {
            if (fineModes.get(m).im() < 0) {
                continue;
            }
            out.add(follow(checks, shapes, shapes.get(n - 1)[m], w, r, out.size() + 1, warnings));
        }
        return out;
    }

    private static GridStudyResult.Tracked follow(CheckResult[] checks, List<ModeOverlap.Nodal[]> shapes,
                                                  ModeOverlap.Nodal target, double[] w, double[] r, int label,
                                                  List<String> warnings) {
        int n = checks.length;
        double[] re = new double[n];
        double[] im = new double[n];
        double[] ov = new double[n];
        double[] res = new double[n];
        for (int k = 0; k < n; k++) {
            int best = -1;
            double bestOv = -1;
            for (int m = 0; m < shapes.get(k).length; m++) {
                double o = ModeOverlap.overlap(target, shapes.get(k)[m], w);
                if (o > bestOv) {
                    bestOv = o;
                    best = m;
                }
            }
            EigenPair p = checks[k].modes().get(best);
            re[k] = p.re();
            im[k] = Math.abs(p.im());
            ov[k] = bestOv;
            res[k] = p.residual();
            if (bestOv < MIN_OVERLAP) {
                warnings.add(String.format(Locale.ROOT, "eigenvalue %d: best match on the %d-cell grid has overlap %.3f "
                        + "(below %.2f): the mode may not be resolved there", label, checks[k].problem().theCase().mesh().cells(),
                        bestOv, MIN_OVERLAP));
            }
        }
        GridStudyResult.Quantity q = quantity(re, r);
        return new GridStudyResult.Tracked(re, im, ov, res, q.orders(), q.estimate());
    }
}
