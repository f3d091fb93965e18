package org.slopewatch.web;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.eclipse.microprofile.openapi.annotations.media.Schema;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeliveryAttempts;
import org.slopewatch.journal.JournalReader;

/**
 * One entry of a spread's timeline. {@code kind} names the alternative; {@code recorded_at} is
 * when the journal learned of it, the order of the timeline.
 */
@Schema(oneOf = {TimelineItem.ObservationItem.class, TimelineItem.TransitionItem.class, TimelineItem.AlertItem.class,
        TimelineItem.AttemptItem.class, TimelineItem.AckItem.class})
sealed interface TimelineItem permits TimelineItem.ObservationItem, TimelineItem.TransitionItem, TimelineItem.AlertItem,
        TimelineItem.AttemptItem, TimelineItem.AckItem {

    String kind();

    Instant recordedAt();

    /** A spread value computed from a quote; {@code standing} false once a later value for the date replaced it. */
    record ObservationItem(String kind, Instant recordedAt, long id, LocalDate date, double valueBp, long seq, boolean standing)
            implements TimelineItem {

        static ObservationItem of(JournalReader.StoredObservation o) {
            return new ObservationItem("observation", o.recordedAt(), o.id(), o.date(), o.valueBp(), o.seq(), o.standing());
        }
    }

    /** A change of state; {@code superseded_by} names the revision that replaced it, when one had by the moment asked about. */
    record TransitionItem(String kind, Instant recordedAt, long id, LocalDate date, String from, String to, String reason, String test,
                          String window, double measured, double limit, double valueBp, long daysInverted, long spellId, long seq,
                          Long supersededBy) implements TimelineItem {

        static TransitionItem of(JournalReader.StoredTransition t) {
            return new TransitionItem("transition", t.recordedAt(), t.id(), t.date(), t.from(), t.to(), t.reason(), t.test(), t.window(),
                    t.measured(), t.limit(), t.valueBp(), t.daysInverted(), t.spellId(), t.seq(), t.supersededBy());
        }
    }

    /** A notice about the spread, with its deliveries as they stood at the moment asked about. */
    record AlertItem(String kind, Instant recordedAt, String id, String rule, String severity, String notice, LocalDate marketDate,
                     String state, String title, String quietedBy, String policyHash, Instant createdAt,
                     List<AlertResource.DeliveryView> deliveries) implements TimelineItem {

        static AlertItem of(AlertHistory.AlertView v) {
            var a = v.stored().alert();
            return new AlertItem("alert", v.stored().recordedAt(), a.id(), a.rule(), a.severity().name(), a.kind().label(), a.marketDate(),
                    a.state(), a.subject(), v.stored().quietedBy(), v.stored().policyHash(), a.createdAt(),
                    v.deliveries().stream().map(d -> new AlertResource.DeliveryView(d.channel(), d.status().name(), d.attempts(),
                            d.nextAttemptAt(), d.lastDetail(), d.updatedAt())).toList());
        }
    }

    /** One try at delivering a notice on one channel. */
    record AttemptItem(String kind, Instant recordedAt, long id, String alertId, String channel, int attempt, String outcome, String detail,
                       String decision, Instant attemptedAt) implements TimelineItem {

        static AttemptItem of(DeliveryAttempts.StoredAttempt a) {
            return new AttemptItem("delivery-attempt", a.recordedAt(), a.id(), a.alertId(), a.channel(), a.attempt(), a.outcome(),
                    a.detail(), a.decision(), a.attemptedAt());
        }
    }

    /** Someone acknowledged a notice. */
    record AckItem(String kind, Instant recordedAt, String alertId, String by, String note) implements TimelineItem {

        static AckItem of(AlertHistory.Ack k) {
            return new AckItem("ack", k.at(), k.alertId(), k.by(), k.note());
        }
    }
}
