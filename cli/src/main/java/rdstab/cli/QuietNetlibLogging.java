package rdstab.cli;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.logging.LogManager;

/**
 * java.util.logging configuration class (named by the system property java.util.logging.config.class, which
 * {@link Main} sets): the usual configuration (the file named by java.util.logging.config.file, else the
 * JDK's conf/logging.properties) plus {@code dev.ludovic.netlib.level = SEVERE}. dev.ludovic.netlib logs a
 * warning each time the native ARPACK is not installed and it falls back to its pure-Java build; that is
 * expected and not the user's concern (both give the same answers).
 *
 * <p>Done this way, java.util.logging starts only when something logs (netlib on the ARPACK paths); setting the
 * logger's level at start-up initialized the LogManager in every run (about 17 ms of a 0.25 s 'check').
 */
public final class QuietNetlibLogging {

    /** The line added to the configuration. */
    static final String NETLIB_LEVEL = "dev.ludovic.netlib.level = SEVERE";

    /**
     * Reads the configuration into the LogManager (called by the LogManager itself when it starts).
     *
     * @throws IOException if the configuration file cannot be read
     */
    public QuietNetlibLogging() throws IOException {
        String file = System.getProperty("java.util.logging.config.file");
        Path p = file != null ? Path.of(file) : Path.of(System.getProperty("java.home"), "conf", "logging.properties");
        // .properties files are ISO 8859-1 (Properties.load(InputStream), which readConfiguration uses)
        String base = Files.isReadable(p) ? Files.readString(p, StandardCharsets.ISO_8859_1) : "";
        String conf = base + "\n" + NETLIB_LEVEL + "\n";
        LogManager.getLogManager().readConfiguration(new ByteArrayInputStream(conf.getBytes(StandardCharsets.ISO_8859_1)));
    }

    /** Makes the LogManager use this class when it starts, unless a configuration class is already named. */
    static void install() {
        if (System.getProperty("java.util.logging.config.class") == null) {
            System.setProperty("java.util.logging.config.class", QuietNetlibLogging.class.getName());
        }
    }
}
