package org.slopewatch.cli;

import org.slopewatch.ops.BuildInfo;
import picocli.CommandLine.IVersionProvider;

/** {@code --version}: the version the build stamped ({@link BuildInfo}). */
final class BuildVersion implements IVersionProvider {

    @Override
    public String[] getVersion() {
        return new String[] {"slopewatch " + BuildInfo.version()};
    }
}
