package dev.reweigh.core;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/**
 * Facts about the library itself.
 *
 * @since 0.1
 */
public final class Reweigh {
    private static final String VERSION = readVersion();

    private Reweigh() {
    }

    /**
     * Returns the library's version, e.g. "0.1.0-SNAPSHOT"; model artifacts record it.
     *
     * @return the version of the glm-core module in use
     * @since 0.1
     */
    public static String version() {
        return VERSION;
    }

    private static String readVersion() {
        try (InputStream in = Reweigh.class.getResourceAsStream("version.properties")) {
            if (in == null) {
                throw new IllegalStateException("version.properties is missing from glm-core");
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
