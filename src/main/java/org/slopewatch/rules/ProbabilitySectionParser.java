package org.slopewatch.rules;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.slopewatch.probability.Covariance;
import org.slopewatch.probability.ProbitModel;
import org.slopewatch.rules.SpreadProbabilityModel.Averaging;
import org.slopewatch.text.Excerpt;

/**
 * Reads the {@code probability} part of a policy: per watched spread, the probit coefficients,
 * the horizon, the averaging and a required provenance note. Problems go to the shared list.
 */
final class ProbabilitySectionParser {

    static final Set<String> MODEL_KEYS = new LinkedHashSet<>(List.of("alpha", "beta", "horizon-months", "average", "source",
            "covariance"));
    static final Set<String> COVARIANCE_KEYS = new LinkedHashSet<>(List.of("var-alpha", "cov-alpha-beta", "var-beta"));

    private ProbabilitySectionParser() {
    }

    /**
     * @param node    the value of {@code probability}, or null when the policy has none
     * @param watched the names of the spreads the policy watches
     */
    static ProbabilityModels models(YamlNode node, Set<String> watched) {
        if (node == null) {
            return ProbabilityModels.NONE;
        }
        Map<String, SpreadProbabilityModel> out = new LinkedHashMap<>();
        for (YamlNode.Entry e : node.entries("'probability'")) {
            if (!watched.contains(e.key())) {
                e.keyNode().problem("unknown spread " + Excerpt.quoted(e.key()) + " in 'probability': not watched by this policy (watched: "
                        + String.join(", ", watched) + ")");
                continue;
            }
            SpreadProbabilityModel m = model(e.key(), e.value());
            if (m != null) {
                out.put(e.key(), m);
            }
        }
        return new ProbabilityModels(out);
    }

    private static SpreadProbabilityModel model(String spread, YamlNode item) {
        String what = "the probability model for " + spread;
        Map<String, YamlNode> keys = item.mapping(what, MODEL_KEYS);
        if (!item.isMapping()) {
            return null;
        }
        double alpha = required(keys, "alpha", item, what, "a number") ? keys.get("alpha").number("'alpha'") : Double.NaN;
        double beta = required(keys, "beta", item, what, "a number") ? keys.get("beta").number("'beta'") : Double.NaN;
        int horizon = Integer.MIN_VALUE;
        if (required(keys, "horizon-months", item, what, "the months ahead the model predicts, e.g. 12")) {
            horizon = keys.get("horizon-months").integer("'horizon-months'");
            if (horizon != Integer.MIN_VALUE && horizon < 0) {
                keys.get("horizon-months").problem("'horizon-months' must be 0 or more, got " + horizon);
                horizon = Integer.MIN_VALUE;
            }
        }
        // A number without a source is hard to defend in a risk review, so the note is required.
        String source = required(keys, "source", item, what, "a note on where the coefficients come from (paper or fit, sample)")
                ? keys.get("source").string("'source'") : null;
        Averaging average = keys.containsKey("average") ? averaging(keys.get("average")) : Averaging.MONTHLY;
        Covariance covariance = keys.containsKey("covariance") ? covariance(keys.get("covariance"), what) : null;
        if (Double.isNaN(alpha) || Double.isNaN(beta) || horizon == Integer.MIN_VALUE || source == null || average == null
                || keys.containsKey("covariance") && covariance == null) {
            return null;
        }
        return new SpreadProbabilityModel(spread, new ProbitModel(alpha, beta, source), horizon, average, covariance);
    }

    /** {@code { var-alpha: …, cov-alpha-beta: …, var-beta: … }}: all three, a positive semi-definite matrix. */
    private static Covariance covariance(YamlNode node, String what) {
        String where = "the covariance of " + what.replace("the probability model for ", "");
        Map<String, YamlNode> keys = node.mapping(where, COVARIANCE_KEYS);
        if (!node.isMapping()) {
            return null;
        }
        double[] v = new double[3];
        int k = 0;
        boolean complete = true;
        for (String key : COVARIANCE_KEYS) {
            if (!required(keys, key, node, where, "a number")) {
                complete = false;
                continue;
            }
            v[k++] = keys.get(key).number("'" + key + "'");
        }
        if (!complete || Double.isNaN(v[0]) || Double.isNaN(v[1]) || Double.isNaN(v[2])) {
            return null;
        }
        if (v[0] < 0 || v[2] < 0 || v[1] * v[1] > v[0] * v[2] * (1 + 1e-12)) {
            node.problem("'covariance' is not a covariance matrix: variances must be 0 or more and cov-alpha-beta² at most "
                    + "var-alpha × var-beta");
            return null;
        }
        return new Covariance(v[0], v[1], v[2]);
    }

    private static Averaging averaging(YamlNode node) {
        String text = node.string("'average'");
        if (text == null) {
            return null;
        }
        for (Averaging a : Averaging.values()) {
            if (a.key().equals(text.strip().toLowerCase(Locale.ROOT))) {
                return a;
            }
        }
        node.problem("unknown average " + Excerpt.quoted(text) + " (known: " + Arrays.stream(Averaging.values()).map(Averaging::key)
                .collect(Collectors.joining(", ")) + ")");
        return null;
    }

    private static boolean required(Map<String, YamlNode> keys, String key, YamlNode item, String what, String hint) {
        if (keys.containsKey(key)) {
            return true;
        }
        item.problem(what + " needs '" + key + "' (" + hint + ")");
        return false;
    }
}
