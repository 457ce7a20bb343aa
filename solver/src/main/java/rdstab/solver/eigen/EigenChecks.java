package rdstab.solver.eigen;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.linear.SparseOps;

/**
 * Post-processing shared by all solvers: M-normalisation, independent residuals, ordering.
 *
 * <p>Residual: ρ = ‖J x − λ M x‖₂ / (‖J‖₁ ‖x‖₂) in complex arithmetic; when J = 0 the denominator
 * uses ‖M‖₁ instead (so that ρ stays defined).
 */
public final class EigenChecks {

    private EigenChecks() {
    }

    /**
     * One eigenvalue or one conjugate pair: λ = re + i·im with im ≥ 0 and eigenvector xr + i·xi; when
     * im &gt; 0 the conjugate (re − i·im, xr − i·xi) is implied.
     */
    record Mode(double re, double im, double[] xr, double[] xi) {
        int multiplicity() {
            return im > 0 ? 2 : 1;
        }
    }

    /** Rightmost first; among equal real parts, the larger |Im| first. */
    static final Comparator<Mode> RIGHTMOST_FIRST =
            Comparator.comparingDouble(Mode::re).reversed().thenComparing(Comparator.comparingDouble(Mode::im).reversed());

    /**
     * Sorts modes rightmost first and keeps the first modes until at least k eigenvalues are covered
     * (a conjugate pair is never split, so k + 1 may be returned), each normalised and checked.
     */
    static List<EigenPair> finish(List<Mode> modes, int k, DMatrixSparseCSC j, DMatrixSparseCSC m) {
        List<Mode> sorted = new ArrayList<>(modes);
        sorted.sort(RIGHTMOST_FIRST);
        double normJ = SparseOps.norm1(j);
        double scale = normJ > 0 ? normJ : SparseOps.norm1(m);
        List<EigenPair> out = new ArrayList<>();
        for (Mode mode : sorted) {
            if (out.size() >= k) {
                break;
            }
            EigenPair p = check(mode.re(), mode.im(), mode.xr(), mode.xi(), j, m, scale);
            out.add(p);
            if (mode.im() > 0) {
                out.add(new EigenPair(p.re(), -p.im(), p.vectorRe(), negate(p.vectorIm()), p.residual()));
            }
        }
        return out;
    }

    /**
     * Normalises x to unit M-norm (and fixes the phase so the largest component is real and positive) and
     * computes ρ. A real pair (im = 0 and no imaginary part in x) skips the products of the zero imaginary
     * part; its vectorIm is a zero array as for a complex one.
     */
    static EigenPair check(double re, double im, double[] xr0, double[] xi0, DMatrixSparseCSC j, DMatrixSparseCSC m,
                           double scale) {
        int n = xr0.length;
        boolean real = im == 0.0 && (xi0 == null || isZero(xi0));
        double[] xr = xr0.clone();
        double[] xi = real ? new double[n] : xi0.clone();
        double[] mr = new double[n];
        double[] mi = real ? null : new double[n];
        normalize(xr, real ? null : xi, m, mr, mi);
        double[] jr = new double[n];
        SparseOps.multiply(j, xr, jr);
        double res2;
        double x2;
        if (real) {
            res2 = residualSquared(re, jr, mr);
            x2 = dot(xr, xr);
        } else {
            double[] ji = new double[n];
            SparseOps.multiply(j, xi, ji);
            res2 = residualSquared(re, im, jr, ji, mr, mi);
            x2 = dot(xr, xr) + dot(xi, xi);
        }
        double denom = scale * Math.sqrt(x2);
        double residual = denom > 0 ? Math.sqrt(res2) / denom : Math.sqrt(res2);
        if (!Double.isFinite(re) || !Double.isFinite(im)) {
            residual = Double.NaN;
        }
        return new EigenPair(re, im, xr, xi, residual);
    }

    /**
     * The pair with x normalised as {@link #check} does (phase fixed, unit M-norm) and the given residual kept:
     * for vectors whose residual was measured elsewhere (in the scaled coordinates of a {@link DiagonalScaling}).
     */
    static EigenPair normalized(double re, double im, double[] xr0, double[] xi0, DMatrixSparseCSC m, double residual) {
        int n = xr0.length;
        boolean real = im == 0.0 && (xi0 == null || isZero(xi0));
        double[] xr = xr0.clone();
        double[] xi = real ? new double[n] : xi0.clone();
        normalize(xr, real ? null : xi, m, new double[n], real ? null : new double[n]);
        return new EigenPair(re, im, xr, xi, residual);
    }

    /** Fixes the phase of x = xr + i·xi (xi null: real) and scales it to unit M-norm; mr, mi receive M x. */
    private static void normalize(double[] xr, double[] xi, DMatrixSparseCSC m, double[] mr, double[] mi) {
        fixPhase(xr, xi);
        SparseOps.multiply(m, xr, mr);
        double mnorm2 = dot(xr, mr);
        if (xi != null) {
            SparseOps.multiply(m, xi, mi);
            mnorm2 += dot(xi, mi);
        }
        double inv = mnorm2 > 0 ? 1.0 / Math.sqrt(mnorm2) : 1.0;
        scale(inv, xr, mr);
        if (xi != null) {
            scale(inv, xi, mi);
        }
    }

    /**
     * Multiplies x = xr + i·xi (xi null: real) by the unit complex number that makes its largest-modulus
     * component real and positive (the first such component). The moduli are compared squared; one
     * hypot for the winner.
     */
    private static void fixPhase(double[] xr, double[] xi) {
        int n = xr.length;
        int big = 0;
        double bigSq = -1;
        for (int i = 0; i < n; i++) {
            double a = xi == null ? xr[i] * xr[i] : xr[i] * xr[i] + xi[i] * xi[i];
            if (a > bigSq) {
                bigSq = a;
                big = i;
            }
        }
        if (xi == null) {
            if (xr[big] < 0) {
                for (int i = 0; i < n; i++) {
                    xr[i] = -xr[i];
                }
            }
            return;
        }
        double bigAbs = Math.hypot(xr[big], xi[big]);
        if (bigAbs > 0) {
            double c = xr[big] / bigAbs;
            double s = -xi[big] / bigAbs;
            for (int i = 0; i < n; i++) {
                double r = xr[i] * c - xi[i] * s;
                double q = xr[i] * s + xi[i] * c;
                xr[i] = r;
                xi[i] = q;
            }
            xi[big] = 0.0;
        }
    }

    // The loops of check are methods of their own: the JIT then compiles each small loop instead of check
    // whole with everything it inlines (0.14 s of C2 CPU in a one-shot 512² run).

    /** x ← a·x, y ← a·y. */
    private static void scale(double a, double[] x, double[] y) {
        for (int i = 0; i < x.length; i++) {
            x[i] *= a;
            y[i] *= a;
        }
    }

    /** ‖j − re·m‖². */
    private static double residualSquared(double re, double[] j, double[] m) {
        double s = 0.0;
        for (int i = 0; i < j.length; i++) {
            double r = j[i] - re * m[i];
            s += r * r;
        }
        return s;
    }

    /** ‖(jr + i·ji) − (re + i·im)(mr + i·mi)‖². */
    private static double residualSquared(double re, double im, double[] jr, double[] ji, double[] mr, double[] mi) {
        double s = 0.0;
        for (int i = 0; i < jr.length; i++) {
            double rr = jr[i] - (re * mr[i] - im * mi[i]);
            double ri = ji[i] - (re * mi[i] + im * mr[i]);
            s += rr * rr + ri * ri;
        }
        return s;
    }

    private static boolean isZero(double[] a) {
        for (double v : a) {
            if (v != 0.0) {
                return false;
            }
        }
        return true;
    }

    static double dot(double[] a, double[] b) {
        double s = 0.0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    static double[] negate(double[] a) {
        double[] b = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            b[i] = -a[i];
        }
        return b;
    }

    /** Argument checks shared by the solvers. */
    static void requireProblem(DMatrixSparseCSC j, DMatrixSparseCSC m) {
        if (j.numRows != j.numCols || m.numRows != m.numCols || j.numCols != m.numCols) {
            throw new IllegalArgumentException("J and M must be square and of one size, got " + j.numRows + "x"
                    + j.numCols + " and " + m.numRows + "x" + m.numCols);
        }
        if (j.numCols == 0) {
            throw new IllegalArgumentException("empty problem (n = 0)");
        }
    }

    /**
     * Error bound of an eigenvalue from its residual in the energy norm:
     * η = ‖W^{-1/2}(Jx − λMx)‖₂ / ‖M^{1/2}x‖₂ with W the row sums of M (W = M for a diagonal M; for a
     * consistent mass matrix W^{-1} stands in for M^{-1}, whose norm it bounds within a small constant).
     * For a self-adjoint pencil some eigenvalue lies within η of λ (Krylov–Bogolyubov / Weinstein bound);
     * for a non-normal operator η is a first-order estimate only.
     */
    public static double errorBound(EigenPair e, DMatrixSparseCSC j, DMatrixSparseCSC m) {
        return errorBound(e, j, m, rowSums(m));
    }

    /** {@link #errorBound(EigenPair, DMatrixSparseCSC, DMatrixSparseCSC)} with the row sums w of M given. */
    static double errorBound(EigenPair e, DMatrixSparseCSC j, DMatrixSparseCSC m, double[] w) {
        int n = j.numRows;
        double[] xr = e.vectorRe();
        double[] xi = e.vectorIm();
        double[] jr = multiply(j, xr);
        double[] ji = multiply(j, xi);
        double[] mr = multiply(m, xr);
        double[] mi = multiply(m, xi);
        double num = 0;
        double den = 0;
        for (int i = 0; i < n; i++) {
            double rr = jr[i] - (e.re() * mr[i] - e.im() * mi[i]);
            double ri = ji[i] - (e.re() * mi[i] + e.im() * mr[i]);
            num += (rr * rr + ri * ri) / w[i];
            den += xr[i] * mr[i] + xi[i] * mi[i];
        }
        return Math.sqrt(num / den);
    }

    /** Row sums of M: the diagonal weights W that stand in for M in the energy-norm bounds (W = M when M is diagonal). */
    static double[] rowSums(DMatrixSparseCSC m) {
        double[] w = new double[m.numRows];
        for (int c = 0; c < m.numCols; c++) {
            for (int p = m.col_idx[c]; p < m.col_idx[c + 1]; p++) {
                w[m.nz_rows[p]] += m.nz_values[p];
            }
        }
        return w;
    }

    private static double[] multiply(DMatrixSparseCSC a, double[] x) {
        double[] y = new double[a.numRows];
        for (int c = 0; c < a.numCols; c++) {
            double xc = x[c];
            for (int p = a.col_idx[c]; p < a.col_idx[c + 1]; p++) {
                y[a.nz_rows[p]] += a.nz_values[p] * xc;
            }
        }
        return y;
    }
}
