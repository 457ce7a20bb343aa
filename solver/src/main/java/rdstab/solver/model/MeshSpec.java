package rdstab.solver.model;

/**
 * Mesh resolution and spacing.
 *
 * @param cells      number of cells along the (first) coordinate, ≥ 2
 * @param cellsY     number of cells along y for 2D shapes (0 in 1D)
 * @param stretchTo  "none", "left", "right" or "both": where the grid clusters (the outer surface is "right")
 * @param stretch    clustering strength (≥ 0; 0 = uniform); see the mesh module's grid javadoc
 * @param size       target element edge length for triangle shapes (0 = not given: then {@code cells}
 *                   elements across the larger extent of the shape, or none at all for a mesh file)
 */
public record MeshSpec(int cells, int cellsY, String stretchTo, double stretch, double size) {

    /** A spec without a triangle size. */
    public MeshSpec(int cells, int cellsY, String stretchTo, double stretch) {
        this(cells, cellsY, stretchTo, stretch, 0.0);
    }

    /**
     * Copy with another cell count (y scaled by the same ratio in 2D). For triangle shapes the
     * count replaces the size: n elements across the larger extent.
     */
    public MeshSpec withCells(int n) {
        int ny = cellsY == 0 || cells == 0 ? 0 : Math.max(2, (int) Math.round((double) cellsY * n / cells));
        return new MeshSpec(n, ny, stretchTo, stretch, 0.0);
    }
}
