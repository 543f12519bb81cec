package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static steelyard.cli.ScoreCommandTest.json;
import static steelyard.cli.ScoreCommandTest.run;
import static steelyard.cli.ScoreCommandTest.write;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.history.InputFile;
import steelyard.history.RunHistory;
import steelyard.history.RunRecord;
import steelyard.rescore.WeightsFile;
import steelyard.text.Unit;
import steelyard.report.ReportText;

/** The runs commands on histories that score and compare recorded, checked against compare on the original files. */
class RunsCommandTest {
  private static final String[] WORDS = {"pallet", "nine", "to", "bay", "four", "crates", "of", "pears", "cold", "store",
    "dock", "three", "kiwifruit", "for", "grower", "hollis", "truck", "twelve"};

  @TempDir Path dir;

  /**
   * Seeded invented voice logs: {@code n} references and two systems' rank-1 transcripts, A with about two edits per
   * utterance, B with about one; A lacks utterance 7, B lacks utterances 11 and 12.
   */
  private Path[] data(long seed, int n) throws IOException {
    SplittableRandom rnd = new SplittableRandom(seed);
    StringBuilder refs = new StringBuilder("utt_id,text\n");
    StringBuilder a = new StringBuilder("utt_id,text\n");
    StringBuilder b = new StringBuilder("utt_id,text\n");
    for (int u = 0; u < n; u++) {
      String id = String.format(Locale.ROOT, "tpc-v-%04d", u);
      List<String> ref = new ArrayList<>();
      for (int k = 0, len = 3 + rnd.nextInt(8); k < len; k++) ref.add(WORDS[rnd.nextInt(WORDS.length)]);
      refs.append(id).append(',').append(String.join(" ", ref)).append('\n');
      if (u != 7) a.append(id).append(',').append(garble(ref, rnd, 2)).append('\n');
      if (u != 11 && u != 12) b.append(id).append(',').append(garble(ref, rnd, 1)).append('\n');
    }
    return new Path[] {write(dir, "refs.csv", refs.toString()), write(dir, "a.csv", a.toString()), write(dir, "b.csv", b.toString())};
  }

  private static String garble(List<String> ref, SplittableRandom rnd, int meanEdits) {
    List<String> t = new ArrayList<>(ref);
    for (int e = rnd.nextInt(2 * meanEdits + 1); e > 0 && !t.isEmpty(); e--) {
      int pos = rnd.nextInt(t.size());
      switch (rnd.nextInt(3)) {
        case 0: t.set(pos, WORDS[rnd.nextInt(WORDS.length)]); break;
        case 1: t.remove(pos); break;
        default: t.add(pos, WORDS[rnd.nextInt(WORDS.length)]);
      }
    }
    return String.join(" ", t);
  }

  private static ScoreCommandTest.Result ok(String... args) {
    ScoreCommandTest.Result r = run(args);
    assertThat(r.code()).as(String.join(" ", args) + "\n" + r.err()).isZero();
    return r;
  }

  @Nested
  class Comparing {
    @ParameterizedTest(name = "[{index}] --missing-hyp {0}")
    @ValueSource(strings = {"all-deletions", "exclude"})
    void runsCompareOfTwoScoreRunsGivesTheJsonCompareGivesOnTheFiles(String missing) throws IOException {
      Path[] f = data(11, 150);
      String h = dir.resolve("runs.db").toString();
      ok("score", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--missing-hyp", missing, "--history", h, "--json", dir.resolve("sa.json").toString());
      ok("score", "--refs", f[0].toString(), "--hyps", f[2].toString(), "--missing-hyp", missing, "--history", h, "--json", dir.resolve("sb.json").toString());
      Path files = dir.resolve("files.json");
      Path stored = dir.resolve("stored.json");
      ok("compare", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--hyps", f[2].toString(), "--missing-hyp", missing,
          "--names", "run 1,run 2", "--seed", "77", "--json", files.toString());
      ok("runs", "compare", "1", "2", "--history", h, "--seed", "77", "--json", stored.toString());
      // Same intervals, p-values, counts and keys, byte for byte.
      assertThat(Files.readString(stored)).isEqualTo(Files.readString(files));
      assertThat(json(stored).get("sign_test_p").asDouble()).isBetween(0.0, 1.0);
    }

    @Test
    void runsCompareOfTheTwoRunsCompareRecordedRepeatsItsReport() throws IOException {
      Path[] f = data(12, 120);
      String h = dir.resolve("runs.db").toString();
      ScoreCommandTest.Result files = ok("compare", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--hyps", f[2].toString(),
          "--names", "baseline,tuned", "--history", h);
      ScoreCommandTest.Result stored = ok("runs", "compare", "1", "2", "--history", h);
      assertThat(stored.out()).isEqualTo(files.out()).contains("tuned minus baseline").contains(ReportText.REVIEW_NOTE);
      assertThat(ok("runs", "list", "--history", h).out()).contains("baseline").contains("tuned");
    }

    @Test
    void runsOnDifferentReferencesExitTwoNamingBothDataHashes() throws IOException {
      Path[] f = data(13, 30);
      Path otherRefs = write(dir, "other-refs.csv", Files.readString(f[0]).replace("tpc-v-0001,", "tpc-v-0001,pallet "));
      String h = dir.resolve("runs.db").toString();
      ok("score", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--history", h);
      ok("score", "--refs", otherRefs.toString(), "--hyps", f[1].toString(), "--history", h);
      ScoreCommandTest.Result r = run("runs", "compare", "1", "2", "--history", h);
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).startsWith("steelyard: " + h + ": runs 1 and 2 were scored on different reference data")
          .contains(sha256(f[0])).contains(sha256(otherRefs));
    }
  }

  private static String sha256(Path p) throws IOException {
    try {
      return java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(p)));
    } catch (java.security.NoSuchAlgorithmException e) {
      throw new AssertionError(e);
    }
  }

  @Nested
  class ListingShowingExporting {
    @Test
    void listShowsOneLinePerRunAndFilters() throws IOException {
      Path[] f = data(14, 40);
      String h = dir.resolve("runs.db").toString();
      ok("score", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--history", h);
      ok("score", "--refs", f[0].toString(), "--hyps", f[2].toString(), "--pick", "oracle", "--history", h);
      String all = ok("runs", "list", "--history", h).out();
      assertThat(all.lines().filter(l -> l.matches("\\s+\\d+\\s.*"))).hasSize(2);
      assertThat(all).contains(sha256(f[0]).substring(0, 12)).contains("2 runs");
      String oracle = ok("runs", "list", "--history", h, "--filter", "method=oracle").out();
      assertThat(oracle).contains("1 run\n").contains("oracle");
      assertThat(ok("runs", "list", "--history", h, "--filter", "text=b.csv").out()).contains("1 run\n");
      assertThat(run("runs", "list", "--history", h, "--filter", "colour=red").code()).isEqualTo(Main.BAD_INPUT);
    }

    @Test
    void showGivesTheCommandLineInputsAndCounts() throws IOException {
      Path[] f = data(15, 40);
      String h = dir.resolve("runs.db").toString();
      ok("score", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--history", h, "--seed", "5");
      String show = ok("runs", "show", "1", "--history", h).out();
      assertThat(show).contains("command line  steelyard score --refs " + f[0]).contains("--seed 5")
          .contains("references    " + f[0] + "  (40 rows").contains(sha256(f[1])).contains("seed 5").contains(ReportText.REVIEW_NOTE);
      assertThat(run("runs", "show", "9", "--history", h).err()).contains(h + ": has no run 9");
    }

    @Test
    void exportWritesOneCsvRowOrJsonObjectPerRun() throws IOException {
      Path[] f = data(16, 40);
      String h = dir.resolve("runs.db").toString();
      ok("compare", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--hyps", f[2].toString(), "--history", h);
      Path csv = dir.resolve("runs.csv");
      Path js = dir.resolve("runs.json");
      ok("runs", "export", "--history", h, "--csv", csv.toString());
      ok("runs", "export", "--history", h, "--json", js.toString(), "--utterances");
      List<String[]> rows = RescoreFixtures.readCsv(csv);
      assertThat(rows).hasSize(3);
      assertThat(rows.get(0)).startsWith("id", "started_at", "command", "label");
      assertThat(rows.get(1)[3]).isEqualTo("A");
      JsonNode runs = json(js);
      assertThat(runs.size()).isEqualTo(2);
      assertThat(runs.get(1).get("label").asText()).isEqualTo("B");
      assertThat(runs.get(1).get("utterance_rows").size()).isEqualTo(40);
      assertThat(runs.get(0).get("inputs").get(0).get("sha256").asText()).isEqualTo(sha256(f[1]));
    }
  }

  @Nested
  class Weights {
    @Test
    void storedWeightsReproduceTheRunsPicksByteForByte() throws IOException {
      // The demo's voice dev set and model; the run's effective weights are what --save-weights wrote.
      String hyps = RescoreFixtures.VOICE_DEV;
      Path saved = dir.resolve("saved.json");
      Path picks = dir.resolve("picks.csv");
      ok("rescore", "--hyps", hyps, "--rules", RescoreFixtures.VOICE_RULES, "--lm", RescoreFixtures.VOICE_LM, "--features",
          "acoustic,lm", "--lm-weight", "16", "--length-weight", "8", "--save-weights", saved.toString(), "--out", picks.toString());
      Path db = dir.resolve("runs.db");
      try (RunHistory h = RunHistory.open(db)) {
        h.record(RunRecord.builder("rescore", Instant.EPOCH, Clock.systemUTC()).method("nbest").unit(Unit.WORD, null)
            .weights(WeightsFile.read(saved, List.of())).input(InputFile.HYPOTHESES, Path.of(hyps), InputFile.UNKNOWN_ROWS).build());
      }
      Path back = dir.resolve("back.json");
      ok("runs", "weights", "1", "--history", db.toString(), "--out", back.toString());
      assertThat(Files.readString(back)).isEqualTo(Files.readString(saved));
      RescoreFixtures.assertVoiceDevWeightsReproduce(dir, back, picks);
    }

    @Test
    void aRunWithoutWeightsExitsTwo() throws IOException {
      Path[] f = data(18, 10);
      String h = dir.resolve("runs.db").toString();
      ok("score", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--history", h);
      ScoreCommandTest.Result r = run("runs", "weights", "1", "--history", h, "--out", dir.resolve("w.json").toString());
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("run 1 has no weights");
      assertThat(dir.resolve("w.json")).doesNotExist();
    }
  }

  @Nested
  class HistoryFiles {
    @ParameterizedTest(name = "[{index}] {0}")
    @ValueSource(strings = {"random bytes", "a CSV file", "an sqlite file of another program"})
    void aDamagedOrForeignHistoryExitsTwoWithItsPathAndIsLeftAlone(String kind) throws Exception {
      Path db = dir.resolve("runs.db");
      switch (kind) {
        case "random bytes": {
          byte[] b = new byte[4096];
          new SplittableRandom(3).nextBytes(b);
          Files.write(db, b);
          break;
        }
        case "a CSV file":
          Files.writeString(db, "utt_id,text\ntpc-v-0001,pallet nine\n");
          break;
        default:
          try (var c = java.sql.DriverManager.getConnection("jdbc:sqlite:" + db); var s = c.createStatement()) {
            s.execute("CREATE TABLE deliveries (docket TEXT, grower TEXT)");
          }
      }
      byte[] before = Files.readAllBytes(db);
      ScoreCommandTest.Result r = run("runs", "list", "--history", db.toString());
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).startsWith("steelyard: " + db + ": ").doesNotContain("Exception");
      assertThat(Files.readAllBytes(db)).isEqualTo(before);
    }

    @Test
    void aRunWhoseHistoryCannotBeWrittenSaysSoAndKeepsItsOutputsAndExitCode() throws IOException {
      Path[] f = data(17, 30);
      Path db = write(dir, "runs.db", "not a database\n");
      Path out = dir.resolve("score.json");
      ScoreCommandTest.Result r = run("score", "--refs", f[0].toString(), "--hyps", f[1].toString(), "--history", db.toString(),
          "--json", out.toString());
      assertThat(r.code()).isZero();
      assertThat(r.err()).contains("steelyard: warning: run not recorded in the history: " + db + ": is not an SQLite database");
      assertThat(json(out).get("error_rate").isNumber()).isTrue();
      assertThat(Files.readString(db)).isEqualTo("not a database\n");
    }

    @Test
    void theRunsCommandsNeedAHistory() {
      org.junit.jupiter.api.Assumptions.assumeTrue(System.getenv("STEELYARD_HISTORY") == null, "the environment names a history");
      ScoreCommandTest.Result r = run("runs", "list");
      assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("--history: no run history named");
    }
  }
}
