package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.equalTo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.common.http.TestHTTPResource;
import io.quarkus.test.junit.QuarkusTest;
import io.restassured.http.ContentType;
import java.io.File;
import java.io.IOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.net.URI;
import java.net.URL;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.StaleElementReferenceException;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.support.ui.WebDriverWait;

/**
 * The dashboard in a real browser (Debian's chromium, headless): quotes go in over HTTP, and the
 * page, polling the read API by itself, shows the inversion they cause. The tests share one
 * application and run in order, each on market dates after those of the one before on its curve:
 * GOVT-A inverts (1), GOVT-B inverts and is acknowledged (2), GOVT-A stays inverted for a season
 * and is confirmed (3), GOVT-B's curve is drawn against three months before (4). Screenshots of
 * the whole page are left in {@code target/} for a person to look at.
 */
@QuarkusTest
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class DashboardBrowserTest {

    private static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    private static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");
    private static final String SPREAD = "GOVT-A:10Y-3M";
    private static final Duration PATIENCE = Duration.ofSeconds(30);

    private static Path profile;
    private static WebDriver browser;

    @TestHTTPResource("/")
    URL page;

    @BeforeAll
    static void startBrowser() throws IOException {
        assertThat(Files.isExecutable(CHROMIUM) && Files.isExecutable(CHROMEDRIVER))
                .as("the browser test needs Debian's chromium and chromium-driver: apt-get install -y chromium chromium-driver")
                .isTrue();
        profile = Files.createTempDirectory("slopewatch-chromium-");
        ChromeOptions options = new ChromeOptions();
        options.setBinary(CHROMIUM.toFile());
        options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage",
                "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run",
                "--window-size=1280,2300", "--user-data-dir=" + profile);
        // an explicit driver, or Selenium goes looking for one on the network first
        ChromeDriverService service = new ChromeDriverService.Builder().usingDriverExecutable(new File(CHROMEDRIVER.toString()))
                .usingAnyFreePort().build();
        browser = new ChromeDriver(service, options);
    }

    @AfterAll
    static void stopBrowser() throws IOException {
        if (browser != null) {
            browser.quit();
        }
        if (profile != null) {
            try (Stream<Path> files = Files.walk(profile)) {
                files.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
            }
        }
    }

    @Test
    @Order(1)
    void anInversionPostedOverHttpAppearsOnThePageWithItsStateValueChartAndReason() throws Exception {
        // A week at +40 bp ends any spell other tests left open; then 10Y-3M dips below zero.
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-A","date":"2026-05-04","yields":{"1M":4.30,"3M":4.40,"6M":4.45,"1Y":4.45,"2Y":4.50,"5Y":4.60,"10Y":4.80,"30Y":5.00}},
                 {"curve":"GOVT-A","date":"2026-05-05","yields":{"1M":4.30,"3M":4.40,"6M":4.45,"1Y":4.45,"2Y":4.50,"5Y":4.60,"10Y":4.80,"30Y":5.00}},
                 {"curve":"GOVT-A","date":"2026-05-06","yields":{"1M":4.30,"3M":4.40,"6M":4.45,"1Y":4.45,"2Y":4.50,"5Y":4.60,"10Y":4.80,"30Y":5.00}},
                 {"curve":"GOVT-A","date":"2026-05-07","yields":{"1M":4.30,"3M":4.40,"6M":4.45,"1Y":4.45,"2Y":4.50,"5Y":4.60,"10Y":4.80,"30Y":5.00}},
                 {"curve":"GOVT-A","date":"2026-05-08","yields":{"1M":4.30,"3M":4.40,"6M":4.45,"1Y":4.45,"2Y":4.50,"5Y":4.60,"10Y":4.80,"30Y":5.00}},
                 {"curve":"GOVT-A","date":"2026-05-11","yields":{"1M":4.60,"3M":4.72,"6M":4.70,"1Y":4.62,"2Y":4.55,"5Y":4.52,"10Y":4.64,"30Y":4.85}},
                 {"curve":"GOVT-A","date":"2026-05-12","yields":{"1M":4.66,"3M":4.80,"6M":4.76,"1Y":4.66,"2Y":4.57,"5Y":4.50,"10Y":4.566,"30Y":4.80}}]""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(7));
        List<String> reasons = given().get("/api/transitions?spread=" + SPREAD + "&from=2026-05-11&to=2026-05-11").then()
                .statusCode(200).body("to", equalTo(List.of("INVERTED"))).extract().path("reason");
        String reason = reasons.get(0);
        assertThat(reason).as("the monitor says why it went INVERTED").contains("below entry threshold");

        browser.manage().window().setSize(new Dimension(1280, 2300));
        browser.get(page.toString());
        WebDriverWait wait = new WebDriverWait(browser, PATIENCE);
        By card = By.cssSelector("article[data-spread='" + SPREAD + "']");
        wait.withMessage("the " + SPREAD + " card should show INVERTED and the posted value −23.4 bp")
                .until(b -> {
                    List<WebElement> found = b.findElements(card);
                    return !found.isEmpty() && "INVERTED".equals(found.get(0).getAttribute("data-state"))
                            && found.get(0).findElement(By.cssSelector(".value")).getText().startsWith("\u221223.4");
                });
        WebElement spread = browser.findElement(card);
        WebElement state = spread.findElement(By.cssSelector(".state"));
        assertThat(state.getText()).as("the state is spelt out, not only coloured").isEqualTo("Inverted");
        assertThat(spread.getText()).as("the card gives the open spell's start").contains("since 2026-05-11");

        // The recession probability in words. The default policy's probit for 10Y-3M (Estrella and Trubin (2006),
        // alpha -0.5333, beta -0.6330, twelve months ahead, from memory) on May's average so far, as the API gives
        // it; P recomputed with Commons Math. May is the month of the latest quote, so it is provisional.
        // (read with Jackson: RestAssured's path() would read the numbers as floats)
        JsonNode p = new ObjectMapper().readTree(given().get("/api/spreads/" + SPREAD).then().statusCode(200).extract().asString())
                .get("probability");
        double value = new NormalDistribution().cumulativeProbability(-0.5333 - 0.6330 * p.get("month_average_bp").asDouble() / 100);
        // probabilities are given to six decimals (docs/policy.md, "Thresholds and resolution")
        assertThat(p.get("value").asDouble()).isEqualTo(new BigDecimal(value).setScale(6, RoundingMode.HALF_EVEN).doubleValue());
        String words = spread.findElement(By.cssSelector(".probability p.provisional")).getText();
        assertThat(words).as("how far ahead, which month's average, provisional, and the model")
                .containsPattern("^(Recession probability|Month to date) \\(provisional\\): ")
                .contains(String.format(Locale.ROOT, "12-month-ahead recession probability %.0f %% (no band: the model has no covariance): "
                        + "P(recession in 2027-05), from the 10Y-3M average of 2026-05 so far (provisional: month to date, ", 100 * value))
                .contains("; model: Estrella and Trubin (2006)");
        WebElement odds = browser.findElement(By.cssSelector("#overview-rows tr[data-spread='" + SPREAD + "'] td.odds"));
        assertThat(odds.getText()).as("the overview names the horizon and the month too").contains("12 months ahead, from the 10Y-3M average of 2026-0");

        assertThat(browser.findElement(By.id("caution")).getText()).as("the caution is on the page, visibly")
                .contains("A statistical signal, not investment advice")
                .contains("licensed professionals");
        assertThat(browser.findElement(By.id("caution")).isDisplayed()).isTrue();

        WebElement chart = spread.findElement(By.cssSelector("figure.history svg"));
        assertThat(chart.getAttribute("aria-label")).as("the chart has a text alternative").contains("latest \u221223.4 bp");
        assertThat(chart.findElement(By.cssSelector("path.series")).getAttribute("d"))
                .as("the history is drawn as an SVG path").startsWith("M");
        assertThat(chart.findElements(By.cssSelector("line.zero"))).as("the zero line").hasSize(1);
        assertThat(chart.findElements(By.cssSelector("rect.spell-inverted"))).as("the open spell is shaded").isNotEmpty();

        By change = By.xpath("//tbody[@id='changes-rows']/tr[@data-spread='" + SPREAD + "' and @data-to='INVERTED']"
                + "/td[contains(@class,'reason')]");
        wait.withMessage("the recent changes should list the transition with its reason: " + reason)
                .until(b -> b.findElements(change).stream().anyMatch(td -> td.getText().equals(reason)));

        for (String link : List.of("/q/metrics", "/q/health", "/q/openapi")) {
            assertThat(browser.findElements(By.cssSelector("a[href='" + link + "']"))).as("a link to " + link).hasSize(1);
        }
        assertThat(browser.findElement(By.id("problem")).isDisplayed()).as("no error banner while the API answers").isFalse();

        browser.manage().window().setSize(new Dimension(390, 900));
        wait.withMessage("the page should fit a narrow screen without sideways scrolling").until(b -> (Boolean)
                ((JavascriptExecutor) b).executeScript("return document.documentElement.scrollWidth <= window.innerWidth;"));
    }

    /*
     * The default policy's first-inversion rule (alert-rules/default.yaml) fires when GOVT-B's 10Y-3M
     * goes below zero; the page lists it as an open alert, and acknowledging it there is journalled
     * and shown. The curve card compares the latest curve with the one three months before.
     */
    @Test
    @Order(2)
    void anOpenAlertIsAcknowledgedFromThePageAndTheCurveIsComparedWithThreeMonthsBefore() throws IOException {
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-B","date":"2026-02-16","yields":{"3M":4.10,"1Y":4.15,"2Y":4.20,"5Y":4.35,"10Y":4.50,"30Y":4.70}},
                 {"curve":"GOVT-B","date":"2026-05-18","yields":{"3M":4.60,"1Y":4.55,"2Y":4.45,"5Y":4.40,"10Y":4.45,"30Y":4.60}}]""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(2));
        String id = "first-inversion~GOVT-B:10Y-3M~2026-05-18~1";
        given().get("/api/alerts/" + id).then().statusCode(200).body("alert.rule", equalTo("first-inversion"));

        browser.manage().window().setSize(new Dimension(1280, 2300));
        browser.get(page.toString());
        WebDriverWait wait = new WebDriverWait(browser, PATIENCE);
        By item = By.cssSelector("li.alert-item[data-alert-id='" + id + "']");
        wait.withMessage("the open alert " + id + " should be listed").until(b -> !b.findElements(item).isEmpty());
        WebElement alert = browser.findElement(item);
        assertThat(alert.getText()).as("the notice's subject without the kind and severity the list shows beside it")
                .contains("GOVT-B:10Y-3M inverted at -15.0 bp").doesNotContain("opening notice").contains("since 2026-05-18");
        WebElement name = alert.findElement(By.cssSelector("input[name='by']"));
        assertThat(browser.findElement(By.cssSelector("label[for='" + name.getAttribute("id") + "']")).getText()).isEqualTo("Your name");
        name.sendKeys("desk lead");
        alert.findElement(By.cssSelector("button[type='submit']")).click();
        wait.withMessage("the page should show the alert acknowledged")
                .until(b -> b.findElement(item).getText().contains("Acknowledged"));
        given().get("/api/alerts/" + id).then().statusCode(200).body("alert.acks[0].by", equalTo("desk lead"));
        String at = given().get("/api/alerts/" + id).then().extract().path("alert.acks[0].at");
        By ack = By.cssSelector("#quiet-list li.ack-item[data-subject='GOVT-B:10Y-3M'][data-rule='first-inversion']");
        wait.ignoring(StaleElementReferenceException.class)
                .withMessage("the panel of quiet periods and acknowledgements should say who acknowledged first-inversion on "
                        + "GOVT-B 10Y-3M, and when (" + at + ")")
                .until(b -> !b.findElements(ack).isEmpty() && b.findElement(ack).getText().contains("by desk lead at " + utcMinutes(at)));

        // the page redraws itself every few seconds: each check reads the element afresh, and a
        // read that meets an element just replaced is tried again
        By row = By.cssSelector("#overview-rows tr[data-spread='GOVT-B:10Y-3M']");
        wait.ignoring(StaleElementReferenceException.class)
                .withMessage("the overview table should list GOVT-B 10Y-3M as inverted at \u221215.0 bp")
                .until(b -> !b.findElements(row).isEmpty() && "INVERTED".equals(b.findElement(row).getAttribute("data-state"))
                        && b.findElement(row).getText().contains("\u221215.0"));

        By earlier = By.cssSelector("article[data-curve='GOVT-B'] svg.curve-chart path.series-earlier");
        By chart = By.cssSelector("article[data-curve='GOVT-B'] svg.curve-chart");
        wait.ignoring(StaleElementReferenceException.class)
                .withMessage("the GOVT-B curve should be drawn against 2026-02-16, and say so in its text alternative")
                .until(b -> !b.findElements(earlier).isEmpty() && b.findElement(chart).getAttribute("aria-label").contains("on 2026-02-16"));

        // the link in the notice opens the page on the spread's card, scrolled to and marked
        String link = given().get("/api/alerts/" + id).then().statusCode(200).extract().path("alert.dashboard");
        URI linked = URI.create(link);
        assertThat(linked.getQuery()).isEqualTo("spread=GOVT-B:10Y-3M");
        assertThat(linked.getFragment()).isEqualTo("spread-GOVT-B-10Y-3M");
        browser.manage().window().setSize(new Dimension(1280, 800));
        browser.get(URI.create(page.toString()).resolve("/?" + linked.getRawQuery() + "#" + linked.getRawFragment()).toString());
        By card = By.cssSelector("article[data-spread='GOVT-B:10Y-3M']");
        wait.ignoring(StaleElementReferenceException.class)
                .withMessage("the linked spread's card should be marked and scrolled into view")
                .until(b -> !b.findElements(card).isEmpty() && b.findElement(card).getAttribute("class").contains("wanted")
                        && (Boolean) ((JavascriptExecutor) b).executeScript("const r = arguments[0].getBoundingClientRect();"
                        + " return window.scrollY > 0 && r.top >= -1 && r.top < window.innerHeight / 2;", b.findElement(card)));
        assertThat(browser.findElements(By.cssSelector("article.card.wanted"))).as("only the linked card is marked").hasSize(1);
        assertThat(browser.switchTo().activeElement().getAttribute("data-spread")).as("the linked card has the focus")
                .isEqualTo("GOVT-B:10Y-3M");
        viewport("dashboard-linked.png");
    }

    /** GOVT-A's business days from the spell's start, 2026-06-15, to its last posted date, 2026-09-18. */
    private static final LocalDate SPELL_START = LocalDate.of(2026, 6, 15);
    private static final LocalDate DEEPEST_DATE = LocalDate.of(2026, 7, 15);
    private static final LocalDate SPELL_LAST = LocalDate.of(2026, 9, 18);

    /*
     * A season of inversion: after a week at +40 bp, which ends the spells of test 1, GOVT-A's
     * 10Y-3M goes below zero on 2026-06-15, sinks to -35.2 bp on 2026-07-15 and is back up to
     * -18.0 bp on 2026-09-18. The default policy's days-inverted test (90 days) holds first on
     * 2026-09-14 (91 days since 2026-06-15); the second quarter, whose last fortnight alone is
     * inverted, averages above zero, so the quarter test cannot confirm it first. A quiet period
     * is set on the spread. The card must say all of it and stand apart from a normal card.
     */
    @Test
    @Order(3)
    void aConfirmedInversionStandsOutWithItsDepthDaysTestAndOddsAndAQuietPeriodShowsWhoAndUntilWhen() {
        List<LocalDate> days = businessDays(SPELL_START, SPELL_LAST);
        List<String> snapshots = new ArrayList<>();
        for (LocalDate d : businessDays(LocalDate.of(2026, 5, 18), LocalDate.of(2026, 5, 22))) {
            snapshots.add(govtA(d, 40.0));
        }
        days.forEach(d -> snapshots.add(govtA(d, tenYearThreeMonthBp(days, d))));
        given().contentType(ContentType.JSON).body("[" + String.join(",", snapshots) + "]")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(snapshots.size()));

        // what the posted quotes imply, worked out here from them and from nothing the application computed
        double last = tenYearThreeMonthBp(days, SPELL_LAST);
        long daysInverted = ChronoUnit.DAYS.between(SPELL_START, SPELL_LAST);
        LocalDate confirmed = days.stream().filter(d -> ChronoUnit.DAYS.between(SPELL_START, d) >= 90).findFirst().orElseThrow();
        // the last complete month is August: the card leads with its final value, as the notices do
        double augustAveragePercent = days.stream().filter(d -> d.getMonthValue() == 8)
                .mapToDouble(d -> tenYearThreeMonthBp(days, d) / 100).average().orElseThrow();
        // P = Phi(alpha + beta * s), the probit of alert-rules/default.yaml's 10Y-3M model (alpha -0.5333, beta -0.6330,
        // s the month's average in percentage points), with Phi from Apache Commons Math rather than from slopewatch
        double odds = new NormalDistribution().cumulativeProbability(-0.5333 - 0.6330 * augustAveragePercent);
        assertThat(last).isEqualTo(-18.0);
        assertThat(confirmed).isEqualTo(LocalDate.of(2026, 9, 14));

        Map<?, ?> quiet = given().contentType(ContentType.JSON)
                .body("{\"spread\":\"GOVT-A:10Y-3M\",\"lasts\":\"PT6H\",\"note\":\"desk review of the GOVT-A feed\",\"set_by\":\"risk desk\"}")
                .post("/api/quiet-periods").then().statusCode(201).extract().as(Map.class);
        String until = utcMinutes(String.valueOf(quiet.get("until")));

        browser.manage().window().setSize(new Dimension(1280, 2300));
        browser.get(page.toString());
        WebDriverWait wait = new WebDriverWait(browser, PATIENCE);
        By card = By.cssSelector("article[data-spread='" + SPREAD + "']");
        wait.ignoring(StaleElementReferenceException.class)
                .withMessage("the " + SPREAD + " card should show CONFIRMED and the last posted value " + signed(last))
                .until(b -> !b.findElements(card).isEmpty() && "CONFIRMED".equals(b.findElement(card).getAttribute("data-state"))
                        && b.findElement(card).findElement(By.cssSelector(".value")).getText().startsWith(signed(last)));
        WebElement spread = browser.findElement(card);
        assertThat(spread.findElement(By.cssSelector(".alarm-banner")).getText()).as("a banner names the confirmed inversion")
                .containsIgnoringCase("confirmed inversion").contains("since " + confirmed);
        assertThat(fact(SPREAD, "deepest")).as("the depth: the deepest value of the spell and its date")
                .contains(signed(-35.2) + " bp").contains(DEEPEST_DATE.toString());
        assertThat(fact(SPREAD, "days")).as("days inverted since the spell began").contains(String.valueOf(daysInverted))
                .contains("since " + SPELL_START);
        String reason = given().get("/api/transitions?spread=" + SPREAD + "&from=" + confirmed + "&to=" + confirmed).then()
                .statusCode(200).body("to", equalTo(List.of("CONFIRMED"))).extract().path("reason[0]");
        assertThat(fact(SPREAD, "test")).as("the persistence test that held, with the monitor's reason")
                .contains("days-inverted").contains(reason);
        assertThat(fact(SPREAD, "odds")).as("the recession odds of the modelled spread, Phi(alpha + beta * August average)")
                .contains(Math.round(100 * odds) + " %").contains("P(recession in 2027-08)").contains("complete month")
                .contains("month to date").contains("(provisional)");

        // calm for the rest: GOVT-A 10Y-2Y stayed above zero (its 2Y is well under its 10Y) and is NORMAL
        By normalCard = By.cssSelector("article[data-spread='GOVT-A:10Y-2Y']");
        wait.ignoring(StaleElementReferenceException.class).withMessage("GOVT-A 10Y-2Y should be NORMAL")
                .until(b -> "NORMAL".equals(b.findElement(normalCard).getAttribute("data-state")));
        WebElement normal = browser.findElement(normalCard);
        assertThat(normal.findElements(By.cssSelector(".alarm-banner, .headline"))).as("a normal card has no banner and no headline").isEmpty();
        Map<String, Object> loud = style(spread);
        Map<String, Object> calm = style(normal);
        assertThat(loud.get("background")).as("a confirmed card's background differs from a normal card's").isNotEqualTo(calm.get("background"));
        assertThat(px(loud.get("borderLeft"))).as("a confirmed card's frame is heavier").isGreaterThanOrEqualTo(3 * px(calm.get("borderLeft")));
        assertThat(px(loud.get("valueSize"))).as("a confirmed card's value is larger").isGreaterThan(px(calm.get("valueSize")));
        // WCAG 2.1, success criterion 1.4.3 (contrast, minimum; level AA): at least 4.5:1 for text
        Map<String, Object> banner = style(spread.findElement(By.cssSelector(".alarm-banner")));
        assertThat(contrast(banner.get("color"), banner.get("background"))).as("banner text on the banner").isGreaterThanOrEqualTo(4.5);
        assertThat(contrast(loud.get("valueColor"), loud.get("background"))).as("the value on the confirmed card").isGreaterThanOrEqualTo(4.5);
        assertThat(contrast(loud.get("color"), loud.get("background"))).as("text on the confirmed card").isGreaterThanOrEqualTo(4.5);

        By listed = By.cssSelector("#quiet-list li.quiet-item[data-target='" + SPREAD + "']");
        wait.ignoring(StaleElementReferenceException.class)
                .withMessage("the panel should list the quiet period on " + SPREAD + " with who set it and until when (" + until + ")")
                .until(b -> !b.findElements(listed).isEmpty() && b.findElement(listed).getText().contains("until " + until)
                        && b.findElement(listed).getText().contains("set by risk desk"));
        assertThat(textOf(listed)).contains("GOVT-A 10Y-3M").contains("desk review of the GOVT-A feed");
        assertThat(browser.findElement(card).getAttribute("data-quiet")).as("the card of the quiet spread is marked").isEqualTo("true");
        assertThat(textOf(By.cssSelector("article[data-spread='" + SPREAD + "'] .quiet-note")))
                .containsIgnoringCase("quiet period").contains("until " + until).contains("risk desk");
        assertThat(browser.findElement(normalCard).findElements(By.cssSelector(".quiet-note"))).as("GOVT-A 10Y-2Y is not quiet").isEmpty();
        assertThat(textOf(By.tagName("body")).toLowerCase(Locale.ROOT))
                .as("the page speaks of quiet periods, in the desk's words").doesNotContain("mute");
    }

    /*
     * A week of GOVT-B at +20 bp ends the spell of test 2; then GOVT-B in August and in November,
     * long end highest: the 30Y point sits at the top right of the chart, where a key drawn inside
     * the plot would cover it. Each yield table must show all its columns within its card, at 1280
     * and at 390 px.
     */
    @Test
    @Order(4)
    void curveTablesFitTheirCardsAndTheChartKeyCoversNoPoint() throws IOException {
        given().contentType(ContentType.JSON).body("""
                [{"curve":"GOVT-B","date":"2026-05-25","yields":{"1M":4.30,"3M":4.32,"6M":4.34,"1Y":4.35,"2Y":4.38,"3Y":4.40,"5Y":4.44,"7Y":4.48,"10Y":4.52,"20Y":4.70,"30Y":4.80}},
                 {"curve":"GOVT-B","date":"2026-05-26","yields":{"1M":4.30,"3M":4.32,"6M":4.34,"1Y":4.35,"2Y":4.38,"3Y":4.40,"5Y":4.44,"7Y":4.48,"10Y":4.52,"20Y":4.70,"30Y":4.80}},
                 {"curve":"GOVT-B","date":"2026-05-27","yields":{"1M":4.30,"3M":4.32,"6M":4.34,"1Y":4.35,"2Y":4.38,"3Y":4.40,"5Y":4.44,"7Y":4.48,"10Y":4.52,"20Y":4.70,"30Y":4.80}},
                 {"curve":"GOVT-B","date":"2026-05-28","yields":{"1M":4.30,"3M":4.32,"6M":4.34,"1Y":4.35,"2Y":4.38,"3Y":4.40,"5Y":4.44,"7Y":4.48,"10Y":4.52,"20Y":4.70,"30Y":4.80}},
                 {"curve":"GOVT-B","date":"2026-05-29","yields":{"1M":4.30,"3M":4.32,"6M":4.34,"1Y":4.35,"2Y":4.38,"3Y":4.40,"5Y":4.44,"7Y":4.48,"10Y":4.52,"20Y":4.70,"30Y":4.80}},
                 {"curve":"GOVT-B","date":"2026-08-14","yields":{"1M":4.52,"3M":4.50,"6M":4.46,"1Y":4.40,"2Y":4.31,"3Y":4.30,"5Y":4.36,"7Y":4.45,"10Y":4.58,"20Y":4.80,"30Y":4.98}},
                 {"curve":"GOVT-B","date":"2026-11-16","yields":{"1M":4.40,"3M":4.38,"6M":4.35,"1Y":4.30,"2Y":4.24,"3Y":4.25,"5Y":4.33,"7Y":4.44,"10Y":4.60,"20Y":4.85,"30Y":5.06}}]""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(7));

        browser.manage().window().setSize(new Dimension(1280, 2300));
        browser.get(page.toString());
        WebDriverWait wait = new WebDriverWait(browser, PATIENCE);
        By chart = By.cssSelector("article[data-curve='GOVT-B'] svg.curve-chart");
        wait.ignoring(StaleElementReferenceException.class).withMessage("GOVT-B's curve of 2026-11-16 should be drawn against 2026-08-14")
                .until(b -> !b.findElements(chart).isEmpty() && b.findElement(chart).getAttribute("aria-label").contains("on 2026-08-14"));

        // the bounding boxes, as the browser laid them out, of each curve card's key and of its plotted points
        String keyOverPoints = """
                const out = [];
                for (const card of document.querySelectorAll('article.curve-card')) {
                  const key = card.querySelector('.legend');
                  if (!key) { out.push(card.dataset.curve + ': no key'); continue; }
                  const k = key.getBoundingClientRect();
                  for (const c of card.querySelectorAll('svg.curve-chart circle')) {
                    const r = c.getBoundingClientRect();
                    if (r.left < k.right && k.left < r.right && r.top < k.bottom && k.top < r.bottom) {
                      out.push(card.dataset.curve + ': the key covers the point ' + c.textContent);
                    }
                  }
                }
                return out.join('; ');""";
        String tablesClipped = """
                const out = [];
                for (const card of document.querySelectorAll('article.curve-card')) {
                  const box = card.querySelector('.table-scroll');
                  const last = [...box.querySelectorAll('th')].find(th => th.textContent === '30Y');
                  if (box.scrollWidth > box.clientWidth) out.push(card.dataset.curve + ': table ' + box.scrollWidth + ' px wide in ' + box.clientWidth + ' px');
                  if (!last) out.push(card.dataset.curve + ': no 30Y column');
                  else if (last.getBoundingClientRect().right > box.getBoundingClientRect().right + 0.5) out.push(card.dataset.curve + ': 30Y cut off');
                }
                return out.join('; ');""";
        for (int width : new int[] {1280, 390}) {
            browser.manage().window().setSize(new Dimension(width, 2300));
            // the page redraws a moment after a resize, and every few seconds: wait for a drawing that holds
            wait.ignoring(StaleElementReferenceException.class)
                    .withMessage("at " + width + " px, no curve key may cover a point: " + script(keyOverPoints))
                    .until(b -> script(keyOverPoints).isEmpty());
            wait.ignoring(StaleElementReferenceException.class)
                    .withMessage("at " + width + " px, each yield table must fit its card up to 30Y: " + script(tablesClipped))
                    .until(b -> b.findElements(By.cssSelector("article.curve-card")).size() == 2 && script(tablesClipped).isEmpty());
        }
        assertThat(textOf(By.cssSelector("article[data-curve='GOVT-B'] .legend")))
                .as("the key names both dates").contains("2026-11-16").contains("2026-08-14");

        screenshot("dashboard.png", 1280);
        browser.manage().window().setSize(new Dimension(390, 900));
        wait.withMessage("the page should fit a narrow screen without sideways scrolling").until(b -> (Boolean)
                ((JavascriptExecutor) b).executeScript("return document.documentElement.scrollWidth <= window.innerWidth;"));
        screenshot("dashboard-narrow.png", 390);
    }

    /** Business days (Monday to Friday) from one date to another, both included. */
    private static List<LocalDate> businessDays(LocalDate from, LocalDate to) {
        return from.datesUntil(to.plusDays(1)).filter(d -> d.getDayOfWeek() != DayOfWeek.SATURDAY && d.getDayOfWeek() != DayOfWeek.SUNDAY)
                .toList();
    }

    /** GOVT-A's 10Y-3M on a day of the spell: -5.0 bp on its first day, straight down to -35.2 on 2026-07-15, up to -18.0 on its last. */
    private static double tenYearThreeMonthBp(List<LocalDate> days, LocalDate d) {
        int i = days.indexOf(d);
        int deepest = days.indexOf(DEEPEST_DATE);
        int lastIndex = days.size() - 1;
        double v = i <= deepest ? -5.0 - 30.2 * i / deepest : -35.2 + 17.2 * (i - deepest) / (lastIndex - deepest);
        return Math.round(v * 10) / 10.0;
    }

    /** A GOVT-A snapshot: short end humped, long end highest, its 10Y set so that 10Y-3M is the given value. */
    private static String govtA(LocalDate d, double tenYearThreeMonthBp) {
        String tenYear = String.format(Locale.ROOT, "%.3f", 4.80 + tenYearThreeMonthBp / 100);
        return "{\"curve\":\"GOVT-A\",\"date\":\"" + d + "\",\"yields\":{\"1M\":4.82,\"3M\":4.80,\"6M\":4.74,\"1Y\":4.62,"
                + "\"2Y\":4.30,\"3Y\":4.28,\"5Y\":4.36,\"7Y\":4.47,\"10Y\":" + tenYear + ",\"20Y\":4.78,\"30Y\":5.00}}";
    }

    /** A value in bp as the page writes it: a true minus sign (U+2212) or a plus, one decimal. */
    private static String signed(double v) {
        return (v < 0 ? "\u2212" : "+") + String.format(Locale.ROOT, "%.1f", Math.abs(v));
    }

    /** An instant to the minute, in UTC, as the page writes it. */
    private static String utcMinutes(String instant) {
        return DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'").withZone(ZoneOffset.UTC)
                .format(Instant.parse(instant).truncatedTo(ChronoUnit.MINUTES));
    }

    /** A headline figure of the spread's card, with its label and detail. */
    private static String fact(String spread, String key) {
        By tile = By.cssSelector("article[data-spread='" + spread + "'] .headline [data-fact='" + key + "']");
        assertThat(browser.findElements(tile)).as("the confirmed card's headline figure '%s'", key).hasSize(1);
        return textOf(tile).replace('\n', ' ');
    }

    /** The text of an element the page may redraw at any moment: read again when the one found was just replaced. */
    private static String textOf(By by) {
        for (int attempt = 1; ; attempt++) {
            try {
                return browser.findElement(by).getText();
            } catch (StaleElementReferenceException e) {
                if (attempt == 3) {
                    throw e;
                }
            }
        }
    }

    private static String script(String js) {
        return String.valueOf(((JavascriptExecutor) browser).executeScript(js));
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> style(WebElement e) {
        return (Map<String, Object>) ((JavascriptExecutor) browser).executeScript("""
                const s = getComputedStyle(arguments[0]);
                const v = arguments[0].querySelector('.value');
                return { background: s.backgroundColor, color: s.color, borderLeft: s.borderLeftWidth,
                         valueSize: v ? getComputedStyle(v).fontSize : '0px', valueColor: v ? getComputedStyle(v).color : s.color };""", e);
    }

    private static double px(Object cssLength) {
        return Double.parseDouble(String.valueOf(cssLength).replace("px", ""));
    }

    /** The contrast ratio of two opaque CSS colours, rgb(r, g, b), as WCAG 2.1 defines it (relative luminance, contrast ratio). */
    private static double contrast(Object a, Object b) {
        double la = luminance(String.valueOf(a));
        double lb = luminance(String.valueOf(b));
        return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
    }

    private static double luminance(String rgb) {
        assertThat(rgb).as("an opaque colour").startsWith("rgb(");
        List<Double> c = Stream.of(rgb.substring(4, rgb.length() - 1).split(",")).map(String::strip).map(Double::parseDouble)
                .map(v -> v / 255).map(v -> v <= 0.03928 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4)).toList();
        return 0.2126 * c.get(0) + 0.7152 * c.get(1) + 0.0722 * c.get(2);
    }

    /**
     * The whole page at this width: the window is made as tall as the page first, and the picture
     * taken once the page has redrawn its charts for the width (until then they are stretched).
     */
    /** What the window shows now, as a reader landing there sees it. */
    private static void viewport(String name) throws IOException {
        Path shot = ((TakesScreenshot) browser).getScreenshotAs(OutputType.FILE).toPath();
        Files.copy(shot, Path.of("target", name), StandardCopyOption.REPLACE_EXISTING);
    }

    private static void screenshot(String name, int width) throws IOException {
        browser.manage().window().setSize(new Dimension(width, 900));
        long height = (Long) ((JavascriptExecutor) browser).executeScript("return document.documentElement.scrollHeight;");
        browser.manage().window().setSize(new Dimension(width, (int) Math.min(12000, height + 20)));
        new WebDriverWait(browser, PATIENCE).withMessage("the charts should be redrawn for " + width + " px").until(b -> (Boolean)
                ((JavascriptExecutor) b).executeScript("return [...document.querySelectorAll('figure svg')]"
                        + ".every(s => Math.abs(s.getBoundingClientRect().width - s.width.baseVal.value) < 2);"));
        Path shot = ((TakesScreenshot) browser).getScreenshotAs(OutputType.FILE).toPath();
        Files.copy(shot, Path.of("target", name), StandardCopyOption.REPLACE_EXISTING);
    }
}
