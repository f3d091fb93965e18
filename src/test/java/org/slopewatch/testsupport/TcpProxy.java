package org.slopewatch.testsupport;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * A TCP forwarder on 127.0.0.1 standing between a daemon and a server, so that a test can make
 * the server unreachable and reachable again without stopping it for everyone else: {@link #cut()}
 * closes every open connection and refuses new ones (the port stops listening), {@link #restore()}
 * listens again on the same port.
 */
public final class TcpProxy implements AutoCloseable {

    private final String targetHost;
    private final int targetPort;
    private final List<Socket> open = new CopyOnWriteArrayList<>();
    private volatile ServerSocket listener;
    private final int port;

    private TcpProxy(String targetHost, int targetPort) {
        this.targetHost = targetHost;
        this.targetPort = targetPort;
        this.port = listen(0);
    }

    public static TcpProxy to(String host, int port) {
        return new TcpProxy(host, port);
    }

    /** The port to give the daemon instead of the server's. */
    public int port() {
        return port;
    }

    /** The server becomes unreachable: open connections are reset and new ones refused. */
    public synchronized void cut() {
        closeQuietly(listener);
        listener = null;
        open.forEach(TcpProxy::closeQuietly);
        open.clear();
    }

    /** The server is reachable again, on the same port. */
    public synchronized void restore() {
        if (listener == null) {
            listen(port);
        }
    }

    private int listen(int wanted) {
        try {
            ServerSocket s = new ServerSocket();
            s.setReuseAddress(true);
            s.bind(new InetSocketAddress(InetAddress.getLoopbackAddress(), wanted));
            listener = s;
            Thread accept = new Thread(() -> accept(s), "tcp-proxy-accept-" + s.getLocalPort());
            accept.setDaemon(true);
            accept.start();
            return s.getLocalPort();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot listen on 127.0.0.1:" + wanted, e);
        }
    }

    private void accept(ServerSocket s) {
        while (!s.isClosed()) {
            Socket client;
            try {
                client = s.accept();
            } catch (IOException e) {
                return; // cut
            }
            try {
                Socket server = new Socket(targetHost, targetPort);
                open.add(client);
                open.add(server);
                pump(client, server);
                pump(server, client);
            } catch (IOException e) {
                closeQuietly(client); // the server refused: so does the proxy
            }
        }
    }

    private void pump(Socket from, Socket to) {
        Thread t = new Thread(() -> {
            byte[] buffer = new byte[16 * 1024];
            try (InputStream in = from.getInputStream(); OutputStream out = to.getOutputStream()) {
                int n;
                while ((n = in.read(buffer)) >= 0) {
                    out.write(buffer, 0, n);
                    out.flush();
                }
            } catch (IOException e) {
                // one side went away
            } finally {
                closeQuietly(from);
                closeQuietly(to);
                open.remove(from);
                open.remove(to);
            }
        }, "tcp-proxy-pump");
        t.setDaemon(true);
        t.start();
    }

    private static void closeQuietly(java.io.Closeable c) {
        if (c != null) {
            try {
                c.close();
            } catch (IOException ignored) {
                // closing is all that is wanted
            }
        }
    }

    @Override
    public void close() {
        cut();
    }
}
