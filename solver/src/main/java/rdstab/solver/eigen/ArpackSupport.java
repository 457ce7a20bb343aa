package rdstab.solver.eigen;

import dev.ludovic.netlib.arpack.ARPACK;
import java.util.Map;

/**
 * Named slots of ARPACK's iparam/ipntr arrays (0-based Java indices of the 1-based Fortran
 * positions documented in dnaupd.f / dsaupd.f) and readable translations of the info codes.
 *
 * <p>ipntr holds 1-based Fortran positions into workd; subtract one to get a Java offset.
 * The f2j ARPACK keeps its SAVE variables in static fields, so all ARPACK calls are serialised on
 * {@link #LOCK}.
 */
final class ArpackSupport {

    private ArpackSupport() {
    }

    /** Serialises every reverse-communication sequence (the f2j translation keeps static state). */
    static final Object LOCK = new Object();

    /** iparam(1): 1 = ARPACK chooses exact shifts. */
    static final int ISHIFT = 0;
    /** iparam(3): on input the maximum number of implicit restarts, on output the number taken. */
    static final int MXITER = 2;
    /** iparam(4): block size, must be 1. */
    static final int NB = 3;
    /** iparam(5): number of converged Ritz values (output). */
    static final int NCONV = 4;
    /** iparam(7): mode (1 = standard, 3 = shift-invert). */
    static final int MODE = 6;
    /** iparam(9): number of OP·x operations (output). */
    static final int NUMOP = 8;
    /** iparam(10): number of B·x operations (output). */
    static final int NUMOPB = 9;
    /** iparam(11): number of re-orthogonalisation steps (output). */
    static final int NUMREO = 10;
    /** Length of iparam. */
    static final int IPARAM_LENGTH = 11;

    /** ipntr(1): start of X in workd. */
    static final int IPNTR_X = 0;
    /** ipntr(2): start of Y in workd. */
    static final int IPNTR_Y = 1;
    /** ipntr(3): start of B·X in workd (mode 3 of dsaupd). */
    static final int IPNTR_BX = 2;
    /** Length of ipntr for dnaupd (dsaupd needs 11). */
    static final int IPNTR_LENGTH = 14;

    /** ido values of the reverse-communication protocol. */
    static final int IDO_FIRST = -1;
    static final int IDO_APPLY_OP = 1;
    static final int IDO_APPLY_B = 2;
    static final int IDO_DONE = 99;

    static ARPACK arpack() {
        return ARPACK.getInstance();
    }

    /** Name of the ARPACK implementation that loaded (pure-Java f2j or the native JNI binding). */
    static String implementationName() {
        return ARPACK.getInstance().getClass().getName();
    }

    private static final Map<Integer, String> AUPD = Map.ofEntries(
            Map.entry(1, "the maximum number of implicit restarts was reached"),
            Map.entry(3, "no shifts could be applied during an implicit restart; a larger subspace (ncv) is needed"),
            Map.entry(-1, "n must be positive"),
            Map.entry(-2, "the number of eigenvalues nev must be positive"),
            Map.entry(-3, "the subspace size ncv is out of range (nev < ncv <= n, dnaupd needs ncv - nev >= 2)"),
            Map.entry(-4, "the maximum number of restarts must be positive"),
            Map.entry(-5, "the 'which' selector is invalid"),
            Map.entry(-6, "bmat must be 'I' or 'G'"),
            Map.entry(-7, "the private work array workl is too short"),
            Map.entry(-8, "LAPACK failed on the projected (Hessenberg/tridiagonal) eigenproblem"),
            Map.entry(-9, "the starting vector is zero"),
            Map.entry(-10, "mode (iparam[6]) must be 1 to 5"),
            Map.entry(-11, "mode 1 is incompatible with bmat = 'G'"),
            Map.entry(-12, "iparam[0] (ishift) must be 0 or 1"),
            Map.entry(-13, "nev and which = 'BE' are incompatible"),
            Map.entry(-9999, "no Arnoldi/Lanczos factorization could be built (the operator may be singular or the start vector deficient)"));

    private static final Map<Integer, String> NEUPD = Map.ofEntries(
            Map.entry(1, "LAPACK could not reorder the Schur form"),
            Map.entry(-7, "the private work array workl is too short"),
            Map.entry(-8, "LAPACK failed on the projected eigenproblem"),
            Map.entry(-9, "LAPACK failed computing the eigenvectors of the projected problem"),
            Map.entry(-14, "the iteration found no eigenvalue to sufficient accuracy"),
            Map.entry(-15, "the post-processing counted a different number of converged Ritz values than the iteration"));

    private static final Map<Integer, String> SEUPD = Map.ofEntries(
            Map.entry(-7, "the private work array workl is too short"),
            Map.entry(-8, "LAPACK failed on the projected tridiagonal eigenproblem"),
            Map.entry(-9, "the starting vector is zero"),
            Map.entry(-14, "the iteration found no eigenvalue to sufficient accuracy"),
            Map.entry(-17, "the post-processing counted a different number of converged Ritz values than the iteration"));

    /** Readable message for an info code of dnaupd/dsaupd. */
    static String describeIteration(String routine, int info) {
        return routine + " returned info=" + info + ": " + AUPD.getOrDefault(info, "undocumented error code");
    }

    /** Readable message for an info code of dneupd. */
    static String describeNonsymmetricPost(int info) {
        String text = NEUPD.containsKey(info) ? NEUPD.get(info) : AUPD.getOrDefault(info, "undocumented error code");
        return "dneupd returned info=" + info + ": " + text;
    }

    /** Readable message for an info code of dseupd. */
    static String describeSymmetricPost(int info) {
        String text = SEUPD.containsKey(info) ? SEUPD.get(info) : AUPD.getOrDefault(info, "undocumented error code");
        return "dseupd returned info=" + info + ": " + text;
    }

    /** Reproducible starting vector (ARPACK's own is random but seeded in static state). */
    static void startVector(double[] resid) {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(20240611L);
        for (int i = 0; i < resid.length; i++) {
            resid[i] = rnd.nextDouble(-1.0, 1.0);
        }
    }
}
