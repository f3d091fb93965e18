package org.slopewatch.security;

import jakarta.ws.rs.HttpMethod;
import jakarta.ws.rs.Path;
import jakarta.ws.rs.QueryParam;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.annotation.Annotation;
import java.lang.reflect.Method;
import java.lang.reflect.Parameter;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.stream.Stream;

/**
 * Every route of the daemon's REST API, read from the JAX-RS annotations of the compiled classes
 * under {@code target/classes/org/slopewatch}, so that a new resource or method is walked by the
 * access tests without anyone listing it: a class with {@code @Path}, each of its methods with an
 * HTTP method annotation (one meta-annotated with {@link HttpMethod}) and its own {@code @Path}.
 */
public record ApiRoutes(List<Route> routes) {

    /**
     * One route: its HTTP method, its path template ({@code /api/spreads/{id}/history}) and the
     * query its required parameters need ({@code ?spread=GOVT-A:10Y-3M}, or empty).
     */
    public record Route(String method, String template, String query) {

        public Route(String method, String template) {
            this(method, template, "");
        }

        public boolean reads() {
            return method.equals("GET") || method.equals("HEAD") || method.equals("OPTIONS");
        }

        public boolean templated() {
            return template.contains("{");
        }

        /** The template with a sample for each parameter: names that exist where the test posted a quote, others that do not. */
        public String sample() {
            String[] segments = template.split("/");
            StringBuilder path = new StringBuilder();
            for (int i = 1; i < segments.length; i++) {
                String s = segments[i];
                path.append('/');
                if (!s.startsWith("{")) {
                    path.append(s);
                } else if (s.equals("{curve}")) {
                    path.append("GOVT-A");
                } else if (s.equals("{date}")) {
                    path.append("2026-03-02");
                } else if (segments[i - 1].equals("spreads")) {
                    path.append("GOVT-A:10Y-3M");
                } else if (segments[i - 1].equals("quiet-periods") || segments[i - 1].equals("mutes")) {
                    // /api/mutes: the old path of quiet periods (vocabulary: deprecation path)
                    path.append("999999");
                } else {
                    path.append("no-such-").append(s.replaceAll("[{}]", ""));
                }
            }
            return path.toString();
        }
    }

    public static ApiRoutes scan() {
        TreeSet<Route> found = new TreeSet<>(ORDER);
        found.addAll(handlers().keySet());
        return new ApiRoutes(new ArrayList<>(found));
    }

    private static final Comparator<Route> ORDER = Comparator.comparing(Route::template).thenComparing(Route::method)
            .thenComparing(Route::query);

    /**
     * Every route with the Java methods that answer it (two where they differ in the media type
     * they take), for tests that read more of their annotations: query parameters, the media
     * types they take and give.
     */
    public static Map<Route, List<Method>> handlers() {
        java.nio.file.Path root = java.nio.file.Path.of("target", "classes");
        ClassLoader loader = Thread.currentThread().getContextClassLoader();
        Map<Route, List<Method>> found = new TreeMap<>(ORDER);
        try (Stream<java.nio.file.Path> files = Files.walk(root.resolve("org/slopewatch"))) {
            for (java.nio.file.Path file : files.filter(f -> f.toString().endsWith(".class")).sorted().toList()) {
                String name = root.relativize(file).toString().replace('/', '.').replace('\\', '.').replaceAll("\\.class$", "");
                Class<?> type = Class.forName(name, false, loader);
                Path base = type.getAnnotation(Path.class);
                if (base == null) {
                    continue;
                }
                for (Method m : Stream.of(type.getDeclaredMethods()).sorted(Comparator.comparing(Method::getName)).toList()) {
                    String verb = httpMethod(m);
                    if (verb != null) {
                        Path sub = m.getAnnotation(Path.class);
                        found.computeIfAbsent(new Route(verb, join(base.value(), sub == null ? "" : sub.value()), query(m)), r -> new ArrayList<>()).add(m);
                    }
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (ClassNotFoundException e) {
            throw new IllegalStateException(e);
        }
        return found;
    }

    /** Samples for the query parameters some routes refuse to go without (400), where the test posted a quote. */
    private static final Map<String, String> QUERY_SAMPLES = Map.of("spread", "GOVT-A:10Y-3M", "on_or_before", "2026-03-02");

    private static String query(Method m) {
        StringBuilder query = new StringBuilder();
        for (Parameter p : m.getParameters()) {
            QueryParam q = p.getAnnotation(QueryParam.class);
            if (q != null && QUERY_SAMPLES.containsKey(q.value())) {
                query.append(query.length() == 0 ? '?' : '&').append(q.value()).append('=').append(QUERY_SAMPLES.get(q.value()));
            }
        }
        return query.toString();
    }

    private static String httpMethod(Method m) {
        for (Annotation a : m.getAnnotations()) {
            HttpMethod verb = a.annotationType().getAnnotation(HttpMethod.class);
            if (verb != null) {
                return verb.value();
            }
        }
        return null;
    }

    private static String join(String base, String sub) {
        String path = ("/" + base + "/" + sub).replaceAll("/+", "/");
        return path.length() > 1 && path.endsWith("/") ? path.substring(0, path.length() - 1) : path;
    }
}
