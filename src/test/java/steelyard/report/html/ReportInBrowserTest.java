package steelyard.report.html;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.logging.Level;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import steelyard.report.HeadlessAwt;

/**
 * Opens reports in a real headless Chromium (Debian's {@code chromium} and {@code chromedriver}, found at fixed
 * paths so that nothing is downloaded): no console error, no transcript script runs, the page shows what it
 * should, and a screenshot is saved to {@code target/screenshots/report.png} for a person to look at.
 */
class ReportInBrowserTest {
  static {
    HeadlessAwt.whenNoDisplay();
  }

  static final Path CHROMIUM = Path.of("/usr/bin/chromium");
  static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");
  static final Path SCREENSHOTS = Path.of("target", "screenshots");
  private static final int WIDTH = 1300;
  private static final int MAX_HEIGHT = 9000;

  @TempDir
  static Path dir;
  static ChromeDriver driver;

  @BeforeAll
  static void startBrowser() throws Exception {
    assumeTrue(Files.isExecutable(CHROMIUM) && Files.isExecutable(CHROMEDRIVER),
        "skipped: needs Debian's chromium at " + CHROMIUM + " and chromium-driver at " + CHROMEDRIVER
            + " (apt-get install chromium chromium-driver); .ci/run installs them");
    System.setProperty(ChromeDriverService.CHROME_DRIVER_EXE_PROPERTY, CHROMEDRIVER.toString());
    ChromeOptions options = new ChromeOptions();
    options.setBinary(CHROMIUM.toFile());
    options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--no-first-run",
        "--disable-background-networking", "--disable-component-update", "--disable-sync",
        "--user-data-dir=" + Files.createDirectories(dir.resolve("profile")), "--window-size=" + WIDTH + ",900");
    LoggingPreferences logs = new LoggingPreferences();
    logs.enable(LogType.BROWSER, Level.ALL);
    options.setCapability("goog:loggingPrefs", logs);
    ChromeDriverService service = new ChromeDriverService.Builder().usingDriverExecutable(CHROMEDRIVER.toFile())
        .usingAnyFreePort().build();
    driver = new ChromeDriver(service, options);
    driver.manage().timeouts().pageLoadTimeout(Duration.ofSeconds(60));
  }

  @AfterAll
  static void stopBrowser() {
    if (driver != null) driver.quit();
  }

  @Test
  void hostileTranscriptsAreShownAsTextAndNoScriptRuns() throws Exception {
    open(SampleReports.hostile(), "hostile.html");
    assertThat(severe(readLog())).isEmpty();
    assertThat(driver.getTitle()).isEqualTo("Report " + SampleReports.SCRIPT);
    assertThat(((JavascriptExecutor) driver).executeScript("return typeof window.steelyardPwned")).isEqualTo("undefined");
    assertThat(driver.findElements(By.tagName("script"))).isEmpty();
    assertThat(driver.findElements(By.tagName("img"))).isEmpty();
    assertThat(driver.findElement(By.cssSelector(".utt")).getText()).isEqualTo(SampleReports.SCRIPT);
    assertThat(driver.findElement(By.cssSelector(".group")).getText()).isEqualTo(SampleReports.IMG);
    assertThat(driver.findElement(By.tagName("h2")).getText()).isEqualTo(SampleReports.SCRIPT + " " + SampleReports.AMP_QUOTES);
  }

  @Test
  void reportRendersWithoutConsoleErrorsAndIsSavedAsAScreenshot() throws Exception {
    open(SampleReports.small(), "report.html");
    List<LogEntry> log = readLog();
    assertThat(severe(log)).isEmpty();
    assertThat(driver.findElement(By.id("review-notice")).getText()).contains(ReportModel.REVIEW_NOTICE);
    assertThat(driver.findElements(By.cssSelector("figure svg"))).hasSize(4);
    assertThat(driver.findElements(By.cssSelector("table.overrules tbody tr"))).hasSize(5);
    assertThat(driver.findElement(By.cssSelector("figure svg")).getSize().getWidth()).isGreaterThan(300);
    saveFullPage(SCREENSHOTS.resolve("report.png"));
  }

  /** The log reader is not blind: a page that writes a console error is caught. */
  @Test
  void consoleErrorsOfAPageAreSeen() throws Exception {
    Path page = dir.resolve("probe.html");
    Files.writeString(page, "<!DOCTYPE html><title>probe</title><script>console.error('steelyard probe error')</script>");
    driver.get(page.toUri().toString());
    assertThat(severe(readLog())).anySatisfy(e -> assertThat(e.getMessage()).contains("steelyard probe error"));
  }

  private static void open(ReportModel model, String name) {
    Path file = dir.resolve(name);
    HtmlReport.write(model, file);
    readLog(); // drop entries of earlier pages
    driver.get(file.toUri().toString());
  }

  private static List<LogEntry> readLog() {
    return driver.manage().logs().get(LogType.BROWSER).getAll();
  }

  private static List<LogEntry> severe(List<LogEntry> log) {
    return log.stream().filter(e -> e.getLevel().intValue() >= Level.SEVERE.intValue()).toList();
  }

  private static void saveFullPage(Path target) throws Exception {
    Number height = (Number) ((JavascriptExecutor) driver).executeScript(
        "return Math.ceil(document.documentElement.scrollHeight)");
    driver.manage().window().setSize(new Dimension(WIDTH, Math.min(MAX_HEIGHT, height.intValue() + 140)));
    byte[] png = driver.getScreenshotAs(OutputType.BYTES);
    Files.createDirectories(target.getParent());
    Files.write(target, png);
    assertThat(png.length).isGreaterThan(10_000);
  }
}
