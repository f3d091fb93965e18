package org.slopewatch.delivery;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.io.OutputStreamWriter;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;

/**
 * A small SMTP server on 127.0.0.1 that answers RCPT with a reply the test chooses, for the
 * rejections GreenMail does not make (550 unknown mailbox, 450 mailbox busy), and, once told to
 * ({@link #refuseLoginWith}), offers AUTH PLAIN and LOGIN and refuses every login with a reply of
 * the test's. It speaks just enough SMTP for a real client: greeting, EHLO, AUTH, MAIL, RCPT,
 * DATA, RSET, NOOP, QUIT.
 */
final class ScriptedSmtpServer implements AutoCloseable {

    private final ServerSocket server;
    private final ExecutorService threads = Executors.newCachedThreadPool();
    private final List<String> commands = new CopyOnWriteArrayList<>();
    private volatile String rcptReply = "250 2.1.5 OK";
    private volatile String authReply;

    private ScriptedSmtpServer(ServerSocket server) {
        this.server = server;
        threads.submit(this::acceptLoop);
    }

    static ScriptedSmtpServer start() {
        try {
            return new ScriptedSmtpServer(new ServerSocket(0, 50, InetAddress.getLoopbackAddress()));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    int port() {
        return server.getLocalPort();
    }

    /** From now on every RCPT gets this reply, e.g. {@code 550 5.1.1 no such mailbox}. */
    void answerRcptWith(String reply) {
        rcptReply = reply;
    }

    /**
     * From now on EHLO offers AUTH PLAIN LOGIN and every AUTH gets this reply, e.g.
     * {@code 535 5.7.8 authentication failed}; two methods, so that a client tries the second
     * after the first was refused (the mail client logs the first refusal before it does).
     */
    void refuseLoginWith(String reply) {
        authReply = reply;
    }

    /** The commands received so far, in order. */
    List<String> commands() {
        return List.copyOf(commands);
    }

    private void acceptLoop() {
        while (!server.isClosed()) {
            try {
                Socket socket = server.accept();
                threads.submit(() -> converse(socket));
            } catch (IOException closed) {
                return;
            }
        }
    }

    private void converse(Socket socket) {
        try (socket;
             BufferedReader in = new BufferedReader(new InputStreamReader(socket.getInputStream(), StandardCharsets.US_ASCII));
             Writer out = new OutputStreamWriter(socket.getOutputStream(), StandardCharsets.US_ASCII)) {
            reply(out, "220 scripted.test ESMTP");
            String line;
            while ((line = in.readLine()) != null) {
                commands.add(line);
                String verb = line.length() < 4 ? line.toUpperCase(Locale.ROOT) : line.substring(0, 4).toUpperCase(Locale.ROOT);
                switch (verb) {
                    case "EHLO", "HELO" -> reply(out, authReply == null ? "250 scripted.test" : "250-scripted.test\r\n250 AUTH PLAIN LOGIN");
                    case "AUTH" -> reply(out, authReply == null ? "502 5.5.1 not implemented" : authReply);
                    case "MAIL" -> reply(out, "250 2.1.0 OK");
                    case "RCPT" -> reply(out, rcptReply);
                    case "DATA" -> {
                        reply(out, "354 end with <CRLF>.<CRLF>");
                        while ((line = in.readLine()) != null && !line.equals(".")) {
                            // the message itself is of no interest here
                        }
                        reply(out, "250 2.0.0 queued");
                    }
                    case "RSET", "NOOP" -> reply(out, "250 2.0.0 OK");
                    case "QUIT" -> {
                        reply(out, "221 2.0.0 bye");
                        return;
                    }
                    default -> reply(out, "502 5.5.1 not implemented");
                }
            }
        } catch (IOException e) {
            // the client went away; nothing to do
        }
    }

    private static void reply(Writer out, String line) throws IOException {
        out.write(line + "\r\n");
        out.flush();
    }

    @Override
    public void close() {
        try {
            server.close();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        threads.shutdownNow();
    }
}
