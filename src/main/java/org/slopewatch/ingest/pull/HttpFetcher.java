package org.slopewatch.ingest.pull;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.net.ConnectException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.net.http.HttpTimeoutException;
import java.nio.ByteBuffer;
import java.time.Duration;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionStage;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Flow;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import org.slopewatch.journal.SourceFetches.Validators;

/**
 * One conditional GET of a publication with the JDK's HTTP client. It sends back the validators of
 * the last publication read (RFC 9110, sections 13.1.1 {@code If-None-Match} and 13.1.3
 * {@code If-Modified-Since}), waits at most the time-out for the whole answer, headers and body, and
 * reads at most {@code maxBytes}: a body cut short or too long is a failure, never a publication.
 * No reason it gives names the URL, which may carry a token.
 */
final class HttpFetcher {

    private final URI url;
    private final Duration timeout;
    private final long maxBytes;
    private final HttpClient client;

    HttpFetcher(URI url, Duration timeout, long maxBytes) {
        String scheme = url.getScheme() == null ? "" : url.getScheme().toLowerCase(Locale.ROOT);
        if (!scheme.equals("http") && !scheme.equals("https")) {
            throw new IllegalArgumentException("the url must be http or https, not '" + scheme + "'");
        }
        if (timeout.isNegative() || timeout.isZero()) {
            throw new IllegalArgumentException("the timeout must be positive, not " + timeout);
        }
        if (maxBytes < 1) {
            throw new IllegalArgumentException("max-bytes must be positive, not " + maxBytes);
        }
        this.url = url;
        this.timeout = timeout;
        this.maxBytes = maxBytes;
        // NORMAL never follows https to http
        this.client = HttpClient.newBuilder().connectTimeout(timeout).followRedirects(HttpClient.Redirect.NORMAL)
                .version(HttpClient.Version.HTTP_1_1).build();
    }

    Fetched fetch(Validators last) {
        HttpRequest.Builder request = HttpRequest.newBuilder(url).timeout(timeout).GET()
                .header("Accept", "text/csv, text/plain;q=0.9, */*;q=0.5");
        if (last != null && last.etag() != null) {
            request.header("If-None-Match", last.etag());
        }
        if (last != null && last.lastModified() != null) {
            request.header("If-Modified-Since", last.lastModified());
        }
        CompletableFuture<HttpResponse<byte[]>> answer = client.sendAsync(request.build(), info -> new Limited(maxBytes));
        HttpResponse<byte[]> response;
        try {
            // the request's own time-out stops at the headers; this bounds the body too, so a server that trickles cannot hold the fetch
            response = answer.get(timeout.toMillis(), TimeUnit.MILLISECONDS);
        } catch (TimeoutException e) {
            answer.cancel(true);
            return new Fetched.Failed(null, true, "no answer within " + human(timeout));
        } catch (InterruptedException e) {
            answer.cancel(true);
            Thread.currentThread().interrupt();
            return new Fetched.Failed(null, true, "interrupted");
        } catch (ExecutionException e) {
            return failure(e.getCause());
        }
        int status = response.statusCode();
        if (status == 304) {
            return new Fetched.NotModified(status);
        }
        if (status == 200) {
            String charset = response.headers().firstValue("Content-Type").map(HttpFetcher::charset).orElse(null);
            return new Fetched.Body(status, response.body(), charset, response.headers().firstValue("ETag").orElse(null),
                    response.headers().firstValue("Last-Modified").orElse(null));
        }
        // the same split as the delivery channels: a server in trouble or asking to slow down may answer later, any other refusal will not
        boolean retryable = status >= 500 || status == 429 || status == 408;
        return new Fetched.Failed(status, retryable, "answered " + status + (status >= 200 && status < 300 ? " without a publication" : ""));
    }

    private Fetched failure(Throwable cause) {
        if (cause instanceof TooLarge) {
            return new Fetched.Failed(200, false, "the body is longer than " + maxBytes + " bytes (max-bytes): refused whole");
        }
        if (cause instanceof HttpTimeoutException) {
            return new Fetched.Failed(null, true, "no answer within " + human(timeout));
        }
        if (cause instanceof ConnectException) {
            return new Fetched.Failed(null, true, "could not connect");
        }
        if (cause instanceof IOException) {
            // a connection closed before the announced length, among others: what was read is not the publication
            return new Fetched.Failed(null, true, "the answer broke off: " + cause.getClass().getSimpleName());
        }
        return new Fetched.Failed(null, true, "the fetch failed: " + (cause == null ? "unknown" : cause.getClass().getSimpleName()));
    }

    /** The charset a {@code Content-Type} names, or null. */
    static String charset(String contentType) {
        for (String part : contentType.split(";")) {
            String p = part.trim();
            if (p.regionMatches(true, 0, "charset=", 0, 8)) {
                return p.substring(8).replace("\"", "").trim();
            }
        }
        return null;
    }

    private static String human(Duration d) {
        return d.toString().substring(2).toLowerCase(Locale.ROOT);
    }

    /** A body read whole into memory, up to a limit: past it the subscription is cancelled and the answer fails. */
    private static final class Limited implements HttpResponse.BodySubscriber<byte[]> {

        private final long max;
        private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        private final CompletableFuture<byte[]> result = new CompletableFuture<>();
        private Flow.Subscription subscription;

        Limited(long max) {
            this.max = max;
        }

        @Override
        public CompletionStage<byte[]> getBody() {
            return result;
        }

        @Override
        public void onSubscribe(Flow.Subscription s) {
            subscription = s;
            s.request(Long.MAX_VALUE);
        }

        @Override
        public void onNext(List<ByteBuffer> items) {
            if (result.isDone()) {
                return;
            }
            for (ByteBuffer b : items) {
                if (bytes.size() + (long) b.remaining() > max) {
                    subscription.cancel();
                    result.completeExceptionally(new TooLarge());
                    return;
                }
                byte[] chunk = new byte[b.remaining()];
                b.get(chunk);
                bytes.write(chunk, 0, chunk.length);
            }
        }

        @Override
        public void onError(Throwable t) {
            result.completeExceptionally(t);
        }

        @Override
        public void onComplete() {
            result.complete(bytes.toByteArray());
        }
    }

    private static final class TooLarge extends IOException {
        TooLarge() {
            super("body too large", null);
        }
    }
}
