package rdstab.cli.output;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;

/**
 * Legacy VTK files (the open "vtk DataFile Version 3.0" ASCII format) that the usual open-source visualisation
 * tools read: an UNSTRUCTURED_GRID with the mesh cells of {@link Discretization#cells()} — VTK_LINE (type 3) in
 * 1D, VTK_TRIANGLE (5) and VTK_QUAD (9) in 2D — node coordinates padded to three components with zeros, and one
 * SCALARS point-data array per quantity. Numbers are written in Java's shortest round-trip form, so reading the
 * file back gives the same doubles.
 */
public final class VtkWriter {

    /** VTK cell type of a 2-node segment. */
    public static final int VTK_LINE = 3;
    /** VTK cell type of a 3-node triangle. */
    public static final int VTK_TRIANGLE = 5;
    /** VTK cell type of a 4-node quadrilateral. */
    public static final int VTK_QUAD = 9;

    private VtkWriter() {
    }

    /**
     * The file's text.
     *
     * @param title     one line, at most 255 characters (longer titles are cut, line breaks become spaces)
     * @param d         the mesh: coordinates and cells
     * @param pointData array name → one value per node (names: letters, digits and '_' only; others are replaced)
     */
    public static String text(String title, Discretization d, Map<String, double[]> pointData) {
        int n = d.nodes();
        StringBuilder sb = new StringBuilder(64 + 40 * n * (1 + pointData.size()));
        String t = title.replaceAll("\\R", " ");
        sb.append("# vtk DataFile Version 3.0\n").append(t, 0, Math.min(255, t.length())).append('\n');
        sb.append("ASCII\nDATASET UNSTRUCTURED_GRID\n");
        sb.append("POINTS ").append(n).append(" double\n");
        for (int i = 0; i < n; i++) {
            sb.append(d.coordinate(i, 0)).append(' ').append(d.dimension() > 1 ? d.coordinate(i, 1) : 0.0).append(" 0.0\n");
        }
        int[][] cells = d.cells();
        int size = 0;
        for (int[] c : cells) {
            size += 1 + c.length;
        }
        sb.append("CELLS ").append(cells.length).append(' ').append(size).append('\n');
        for (int[] c : cells) {
            sb.append(c.length);
            for (int k : c) {
                sb.append(' ').append(k);
            }
            sb.append('\n');
        }
        sb.append("CELL_TYPES ").append(cells.length).append('\n');
        for (int[] c : cells) {
            sb.append(cellType(c.length)).append('\n');
        }
        sb.append("POINT_DATA ").append(n).append('\n');
        for (Map.Entry<String, double[]> e : pointData.entrySet()) {
            double[] v = e.getValue();
            if (v.length != n) {
                throw new IllegalArgumentException("array '" + e.getKey() + "' has " + v.length + " values, the mesh has "
                        + n + " nodes");
            }
            sb.append("SCALARS ").append(arrayName(e.getKey())).append(" double 1\nLOOKUP_TABLE default\n");
            for (double x : v) {
                sb.append(Double.isFinite(x) ? Double.toString(x) : "0.0").append('\n');
            }
        }
        return sb.toString();
    }

    /**
     * The arrays of a check: each field's base state under its own name, and each mode's real and imaginary parts
     * as {@code modeK_FIELD_re} and {@code modeK_FIELD_im}, normalised as in modes.csv (largest amplitude 1,
     * real and positive there).
     */
    public static Map<String, double[]> checkArrays(CheckResult r) {
        Discretization d = r.problem().full();
        List<String> names = r.problem().theCase().fieldNames();
        Map<String, double[]> m = new LinkedHashMap<>();
        for (int f = 0; f < names.size(); f++) {
            m.put(arrayName(names.get(f)), r.baseNodal()[f]);
        }
        int k = 1;
        for (EigenPair e : r.modes()) {
            double[][] re = d.nodalPerturbation(e.vectorRe());
            double[][] im = d.nodalPerturbation(e.vectorIm());
            ResultFiles.normalise(re, im);
            for (int f = 0; f < names.size(); f++) {
                m.put("mode" + k + "_" + arrayName(names.get(f)) + "_re", re[f]);
                m.put("mode" + k + "_" + arrayName(names.get(f)) + "_im", im[f]);
            }
            k++;
        }
        return m;
    }

    /** Writes {@code dir/check.vtk} for a check result; returns its path. */
    public static Path write(CheckResult r, Path dir, boolean overwrite) {
        Path p = dir.resolve("check.vtk");
        String title = "rdstab check: " + r.problem().theCase().title() + " | verdict " + r.assessment().verdict().word();
        AtomicFiles.write(p, text(title, r.problem().full(), checkArrays(r)), overwrite);
        return p;
    }

    static int cellType(int nodes) {
        return switch (nodes) {
            case 2 -> VTK_LINE;
            case 3 -> VTK_TRIANGLE;
            case 4 -> VTK_QUAD;
            default -> throw new IllegalArgumentException("no VTK cell type for a cell of " + nodes + " nodes");
        };
    }

    /** An array name VTK accepts (no blanks): characters other than letters, digits and '_' become '_'. */
    static String arrayName(String s) {
        String t = s.replaceAll("[^A-Za-z0-9_]", "_");
        return t.isEmpty() ? "_" : t;
    }
}
