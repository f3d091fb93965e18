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
    static final String[] SCRIPTED_LOGIN = {"scripted-login", "scripted-login-quiet"};

    @Inject
    @MailerName("wrong-password")
    Mailer wrongPassword;

    @Inject
    @MailerName("wrong-password-secrets")
    Mailer wrongPasswordForSecrets;

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

    @Inject
    @MailerName("scripted-login")
    Mailer scriptedLogin;

    @Inject
    @MailerName("scripted-login-quiet")
    Mailer scriptedLoginQuiet;

    Mailer wrongPassword() {
        return wrongPassword;
    }

    /** A wrong password of its own for {@link SecretsNeverLeakTest}, so that no other test's refused login precedes its attempt. */
    Mailer wrongPasswordForSecrets() {
        return wrongPasswordForSecrets;
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

    /** The scripted server that refuses the login with a reply repeating the password. */
    Mailer scriptedLogin() {
        return scriptedLogin;
    }

    /** The same server through a mailer of its own, for the case at the configured log levels. */
    Mailer scriptedLoginQuiet() {
        return scriptedLoginQuiet;
    }
}
