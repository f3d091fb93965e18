package org.slopewatch.ops;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.Meter;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import jakarta.enterprise.context.ApplicationScoped;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.Transition;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.RejectReason;
import org.slopewatch.probability.LiveProbability;

/**
 * The pipeline's metrics, under {@code slopewatch.}: quotes accepted, rejected by reason and
 * duplicated (by origin); per spread the latest value, the state as a number
 * ({@link SpreadState#code()}: 0 normal, 1 inverted, 2 confirmed, 3 re-steepening) and as one
 * series per state (1 for the state the spread is in, 0 for the others), days inverted and the
 * quarter-to-date average; transitions; processing and journal-write timers with histogram
 * buckets; and {@code slopewatch.info}, 1 with the build's version and the policy's hash as tags.
 * A spread the policy no longer watches loses its series at the rebuild that follows a reload.
 * Tag values are bounded: origins, reasons, spread ids, states, one version and one policy hash.
 */
@ApplicationScoped
public class PipelineMetrics implements PipelineListener {

    static final String[] ORIGINS = {"http", "kafka", "demo", "csv", "pull"};

    private final MeterRegistry registry;
    private final Timer processing;
    private final Timer journalWrite;
    private final Map<String, SpreadGauges> spreads = new ConcurrentHashMap<>();

    /** The latest figures of one spread, read by its gauges at scrape time. */
    static final class SpreadGauges {
        final List<Meter> meters = new ArrayList<>();
        volatile double valueBp = Double.NaN;
        volatile double state;
        volatile double daysInverted;
        volatile double quarterToDateBp = Double.NaN;
        volatile double probability = Double.NaN;
    }

    private final PolicyHolder policies;
    private Meter info;
    private String infoPolicyHash;

    PipelineMetrics(MeterRegistry registry, PolicyHolder policies) {
        this.registry = registry;
        this.policies = policies;
        this.processing = Timer.builder("slopewatch.processing").description("Time to run a step through curves, spreads and monitors")
                .publishPercentileHistogram().register(registry);
        this.journalWrite = Timer.builder("slopewatch.journal.write").description("Time to write a step to the journal")
                .publishPercentileHistogram().register(registry);
        // counters exist at zero from the start, so that a rate over them is defined before the first event
        for (String origin : ORIGINS) {
            accepted(origin).increment(0);
            duplicates(origin).increment(0);
            for (RejectReason reason : RejectReason.values()) {
                rejectedCounter(origin, reason).increment(0);
            }
        }
    }

    private Counter accepted(String origin) {
        return Counter.builder("slopewatch.quotes.accepted").description("Quote messages accepted").tag("origin", origin).register(registry);
    }

    private Counter duplicates(String origin) {
        return Counter.builder("slopewatch.quotes.duplicates").description("Quote messages ignored because their id was seen before")
                .tag("origin", origin).register(registry);
    }

    private Counter rejectedCounter(String origin, RejectReason reason) {
        return Counter.builder("slopewatch.quotes.rejected").description("Quote messages rejected, by reason")
                .tag("origin", origin).tag("reason", reason.code()).register(registry);
    }

    @Override
    public void accepted(String origin, int messages) {
        accepted(origin).increment(messages);
    }

    @Override
    public void rejected(String origin, RejectReason reason) {
        rejectedCounter(origin, reason).increment();
    }

    @Override
    public void duplicates(String origin, int messages) {
        duplicates(origin).increment(messages);
    }

    @Override
    public void transition(Transition t) {
        Counter.builder("slopewatch.transitions").description("State transitions of the monitored spreads")
                .tag("spread", t.spread().id()).tag("to", t.to().name()).register(registry).increment();
    }

    @Override
    public void spreadChanged(SpreadStatus s) {
        SpreadGauges g = spreads.computeIfAbsent(s.id(), this::register);
        g.valueBp = s.valueBp();
        g.state = s.state().code();
        g.daysInverted = s.daysInverted();
        g.quarterToDateBp = s.quarterToDateAverageBp();
        g.probability = policies.policy().probability().current(s).map(LiveProbability::probability).orElse(Double.NaN);
    }

    private SpreadGauges register(String spreadId) {
        SpreadGauges g = new SpreadGauges();
        g.meters.add(Gauge.builder("slopewatch.spread.value", g, x -> x.valueBp).baseUnit("bp").description("Latest spread value")
                .tag("spread", spreadId).register(registry));
        g.meters.add(Gauge.builder("slopewatch.spread.state", g, x -> x.state)
                .description("Monitor state: 0 NORMAL, 1 INVERTED, 2 CONFIRMED, 3 RESTEEPENING").tag("spread", spreadId).register(registry));
        for (SpreadState state : SpreadState.values()) {
            g.meters.add(Gauge.builder("slopewatch.spread.in.state", g, x -> x.state == state.code() ? 1 : 0)
                    .description("1 for the state the spread is in, 0 for the others").tag("spread", spreadId).tag("state", state.name())
                    .register(registry));
        }
        g.meters.add(Gauge.builder("slopewatch.spread.inverted", g, x -> x.daysInverted).baseUnit("days")
                .description("Calendar days continuously below the entry threshold").tag("spread", spreadId).register(registry));
        g.meters.add(Gauge.builder("slopewatch.spread.quarter.average", g, x -> x.quarterToDateBp).baseUnit("bp")
                .description("Average of the current calendar quarter so far").tag("spread", spreadId).register(registry));
        g.meters.add(Gauge.builder("slopewatch.spread.recession.probability", g, x -> x.probability)
                .description("Recession probability from the policy's probit model on this month's average so far (0 to 1; "
                        + "absent model: NaN)").tag("spread", spreadId).register(registry));
        return g;
    }

    /** A rebuild: spreads no longer watched lose their series; the info metric names the policy now in force. */
    @Override
    public synchronized void watching(Set<String> spreadIds) {
        spreads.keySet().removeIf(id -> {
            if (spreadIds.contains(id)) {
                return false;
            }
            spreads.get(id).meters.forEach(registry::remove);
            return true;
        });
        String hash = policies.current().hash();
        if (!hash.equals(infoPolicyHash)) {
            if (info != null) {
                registry.remove(info);
            }
            info = Gauge.builder("slopewatch.info", () -> 1).description("The build's version and the hash of the policy in force")
                    .tag("version", BuildInfo.version()).tag("policy", hash).register(registry);
            infoPolicyHash = hash;
        }
    }

    @Override
    public void processed(Duration processingTime, Duration journalWriteTime) {
        processing.record(processingTime);
        journalWrite.record(journalWriteTime);
    }
}
