package rdstab.cli.command;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.ejml.data.DMatrixSparseCSC;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.MatrixMarket;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.eigen.EigenOptions;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.eigen.EigenSolvers;
import rdstab.solver.eigen.Spectrum;
import rdstab.solver.energy.EnergyAnalysis;
import rdstab.solver.error.InputException;

/** rdstab spectrum: the eigen-solver on matrices read from Matrix Market files. */
@Command(name = "spectrum", mixinStandardHelpOptions = true,
        description = {
            "Compute the rightmost eigenvalues of J x = lambda M x for matrices read from Matrix Market files "
                + "(M defaults to the identity), with each eigenpair's residual and the time spent in ordering, "
                + "factorization and iteration. Use it on the files 'rdstab export' writes, or on any operator.",
            "",
            "Examples:",
            "  rdstab spectrum out/J.mtx out/M.mtx --modes 6",
            "  rdstab spectrum A.mtx --shift 0 --symmetric --json"},
        footer = {"", "Exit status: 0 completed, 2 bad input, 3 the eigen-solver failed, 4 file error."})
public final class SpectrumCommand implements Callable<Integer> {

    private static final ObjectMapper MAPPER = new ObjectMapper();

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "J.mtx", description = "The operator J (Matrix Market coordinate file).")
    Path jFile;

    @Parameters(index = "1", arity = "0..1", paramLabel = "M.mtx",
            description = "The weight matrix M (symmetric positive definite); the identity when absent.")
    Path mFile;

    @Option(names = "--modes", paramLabel = "K", defaultValue = "6", description = "Number of rightmost eigenvalues (default: ${DEFAULT-VALUE}).")
    int modes;

    @Option(names = "--shift", paramLabel = "S",
            description = "Shift for shift-invert (default: automatic, right of every eigenvalue by a Gershgorin bound). "
                    + "The eigenvalues nearest S are found first.")
    Double shift;

    @Option(names = "--symmetric", description = "J is symmetric: Lanczos with a Cholesky factorization (the shift must "
            + "lie above the spectrum). Without --shift a symmetric J is detected by itself.")
    boolean symmetric;

    @Option(names = "--tolerance", paramLabel = "T",
            description = "Relative residual tolerance of the Ritz pairs (default 0: the solver's own, 1e-10 for the "
                    + "Lanczos path, which already gives the eigenvalues to round-off, and the unit round-off for "
                    + "Arnoldi). Use it to match another solver's setting.")
    Double tolerance;

    @Option(names = "--json", description = "Print one JSON object with 'leading' as in the result contract, and the timings.")
    boolean json;

    @Option(names = "--debug", description = "Show stack traces on errors and the factorization details.")
    boolean debug;

    @Override
    public Integer call() {
        long t0 = System.nanoTime();
        DMatrixSparseCSC j = MatrixMarket.read(jFile);
        DMatrixSparseCSC m = mFile == null ? identity(j.numCols) : MatrixMarket.read(mFile);
        double readSeconds = (System.nanoTime() - t0) * 1e-9;
        if (j.numRows != j.numCols) {
            throw new InputException(jFile.toString(), "size line", "a square matrix, found " + j.numRows + "x" + j.numCols);
        }
        if (m.numRows != j.numRows || m.numCols != j.numCols) {
            throw new InputException(String.valueOf(mFile), "size line", "a " + j.numRows + "x" + j.numCols
                    + " matrix like J, found " + m.numRows + "x" + m.numCols);
        }
        if (modes < 1 || modes > Math.min(200, j.numCols)) {
            throw new InputException("command line", "--modes", "1 to " + Math.min(200, j.numCols) + " modes, found " + modes);
        }
        if (shift != null && !Double.isFinite(shift)) {
            throw new InputException("command line", "--shift", "a finite number, found " + shift);
        }
        if (tolerance != null && !(tolerance >= 0 && tolerance < 1)) {
            throw new InputException("command line", "--tolerance", "a number in [0, 1), found " + tolerance);
        }
        boolean sym = symmetric || (shift == null && EnergyAnalysis.isSymmetric(j));
        EigenOptions opts = new EigenOptions(modes, shift == null ? Double.NaN : shift, sym,
                tolerance == null ? 0.0 : tolerance, 3000, 0);
        Spectrum s = EigenSolvers.solve(j, m, opts);
        double total = (System.nanoTime() - t0) * 1e-9;
        PrintWriter w = spec.commandLine().getOut();
        if (json) {
            w.println(toJson(s, j, readSeconds, total));
        } else {
            text(w, s, j, readSeconds, total);
        }
        w.flush();
        return 0;
    }

    private static DMatrixSparseCSC identity(int n) {
        DMatrixSparseCSC a = new DMatrixSparseCSC(n, n, n);
        for (int i = 0; i < n; i++) {
            a.col_idx[i + 1] = i + 1;
            a.nz_rows[i] = i;
            a.nz_values[i] = 1.0;
        }
        a.nz_length = n;
        a.indicesSorted = true;
        return a;
    }

    private void text(PrintWriter w, Spectrum s, DMatrixSparseCSC j, double read, double total) {
        w.printf(Locale.ROOT, "Operator: %d unknowns, %d stored entries in J%n", j.numCols, j.nz_length);
        w.printf(Locale.ROOT, "Method: %s, shift %s, %d of %d requested computed, %d operator applications, %s%n",
                s.method(), fmt(s.shift()), s.computed(), s.requested(), s.operatorApplications(),
                s.rightmostCertified() ? "rightmost set certified" : "rightmost set NOT certified (eigenvalues nearest the shift)");
        if (!s.scaling().isIdentity()) {
            w.printf(Locale.ROOT, "Scaling: J was brought close to symmetric by a diagonal similarity D^-1 J D (span %.1e) before "
                    + "the solve: same eigenvalues, well conditioned there; residuals are those of the scaled pencil%n",
                    s.scaling().span());
        }
        w.printf(Locale.ROOT, "Time: read %.3f s, ordering %.3f s, factorization %.3f s, iteration %.3f s (total %.3f s)%n",
                read, nan0(s.orderingSeconds()), s.factorizationSeconds(), s.iterationSeconds(), total);
        if (debug) {
            w.printf(Locale.ROOT, "Factor non-zeros: %d%n", s.factorNonZeros());
        }
        w.println();
        w.println("  #   Re(lambda)              Im(lambda)              residual");
        int i = 1;
        for (EigenPair p : s.pairs()) {
            w.printf(Locale.ROOT, "%3d   %-22s  %-22s  %.2e%n", i++, fmt(p.re()), fmt(p.im()), p.residual());
        }
        w.println();
        w.println("Cautions:");
        for (String c : SafetyCautions.STANDARD) {
            w.println("  - " + c);
        }
    }

    private String toJson(Spectrum s, DMatrixSparseCSC j, double read, double total) {
        Map<String, Object> o = new LinkedHashMap<>();
        List<Object> leading = new ArrayList<>();
        for (EigenPair p : s.pairs()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("re", p.re());
            e.put("im", p.im());
            e.put("residual", p.residual());
            leading.add(e);
        }
        o.put("leading", leading);
        o.put("growth_rate", s.rightmostRealPart());
        o.put("unknowns", j.numCols);
        o.put("method", s.method());
        o.put("shift", Double.isNaN(s.shift()) ? null : s.shift());
        o.put("rightmost_certified", s.rightmostCertified());
        o.put("operator_applications", s.operatorApplications());
        o.put("factor_nonzeros", s.factorNonZeros());
        o.put("scaling_span", s.scaling().span());
        Map<String, Object> sec = new LinkedHashMap<>();
        sec.put("read", read);
        sec.put("ordering", nan0(s.orderingSeconds()));
        sec.put("factorization", s.factorizationSeconds());
        sec.put("iteration", s.iterationSeconds());
        sec.put("total", total);
        o.put("seconds", sec);
        o.put("cautions", SafetyCautions.STANDARD);
        try {
            return MAPPER.writeValueAsString(o);
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static double nan0(double v) {
        return Double.isNaN(v) ? 0.0 : v;
    }

    private static String fmt(double v) {
        return Double.isNaN(v) ? "none" : String.format(Locale.ROOT, "%.15g", v);
    }
}
