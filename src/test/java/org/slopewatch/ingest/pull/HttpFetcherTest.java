package org.slopewatch.ingest.pull;

import static org.assertj.core.api.Assertions.assertThat;

import com.sun.net.httpserver.HttpServer;
import java.io.IOException;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.URI;
import java.time.Duration;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.journal.SourceFetches.Validators;

/** One fetch against a JDK {@code HttpServer} on 127.0.0.1: the conditional headers, the body limit, which failures are retried. */
class HttpFetcherTest {

    private HttpServer server;
    private final Map<String, String> asked = new ConcurrentHashMap<>();

    @BeforeEach
    void start() throws IOException {
        server = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0), 0);
        server.createContext("/big.csv", ex -> {
            byte[] body = "x".repeat(1_000).getBytes(java.nio.charset.StandardCharsets.US_ASCII);
            ex.sendResponseHeaders(200, 0); // chunked: no length announced, the limit must count what arrives
            try (OutputStream out = ex.getResponseBody()) {
                out.write(body);
            }
        });
        server.createContext("/conditional.csv", ex -> {
            ex.getRequestHeaders().forEach((k, v) -> asked.put(k.toLowerCase(java.util.Locale.ROOT), v.get(0)));
            ex.sendResponseHeaders(304, -1);
            ex.close();
        });
        server.createContext("/busy.csv", ex -> {
            ex.sendResponseHeaders(503, -1);
            ex.close();
        });
        server.createContext("/gone.csv", ex -> {
            ex.sendResponseHeaders(404, -1);
            ex.close();
        });
        server.start();
    }

    @AfterEach
    void stop() {
        server.stop(0);
    }

    private HttpFetcher fetcher(String path, long maxBytes) {
        return new HttpFetcher(URI.create("http://127.0.0.1:" + server.getAddress().getPort() + path), Duration.ofSeconds(5), maxBytes);
    }

    @Test
    void aBodyLongerThanTheLimitIsRefusedWholeAndNotRetried() {
        Fetched f = fetcher("/big.csv", 100).fetch(null);
        assertThat(f).isInstanceOf(Fetched.Failed.class);
        assertThat(((Fetched.Failed) f).retryable()).as("the same file next time would be as long").isFalse();
        assertThat(((Fetched.Failed) f).reason()).contains("longer than 100 bytes");
        assertThat(fetcher("/big.csv", 1_000).fetch(null)).as("exactly at the limit is read").isInstanceOf(Fetched.Body.class);
    }

    @Test
    void theValidatorsOfTheLastPublicationAreSentBack() {
        Fetched f = fetcher("/conditional.csv", 100).fetch(new Validators("\"2026-06-12\"", "Fri, 12 Jun 2026 21:00:00 GMT"));
        // RFC 9110, 13.1.2 (If-None-Match: the entity tag as received) and 13.1.3 (If-Modified-Since: the
        // Last-Modified value as received); 15.4.5: a 304 carries no publication
        assertThat(asked).containsEntry("if-none-match", "\"2026-06-12\"")
                .containsEntry("if-modified-since", "Fri, 12 Jun 2026 21:00:00 GMT");
        assertThat(f).isEqualTo(new Fetched.NotModified(304));
        asked.clear();
        fetcher("/conditional.csv", 100).fetch(null);
        assertThat(asked).as("a first fetch is unconditional").doesNotContainKeys("if-none-match", "if-modified-since");
    }

    @Test
    void a503IsRetriedA404IsNot() {
        // the split of the delivery channels: 5xx and 429 may answer later, another 4xx will not (RFC 9110, 15.5.5 and 15.6.4)
        assertThat(fetcher("/busy.csv", 100).fetch(null)).isEqualTo(new Fetched.Failed(503, true, "answered 503"));
        assertThat(fetcher("/gone.csv", 100).fetch(null)).isEqualTo(new Fetched.Failed(404, false, "answered 404"));
    }

    @Test
    void onlyHttpAndHttpsAreFetched() {
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> new HttpFetcher(URI.create("file:///etc/passwd"), Duration.ofSeconds(1), 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("http or https");
    }
}
