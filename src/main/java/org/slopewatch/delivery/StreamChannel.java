package org.slopewatch.delivery;

import com.fasterxml.jackson.databind.node.ObjectNode;
import io.smallrye.reactive.messaging.kafka.api.OutgoingKafkaRecordMetadata;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Locale;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.apache.kafka.common.header.internals.RecordHeaders;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.slopewatch.rules.Alert;

/**
 * Sends each alert on the outgoing messaging channel {@code alerts-out} as a CloudEvents 1.0
 * event in structured mode: the whole event is the JSON payload ({@code specversion}, {@code id}
 * = the alert id, {@code source} as configured ({@code slopewatch.delivery.cloud-events-source},
 * {@value #DEFAULT_SOURCE} by default), {@code type}
 * {@code org.slopewatch.alert.firing|repeat|resolved}, {@code subject} = the spread,
 * {@code time}, {@code datacontenttype} and {@code data} = {@link AlertJson}). On Kafka the
 * record is keyed by spread, so that a spread's alerts stay in order, and carries the
 * structured-mode content type header.
 *
 * <p>The outcome is the broker's answer: acknowledged is delivered; a nack, a full buffer or no
 * answer in time is retried (a consumer that has the event already recognises it by its id).
 */
public final class StreamChannel implements AlertChannel {

    public static final String TYPE = "stream";
    public static final String CHANNEL = "alerts-out";
    public static final String DEFAULT_SOURCE = "slopewatch";
    public static final String CONTENT_TYPE = "application/cloudevents+json; charset=UTF-8";

    private final String name;
    private final Emitter<String> emitter;
    private final Duration timeout;
    private final String source;

    public StreamChannel(String name, Emitter<String> emitter, Duration timeout) {
        this(name, emitter, timeout, DEFAULT_SOURCE);
    }

    /** @param source the events' CloudEvents {@code source}, a URI reference naming this deployment */
    public StreamChannel(String name, Emitter<String> emitter, Duration timeout, String source) {
        this.source = checkedSource(source);
        this.name = Objects.requireNonNull(name, "name");
        this.emitter = Objects.requireNonNull(emitter, "emitter");
        this.timeout = Objects.requireNonNull(timeout, "timeout");
    }

    /** CloudEvents 1.0: {@code source} is a non-empty URI reference. */
    static String checkedSource(String source) {
        if (source == null || source.isBlank()) {
            throw new IllegalArgumentException("the CloudEvents source must not be empty");
        }
        try {
            new java.net.URI(source);
        } catch (java.net.URISyntaxException e) {
            throw new IllegalArgumentException("the CloudEvents source must be a URI reference: " + e.getMessage());
        }
        return source;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public String type() {
        return TYPE;
    }

    /** The CloudEvents type of an alert's kind. */
    public static String eventType(Alert alert) {
        return "org.slopewatch.alert." + alert.kind().name().toLowerCase(Locale.ROOT);
    }

    /** The alert as a structured-mode CloudEvent from the default source. */
    public static ObjectNode event(Alert alert) {
        return event(alert, DEFAULT_SOURCE);
    }

    /** The alert as a structured-mode CloudEvent. */
    public static ObjectNode event(Alert alert, String source) {
        ObjectNode e = AlertJson.MAPPER.createObjectNode();
        e.put("specversion", "1.0");
        e.put("id", alert.id());
        e.put("source", source);
        e.put("type", eventType(alert));
        if (alert.spreadId() != null) {
            e.put("subject", alert.spreadId());
        }
        if (alert.createdAt() != null) {
            e.put("time", alert.createdAt().toString());
        }
        e.put("datacontenttype", "application/json");
        e.set("data", AlertJson.toJson(alert));
        return e;
    }

    @Override
    public DeliveryOutcome deliver(Alert alert) {
        CompletableFuture<Void> answered = new CompletableFuture<>();
        RecordHeaders headers = new RecordHeaders();
        headers.add("content-type", CONTENT_TYPE.getBytes(StandardCharsets.UTF_8));
        Message<String> message = Message.of(event(alert, source).toString())
                .addMetadata(OutgoingKafkaRecordMetadata.<String>builder().withKey(alert.spreadId()).withHeaders(headers).build())
                .withAck(() -> {
                    answered.complete(null);
                    return CompletableFuture.completedFuture(null);
                })
                .withNack(failure -> {
                    answered.completeExceptionally(failure);
                    return CompletableFuture.completedFuture(null);
                });
        try {
            emitter.send(message);
        } catch (RuntimeException e) {
            // a full buffer or a channel that is shutting down
            return new DeliveryOutcome.RetryLater(prefix() + "the channel did not take the event: " + e.getClass().getSimpleName());
        }
        try {
            answered.get(timeout.toMillis(), TimeUnit.MILLISECONDS);
            return new DeliveryOutcome.Delivered(prefix() + "acknowledged");
        } catch (TimeoutException e) {
            return new DeliveryOutcome.RetryLater(prefix() + "no acknowledgement within " + timeout.toMillis() + " ms");
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return new DeliveryOutcome.RetryLater(prefix() + "interrupted while waiting for the acknowledgement");
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            return new DeliveryOutcome.RetryLater(prefix() + "not acknowledged: " + cause.getClass().getSimpleName()
                    + (cause.getMessage() == null ? "" : ": " + Redactor.none().redactAndTruncate(cause.getMessage(), 300)));
        }
    }

    private String prefix() {
        return "stream '" + name + "': ";
    }

    @Override
    public String toString() {
        return "StreamChannel[" + name + ", " + CHANNEL + "]";
    }
}
