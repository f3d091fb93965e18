package org.slopewatch.rules;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The policy's probability models, by spread name. A spread without a model has no probability,
 * so no {@code probability-above} rule may refer to it.
 */
public record ProbabilityModels(Map<String, SpreadProbabilityModel> bySpread) {

    public static final ProbabilityModels NONE = new ProbabilityModels(Map.of());

    public ProbabilityModels {
        // keep the file's order for reports, and make it unmodifiable
        bySpread = Collections.unmodifiableMap(new LinkedHashMap<>(bySpread));
        bySpread.forEach((name, m) -> {
            if (!name.equals(m.spread())) {
                throw new IllegalArgumentException("model for " + m.spread() + " filed under " + name);
            }
        });
    }

    public Optional<SpreadProbabilityModel> forSpread(String spread) {
        return Optional.ofNullable(bySpread.get(spread));
    }

    public Set<String> spreads() {
        return bySpread.keySet();
    }

    public int size() {
        return bySpread.size();
    }
}
