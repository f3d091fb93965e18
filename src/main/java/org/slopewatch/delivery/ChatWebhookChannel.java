package org.slopewatch.delivery;

import java.io.IOException;
import java.net.ConnectException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpConnectTimeoutException;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.net.http.HttpTimeoutException;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Locale;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertText;

/**
 * Posts an alert as JSON to a chat webhook. Body {@code text}: {@code {"text": "..."}} with the
 * subject, the body, the dashboard link and the caution, which common chat webhooks accept;
 * body {@code alert-json}: the whole alert ({@link AlertJson}).
 *
 * <p>2xx is delivered; 5xx, 429, a time-out, a refused connection and other I/O trouble are worth
 * another try; any other status is not (the reason carries the status and the start of the
 * response body). Webhook URLs carry their token in the path or the query, so the URL never
 * appears in a reason: the channel is named instead, and every foreign string goes through the
 * {@link Redactor}.
 */
public final class ChatWebhookChannel implements AlertChannel {

    public static final String TYPE = "chat-webhook";

    /** How much of a response body a reason keeps. */
    static final int BODY_CHARS = 300;
    private static final int BODY_BYTES = 4096;

    /** The two bodies the channel can send. */
    public enum Format {
        TEXT("text"), ALERT_JSON("alert-json");

        private final String configName;

        Format(String configName) {
            this.configName = configName;
        }

        public String configName() {
            return configName;
        }

        /** The format for a configuration value, or null if there is none by that name. */
        public static Format byName(String name) {
            for (Format f : values()) {
                if (f.configName.equals(name.strip().toLowerCase(Locale.ROOT))) {
                    return f;
                }
            }
            return null;
        }
    }

    private final String name;
    private final URI url;
    private final Format format;
    private final Duration timeout;
    private final Redactor redactor;
    private final HttpClient client;

    /**
     * @param url     the webhook, a secret; it is checked here and never repeated in an exception
     * @param timeout for connecting and for the answer
     */
    public ChatWebhookChannel(String name, String url, Format format, Duration timeout) {
        this.name = Objects.requireNonNull(name, "name");
        this.redactor = Redactor.forUrl(Objects.requireNonNull(url, "url"));
        this.url = parse(name, url);
        this.format = Objects.requireNonNull(format, "format");
        if (timeout.isNegative() || timeout.isZero()) {
            throw new IllegalArgumentException("channel '" + name + "': the timeout must be positive, not " + timeout);
        }
        this.timeout = timeout;
        this.client = HttpClient.newBuilder().connectTimeout(timeout).followRedirects(HttpClient.Redirect.NEVER)
                .version(HttpClient.Version.HTTP_1_1).build();
    }

    private static URI parse(String name, String url) {
        URI uri;
        try {
            uri = new URI(url.strip());
        } catch (java.net.URISyntaxException e) {
            // the exception's message quotes the URL, so it is not passed on
            throw new IllegalArgumentException("channel '" + name + "': the url is not a valid URL (value not shown: it is a secret)");
        }
        String scheme = uri.getScheme() == null ? "" : uri.getScheme().toLowerCase(Locale.ROOT);
        if (!scheme.equals("http") && !scheme.equals("https") || uri.getHost() == null) {
            throw new IllegalArgumentException("channel '" + name + "': the url must be an http or https URL with a host "
                    + "(value not shown: it is a secret)");
        }
        return uri;
    }

    @Override
    public String name() {
        return name;
    }

    /** Whether the webhook's host is on the list. */
    public boolean pointsWithin(HostAllowlist allowed) {
        return allowed.allows(url);
    }

    /** The webhook's host, which may appear in messages (its path and query may not: they carry the token). */
    public String host() {
        return url.getHost();
    }

    @Override
    public String type() {
        return TYPE;
    }

    public Format format() {
        return format;
    }

    @Override
    public DeliveryOutcome deliver(Alert alert) {
        HttpRequest request = HttpRequest.newBuilder(url).timeout(timeout)
                .header("Content-Type", "application/json; charset=utf-8")
                .header("User-Agent", "slopewatch")
                .POST(HttpRequest.BodyPublishers.ofString(body(alert), StandardCharsets.UTF_8))
                .build();
        CompletableFuture<HttpResponse<byte[]>> sent = client.sendAsync(request, HttpResponse.BodyHandlers.ofByteArray());
        HttpResponse<byte[]> response;
        try {
            // the request time-out covers the wait for the headers; this bound also covers a body that stalls
            response = sent.get(timeout.toMillis() * 2, TimeUnit.MILLISECONDS);
        } catch (TimeoutException e) {
            sent.cancel(true);
            return new DeliveryOutcome.RetryLater(prefix() + "no answer within " + timeout.toMillis() + " ms");
        } catch (InterruptedException e) {
            sent.cancel(true);
            Thread.currentThread().interrupt();
            return new DeliveryOutcome.RetryLater(prefix() + "interrupted while waiting for the answer");
        } catch (ExecutionException e) {
            return failed(e.getCause());
        }
        return outcome(response.statusCode(), response.body());
    }

    String body(Alert alert) {
        if (format == Format.ALERT_JSON) {
            return AlertJson.toJson(alert).toString();
        }
        return AlertJson.MAPPER.createObjectNode().put("text", AlertText.plain(alert)).toString();
    }

    private DeliveryOutcome outcome(int status, byte[] body) {
        String text = new String(body, 0, Math.min(body.length, BODY_BYTES), StandardCharsets.UTF_8);
        String excerpt = redactor.redactAndTruncate(text, BODY_CHARS);
        String detail = "HTTP " + status + (excerpt.isEmpty() ? "" : ": " + excerpt);
        if (status >= 200 && status < 300) {
            return new DeliveryOutcome.Delivered(prefix() + "HTTP " + status);
        }
        if (status >= 500 || status == 429) {
            return new DeliveryOutcome.RetryLater(prefix() + detail);
        }
        // other 4xx, and 3xx: a redirect is not followed because it would post the alert somewhere not configured
        return new DeliveryOutcome.FailedForGood(prefix() + detail);
    }

    private DeliveryOutcome failed(Throwable cause) {
        for (Throwable t = cause; t != null; t = t.getCause()) {
            if (t instanceof HttpConnectTimeoutException) {
                return new DeliveryOutcome.RetryLater(prefix() + "could not connect within " + timeout.toMillis() + " ms");
            }
            if (t instanceof HttpTimeoutException) {
                return new DeliveryOutcome.RetryLater(prefix() + "no answer within " + timeout.toMillis() + " ms");
            }
            if (t instanceof ConnectException) {
                return new DeliveryOutcome.RetryLater(prefix() + "connection refused");
            }
        }
        if (cause instanceof IOException) {
            return new DeliveryOutcome.RetryLater(prefix() + "I/O error: " + describe(cause));
        }
        return new DeliveryOutcome.RetryLater(prefix() + "unexpected error: " + describe(cause));
    }

    private String describe(Throwable t) {
        return redactor.describe(t, BODY_CHARS);
    }

    private String prefix() {
        return "chat-webhook '" + name + "': ";
    }

    @Override
    public String toString() {
        return "ChatWebhookChannel[" + name + ", " + format.configName() + "]";
    }
}
