package org.slopewatch.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;
import picocli.CommandLine.IVersionProvider;

/**
 * The version the build stamped into {@code slopewatch-build.properties} (Maven fills in the
 * project's version when it copies the file), so {@code --version} never disagrees with the pom.
 */
final class BuildVersion implements IVersionProvider {

    static final String RESOURCE = "/slopewatch-build.properties";

    @Override
    public String[] getVersion() {
        return new String[] {"slopewatch " + version()};
    }

    static String version() {
        try (InputStream in = BuildVersion.class.getResourceAsStream(RESOURCE)) {
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
