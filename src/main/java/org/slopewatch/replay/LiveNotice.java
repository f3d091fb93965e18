package org.slopewatch.replay;

import java.time.LocalDate;
import org.slopewatch.rules.Alert;

/**
 * A notice the daemon journalled, as far as a what-if compares it: which rule, about what, the
 * episode it belongs to and the market date it was decided on.
 *
 * @param subject      a spread id ({@code GOVT-A:10Y-3M}), or a curve for a rule about a feed
 * @param episodeSince the market date the rule's condition started to hold
 * @param marketDate   the spread's latest market date when the notice was decided
 * @param policyHash   the content hash of the policy it was decided under, or null
 */
public record LiveNotice(String rule, String subject, Alert.Kind kind, LocalDate episodeSince, LocalDate marketDate,
                         String policyHash) {

    /** Rules about a feed name a curve; spread ids always carry {@code CURVE:SPREAD}. */
    public boolean aboutSpread() {
        return subject.indexOf(':') > 0;
    }
}
