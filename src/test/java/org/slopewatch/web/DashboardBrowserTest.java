package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.hamcrest.Matchers.equalTo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.common.http.TestHTTPResource;
import io.quarkus.test.junit.QuarkusTest;
import io.restassured.http.ContentType;
import java.io.File;
import java.io.IOException;
import java.net.URL;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
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
 * page, polling the read API by itself, shows the inversion they cause. Screenshots are left in
 * {@code target/} for a person to look at.
 */
@QuarkusTest
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
    void anInversionPostedOverHttpAppearsOnThePageWithItsStateValueChartAndReason() throws IOException {
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
        assertThat(p.get("value").asDouble()).isCloseTo(value, within(1e-12));
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
        screenshot("dashboard.png");

        browser.manage().window().setSize(new Dimension(390, 900));
        wait.withMessage("the page should fit a narrow screen without sideways scrolling").until(b -> (Boolean)
                ((JavascriptExecutor) b).executeScript("return document.documentElement.scrollWidth <= window.innerWidth;"));
        screenshot("dashboard-narrow.png");
    }

    /*
     * The default policy's first-inversion rule (alert-rules/default.yaml) fires when GOVT-B's 10Y-3M
     * goes below zero; the page lists it as an open alert, and acknowledging it there is journalled
     * and shown. The curve card compares the latest curve with the one three months before.
     */
    @Test
    void anOpenAlertIsAcknowledgedFromThePageAndTheCurveIsComparedWithThreeMonthsBefore() {
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
        assertThat(alert.getText()).contains("GOVT-B 10Y-3M").contains("since 2026-05-18");
        WebElement name = alert.findElement(By.cssSelector("input[name='by']"));
        assertThat(browser.findElement(By.cssSelector("label[for='" + name.getAttribute("id") + "']")).getText()).isEqualTo("Your name");
        name.sendKeys("desk lead");
        alert.findElement(By.cssSelector("button[type='submit']")).click();
        wait.withMessage("the page should show the alert acknowledged")
                .until(b -> b.findElement(item).getText().contains("Acknowledged"));
        given().get("/api/alerts/" + id).then().statusCode(200).body("alert.acks[0].by", equalTo("desk lead"));

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
    }

    private static void screenshot(String name) throws IOException {
        Path shot = ((TakesScreenshot) browser).getScreenshotAs(OutputType.FILE).toPath();
        Files.copy(shot, Path.of("target", name), StandardCopyOption.REPLACE_EXISTING);
    }
}
