package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import jakarta.inject.Inject;
import java.time.Duration;
import org.junit.jupiter.api.Test;

/** The channels and the retry policy as the application configures them. */
@QuarkusTest
class ChannelRegistryTest {

    @Inject
    ChannelRegistry registry;

    @Inject
    RetryPolicy retryPolicy;

    @Test
    void aLogChannelNamedLogExistsByDefaultBesideTheConfiguredOnes() {
        assertThat(registry.names()).containsExactly("alerts-topic", "desk-mail", "log");
        assertThat(registry.channel("log")).get().isInstanceOf(LogChannel.class);
        assertThat(registry.channel("desk-mail")).get().isInstanceOf(EmailChannel.class);
        assertThat(registry.channel("alerts-topic")).get().isInstanceOf(StreamChannel.class);
        assertThat(registry.channel("nowhere")).isEmpty();
        assertThat(ChannelRegistry.summary(registry.all())).isEqualTo("alerts-topic (stream), desk-mail (email), log (log)");
    }

    @Test
    void streamChannelsTravelOnTheConnectorConfiguredForAlertsOut() {
        // application.properties: mp.messaging.outgoing.alerts-out.connector=smallrye-in-memory outside the kafka profile
        assertThat(registry.streamTransport()).isEqualTo(new StreamTransport("smallrye-in-memory"));
        assertThat(registry.streamTransport().isKafka()).isFalse();
    }

    @Test
    void theRetryPolicyComesFromConfiguration() {
        assertThat(retryPolicy.base()).isEqualTo(Duration.ofSeconds(30));
        assertThat(retryPolicy.cap()).isEqualTo(Duration.ofMinutes(30));
        assertThat(retryPolicy.maxAge()).isEqualTo(Duration.ofHours(24));
        assertThat(retryPolicy.jitter()).isEqualTo(0.2);
    }
}
