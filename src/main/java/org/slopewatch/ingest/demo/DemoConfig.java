package org.slopewatch.ingest.demo;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.LocalDate;

/** The built-in scenario feed ({@code ./slopewatch demo} turns it on). */
@ConfigMapping(prefix = "slopewatch.demo")
public interface DemoConfig {

    @WithDefault("false")
    boolean enabled();

    @WithDefault("1")
    long seed();

    /** The scenario's first market date; its market clock then runs ahead on its own. */
    @WithDefault("2026-01-05")
    LocalDate start();

    /** Business days of the scripted cycle played fast: about two years. */
    @WithDefault("520")
    int fastDays();

    /** Pace of the scripted cycle: about two years of business days in under a minute. */
    @WithDefault("12")
    double fastDaysPerSecond();

    /** Pace once the cycle is over: the feed keeps going, slower. */
    @WithDefault("0.5")
    double laterDaysPerSecond();
}
