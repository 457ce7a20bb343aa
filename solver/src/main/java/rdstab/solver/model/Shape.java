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
    RECTANGLE("rectangle", 2);

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

    /** True for curved 1D bodies with a radial coordinate. */
    public boolean radial() {
        return this == CYLINDER || this == SPHERE;
    }
}
