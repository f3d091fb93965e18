package org.slopewatch.delivery;

import com.icegreen.greenmail.util.GreenMail;
import com.icegreen.greenmail.util.ServerSetupTest;
import io.quarkus.test.common.QuarkusTestResource;
import io.quarkus.test.common.QuarkusTestResourceLifecycleManager;
import java.util.HashMap;
import java.util.Map;

/**
 * Starts the mail servers the delivery tests talk to, before Quarkus boots, and hands their
 * addresses to the Mailer: GreenMail (the real SMTP server that receives and checks the
 * password) as the default mailer; the same GreenMail with a wrong password as mailers
 * {@code wrong-password} and {@code wrong-password-secrets}; a closed port as {@code refused}; the {@link ScriptedSmtpServer} as
 * {@code scripted-rejects}, {@code scripted-busy} and {@code scripted-echo}; a second scripted server
 * that refuses every login with a reply repeating the password as {@code scripted-login} and
 * {@code scripted-login-quiet}. It also configures the channels the tests use. Applied to every
 * {@code @QuarkusTest}, so the application boots once for all of them.
 */
@QuarkusTestResource(SmtpTestResource.class)
public class SmtpTestResource implements QuarkusTestResourceLifecycleManager {

    static final String USER = "slopewatch";
    static final String FROM = "slopewatch@slopewatch.test";
    /** Recognisable, so that a test can look for it in every reason and log line. */
    static final String PASSWORD = "smtp-pw-Qz7Kx2Lm9Vw";
    static final String WRONG_PASSWORD = "smtp-pw-WRONG-Hr4Tn8Bc";
    static final String DESK = "desk@slopewatch.test";
    public static final String RISK = "risk@slopewatch.test";

    /** What {@link #scriptedLogin} answers every login with: a refusal that repeats the credentials. */
    static final String LOGIN_REFUSAL = "535 5.7.8 authentication failed for " + USER + " with password " + PASSWORD;

    public static GreenMail greenMail;
    static ScriptedSmtpServer scripted;
    /** A scripted server that offers AUTH and refuses every login with {@link #LOGIN_REFUSAL}. */
    static ScriptedSmtpServer scriptedLogin;

    @Override
    public Map<String, String> start() {
        greenMail = new GreenMail(ServerSetupTest.SMTP.dynamicPort());
        greenMail.start();
        greenMail.setUser(FROM, USER, PASSWORD);
        scripted = ScriptedSmtpServer.start();
        scriptedLogin = ScriptedSmtpServer.start();
        scriptedLogin.refuseLoginWith(LOGIN_REFUSAL);
        String host = greenMail.getSmtp().getServerSetup().getBindAddress();
        int port = greenMail.getSmtp().getPort();

        Map<String, String> config = new HashMap<>();
        mailer(config, "quarkus.mailer.", host, port, PASSWORD, "REQUIRED");
        mailer(config, "quarkus.mailer.wrong-password.", host, port, WRONG_PASSWORD, "REQUIRED");
        // the same, for the secrets contract alone: after a refused login the mail client sometimes leaves its next
        // message waiting until the mailer's time-out, so two test classes sharing one such mailer failed now and then
        mailer(config, "quarkus.mailer.wrong-password-secrets.", host, port, WRONG_PASSWORD, "REQUIRED");
        mailer(config, "quarkus.mailer.refused.", "127.0.0.1", ClosedPort.find(), PASSWORD, "REQUIRED");
        // the scripted server offers no AUTH, so none is attempted
        // one mailer per scripted case: a Vert.x mail client that has just had a recipient refused
        // sometimes leaves its next message waiting until the mailer's time-out (seen with 3.33.2)
        for (String name : TestMailers.SCRIPTED) {
            mailer(config, "quarkus.mailer." + name + ".", "127.0.0.1", scripted.port(), PASSWORD, "NONE");
        }
        // one mailer per login case, for the same reason
        for (String name : TestMailers.SCRIPTED_LOGIN) {
            mailer(config, "quarkus.mailer." + name + ".", "127.0.0.1", scriptedLogin.port(), PASSWORD, "REQUIRED");
        }
        config.put("slopewatch.channels.desk-mail.type", "email");
        config.put("slopewatch.channels.desk-mail.to", DESK + "," + RISK);
        config.put("slopewatch.channels.alerts-topic.type", "stream");
        config.put("slopewatch.channels.alerts-topic.timeout", "5s");
        return config;
    }

    private static void mailer(Map<String, String> config, String prefix, String host, int port, String password, String login) {
        config.put(prefix + "mock", "false");
        config.put(prefix + "host", host);
        config.put(prefix + "port", Integer.toString(port));
        config.put(prefix + "from", FROM);
        config.put(prefix + "username", USER);
        config.put(prefix + "password", password);
        config.put(prefix + "login", login);
        config.put(prefix + "timeout", "10s");
    }

    @Override
    public void stop() {
        if (greenMail != null) {
            greenMail.stop();
        }
        if (scripted != null) {
            scripted.close();
        }
        if (scriptedLogin != null) {
            scriptedLogin.close();
        }
    }
}
