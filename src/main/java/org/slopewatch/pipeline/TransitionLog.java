package org.slopewatch.pipeline;

import java.util.Locale;
import org.jboss.logging.Logger;
import org.jboss.logging.MDC;
import org.slopewatch.monitor.Revision;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpellRestatement;
import org.slopewatch.monitor.Transition;

/**
 * The log lines of what the monitors concluded: one structured line per transition once its step
 * is journalled (with JSON logs its fields also travel as MDC keys), a warning per revision as
 * it is decided, and a line per restatement of spells' figures.
 * Category {@value #CATEGORY}, which operators raise or lower on its own.
 */
final class TransitionLog {

    static final String CATEGORY = "org.slopewatch.transitions";
    private static final Logger LOG = Logger.getLogger(CATEGORY);

    private TransitionLog() {
    }

    static void transition(Transition t) {
        MDC.put("spread", t.spread().id());
        MDC.put("market_date", t.date().toString());
        MDC.put("from", t.from().name());
        MDC.put("to", t.to().name());
        MDC.put("test", t.evidence().test());
        try {
            LOG.infof("transition spread=%s date=%s from=%s to=%s test=%s reason=\"%s\"", t.spread().id(), t.date(), t.from(),
                    t.to(), t.evidence().test(), t.reason());
        } finally {
            MDC.remove("spread");
            MDC.remove("market_date");
            MDC.remove("from");
            MDC.remove("to");
            MDC.remove("test");
        }
    }

    static void revision(Revision r) {
        LOG.warnf("revision spread=%s from=%s: %d transition(s) replaced by %d: %s", r.spread().id(), r.from(), r.before().size(),
                r.after().size(), r.after());
    }

    static void restatement(SpellRestatement r) {
        StringBuilder spells = new StringBuilder();
        for (Spell s : r.spells()) {
            spells.append(spells.isEmpty() ? "" : "; ").append(String.format(Locale.ROOT,
                    "spell %d %s to %s: deepest %s bp on %s, area %s bp-days, %d observations", s.id(), s.start(), s.end(),
                    s.deepestBp(), s.deepestDate(), s.invertedAreaBpDays(), s.observations()));
        }
        LOG.infof("restatement spread=%s from=%s: %s", r.spread().id(), r.from(), spells);
    }
}
