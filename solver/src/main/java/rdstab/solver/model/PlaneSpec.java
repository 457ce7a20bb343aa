package rdstab.solver.model;

import java.nio.file.Path;
import java.util.List;

/**
 * The outline of a {@link Shape#POLYGON} (an outer ring and holes, each with a part name per side)
 * or the mesh file of a {@link Shape#MESH_FILE}.
 *
 * @param rings    outer ring first, then the holes (empty for a mesh file)
 * @param meshFile the mesh file, resolved inside the case file's folder (null for a polygon)
 * @param place    where it was written in the case file
 */
public record PlaneSpec(List<Ring> rings, Path meshFile, String place) {

    public PlaneSpec {
        rings = List.copyOf(rings);
    }

    /**
     * One ring of a polygon.
     *
     * @param points corner points [x, y] in order (the ring closes by itself)
     * @param parts  part name of each side (side i from point i to point i+1)
     */
    public record Ring(double[][] points, String[] parts) {
    }
}
