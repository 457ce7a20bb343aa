package rdstab.cli.output;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes files atomically: the text goes to a temporary file in the same folder, which is then
 * renamed over the target, so a reader never sees half a file. Existing files are kept unless
 * overwriting is asked for.
 */
public final class AtomicFiles {

    private AtomicFiles() {
    }

    /**
     * @param target    the file to write
     * @param text      its whole content
     * @param overwrite replace an existing file
     */
    public static void write(Path target, String text, boolean overwrite) {
        write(target, text.getBytes(StandardCharsets.UTF_8), overwrite);
    }

    /**
     * Writes bytes (images) the same way.
     *
     * @param target    the file to write
     * @param bytes     its whole content
     * @param overwrite replace an existing file
     */
    public static void write(Path target, byte[] bytes, boolean overwrite) {
        try {
            Path dir = target.toAbsolutePath().getParent();
            Files.createDirectories(dir);
            if (!overwrite && Files.exists(target)) {
                throw new FileAlreadyExistsException(target + " exists; pass --force to overwrite it");
            }
            Path tmp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
            try {
                Files.write(tmp, bytes);
                try (java.nio.channels.FileChannel ch = java.nio.channels.FileChannel.open(tmp, java.nio.file.StandardOpenOption.WRITE)) {
                    ch.force(true);
                }
                try {
                    // temporary files are created private (0600); results are ordinary files (0644)
                    Files.setPosixFilePermissions(tmp, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
                } catch (UnsupportedOperationException e) {
                    // not a POSIX file system: keep the default permissions
                }
                Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } finally {
                Files.deleteIfExists(tmp);
            }
        } catch (FileAlreadyExistsException e) {
            throw new UncheckedIOException(e.getMessage(), e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        }
    }
}
