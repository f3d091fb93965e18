package org.slopewatch.ops;

import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.time.Clock;

/** The one place the daemon reads the wall clock; everything else has it injected. */
@ApplicationScoped
public class ClockBeans {

    @Produces
    @Singleton
    Clock clock() {
        return Clock.systemUTC();
    }
}
