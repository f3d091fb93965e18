package org.slopewatch;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * docs/configuration.md against the code: every key the code uses has a row, every row names a
 * key the code uses, and the defaults, types, values and environment spellings the rows show are
 * the code's. The keys come from the code ({@link ConfigKeys}), never from a list kept here.
 */
class ConfigurationReferenceTest {

    private static final Path DOC = Path.of("docs/configuration.md");
    /** The test suite's own profile; an operator never runs it, so the doc does not describe it. */
    private static final String TEST_PROFILE = "test";

    private static ConfigKeys code;
    private static ConfigurationDoc doc;

    @BeforeAll
    static void read() throws IOException {
        code = ConfigKeys.scan(Path.of("src/main/java"), Path.of("src/main/resources/application.properties"));
        doc = ConfigurationDoc.read(DOC);
    }

    @Test
    void theScanFindsKeysInEveryKindOfSource() {
        assertThat(code.mappingInterfaces).as("@ConfigMapping interfaces under org.slopewatch").isNotEmpty();
        assertThat(code.sourceKeys).as("keys read or set through string literals in src/main/java").isPositive();
        assertThat(code.propertiesKeys).as("slopewatch keys in application.properties").isPositive();
        assertThat(code.connectorAttributes).as("attributes the Kafka deserializer reads").isNotEmpty();
        assertThat(doc.rows).as("key rows in " + DOC).isNotEmpty();
        assertThat(doc.problems).as("malformed rows in " + DOC).isEmpty();
    }

    @Test
    void everyKeyShapedLiteralIsClassified() {
        assertThat(code.unclassifiedLiterals)
                .as("string literals that look like slopewatch keys, in a call this test does not know; add the call to "
                        + "ConfigKeys.KEY_READS (it reads or sets configuration), CONNECTOR_ATTRIBUTE_READS or NOT_A_KEY")
                .isEmpty();
    }

    @Test
    void everyKeyTheCodeUsesHasARow() {
        List<String> missing = new ArrayList<>();
        for (ConfigKey k : code.keys.values()) {
            if (doc.rowCovering(k.key).isEmpty()) {
                missing.add(k.toString());
            }
        }
        assertThat(missing).as("keys the code uses without a row `key` | type | default | meaning in " + DOC).isEmpty();
    }

    @Test
    void everyChannelAttributeTheDeserializerReadsHasARow() {
        List<String> missing = new ArrayList<>();
        for (Map.Entry<String, List<String>> e : code.connectorAttributes.entrySet()) {
            if (doc.rows.keySet().stream().noneMatch(r -> r.endsWith("." + e.getKey()))) {
                missing.add(e.getKey() + " (" + String.join("; ", e.getValue()) + ")");
            }
        }
        assertThat(missing).as("channel attributes without a row mp.messaging.incoming.<channel>.<attribute> in " + DOC).isEmpty();
    }

    @Test
    void everyRowNamesAKeyTheCodeUses() {
        List<String> stale = new ArrayList<>();
        for (ConfigurationDoc.Row row : doc.rows.values()) {
            String key = row.key();
            int attribute = key.indexOf(".slopewatch.");
            if (key.startsWith("slopewatch.")) {
                if (code.keys.values().stream().noneMatch(k -> k.key.equals(key) || ConfigKey.covers(k.key, key))) {
                    stale.add(key + " (line " + row.line() + ")");
                }
            } else if (attribute >= 0 && !code.connectorAttributes.containsKey(key.substring(attribute + 1))) {
                stale.add(key + " (line " + row.line() + ")");
            }
        }
        assertThat(stale).as("rows in " + DOC + " for slopewatch keys that no code reads").isEmpty();
    }

    @Test
    void defaultsAreTheCodes() {
        List<String> wrong = new ArrayList<>();
        for (ConfigKey k : code.keys.values()) {
            Optional<ConfigurationDoc.Row> row = doc.row(k.key);
            if (row.isPresent() && k.defaultKnown()) {
                checkDefault(row.get(), k.expectedDefault(), "the code", wrong);
            }
        }
        // the Quarkus and Kafka keys the doc lists, where application.properties sets them
        for (ConfigurationDoc.Row row : doc.rows.values()) {
            String value = code.properties.get(row.key());
            if (value != null && !code.keys.containsKey(row.key())) {
                checkDefault(row, Optional.of(value), "application.properties", wrong);
            }
        }
        assertThat(wrong).as("defaults in " + DOC + " (first code span of the default column; none when there is no default)")
                .isEmpty();
    }

    private static void checkDefault(ConfigurationDoc.Row row, Optional<String> expected, String source, List<String> wrong) {
        Optional<String> shown = row.shownDefault();
        if (!shown.equals(expected)) {
            wrong.add(row.key().replace(ConfigKey.ANY, "<name>") + " (line " + row.line() + "): the doc shows "
                    + shown.map(s -> "`" + s + "`").orElse("no default") + ", " + source + " has "
                    + expected.map(s -> "`" + s + "`").orElse("none"));
        }
    }

    @Test
    void profileValuesAndEnumValuesAreNamedInTheirRows() {
        List<String> unnamed = new ArrayList<>();
        for (ConfigKey k : code.keys.values()) {
            Optional<ConfigurationDoc.Row> row = doc.rowCovering(k.key);
            if (row.isEmpty()) {
                continue;
            }
            k.profileValues.forEach((profile, value) -> {
                if (!profile.equals(TEST_PROFILE) && !row.get().showsSpan(value)) {
                    unnamed.add(k.shown() + ": `" + value + "` of profile " + profile);
                }
            });
            for (String value : k.enumValues) {
                if (!row.get().showsSpan(value)) {
                    unnamed.add(k.shown() + ": value `" + value + "`");
                }
            }
        }
        assertThat(unnamed).as("values the code gives or accepts that the row in " + DOC + " does not show as a code span")
                .isEmpty();
    }

    @Test
    void typesAreTheMappings() {
        List<String> wrong = new ArrayList<>();
        for (ConfigKey k : code.keys.values()) {
            Optional<ConfigurationDoc.Row> row = doc.row(k.key);
            if (k.typeWord != null && row.isPresent() && !row.get().type().toLowerCase(Locale.ROOT).contains(k.typeWord)) {
                wrong.add(k.shown() + " (line " + row.get().line() + "): type column '" + row.get().type() + "' should say "
                        + k.typeWord);
            }
        }
        assertThat(wrong).as("types in " + DOC).isEmpty();
    }

    @Test
    void environmentVariablesAreSpelledAsTheConfigurationReadsThem() {
        List<String> wrong = new ArrayList<>();
        for (ConfigurationDoc.EnvRow env : doc.envRows) {
            String expected = env.key().replaceAll("[^A-Za-z0-9]", "_").toUpperCase(Locale.ROOT);
            if (!env.variable().equals(expected)) {
                wrong.add("line " + env.line() + ": " + env.key() + " is " + expected + ", not " + env.variable());
            }
            if (doc.rowCovering(env.key()).isEmpty()) {
                wrong.add("line " + env.line() + ": " + env.key() + " has no row of its own");
            }
        }
        assertThat(doc.envRows).as("environment rows in " + DOC).isNotEmpty();
        assertThat(wrong).as("environment variables in " + DOC).isEmpty();
    }
}
