package org.slopewatch.cli;

import io.quarkus.runtime.Quarkus;
import io.quarkus.runtime.QuarkusApplication;
import org.eclipse.microprofile.config.ConfigProvider;

/** The daemon once Quarkus is up: say where to look, then run until stopped. */
public class DaemonApplication implements QuarkusApplication {

    @Override
    public int run(String... args) {
        int port = ConfigProvider.getConfig().getOptionalValue("quarkus.http.port", Integer.class).orElse(8080);
        String base = "http://localhost:" + port;
        System.out.println();
        System.out.println("slopewatch is running. Where to look:");
        System.out.println("  dashboard    " + base + "/");
        System.out.println("  spreads      " + base + "/api/spreads");
        System.out.println("  transitions  " + base + "/api/transitions   (and log lines starting 'transition spread=')");
        System.out.println("  metrics      " + base + "/q/metrics");
        System.out.println("  health       " + base + "/q/health         (every check: DOWN when any is)");
        System.out.println("    ready      " + base + "/q/health/ready   (takes and journals quotes)");
        System.out.println("    well       " + base + "/q/health/well    (the desk can rely on its alerts and feeds)");
        System.out.println("  API          " + base + "/q/openapi");
        System.out.println("A statistical signal, not investment advice. Stop with Ctrl+C.");
        System.out.println();
        Quarkus.waitForExit();
        return 0;
    }
}
