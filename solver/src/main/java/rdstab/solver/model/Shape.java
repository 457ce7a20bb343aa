package rdstab.solver.model;

/** The body's shape. One-dimensional shapes use a radial or through-thickness coordinate. */
public enum Shape {
    /** Plane wall, coordinate x. */
    SLAB("slab", 1),
    /** Long cylinder, radial coordinate r. */
    CYLINDER("cylinder", 1),
    /** Sphere, radial coordinate r. */
    SPHERE("sphere", 1),
    /** Rectangle (x, y), finite differences. */
    RECTANGLE("rectangle", 2),
    /** Disk of a given radius centred at the origin, P1 triangles; boundary part "edge". */
    DISK("disk", 2),
    /** Annulus (ring) centred at the origin, P1 triangles; parts "inner" and "outer". */
    ANNULUS("annulus", 2),
    /** The rectangle from/to × y-from/y-to without its upper-right quarter, P1 triangles; part "edge". */
    L_SHAPE("l-shape", 2),
    /** A polygon with holes given by corner points, P1 triangles; parts named in the case file. */
    POLYGON("polygon", 2),
    /** A triangle mesh read from a file beside the case file, P1 triangles; parts from the file. */
    MESH_FILE("mesh-file", 2);

    private final String word;
    private final int dimension;

    Shape(String word, int dimension) {
        this.word = word;
        this.dimension = dimension;
    }

    /** The word used in case files. */
    public String word() {
        return word;
    }

    /** Space dimension. */
    public int dimension() {
        return dimension;
    }

    /** Shape named by its case-file word, or null. */
    public static Shape byWord(String w) {
        for (Shape s : values()) {
            if (s.word.equals(w)) {
                return s;
            }
        }
        return null;
    }

    /** True for the 2D shapes meshed with triangles (finite elements). */
    public boolean triangles() {
        return dimension == 2 && this != RECTANGLE;
    }

    /** True for curved 1D bodies with a radial coordinate. */
    public boolean radial() {
        return this == CYLINDER || this == SPHERE;
    }
}
