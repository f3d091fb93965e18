package org.slopewatch.ops;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/**
 * The version the build stamped into {@code slopewatch-build.properties} (Maven fills in the
 * project's version when it copies the file), so that {@code --version} and the info metric
 * never disagree with the pom.
 */
public final class BuildInfo {

    static final String RESOURCE = "/slopewatch-build.properties";

    private BuildInfo() {
    }

    public static String version() {
        try (InputStream in = BuildInfo.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException(RESOURCE + " is missing from the build");
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
