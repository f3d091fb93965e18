package org.slopewatch.rules;

import java.util.Map;

/**
 * The names slopewatch used before it spoke the desk's own vocabulary, kept for one release so
 * that policies and journals written with them go on working (vocabulary: deprecation path).
 * Policy keys written the old way are read as the new ones, with a warning that names the new key;
 * notice kinds stored the old way in an existing journal are read as the new kinds.
 */
public final class DeprecatedNames {

    private DeprecatedNames() {
    }

    /** Old alert rule keys → the keys that replace them. */
    static final Map<String, String> RULE_KEYS = Map.of("repeat-every", "standing-every", "resolve-notice", "closing-notice");

    /** Old stored notice kinds → the kinds that replace them (the journal's {@code alert.kind} column). */
    private static final Map<String, Alert.Kind> STORED_KINDS = Map.of(
            "FIRING", Alert.Kind.OPENING, "REPEAT", Alert.Kind.STANDING, "RESOLVED", Alert.Kind.CLOSING);

    /** The warning for an old key, e.g. {@code 'repeat-every' is deprecated, write 'standing-every'}. */
    static String keyWarning(String oldKey, String newKey) {
        return "'" + oldKey + "' is deprecated, write '" + newKey + "'";
    }

    /** A stored kind, old or new, as the kind it means now; null when it is neither. */
    static Alert.Kind storedKind(String stored) {
        Alert.Kind old = STORED_KINDS.get(stored);
        if (old != null) {
            return old;
        }
        for (Alert.Kind k : Alert.Kind.values()) {
            if (k.name().equals(stored)) {
                return k;
            }
        }
        return null;
    }

    /** The old stored name of a kind, which a journal written before the rename may hold. */
    static String oldStoredName(Alert.Kind kind) {
        for (Map.Entry<String, Alert.Kind> e : STORED_KINDS.entrySet()) {
            if (e.getValue() == kind) {
                return e.getKey();
            }
        }
        throw new IllegalArgumentException(kind.name());
    }
}
