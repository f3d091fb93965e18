package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;
import static org.awaitility.Awaitility.await;

import io.quarkus.test.junit.QuarkusTest;
import jakarta.inject.Inject;
import jakarta.mail.BodyPart;
import jakarta.mail.Message;
import jakarta.mail.Multipart;
import jakarta.mail.Part;
import jakarta.mail.internet.MimeMessage;
import java.time.Duration;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertText;

/**
 * The email channel against real SMTP servers: GreenMail receives the message (and checks the
 * password), a closed port refuses, and a scripted server rejects recipients.
 */
@QuarkusTest
class EmailChannelTest {

    @Inject
    ChannelRegistry registry;

    @Inject
    TestMailers mailers;

    @BeforeEach
    void emptyMailbox() throws Exception {
        SmtpTestResource.greenMail.purgeEmailFromAllMailboxes();
    }

    private AlertChannel deskMail() {
        return registry.channel("desk-mail").orElseThrow();
    }

    private static MimeMessage[] received(int expected) {
        await("%d messages at the SMTP server".formatted(expected)).atMost(Duration.ofSeconds(10))
                .until(() -> SmtpTestResource.greenMail.getReceivedMessages().length, n -> n >= expected);
        return SmtpTestResource.greenMail.getReceivedMessages();
    }

    /** The leaf parts of a message by content type (text/plain, text/html). */
    private static Map<String, String> parts(Part part) throws Exception {
        Map<String, String> out = new TreeMap<>();
        if (part.isMimeType("multipart/*")) {
            Multipart multipart = (Multipart) part.getContent();
            for (int i = 0; i < multipart.getCount(); i++) {
                BodyPart child = multipart.getBodyPart(i);
                out.putAll(parts(child));
            }
        } else {
            out.put(part.getContentType().split(";")[0].strip().toLowerCase(), part.getContent().toString());
        }
        return out;
    }

    @Test
    void theAlertArrivesWithSubjectTextAndHtmlParts() throws Exception {
        DeliveryOutcome outcome = deskMail().deliver(TestAlerts.confirmed());

        assertThat(outcome).isEqualTo(new DeliveryOutcome.Delivered("email 'desk-mail': accepted for 2 recipients"));
        MimeMessage[] messages = received(2);
        assertThat(messages).as("one copy per recipient").hasSize(2);
        MimeMessage mail = messages[0];
        assertThat(mail.getSubject()).isEqualTo("[CRITICAL] GOVT-A 10Y-3M CONFIRMED");
        assertThat(Arrays.stream(mail.getRecipients(Message.RecipientType.TO)).map(Object::toString))
                .containsExactlyInAnyOrder(SmtpTestResource.DESK, SmtpTestResource.RISK);
        assertThat(mail.getFrom()[0].toString()).isEqualTo(SmtpTestResource.FROM);

        Map<String, String> parts = parts(mail);
        assertThat(parts).as("a text and an HTML part").containsOnlyKeys("text/plain", "text/html");
        String text = parts.get("text/plain").replace("\r\n", "\n");
        assertThat(text).contains("inverted for the whole of 2026Q2").contains("days inverted: 92")
                .contains("Dashboard: " + TestAlerts.DASHBOARD);
        assertThat(text.strip()).as("the caution comes last").endsWith(Alert.CAUTION);

        String html = parts.get("text/html");
        assertThat(html).contains("<h2>[CRITICAL] GOVT-A 10Y-3M CONFIRMED</h2>")
                .contains("<table>")
                .contains("<th style=\"text-align:left\">days inverted</th><td>92</td>")
                .contains("<a href=\"" + TestAlerts.DASHBOARD + "\">Dashboard</a>");
        assertThat(html.indexOf(AlertText.escape(Alert.CAUTION))).as("the caution comes after the facts table and the link")
                .isGreaterThan(html.indexOf("</table>")).isGreaterThan(html.indexOf("Dashboard</a>"));
    }

    @Test
    void markupInAnAlertIsEscapedInTheHtmlPart() throws Exception {
        deskMail().deliver(TestAlerts.withMarkup());

        MimeMessage mail = received(2)[0];
        assertThat(mail.getSubject()).isEqualTo("[INFO] GOVT-B 2Y-3M <b>INVERTED</b> & \"still\"");
        String html = parts(mail).get("text/html");
        assertThat(html).as("no markup from the alert survives")
                .doesNotContain("<script>").doesNotContain("<b>INVERTED</b>").doesNotContain("<i>days</i>")
                .contains("Spread &lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; is -3 bp &amp; falling.<br>")
                .contains("<th style=\"text-align:left\">&lt;i&gt;days&lt;/i&gt;</th><td>3 &amp; counting</td>");
        assertThat(html).as("only http(s) links become links").doesNotContain("javascript:").doesNotContain("<a href");
    }

    @Test
    void aRefusedConnectionIsRetried() {
        EmailChannel refused = new EmailChannel("desk-mail", mailers.refused(), List.of(SmtpTestResource.DESK),
                Redactor.of(List.of(SmtpTestResource.PASSWORD)));

        assertThat(refused.deliver(TestAlerts.confirmed()))
                .isEqualTo(new DeliveryOutcome.RetryLater("email 'desk-mail': connection to the SMTP server refused"));
    }

    @Test
    void aRefusedPasswordFailsForGood() {
        EmailChannel wrong = new EmailChannel("desk-mail", mailers.wrongPassword(), List.of(SmtpTestResource.DESK),
                Redactor.of(List.of(SmtpTestResource.WRONG_PASSWORD)));

        DeliveryOutcome outcome = wrong.deliver(TestAlerts.confirmed());

        assertThat(outcome).isInstanceOf(DeliveryOutcome.FailedForGood.class);
        assertThat(((DeliveryOutcome.FailedForGood) outcome).reason()).startsWith("email 'desk-mail': SMTP 535");
        assertThat(SmtpTestResource.greenMail.getReceivedMessages()).as("nothing was delivered").isEmpty();
    }

    @Test
    void aRejectedRecipientFailsForGood() {
        EmailChannel scripted = new EmailChannel("desk-mail", mailers.scriptedRejects(), List.of("nobody@slopewatch.test"),
                Redactor.of(List.of(SmtpTestResource.PASSWORD)));
        SmtpTestResource.scripted.answerRcptWith("550 5.1.1 <nobody@slopewatch.test>: no such mailbox");
        try {
            assertThat(scripted.deliver(TestAlerts.confirmed())).isEqualTo(new DeliveryOutcome.FailedForGood(
                    "email 'desk-mail': SMTP 550: 550 5.1.1 <nobody@slopewatch.test>: no such mailbox"));
        } finally {
            SmtpTestResource.scripted.answerRcptWith("250 2.1.5 OK");
        }
        assertThat(SmtpTestResource.scripted.commands()).as("the server saw the recipient")
                .anyMatch(c -> c.equalsIgnoreCase("RCPT TO:<nobody@slopewatch.test>"));
    }

    @Test
    void aBusyMailboxIsRetried() {
        EmailChannel scripted = new EmailChannel("desk-mail", mailers.scriptedBusy(), List.of("busy@slopewatch.test"),
                Redactor.of(List.of(SmtpTestResource.PASSWORD)));
        SmtpTestResource.scripted.answerRcptWith("450 4.2.1 mailbox busy, try again later");
        try {
            assertThat(scripted.deliver(TestAlerts.confirmed())).isEqualTo(new DeliveryOutcome.RetryLater(
                    "email 'desk-mail': SMTP 450: 450 4.2.1 mailbox busy, try again later"));
        } finally {
            SmtpTestResource.scripted.answerRcptWith("250 2.1.5 OK");
        }
    }
}
