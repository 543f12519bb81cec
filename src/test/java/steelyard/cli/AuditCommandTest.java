package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.audit.AuditReport;

/** The audit command end to end, run in-process through {@link Main#run} with captured streams. */
class AuditCommandTest {
  static {
    steelyard.report.HeadlessAwt.whenNoDisplay();
  }

  @TempDir Path dir;
  private Path hyps;
  private Path refs;

  @BeforeEach
  void files() throws IOException {
    hyps = dir.resolve("hyps.csv");
    refs = dir.resolve("refs.csv");
    RescoreFixtures.writeRandomSet(hyps, refs, 20261202L, 300);
  }

  /** The random set with a confidence weight strong enough to overrule rank 1 often. */
  private String[] args(String... more) {
    List<String> a = new ArrayList<>(List.of("audit", "--hyps", hyps.toString(), "--refs", refs.toString(), "--features",
        "acoustic,conf:linear", "--weight", "conf=20", "--length-weight", "-0.3"));
    a.addAll(Arrays.asList(more));
    return a.toArray(new String[0]);
  }

  private static ScoreCommandTest.Result run(String... args) {
    return ScoreCommandTest.run(args);
  }

  private static JsonNode json(Path p) throws IOException {
    return new ObjectMapper().readTree(p.toFile());
  }

  @Test
  void jsonHasTheIssuesKeysAndCountsThatAddUp() throws IOException {
    Path js = dir.resolve("audit.json");
    ScoreCommandTest.Result r = run(args("--out", js.toString()));
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode j = json(js);
    for (String key : List.of("overrules", "helped", "hurt", "neutral", "unverified", "net_error_change", "per_overrule"))
      assertThat(j.has(key)).as(key).isTrue();
    long overrules = j.get("overrules").asLong();
    assertThat(overrules).isPositive();
    assertThat(j.get("per_overrule").size()).isEqualTo((int) overrules);
    assertThat(j.get("helped").asLong() + j.get("hurt").asLong() + j.get("neutral").asLong() + j.get("unverified").asLong())
        .isEqualTo(overrules);
    // one utterance in 17 has no reference: some overrules cannot be verified
    assertThat(j.get("unverified").asLong()).isPositive();
  }

  @Test
  void stderrNamesTheCountsTheErrorMeasureAndTheReviewNotice() {
    ScoreCommandTest.Result r = run(args("--out", dir.resolve("a.json").toString()));
    assertThat(r.code()).as(r.err()).isZero();
    assertThat(r.err()).contains("overrules:").contains(" helped, ").contains(" hurt, ").contains(" neutral, ").contains(" unverified")
        .contains("net error change").contains("WER ").contains(AuditReport.NOTICE);
    assertThat(r.out()).isEmpty();
  }

  /** Identity: Σ over overrules of errors(rank 1) − errors(pick) = corpus errors of rank 1 − corpus errors of the picks. */
  @Test
  void netErrorChangeEqualsRankOneErrorsMinusChosenErrorsOfRescore() throws IOException {
    Path audit = dir.resolve("a.json");
    Path summary = dir.resolve("s.json");
    assertThat(run(args("--out", audit.toString())).code()).isZero();
    ScoreCommandTest.Result r = run("rescore", "--hyps", hyps.toString(), "--refs", refs.toString(), "--features",
        "acoustic,conf:linear", "--weight", "conf=20", "--length-weight", "-0.3", "--out", dir.resolve("p.csv").toString(),
        "--json", summary.toString());
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode s = json(summary);
    long n = s.get("reference_tokens").asLong();
    long chosen = s.get("substitutions").asLong() + s.get("deletions").asLong() + s.get("insertions").asLong();
    long first = Math.round(s.get("first_error_rate").asDouble() * n);
    assertThat(json(audit).get("net_error_change").asLong()).isEqualTo(first - chosen).isNotZero();
  }

  @ParameterizedTest(name = "[{index}] --threads {0}")
  @ValueSource(strings = {"2", "8"})
  void outputsAreByteIdenticalAcrossRerunsAndThreadCounts(String threads) throws IOException {
    List<byte[]> first = outputs("one", "1");
    List<byte[]> again = outputs("again", "1");
    List<byte[]> other = outputs("many", threads);
    for (int k = 0; k < first.size(); k++) {
      assertThat(again.get(k)).isEqualTo(first.get(k));
      assertThat(other.get(k)).isEqualTo(first.get(k));
    }
  }

  private List<byte[]> outputs(String name, String threads) throws IOException {
    Path d = Files.createDirectories(dir.resolve(name));
    ScoreCommandTest.Result r = run(args("--threads", threads, "--out", d.resolve("a.json").toString(), "--out",
        d.resolve("a.csv").toString(), "--out", d.resolve("a.html").toString()));
    assertThat(r.code()).as(r.err()).isZero();
    return List.of(Files.readAllBytes(d.resolve("a.json")), Files.readAllBytes(d.resolve("a.csv")), Files.readAllBytes(d.resolve("a.html")));
  }

  @Nested
  class AllOrNone {
    @Test
    void aMissingOutputDirectoryLeavesNoOutputFile() throws IOException {
      Path good = dir.resolve("a.json");
      Path bad = dir.resolve("no-such-dir").resolve("a.html");
      ScoreCommandTest.Result r = run(args("--out", good.toString(), "--out", bad.toString()));
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("does not exist").doesNotContain("Exception");
      assertThat(good).doesNotExist();
      assertThat(bad).doesNotExist();
      try (Stream<Path> left = Files.list(dir)) {
        assertThat(left.map(p -> p.getFileName().toString())).containsExactlyInAnyOrder("hyps.csv", "refs.csv");
      }
    }

    @Test
    void aNameWithoutAKnownExtensionIsRefusedBeforeAnythingIsWritten() {
      Path good = dir.resolve("a.csv");
      ScoreCommandTest.Result r = run(args("--out", good.toString(), "--out", dir.resolve("a.txt").toString()));
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("a.txt").contains(".json, .csv or .html");
      assertThat(good).doesNotExist();
    }

    @Test
    void anOutputThatIsAnInputIsRefused() throws IOException {
      byte[] before = Files.readAllBytes(refs);
      Path sameAsRefs = dir.resolve("refs.csv");
      ScoreCommandTest.Result r = run(args("--out", sameAsRefs.toString()));
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(Files.readAllBytes(refs)).isEqualTo(before);
    }
  }

  @Test
  void dashWritesTheJsonToStdout() throws IOException {
    ScoreCommandTest.Result r = run(args("--out", "-"));
    assertThat(r.code()).as(r.err()).isZero();
    assertThat(new ObjectMapper().readTree(r.out()).has("per_overrule")).isTrue();
  }

  @Test
  void noOutputIsAUsageError() {
    ScoreCommandTest.Result r = run("audit", "--hyps", hyps.toString(), "--refs", refs.toString(), "--features", "acoustic");
    assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("--out");
  }

  /** Hostile transcripts: an overrule between texts that look like formulas or markup. */
  @Nested
  class HostileText {
    private Path hostileHyps;
    private Path hostileRefs;

    @BeforeEach
    void hostileFiles() throws IOException {
      hostileHyps = dir.resolve("hostile.csv");
      hostileRefs = dir.resolve("hostile-refs.csv");
      Files.writeString(hostileHyps, """
          utt_id,rank,text,acoustic,bonus
          u1,1,=SUM(A1) crates,-10,0
          u1,2,<script>alert(1)</script> crates,-11,5
          u2,1,+ten pears,-10,0
          u2,2,-ten pears,-11,5
          u3,1,@bay four,-10,0
          u3,2,bay four,-11,5
          """);
      Files.writeString(hostileRefs, """
          utt_id,text
          u1,<script>alert(1)</script> crates
          u2,ten pears
          u3,bay four
          """);
    }

    private ScoreCommandTest.Result audit(String... outs) {
      List<String> a = new ArrayList<>(List.of("audit", "--hyps", hostileHyps.toString(), "--refs", hostileRefs.toString(),
          "--features", "acoustic,bonus"));
      a.addAll(Arrays.asList(outs));
      return run(a.toArray(new String[0]));
    }

    @Test
    void csvNeutralisesFormulaCellsAndKeepsThemWhenSwitchedOff() throws IOException {
      Path safe = dir.resolve("safe.csv");
      Path raw = dir.resolve("raw.csv");
      assertThat(audit("--out", safe.toString()).code()).isZero();
      assertThat(audit("--out", raw.toString(), "--spreadsheet-safe", "false").code()).isZero();
      List<String> safeCells = textCells(safe);
      assertThat(safeCells).contains("'=SUM(A1) crates", "'+ten pears", "'-ten pears", "'@bay four");
      assertThat(safeCells).noneMatch(c -> c.startsWith("=") || c.startsWith("+") || c.startsWith("@"));
      assertThat(textCells(raw)).contains("=SUM(A1) crates", "+ten pears", "-ten pears", "@bay four");
    }

    private List<String> textCells(Path csv) throws IOException {
      List<String[]> rows = RescoreFixtures.readCsv(csv);
      List<String> header = List.of(rows.get(0));
      assertThat(rows).hasSize(4);
      List<String> out = new ArrayList<>();
      for (String[] row : rows.subList(1, rows.size())) {
        out.add(row[header.indexOf("rank1_text")]);
        out.add(row[header.indexOf("pick_text")]);
      }
      return out;
    }

    @Test
    void htmlEscapesAScriptInATranscriptAndJsonKeepsItRaw() throws IOException {
      Path html = dir.resolve("r.html");
      Path js = dir.resolve("r.json");
      ScoreCommandTest.Result r = audit("--out", html.toString(), "--out", js.toString());
      assertThat(r.code()).as(r.err()).isZero();
      String page = Files.readString(html);
      assertThat(page).doesNotContain("<script>alert(1)</script>").contains("&lt;script&gt;");
      assertThat(page.toLowerCase(java.util.Locale.ROOT)).doesNotContain("<script");
      assertThat(json(js).get("per_overrule").toString()).contains("<script>alert(1)</script> crates");
    }
  }
}
