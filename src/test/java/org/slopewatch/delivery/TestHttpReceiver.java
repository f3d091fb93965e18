package org.slopewatch.delivery;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.sun.net.httpserver.HttpExchange;
import com.sun.net.httpserver.HttpServer;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.function.Function;
import org.awaitility.Awaitility;

/**
 * A real HTTP server on 127.0.0.1 standing in for a chat service: it answers from a script
 * (a status and a body, or no answer at all), records every request it reads, can be stopped so
 * that connections are refused, and started again on the same port.
 */
public final class TestHttpReceiver implements AutoCloseable {

    /**
     * A request as the receiver read it; {@code receivedNanos} is {@link System#nanoTime()} once its
     * body was read, for latencies measured in the same JVM.
     */
    public record Request(String path, String query, String contentType, String body, long receivedNanos) {
    }

    /** One scripted answer; {@code status < 0} means never answer. */
    private record Reply(int status, Function<Request, String> body) {
    }

    private static final ObjectMapper JSON = new ObjectMapper();

    private final Deque<Reply> script = new ArrayDeque<>();
    private final List<Request> requests = new CopyOnWriteArrayList<>();
    private final List<Request> accepted = new CopyOnWriteArrayList<>();
    private final CountDownLatch releaseHung = new CountDownLatch(1);
    private final ExecutorService executor = Executors.newCachedThreadPool();
    private HttpServer server;
    private int port;

    private TestHttpReceiver() {
    }

    public static TestHttpReceiver start() {
        TestHttpReceiver receiver = new TestHttpReceiver();
        receiver.bind(0);
        return receiver;
    }

    private void bind(int wanted) {
        try {
            server = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), wanted), 0);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        server.createContext("/", this::handle);
        server.setExecutor(executor);
        server.start();
        port = server.getAddress().getPort();
    }

    /** The URL of a path (and query) on this receiver. */
    public String url(String pathAndQuery) {
        return "http://127.0.0.1:" + port + pathAndQuery;
    }

    int port() {
        return port;
    }

    /** The next request gets this answer; with an empty script every request gets 200. */
    public synchronized TestHttpReceiver answer(int status, String body) {
        script.add(new Reply(status, r -> body));
        return this;
    }

    /** The next request gets this status and a body made from the request, e.g. one that echoes the path. */
    synchronized TestHttpReceiver answer(int status, Function<Request, String> body) {
        script.add(new Reply(status, body));
        return this;
    }

    /** The next request is read and never answered. */
    public synchronized TestHttpReceiver hang() {
        script.add(new Reply(-1, r -> ""));
        return this;
    }

    private synchronized Reply next() {
        Reply r = script.poll();
        return r == null ? new Reply(200, x -> "ok") : r;
    }

    private void handle(HttpExchange exchange) throws IOException {
        Request request = new Request(exchange.getRequestURI().getRawPath(), exchange.getRequestURI().getRawQuery(),
                exchange.getRequestHeaders().getFirst("Content-Type"),
                new String(exchange.getRequestBody().readAllBytes(), StandardCharsets.UTF_8), System.nanoTime());
        requests.add(request);
        Reply reply = next();
        if (reply.status() < 0) {
            try {
                releaseHung.await();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            exchange.close();
            return;
        }
        if (reply.status() / 100 == 2) {
            accepted.add(request);
        }
        byte[] body = reply.body().apply(request).getBytes(StandardCharsets.UTF_8);
        // no keep-alive: each attempt opens its own connection, as after a receiver's restart
        exchange.getResponseHeaders().add("Connection", "close");
        exchange.getResponseHeaders().add("Content-Type", "text/plain; charset=utf-8");
        exchange.sendResponseHeaders(reply.status(), body.length == 0 ? -1 : body.length);
        try (OutputStream out = exchange.getResponseBody()) {
            out.write(body);
        }
    }

    /** Every request read, whatever the answer. */
    public List<Request> requests() {
        return List.copyOf(requests);
    }

    /** The requests answered with 2xx: what the chat service actually took. */
    public List<Request> accepted() {
        return List.copyOf(accepted);
    }

    /**
     * Notice id → how many times a notice was posted to {@code path}, for a channel posting alert
     * JSON ({@code format=alert-json}), whatever the answer.
     */
    public Map<String, Long> noticesReceived(String path) {
        Map<String, Long> out = new TreeMap<>();
        for (Request r : requests) {
            if (r.path().equals(path)) {
                try {
                    JsonNode notice = JSON.readTree(r.body());
                    out.merge(notice.path("id").asText(), 1L, Long::sum);
                } catch (IOException e) {
                    throw new UncheckedIOException("not alert JSON on " + path + ": " + r.body(), e);
                }
            }
        }
        return out;
    }

    /** Closes the port: from now on connections are refused. */
    public void stop() {
        server.stop(0);
    }

    /** Listens again on the same port. */
    public void restart() {
        int same = port;
        // the port was just released; binding again can take a moment on a busy machine
        Awaitility.await("rebind port " + same).atMost(Duration.ofSeconds(10)).pollInterval(Duration.ofMillis(50))
                .ignoreExceptions().until(() -> {
                    bind(same);
                    return true;
                });
    }

    @Override
    public void close() {
        releaseHung.countDown();
        server.stop(0);
        executor.shutdownNow();
    }
}
