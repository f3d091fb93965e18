package org.slopewatch.ops;

import io.quarkus.runtime.Startup;
import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.alerting.ChannelFailures;

/**
 * DOWN while a channel's delivery attempts are failing ({@link ChannelFailures.Run#failing}): at
 * least {@code slopewatch.health.failing-after-attempts} attempts in a row not delivered, or one
 * delivery given up on, the latest within {@code slopewatch.health.failing-within}. Wellness: the
 * daemon still takes quotes, and a pod out of its Service would not make the chat server answer.
 * Started with the daemon, so that a bad setting stops start-up.
 */
@Startup
@Wellness
@ApplicationScoped
public class DeliveryFailuresCheck implements HealthCheck {

    private final ChannelFailures failures;
    private final Clock clock;
    private final int afterAttempts;
    private final Duration within;

    DeliveryFailuresCheck(ChannelFailures failures, HealthConfig config, Clock clock) {
        if (config.failingAfterAttempts() < 1) {
            throw new IllegalArgumentException("slopewatch.health.failing-after-attempts must be at least 1, not "
                    + config.failingAfterAttempts());
        }
        if (config.failingWithin().isNegative() || config.failingWithin().isZero()) {
            throw new IllegalArgumentException("slopewatch.health.failing-within must be positive, not " + config.failingWithin());
        }
        this.failures = failures;
        this.clock = clock;
        this.afterAttempts = config.failingAfterAttempts();
        this.within = config.failingWithin();
    }

    @Override
    public HealthCheckResponse call() {
        Instant now = clock.instant();
        List<ChannelFailures.Run> runs = failures.runs();
        HealthCheckResponseBuilder b = HealthCheckResponse.named("alert deliveries").up()
                .withData("failing when", afterAttempts + " attempt(s) in a row not delivered, or a delivery given up on, the latest "
                        + "within " + within);
        if (runs.isEmpty()) {
            b.withData("attempts", "none since start-up");
        }
        for (ChannelFailures.Run run : runs) {
            boolean failing = run.failing(now, within, afterAttempts);
            if (failing) {
                b.down();
            }
            b.withData(run.channel(), describe(run, failing, now));
        }
        return b.build();
    }

    private String describe(ChannelFailures.Run run, boolean failing, Instant now) {
        if (run.undelivered() == 0) {
            return "delivering: latest attempt delivered at " + run.latest();
        }
        String state = failing ? "failing: " : run.latest().isBefore(now.minus(within)) ? "no attempt within " + within + ": "
                : "retrying: ";
        String lost = run.lost() == 0 ? "" : "; " + run.lost() + " delivery(ies) given up on";
        return state + run.undelivered() + " attempt(s) in a row not delivered since "
                + run.since() + ", latest at " + run.latest() + " (" + run.latestOutcome().name().toLowerCase(Locale.ROOT)
                + ")" + lost + "; the reasons are in the journal's delivery attempts";
    }
}
