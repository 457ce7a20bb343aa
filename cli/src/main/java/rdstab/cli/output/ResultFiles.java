package rdstab.cli.output;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import rdstab.cli.report.ResultJson;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;

/**
 * The files of one check: base.csv (coordinates and the base state per node), modes.csv (each mode's
 * real and imaginary part per field and node, normalised to unit max amplitude and zero phase at its peak,
 * with amplitude √(re² + im²) and phase atan2(im, re) in radians: the disturbance of an oscillating mode
 * at node i is amp_i e^{Re λ t} cos(Im λ t + phase_i)), eigenvalues.csv and
 * result.json. CSV: comma-separated, one header line, numbers in Java's round-trip decimal form.
 */
public final class ResultFiles {

    private ResultFiles() {
    }

    /** Writes the four files into {@code dir}. */
    public static void write(CheckResult r, Path dir, boolean overwrite) {
        AtomicFiles.write(dir.resolve("base.csv"), baseCsv(r), overwrite);
        AtomicFiles.write(dir.resolve("modes.csv"), modesCsv(r), overwrite);
        AtomicFiles.write(dir.resolve("eigenvalues.csv"), eigenCsv(r), overwrite);
        AtomicFiles.write(dir.resolve("result.json"), ResultJson.toJson(r) + "\n", overwrite);
    }

    static String coordHeader(Discretization d) {
        return d.dimension() == 2 ? "node,x,y" : "node,x";
    }

    static void coords(StringBuilder sb, Discretization d, int i) {
        sb.append(i).append(',').append(d.coordinate(i, 0));
        if (d.dimension() == 2) {
            sb.append(',').append(d.coordinate(i, 1));
        }
    }

    /** base.csv text. */
    public static String baseCsv(CheckResult r) {
        Discretization d = r.problem().full();
        List<String> names = r.problem().theCase().fieldNames();
        StringBuilder sb = new StringBuilder(coordHeader(d));
        for (String n : names) {
            sb.append(',').append(n);
        }
        sb.append('\n');
        for (int i = 0; i < d.nodes(); i++) {
            coords(sb, d, i);
            for (int f = 0; f < names.size(); f++) {
                sb.append(',').append(r.baseNodal()[f][i]);
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** modes.csv text: columns mode{k}_{field}_re, _im, _amp and _phase, each mode scaled to max amplitude 1. */
    public static String modesCsv(CheckResult r) {
        Discretization d = r.problem().full();
        List<String> names = r.problem().theCase().fieldNames();
        int k = r.modes().size();
        double[][][] re = new double[k][][];
        double[][][] im = new double[k][][];
        StringBuilder sb = new StringBuilder(coordHeader(d));
        for (int m = 0; m < k; m++) {
            EigenPair e = r.modes().get(m);
            re[m] = d.nodalPerturbation(e.vectorRe());
            im[m] = d.nodalPerturbation(e.vectorIm());
            normalise(re[m], im[m]);
            for (String n : names) {
                sb.append(",mode").append(m + 1).append('_').append(n).append("_re");
                sb.append(",mode").append(m + 1).append('_').append(n).append("_im");
                sb.append(",mode").append(m + 1).append('_').append(n).append("_amp");
                sb.append(",mode").append(m + 1).append('_').append(n).append("_phase");
            }
        }
        sb.append('\n');
        for (int i = 0; i < d.nodes(); i++) {
            coords(sb, d, i);
            for (int m = 0; m < k; m++) {
                for (int f = 0; f < names.size(); f++) {
                    double a = re[m][f][i];
                    double b = im[m][f][i];
                    sb.append(',').append(a).append(',').append(b).append(',').append(Math.hypot(a, b))
                      .append(',').append(Math.atan2(b, a));
                }
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /**
     * Scales a complex mode so its largest amplitude is 1 and, at that node, it is real and positive.
     */
    public static void normalise(double[][] re, double[][] im) {
        double best = -1;
        double pr = 1;
        double pi = 0;
        for (int f = 0; f < re.length; f++) {
            for (int i = 0; i < re[f].length; i++) {
                double a = Math.hypot(re[f][i], im[f][i]);
                if (a > best) {
                    best = a;
                    pr = re[f][i];
                    pi = im[f][i];
                }
            }
        }
        if (best <= 0) {
            return;
        }
        double s = 1.0 / (best * best);
        for (int f = 0; f < re.length; f++) {
            for (int i = 0; i < re[f].length; i++) {
                double a = re[f][i];
                double b = im[f][i];
                re[f][i] = (a * pr + b * pi) * s;
                im[f][i] = (b * pr - a * pi) * s;
            }
        }
    }

    /** eigenvalues.csv text. */
    public static String eigenCsv(CheckResult r) {
        StringBuilder sb = new StringBuilder("index,re,im,residual\n");
        int i = 1;
        for (EigenPair e : r.modes()) {
            sb.append(i++).append(',').append(e.re()).append(',').append(e.im()).append(',')
              .append(String.format(Locale.ROOT, "%.3e", e.residual())).append('\n');
        }
        return sb.toString();
    }
}
