package org.slopewatch.testsupport;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * One HTTP/1.1 request written byte for byte to a plain socket, so that the request target
 * reaches the server exactly as given: HTTP client libraries (java.net.http, RestAssured)
 * normalise or escape paths, and a test of how a server reads odd spellings must not depend on
 * that. {@link Answer#requestLine()} keeps what was sent, for messages.
 */
public final class RawHttp {

    /** What came back: the status, the head (status line and headers) and the body as sent (chunked or not). */
    public record Answer(String requestLine, int status, String head, String body) {
    }

    private final int port;

    public RawHttp(int port) {
        this.port = port;
    }

    /** @param token a bearer token, or null for none; @param body sent as JSON when not null */
    public Answer send(String method, String target, String token, String body) {
        Map<String, String> headers = new LinkedHashMap<>();
        if (token != null) {
            headers.put("Authorization", "Bearer " + token);
        }
        if (body != null) {
            headers.put("Content-Type", "application/json");
        }
        return exchange(method, target, headers, body == null ? null : body.getBytes(StandardCharsets.UTF_8));
    }

    /**
     * The request with these headers (besides Host and Connection) and this body, or none when
     * null; a Content-Length is sent with a body and with any method that is not a read.
     */
    public Answer exchange(String method, String target, Map<String, String> headers, byte[] body) {
        String requestLine = method + " " + target + " HTTP/1.1";
        StringBuilder head = new StringBuilder(requestLine).append("\r\n")
                .append("Host: 127.0.0.1:").append(port).append("\r\n")
                .append("Connection: close\r\n");
        headers.forEach((name, value) -> head.append(name).append(": ").append(value).append("\r\n"));
        byte[] content = body == null ? new byte[0] : body;
        if (body != null || !(method.equals("GET") || method.equals("HEAD") || method.equals("OPTIONS"))) {
            head.append("Content-Length: ").append(content.length).append("\r\n");
        }
        head.append("\r\n");
        try (Socket socket = new Socket()) {
            socket.connect(new InetSocketAddress("127.0.0.1", port), 5_000);
            socket.setSoTimeout(30_000);
            OutputStream out = socket.getOutputStream();
            // ISO-8859-1: every char of the target goes out as the one byte it names, nothing escaped
            out.write(head.toString().getBytes(StandardCharsets.ISO_8859_1));
            try {
                out.write(content);
                out.flush();
            } catch (IOException e) {
                // the server may answer and close before reading a body it refuses (413): its answer is what counts
            }
            String answer = readAll(socket.getInputStream());
            int end = answer.indexOf("\r\n\r\n");
            String responseHead = end < 0 ? answer : answer.substring(0, end);
            String responseBody = end < 0 ? "" : answer.substring(end + 4);
            String[] statusLine = responseHead.split("\r\n", 2)[0].split(" ");
            int status = statusLine.length > 1 ? Integer.parseInt(statusLine[1]) : -1;
            return new Answer(requestLine, status, responseHead, responseBody);
        } catch (IOException e) {
            throw new UncheckedIOException(requestLine + ": " + e.getMessage(), e);
        }
    }

    /** A header of the answer, by name in any case, or null. */
    public static String header(Answer answer, String name) {
        for (String line : answer.head().split("\r\n")) {
            int colon = line.indexOf(':');
            if (colon > 0 && line.substring(0, colon).strip().equalsIgnoreCase(name)) {
                return line.substring(colon + 1).strip();
            }
        }
        return null;
    }

    private static String readAll(InputStream in) throws IOException {
        ByteArrayOutputStream all = new ByteArrayOutputStream();
        in.transferTo(all);
        return all.toString(StandardCharsets.UTF_8);
    }
}
