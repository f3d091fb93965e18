package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionStage;
import java.util.function.Consumer;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.junit.jupiter.api.Test;

/**
 * What the broker's answer comes to. The in-memory connector always acknowledges, so a nack, a
 * silence and a refusal to take the message are played by an emitter that does just that.
 */
class StreamChannelOutcomeTest {

    /** An emitter that does to each message what the test says. */
    private record ScriptedEmitter(Consumer<Message<String>> onSend) implements Emitter<String> {
        @Override
        public CompletionStage<Void> send(String payload) {
            throw new UnsupportedOperationException("the channel sends messages");
        }

        @Override
        public <M extends Message<? extends String>> void send(M message) {
            @SuppressWarnings("unchecked")
            Message<String> m = (Message<String>) message;
            onSend.accept(m);
        }

        @Override
        public void complete() {
        }

        @Override
        public void error(Exception e) {
        }

        @Override
        public boolean isCancelled() {
            return false;
        }

        @Override
        public boolean hasRequests() {
            return true;
        }
    }

    private static DeliveryOutcome deliverVia(Consumer<Message<String>> broker) {
        return new StreamChannel("alerts-topic", new ScriptedEmitter(broker), Duration.ofMillis(200)).deliver(TestAlerts.confirmed());
    }

    @Test
    void anAckIsDelivered() {
        assertThat(deliverVia(Message::ack)).isEqualTo(new DeliveryOutcome.Delivered("stream 'alerts-topic': acknowledged"));
    }

    @Test
    void aNackIsRetriedWithTheBrokersReason() {
        assertThat(deliverVia(m -> m.nack(new IllegalStateException("leader not available"))))
                .isEqualTo(new DeliveryOutcome.RetryLater("stream 'alerts-topic': not acknowledged: IllegalStateException: leader not available"));
    }

    @Test
    void noAnswerInTimeIsRetried() {
        CompletableFuture<Message<String>> kept = new CompletableFuture<>();
        assertThat(deliverVia(kept::complete))
                .isEqualTo(new DeliveryOutcome.RetryLater("stream 'alerts-topic': no acknowledgement within 200 ms"));
        assertThat(kept).as("the message did reach the emitter").isCompleted();
    }

    @Test
    void aChannelThatDoesNotTakeTheMessageIsRetried() {
        assertThat(deliverVia(m -> {
            throw new IllegalStateException("buffer full");
        })).isEqualTo(new DeliveryOutcome.RetryLater("stream 'alerts-topic': the channel did not take the event: IllegalStateException"));
    }
}
