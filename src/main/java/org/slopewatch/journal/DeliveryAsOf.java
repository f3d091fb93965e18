package org.slopewatch.journal;

import java.time.Instant;
import java.util.List;

/**
 * Where a delivery stood at a past moment. The outbox row keeps only its latest state, but
 * every attempt is journalled with the state it led to, so the state at any moment is the
 * state the outbox row was created with, moved on by the attempts recorded by then.
 */
final class DeliveryAsOf {

    private DeliveryAsOf() {
    }

    /**
     * @param now      the outbox row as it stands
     * @param alert    its notice (the outbox row was written with it, in the same transaction)
     * @param attempts the delivery's attempts recorded by the moment asked about, in order
     */
    static DeliveryOutbox.Delivery at(DeliveryOutbox.Delivery now, AlertHistory.StoredAlert alert,
                                      List<DeliveryAttempts.StoredAttempt> attempts) {
        if (now.status() == DeliveryOutbox.Status.SKIPPED) {
            return now; // skipped when written and never attempted: it has always looked like this
        }
        DeliveryOutbox.Status status = DeliveryOutbox.Status.PENDING;
        Instant next = alert.alert().createdAt(); // a new delivery is due at once
        Instant first = null;
        String detail = null;
        Instant updated = alert.recordedAt();
        for (DeliveryAttempts.StoredAttempt a : attempts) {
            status = switch (a.outcome()) {
                case "delivered" -> DeliveryOutbox.Status.DELIVERED;
                case "failed" -> DeliveryOutbox.Status.FAILED;
                default -> DeliveryOutbox.Status.PENDING;
            };
            // the journal keeps the time of the next try only for the latest state of the row
            next = null;
            first = first == null ? a.attemptedAt() : first;
            detail = a.decision();
            updated = a.recordedAt();
        }
        return new DeliveryOutbox.Delivery(now.alertId(), now.channel(), status, attempts.size(), next, first, detail, updated);
    }
}
