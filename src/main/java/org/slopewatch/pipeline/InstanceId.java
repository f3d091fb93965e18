package org.slopewatch.pipeline;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.slopewatch.journal.PolicyInForce;
import org.slopewatch.text.ControlCharacters;

/**
 * The name an instance goes by in the journal: {@code slopewatch.fleet.instance-id} when set,
 * otherwise {@code HOST-PID}, the host name and this process's id. On Kubernetes the host name is
 * the pod's name, which is what an operator looks up; the process id tells apart two daemons on
 * one machine. The host name comes from the environment or {@code /etc/hostname}, never from a
 * name lookup, so that finding it asks no server.
 */
public final class InstanceId {

    private InstanceId() {
    }

    /** The configured id, checked, or the default. */
    public static String of(Optional<String> configured) {
        if (configured.isPresent()) {
            String id = configured.get().strip();
            if (id.isEmpty() || id.length() > PolicyInForce.INSTANCE_CHARS || ControlCharacters.first(id) >= 0) {
                throw new IllegalArgumentException("slopewatch.fleet.instance-id must be 1 to " + PolicyInForce.INSTANCE_CHARS
                        + " characters without control characters");
            }
            return id;
        }
        return host() + "-" + ProcessHandle.current().pid();
    }

    private static String host() {
        String env = System.getenv("HOSTNAME");
        if (env != null && !env.isBlank()) {
            return env.strip();
        }
        try {
            String file = Files.readString(Path.of("/etc/hostname")).strip();
            if (!file.isEmpty()) {
                return file;
            }
        } catch (IOException | RuntimeException e) {
            // no such file on this system: the fallback below
        }
        return "host";
    }
}
