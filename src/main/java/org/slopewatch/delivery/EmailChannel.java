package org.slopewatch.delivery;

import io.quarkus.mailer.Mail;
import io.quarkus.mailer.Mailer;
import io.vertx.ext.mail.SMTPException;
import java.io.IOException;
import java.net.ConnectException;
import java.util.List;
import java.util.Objects;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertText;

/**
 * Sends an alert by email through the Quarkus {@link Mailer} (SMTP settings under
 * {@code quarkus.mailer.*}): the subject is {@link Alert#subject()}, with a plain-text and an
 * HTML part ({@link AlertText}).
 *
 * <p>An SMTP reply decides the outcome by its class: 4xx (mailbox busy, try later) is retried,
 * 5xx (recipient unknown, authentication refused) is not. A refused connection, a time-out and
 * other I/O trouble are retried. The SMTP password never appears: the server's reply is all a
 * reason repeats, and it passes through the {@link Redactor} first.
 */
public final class EmailChannel implements AlertChannel {

    public static final String TYPE = "email";

    static final int REPLY_CHARS = 300;

    private final String name;
    private final Mailer mailer;
    private final List<String> to;
    private final Redactor redactor;

    /**
     * @param to       the recipients, at least one
     * @param redactor knows the SMTP password (and anything else that must not be repeated)
     */
    public EmailChannel(String name, Mailer mailer, List<String> to, Redactor redactor) {
        this.name = Objects.requireNonNull(name, "name");
        this.to = List.copyOf(to);
        if (this.to.isEmpty()) {
            throw new IllegalArgumentException("channel '" + name + "': no recipients (set slopewatch.channels." + name + ".to)");
        }
        for (String address : this.to) {
            int at = address.indexOf('@');
            if (at <= 0 || at == address.length() - 1 || address.chars().anyMatch(Character::isWhitespace)) {
                throw new IllegalArgumentException("channel '" + name + "': '" + address + "' is not an email address");
            }
        }
        this.mailer = Objects.requireNonNull(mailer, "mailer");
        this.redactor = Objects.requireNonNull(redactor, "redactor");
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public String type() {
        return TYPE;
    }

    public List<String> recipients() {
        return to;
    }

    @Override
    public DeliveryOutcome deliver(Alert alert) {
        Mail mail = new Mail().setTo(to).setSubject(alert.subject()).setText(AlertText.mailText(alert)).setHtml(AlertText.html(alert));
        try {
            mailer.send(mail);
        } catch (RuntimeException e) {
            return outcomeOf(e);
        }
        return new DeliveryOutcome.Delivered(prefix() + "accepted for " + to.size() + (to.size() == 1 ? " recipient" : " recipients"));
    }

    /** What a failure of the mailer comes to; the Mailer wraps the SMTP client's failure, so the chain is searched. */
    DeliveryOutcome outcomeOf(Throwable failure) {
        for (Throwable t = failure; t != null; t = t.getCause()) {
            if (t instanceof SMTPException smtp) {
                String reply = "SMTP " + smtp.getReplyCode() + ": " + redactor.redactAndTruncate(String.join(" ", smtp.getReplyMessages()),
                        REPLY_CHARS);
                if (smtp.getReplyCode() >= 500) {
                    return new DeliveryOutcome.FailedForGood(prefix() + reply);
                }
                return new DeliveryOutcome.RetryLater(prefix() + reply);
            }
            if (t instanceof ConnectException) {
                return new DeliveryOutcome.RetryLater(prefix() + "connection to the SMTP server refused");
            }
            if (t instanceof java.util.concurrent.TimeoutException || t instanceof io.smallrye.mutiny.TimeoutException) {
                return new DeliveryOutcome.RetryLater(prefix() + "the SMTP server did not answer in time");
            }
            if (t instanceof IOException) {
                return new DeliveryOutcome.RetryLater(prefix() + "I/O error: " + describe(t));
            }
        }
        if (failure instanceof IllegalArgumentException) {
            // the Mailer's own check of the addresses: sending again will not change them
            return new DeliveryOutcome.FailedForGood(prefix() + "the mail was refused before sending: " + describe(failure));
        }
        return new DeliveryOutcome.RetryLater(prefix() + "unexpected error: " + describe(innermost(failure)));
    }

    private static Throwable innermost(Throwable t) {
        Throwable root = t;
        while (root.getCause() != null && root.getCause() != root) {
            root = root.getCause();
        }
        return root;
    }

    private String describe(Throwable t) {
        return redactor.describe(t, REPLY_CHARS);
    }

    private String prefix() {
        return "email '" + name + "': ";
    }

    @Override
    public String toString() {
        return "EmailChannel[" + name + ", " + to.size() + " recipients]";
    }
}
