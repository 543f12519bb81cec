package steelyard.gui;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Reader;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import com.fasterxml.jackson.databind.JsonNode;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import steelyard.cli.Main;

/**
 * The real window on the demo data, in a child JVM on an X display ({@link XvfbDisplay}; Swing reads the
 * display from the environment when the toolkit starts, so the window needs a process of its own). The
 * expected values come from the command line ({@code steelyard rescore --json --out}) on the same files and
 * weights: the corpus error label and the chosen hypothesis must match it before and after the λ slider
 * moves, and a broken file must give the same message in the window's dialog as on the command line.
 */
@ExtendWith(XvfbDisplay.class)
class WindowTest {
  /** The λ the slider is moved to (away from the demo weights file's N-best λ, {@link #demoLambda}). */
  static final double LAMBDA = 4;
  static final Path ROOT = Path.of("").toAbsolutePath();
  static final Path SHOTS = ROOT.resolve("target/screenshots");
  @TempDir static Path dir;
  static Path bad;
  static String badMessage;

  @BeforeAll
  static void brokenFile() throws IOException {
    List<String> lines = Files.readAllLines(ROOT.resolve("sample-hypotheses/voice-dev.nbest.csv"), StandardCharsets.UTF_8);
    List<String> out = new ArrayList<>(lines.subList(0, 30));
    String[] f = out.get(13).split(",", -1);
    f[1] = "x";
    out.set(13, String.join(",", f));
    bad = dir.resolve("voice-broken.nbest.csv");
    Files.write(bad, out, StandardCharsets.UTF_8);
    badMessage = cliError("rescore", "--hyps", bad.toString(), "--features", "acoustic,lm", "--out", dir.resolve("x.csv").toString(),
        "--json", dir.resolve("x.json").toString());
  }

  @Test
  void theWindowShowsWhatTheCommandLineComputes(XvfbDisplay.Display display) throws Exception {
    double start = demoLambda();
    Map<String, String> atStart = picks(start);
    Map<String, String> atLambda = picks(LAMBDA);
    String utt = atStart.keySet().stream().filter(u -> !atStart.get(u).equals(atLambda.get(u))).findFirst().orElseThrow();
    Properties r = scenario(display, utt);

    System.out.println("window scenario: " + r);
    assertThat(r.getProperty("failure")).as(() -> read(log())).isNull();
    assertThat(r.getProperty("edt.selfCheck")).as("the EDT check records an off-EDT setText").isNotEqualTo("0");
    assertThat(r.getProperty("edt.violations")).as(r.getProperty("edt.first")).isEqualTo("0");
    assertThat(r.getProperty("after.lambda")).isEqualTo(Double.toString(LAMBDA));

    JsonNode before = summary(run(start, "nbest", 1));
    JsonNode after = summary(run(LAMBDA, "nbest", 1));
    assertThat(r.getProperty("before.error")).isEqualTo("WER " + percent(before.get("error_rate").asDouble()));
    assertThat(r.getProperty("after.error")).isEqualTo("WER " + percent(after.get("error_rate").asDouble()));
    assertThat(r.getProperty("after.error")).isNotEqualTo(r.getProperty("before.error"));
    assertThat(r.getProperty("before.counts")).startsWith("changed " + before.get("changed").asInt() + " ");
    assertThat(r.getProperty("after.counts")).startsWith("changed " + after.get("changed").asInt() + " ");

    assertThat(r.getProperty("before.pick.rank") + "," + r.getProperty("before.pick.text")).isEqualTo(atStart.get(utt));
    assertThat(r.getProperty("after.pick.rank") + "," + r.getProperty("after.pick.text")).isEqualTo(atLambda.get(utt));
    assertThat(r.getProperty("after.pick.label")).isEqualTo("Pick: " + r.getProperty("after.pick.text"));

    JsonNode consensus = summary(run(LAMBDA, "consensus", WindowScenario.CONSENSUS_ALPHA));
    assertThat(r.getProperty("consensus.error")).isEqualTo("WER " + percent(consensus.get("error_rate").asDouble()));
    assertThat(r.getProperty("consensus.counts")).startsWith("changed " + consensus.get("changed").asInt() + " ");

    Path tuned = Path.of(r.getProperty("tuned.weights"));
    JsonNode afterTuning = summary(run(tuned));
    assertThat(r.getProperty("tuned.error")).isEqualTo("WER " + percent(afterTuning.get("error_rate").asDouble()));
    assertThat(afterTuning.get("error_rate").asDouble()).as("tuning never makes the dev error worse")
        .isLessThanOrEqualTo(after.get("error_rate").asDouble());

    assertThat(r.getProperty("tuned.counts")).startsWith(r.getProperty("audit.counts"));
    assertThat(r.getProperty("audit.opened")).isEqualTo(r.getProperty("audit.first"));
    String page = Files.readString(Path.of(r.getProperty("report.file")));
    assertThat(page).contains("<svg").contains("An automatic pick is not a verified transcript").contains(r.getProperty("audit.first"));

    assertThat(r.getProperty("import.problems")).isEqualTo(badMessage);
    assertThat(r.getProperty("error.message")).isEqualTo(badMessage);
    assertThat(r.getProperty("error.keptData")).isEqualTo("true");
    assertThat(r.getProperty("menus.withoutMnemonic")).isEmpty();
    assertThat(r.getProperty("prefs.recent")).endsWith("voice-dev.nbest.csv");
    assertThat(r.getProperty("prefs.hasBounds")).isEqualTo("true");
    for (String view : List.of("utterance", "network", "charts", "tune", "audit", "import", "error")) {
      Path png = SHOTS.resolve(view + ".png");
      assertThat(pngWidth(png)).as(view).isGreaterThan(300);
    }
    System.out.printf(Locale.ROOT, "window: first paint %s ms, demo shown %s ms after the JVM started%n",
        r.getProperty("ms.firstPaint"), r.getProperty("ms.demoShown"));
  }

  private static Properties scenario(XvfbDisplay.Display display, String utt) throws Exception {
    Path results = dir.resolve("window.properties");
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    String prefs = "steelyard-test/" + UUID.randomUUID();
    ProcessBuilder pb = new ProcessBuilder(java, "-Xmx1g", "-Djava.awt.headless=false", "-ea", "-cp", System.getProperty("java.class.path"),
        WindowScenario.class.getName(), ROOT.toString(), utt, Double.toString(LAMBDA), SHOTS.toString(), results.toString(),
        bad.toString(), prefs);
    pb.environment().put("DISPLAY", display.name());
    pb.redirectErrorStream(true).redirectOutput(log().toFile());
    Process p = pb.start();
    if (!p.waitFor(150, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      throw new AssertionError("the window scenario did not finish in 150 s; see " + log());
    }
    assertThat(Files.exists(results)).as("results written; log: " + Files.readString(log())).isTrue();
    Properties r = new Properties();
    try (Reader in = Files.newBufferedReader(results)) {
      r.load(in);
    }
    assertThat(p.exitValue()).as(Files.readString(log())).isZero();
    return r;
  }

  /**
   * The width in the PNG header (bytes 16–19 of the IHDR chunk, PNG specification §11.2.2). Read by hand:
   * decoding the image would start AWT in this JVM, which other tests share and need headless.
   */
  private static int pngWidth(Path png) throws IOException {
    byte[] b = Files.readAllBytes(png);
    assertThat(b.length).isGreaterThan(24);
    assertThat(new String(b, 1, 3, StandardCharsets.US_ASCII)).isEqualTo("PNG");
    return ((b[16] & 0xff) << 24) | ((b[17] & 0xff) << 16) | ((b[18] & 0xff) << 8) | (b[19] & 0xff);
  }

  private static String read(Path p) {
    try {
      return Files.readString(p);
    } catch (IOException e) {
      return "(no log: " + e + ")";
    }
  }

  private static Path log() {
    return ROOT.resolve("target/window-scenario.log");
  }

  private static final Map<String, Path> RUNS = new LinkedHashMap<>();

  /** utt_id → "rank,text" of the command line's picks at λ. */
  private static Map<String, String> picks(double lambda) throws IOException {
    Path run = run(lambda, "nbest", 1);
    Map<String, String> m = new LinkedHashMap<>();
    try (Reader in = Files.newBufferedReader(run.resolve("picks.csv")); var csv = new com.opencsv.CSVReader(in)) {
      String[] header = csv.readNext();
      List<String> h = List.of(header);
      for (String[] row; (row = csv.readNext()) != null; ) {
        m.put(row[h.indexOf("utt_id")], row[h.indexOf("rank")] + "," + row[h.indexOf("text")]);
      }
    } catch (com.opencsv.exceptions.CsvValidationException e) {
      throw new IOException(e);
    }
    return m;
  }

  private static JsonNode summary(Path run) throws IOException {
    return new com.fasterxml.jackson.databind.ObjectMapper().readTree(run.resolve("summary.json").toFile());
  }

  /** The N-best λ of the demo weights file, the λ the window opens the demo with. */
  private static double demoLambda() throws IOException {
    JsonNode file = new com.fasterxml.jackson.databind.ObjectMapper().readTree(ROOT.resolve("models/voice-demo.weights.json").toFile());
    return file.get("methods").get("nbest").get("lm_weight").asDouble();
  }

  /** The command line's N-best rescore of the demo dev set with a weights file alone. */
  private static Path run(Path weights) throws IOException {
    Path out = Files.createDirectories(dir.resolve("rescore-tuned"));
    Path data = ROOT.resolve("sample-hypotheses");
    int code = Main.run("rescore", "--hyps", data.resolve("voice-dev.nbest.csv").toString(), "--refs", data.resolve("voice-dev.refs.csv").toString(),
        "--rules", data.resolve("voice.rules").toString(), "--lm", ROOT.resolve("models/voice-3gram.arpa.gz").toString(),
        "--weights", weights.toString(), "--out", out.resolve("picks.csv").toString(), "--json", out.resolve("summary.json").toString());
    assertThat(code).isZero();
    return out;
  }

  /** The command line's rescore of the demo dev set at λ with {@code method} and α; cached per arguments. */
  private static Path run(double lambda, String method, double alpha) throws IOException {
    String key = lambda + "-" + method + "-" + alpha;
    Path out = RUNS.get(key);
    if (out != null) return out;
    out = Files.createDirectories(dir.resolve("rescore-" + key));
    Path data = ROOT.resolve("sample-hypotheses");
    Path models = ROOT.resolve("models");
    int code = Main.run("rescore", "--hyps", data.resolve("voice-dev.nbest.csv").toString(), "--refs", data.resolve("voice-dev.refs.csv").toString(),
        "--rules", data.resolve("voice.rules").toString(), "--lm", models.resolve("voice-3gram.arpa.gz").toString(),
        "--weights", models.resolve("voice-demo.weights.json").toString(), "--features", "acoustic,lm", "--lm-weight", Double.toString(lambda),
        "--method", method, "--posterior-sharpness", Double.toString(alpha),
        "--out", out.resolve("picks.csv").toString(), "--json", out.resolve("summary.json").toString());
    assertThat(code).isZero();
    RUNS.put(key, out);
    return out;
  }

  /** The command line's message for a failing command, without its "steelyard: " prefix. */
  private static String cliError(String... args) {
    CommandLine cl = Main.commandLine();
    StringWriter err = new StringWriter();
    cl.setErr(new PrintWriter(err, true));
    assertThat(cl.execute(args)).isEqualTo(Main.BAD_INPUT);
    String first = err.toString().lines().findFirst().orElseThrow();
    assertThat(first).startsWith("steelyard: ");
    return first.substring("steelyard: ".length());
  }

  private static String percent(double rate) {
    return String.format(Locale.ROOT, "%.2f %%", 100 * rate);
  }
}
