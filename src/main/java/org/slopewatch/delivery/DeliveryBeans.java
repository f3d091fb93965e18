package org.slopewatch.delivery;

import io.quarkus.runtime.Startup;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.time.Clock;
import java.util.Random;

/** The retry policy from {@link DeliveryConfig}, checked at start-up. */
@ApplicationScoped
public class DeliveryBeans {

    @Produces
    @Singleton
    @Startup
    RetryPolicy retryPolicy(DeliveryConfig config, Clock clock) {
        DeliveryConfig.Retry r = config.retry();
        try {
            // java.util.Random is safe to share between the threads that deliver
            return new RetryPolicy(r.base(), r.cap(), r.maxAge(), r.jitter(), clock, new Random());
        } catch (IllegalArgumentException e) {
            throw new IllegalStateException("slopewatch.delivery.retry: " + e.getMessage(), e);
        }
    }
}
