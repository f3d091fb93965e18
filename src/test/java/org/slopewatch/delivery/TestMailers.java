package org.slopewatch.delivery;

import io.quarkus.arc.Unremovable;
import io.quarkus.mailer.Mailer;
import io.quarkus.mailer.MailerName;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.inject.Inject;

/** The named mailers of {@link SmtpTestResource}; Quarkus makes a named mailer only where one is injected. */
@ApplicationScoped
@Unremovable
public class TestMailers {

    static final String[] SCRIPTED = {"scripted-rejects", "scripted-busy", "scripted-echo"};

    @Inject
    @MailerName("wrong-password")
    Mailer wrongPassword;

    @Inject
    @MailerName("refused")
    Mailer refused;

    @Inject
    @MailerName("scripted-rejects")
    Mailer scriptedRejects;

    @Inject
    @MailerName("scripted-busy")
    Mailer scriptedBusy;

    @Inject
    @MailerName("scripted-echo")
    Mailer scriptedEcho;

    Mailer wrongPassword() {
        return wrongPassword;
    }

    Mailer refused() {
        return refused;
    }

    /** The scripted server, for the recipient rejected for good. */
    Mailer scriptedRejects() {
        return scriptedRejects;
    }

    /** The scripted server, for the busy mailbox. */
    Mailer scriptedBusy() {
        return scriptedBusy;
    }

    /** The scripted server, for the reply that repeats the password. */
    Mailer scriptedEcho() {
        return scriptedEcho;
    }
}
