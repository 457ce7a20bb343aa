package rdstab.mesh.fem;

/**
 * A triangle mesh that fails validation, naming the offending item (a node, a triangle or a
 * boundary edge, numbered from 0 in the order given) so that a file reader can point at its line.
 */
public final class InvalidMeshException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    /** What the item is. */
    public enum Item { NODE, TRIANGLE, EDGE, MESH }

    private final Item item;
    private final int number;

    /**
     * @param item    kind of the offending item
     * @param number  its number from 0 (−1 for the mesh as a whole)
     * @param message the problem, in plain words
     */
    public InvalidMeshException(Item item, int number, String message) {
        super(message);
        this.item = item;
        this.number = number;
    }

    /** Kind of the offending item. */
    public Item item() {
        return item;
    }

    /** Its number from 0, or −1. */
    public int number() {
        return number;
    }
}
