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

    /**
     * Pace of the scripted cycle: four business days a second, a quarter of a second each, so that
     * a confirmed inversion stays on screen for over a minute before it re-steepens (about two
     * years of business days in a little over two minutes). {@code slopewatch demo --pace} sets it
     * in seconds per market day.
     */
    @WithDefault("4")
    double fastDaysPerSecond();

    /** Pace once the cycle is over: the feed keeps going, slower. */
    @WithDefault("0.5")
    double laterDaysPerSecond();
}
