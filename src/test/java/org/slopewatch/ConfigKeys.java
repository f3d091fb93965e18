package org.slopewatch;

import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import io.smallrye.config.WithName;
import io.smallrye.config.WithParentName;
import java.io.IOException;
import java.io.Reader;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.Type;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Properties;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Every configuration key the code uses, found in the code itself: the {@code @ConfigMapping}
 * interfaces of the compiled main classes, key-shaped string literals in the main sources, and
 * application.properties (keys, profile keys, and keys its values refer to).
 */
final class ConfigKeys {

    /** A string literal that is a whole {@code slopewatch.*} key, or the start of one ending in a dot. */
    private static final Pattern KEY_LITERAL = Pattern.compile("slopewatch(\\.[a-z0-9][a-z0-9-]*)+\\.?");
    /** {@code ${key}} or {@code ${key:fallback}} in a properties value. */
    private static final Pattern REFERENCE = Pattern.compile("\\$\\{(slopewatch(?:\\.[a-z0-9][a-z0-9-]*)+)(?::([^}]*))?}");
    /** The rest of a concatenation after a literal ending in a dot: {@code + name + "}. */
    private static final Pattern CONCATENATION = Pattern.compile("\\G\\s*\\+\\s*[^\";+]+?\\s*\\+\\s*\"");

    /**
     * How a key-shaped literal is used, by the method (or annotation) it is an argument of. A
     * literal outside any call, such as a constant, counts as a key; one in a call named nowhere
     * here fails the test, so that each new use is classified once.
     */
    static final Set<String> KEY_READS = Set.of("ConfigProperty", "getValue", "getOptionalValue", "getValues",
            "getOptionalValues", "getConfigValue", "getProperty", "setProperty", "clearProperty", "getBoolean", "getInteger",
            "getLong",
            // ChannelRegistry.origin: where a key was set
            "origin");
    /** Attributes a Kafka deserializer reads from its channel's configuration (QuoteBatchDeserializer.setting). */
    static final Set<String> CONNECTOR_ATTRIBUTE_READS = Set.of("setting");
    /** Mapping prefixes, whose keys the mapping walk finds, and Micrometer meter names, which only look like keys. */
    static final Set<String> NOT_A_KEY = Set.of("ConfigMapping", "builder");

    final Map<String, ConfigKey> keys = new TreeMap<>();
    /** Channel attributes such as {@code slopewatch.curves}, set as {@code mp.messaging.incoming.<channel>.slopewatch.curves}. */
    final Map<String, List<String>> connectorAttributes = new TreeMap<>();
    /** Every key application.properties sets without a profile, with its value. */
    final Map<String, String> properties = new TreeMap<>();
    final List<String> mappingInterfaces = new ArrayList<>();
    final List<String> unclassifiedLiterals = new ArrayList<>();
    int sourceKeys;
    int propertiesKeys;

    static ConfigKeys scan(Path sources, Path applicationProperties) throws IOException {
        ConfigKeys found = new ConfigKeys();
        found.readMappings();
        found.readSources(sources);
        found.readProperties(applicationProperties);
        return found;
    }

    private ConfigKey key(String name) {
        return keys.computeIfAbsent(name, ConfigKey::new);
    }

    // --- (a) @ConfigMapping interfaces ---

    private void readMappings() {
        List<JavaClass> mappings = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.slopewatch").stream().filter(c -> c.isAnnotatedWith(ConfigMapping.class))
                .sorted(Comparator.comparing(JavaClass::getName)).toList();
        for (JavaClass c : mappings) {
            Class<?> type = c.reflect();
            ConfigMapping mapping = type.getAnnotation(ConfigMapping.class);
            mappingInterfaces.add(type.getSimpleName());
            walk(mapping.prefix(), type, mapping.namingStrategy());
        }
    }

    private void walk(String prefix, Class<?> group, ConfigMapping.NamingStrategy naming) {
        Method[] methods = group.getMethods();
        Arrays.sort(methods, Comparator.comparing(Method::getName));
        for (Method m : methods) {
            if (m.getParameterCount() > 0 || m.isDefault() || Modifier.isStatic(m.getModifiers()) || m.isSynthetic()) {
                continue;
            }
            String segment = m.isAnnotationPresent(WithParentName.class) ? ""
                    : m.isAnnotationPresent(WithName.class) ? m.getAnnotation(WithName.class).value() : name(m.getName(), naming);
            String key = segment.isEmpty() ? prefix : prefix + "." + segment;
            member(key, m.getGenericReturnType(), m, naming);
        }
    }

    private void member(String key, Type type, Method m, ConfigMapping.NamingStrategy naming) {
        Class<?> raw = raw(type);
        if (raw == Optional.class) {
            member(key, argument(type, 0), m, naming);
        } else if (raw == Map.class) {
            member(key + "." + ConfigKey.ANY, argument(type, 1), m, naming);
        } else if (raw.isInterface() && !raw.getName().startsWith("java.")) {
            walk(key, raw, naming);
        } else {
            ConfigKey k = key(key);
            k.mapped = true;
            k.foundIn.add(m.getDeclaringClass().getName().replaceFirst("^.*\\.", "").replace('$', '.') + "." + m.getName() + "()");
            WithDefault withDefault = m.getAnnotation(WithDefault.class);
            k.mappingDefault = withDefault == null ? null : withDefault.value();
            k.typeWord = typeWord(raw);
            if (raw.isEnum()) {
                k.enumValues = Arrays.stream(raw.getEnumConstants()).map(e -> ((Enum<?>) e).name().toLowerCase(Locale.ROOT)
                        .replace('_', '-')).toList();
            }
        }
    }

    private static Class<?> raw(Type type) {
        return type instanceof ParameterizedType p ? (Class<?>) p.getRawType() : (Class<?>) type;
    }

    private static Type argument(Type type, int index) {
        return ((ParameterizedType) type).getActualTypeArguments()[index];
    }

    /** The method name as SmallRye spells the key segment. */
    static String name(String method, ConfigMapping.NamingStrategy naming) {
        if (naming == ConfigMapping.NamingStrategy.VERBATIM) {
            return method;
        }
        char separator = naming == ConfigMapping.NamingStrategy.SNAKE_CASE ? '_' : '-';
        StringBuilder b = new StringBuilder();
        for (char ch : method.toCharArray()) {
            if (Character.isUpperCase(ch) && b.length() > 0) {
                b.append(separator);
            }
            b.append(Character.toLowerCase(ch));
        }
        return b.toString();
    }

    private static String typeWord(Class<?> raw) {
        if (raw == Duration.class) {
            return "duration";
        } else if (raw == int.class || raw == Integer.class || raw == long.class || raw == Long.class) {
            return "integer";
        } else if (raw == double.class || raw == Double.class || raw == float.class || raw == Float.class) {
            return "number";
        } else if (raw == boolean.class || raw == Boolean.class) {
            return "boolean";
        } else if (raw == LocalDate.class) {
            return "date";
        } else if (List.class.isAssignableFrom(raw) || Set.class.isAssignableFrom(raw)) {
            return "list";
        } else if (raw.isEnum()) {
            return "one of";
        }
        return "string";
    }

    // --- (b) key-shaped string literals in the main sources ---

    private void readSources(Path root) throws IOException {
        List<Path> files;
        try (Stream<Path> walk = Files.walk(root)) {
            files = walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
        }
        for (Path file : files) {
            JavaSource source = JavaSource.of(Files.readString(file));
            for (JavaSource.Literal literal : source.literals()) {
                if (!KEY_LITERAL.matcher(literal.text()).matches()) {
                    continue;
                }
                String where = root.relativize(file) + ":" + source.line(literal.start());
                String call = source.enclosingCall(literal.start());
                String name = completed(source, literal);
                if (NOT_A_KEY.contains(call)) {
                    continue;
                }
                if (CONNECTOR_ATTRIBUTE_READS.contains(call)) {
                    connectorAttributes.computeIfAbsent(name, n -> new ArrayList<>()).add(where);
                } else if (call.isEmpty() || KEY_READS.contains(call)) {
                    key(name).foundIn.add(where);
                    sourceKeys++;
                } else {
                    unclassifiedLiterals.add("\"" + literal.text() + "\" in " + call + "(…) at " + where);
                }
            }
        }
    }

    /** {@code "slopewatch.channels." + name + ".type"} becomes {@code slopewatch.channels.<*>.type}. */
    private static String completed(JavaSource source, JavaSource.Literal literal) {
        if (!literal.text().endsWith(".")) {
            return literal.text();
        }
        Matcher m = CONCATENATION.matcher(source.code());
        if (m.find(literal.end())) {
            Optional<JavaSource.Literal> next = source.literalAt(m.end() - 1);
            if (next.isPresent()) {
                return literal.text() + ConfigKey.ANY + next.get().text();
            }
        }
        return literal.text() + ConfigKey.ANY;
    }

    // --- (c) application.properties ---

    private void readProperties(Path file) throws IOException {
        Properties p = new Properties();
        try (Reader in = Files.newBufferedReader(file)) {
            p.load(in);
        }
        for (String raw : new TreeSet<>(p.stringPropertyNames())) {
            String value = p.getProperty(raw);
            String profiles = null;
            String name = raw;
            if (raw.startsWith("%")) {
                int dot = raw.indexOf('.');
                profiles = raw.substring(1, dot);
                name = raw.substring(dot + 1);
            }
            if (profiles == null) {
                properties.put(name, value);
            }
            if (name.startsWith("slopewatch.") || name.contains(".slopewatch.")) {
                ConfigKey k = key(name);
                k.foundIn.add("application.properties: " + raw);
                propertiesKeys++;
                if (profiles == null) {
                    k.propertiesValue = value;
                } else {
                    for (String profile : profiles.split(",")) {
                        k.profileValues.put(profile, value);
                    }
                }
            }
            Matcher ref = REFERENCE.matcher(value);
            while (ref.find()) {
                ConfigKey k = key(ref.group(1));
                k.foundIn.add("application.properties: referenced by " + raw);
                propertiesKeys++;
                if (ref.group(2) == null) {
                    k.referencedWithoutFallback = true;
                } else {
                    k.referenceFallbacks.add(ref.group(2));
                }
            }
        }
    }
}
