package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.report.ReportText;

class ScoreCommandTest {
  @TempDir Path dir;

  /** Exit code and captured output of one in-process run. */
  record Result(int code, String out, String err) {}

  /** Runs the command line in-process with its own output writers (the commands print only through them). */
  static Result run(String... args) {
    picocli.CommandLine cl = Main.commandLine();
    java.io.StringWriter out = new java.io.StringWriter();
    java.io.StringWriter err = new java.io.StringWriter();
    cl.setOut(new java.io.PrintWriter(out, true));
    cl.setErr(new java.io.PrintWriter(err, true));
    int code = cl.execute(args);
    return new Result(code, out.toString(), err.toString());
  }

  static Path write(Path dir, String name, String content) throws IOException {
    Path p = dir.resolve(name);
    Files.writeString(p, content, StandardCharsets.UTF_8);
    return p;
  }

  static JsonNode json(Path p) throws IOException {
    return new ObjectMapper().readTree(Files.readString(p, StandardCharsets.UTF_8));
  }

  /** The realistic fixture directory, or null when it is absent. */
  static Path realistic() {
    for (String c : new String[] {"../shared/realistic", "../../shared/realistic", "/work/shared/realistic"}) {
      Path p = Path.of(c);
      if (Files.isDirectory(p)) return p;
    }
    return null;
  }

  static final String REFS = "utt_id,text,group\n"
      + "d1,load six crates of pears,north\n"
      + "d2,bay four is full,south\n"
      + "d3,=sum the dock,south\n";
  static final String HYPS = "utt_id,rank,text,acoustic\n"
      + "d1,1,load six crates of bears,-10.5\n"
      + "d1,2,load six crates of pears,-11.0\n"
      + "d2,1,bay for is full,-8.25\n"
      + "d3,1,=sum the dock,-3.0\n";

  private Path refs() throws IOException {
    return write(dir, "refs.csv", REFS);
  }

  private Path hyps() throws IOException {
    return write(dir, "hyps.csv", HYPS);
  }

  @Nested
  class Outputs {
    @Test
    void writesJsonSummaryWithTheDocumentedKeys() throws IOException {
      Path out = dir.resolve("summary.json");
      Result r = run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--features", "acoustic", "--json", out.toString());
      assertThat(r.code()).as(r.err()).isZero();
      JsonNode j = json(out);
      for (String key : List.of("utterances", "reference_tokens", "correct", "substitutions", "deletions", "insertions",
          "error_rate", "sentence_error_rate", "ci95_low", "ci95_high", "missing_hypotheses", "missing_references",
          "unit", "pick", "seed", "resamples", "groups", "skipped_rows", "warnings"))
        assertThat(j.has(key)).as(key).isTrue();
      // Worked by hand: d1 C4 S1, d2 C3 S1, d3 C3; N = 12, errors 2, WER 2/12, SER 2/3.
      assertThat(j.get("reference_tokens").asLong()).isEqualTo(12);
      assertThat(j.get("substitutions").asLong()).isEqualTo(2);
      assertThat(j.get("error_rate").decimalValue()).isEqualByComparingTo("0.166667");
      assertThat(j.get("sentence_error_rate").decimalValue()).isEqualByComparingTo("0.666667");
      assertThat(j.get("pick").asText()).isEqualTo("first");
      assertThat(j.get("groups")).hasSize(2);
      assertThat(r.out()).contains("WER 16.67%").contains(ReportText.REVIEW_NOTE);
    }

    @Test
    void oraclePickIsNeverWorseThanFirst() throws IOException {
      Path out = dir.resolve("oracle.json");
      Result r = run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--pick", "oracle", "--json", out.toString());
      assertThat(r.code()).as(r.err()).isZero();
      assertThat(json(out).get("substitutions").asLong()).isEqualTo(1);
      assertThat(json(out).get("pick").asText()).isEqualTo("oracle");
    }

    @Test
    void jsonToStdoutMovesTheTextReportToStderr() throws IOException {
      Result r = run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--json", "-");
      assertThat(r.code()).as(r.err()).isZero();
      assertThat(new ObjectMapper().readTree(r.out()).get("utterances").asInt()).isEqualTo(3);
      assertThat(r.err()).contains(ReportText.REVIEW_NOTE);
    }

    @Test
    void csvToStdoutMovesTheTextReportToStderrAndOnlyOneOutputMayTakeStdout() throws IOException {
      Result r = run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--csv", "-");
      assertThat(r.code()).as(r.err()).isZero();
      assertThat(r.out()).startsWith("utt_id,group,status,");
      assertThat(r.err()).contains(ReportText.REVIEW_NOTE);
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--csv", "-", "--json", "-").code()).isEqualTo(2);
    }

    @Test
    void csvTableIsSpreadsheetSafeByDefault() throws IOException {
      Path csv = dir.resolve("table.csv");
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--csv", csv.toString()).code()).isZero();
      List<String> lines = Files.readAllLines(csv, StandardCharsets.UTF_8);
      assertThat(lines.get(0)).startsWith("utt_id,group,status,ref_tokens,correct,substitutions,deletions,insertions,errors,error_rate,");
      assertThat(lines.get(1)).startsWith("d1,north,scored,5,4,1,0,0,1,0.200000,");
      assertThat(lines.get(3)).contains(",'=sum the dock,'=sum the dock");
      Path raw = dir.resolve("raw.csv");
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--csv", raw.toString(), "--spreadsheet-safe", "false").code()).isZero();
      assertThat(Files.readString(raw)).contains(",=sum the dock,=sum the dock");
    }

    @Test
    void outputsAreByteIdenticalAcrossRerunsAndThreadCounts() throws IOException {
      List<String> seen = new ArrayList<>();
      for (String threads : List.of("1", "3", "1")) {
        Path j = dir.resolve("s" + seen.size() + ".json");
        Path c = dir.resolve("s" + seen.size() + ".csv");
        Result r = run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--threads", threads,
            "--seed", "5", "--json", j.toString(), "--csv", c.toString());
        assertThat(r.code()).as(r.err()).isZero();
        seen.add(Files.readString(j) + Files.readString(c) + r.out());
      }
      assertThat(seen.get(1)).isEqualTo(seen.get(0));
      assertThat(seen.get(2)).isEqualTo(seen.get(0));
    }

    @Test
    void missingUtterancesAreReportedAndCountedByPolicy() throws IOException {
      Path refs = write(dir, "refs4.csv", REFS + "d4,two bins,south\n");
      Path hyps = write(dir, "hyps4.csv", HYPS + "d9,1,ghost words,-1\n");
      Path all = dir.resolve("all.json");
      Path ex = dir.resolve("ex.json");
      assertThat(run("score", "--hyps", hyps.toString(), "--refs", refs.toString(), "--json", all.toString()).code()).isZero();
      assertThat(run("score", "--hyps", hyps.toString(), "--refs", refs.toString(), "--missing-hyp", "exclude", "--json", ex.toString()).code()).isZero();
      assertThat(json(all).get("missing_hypotheses").asInt()).isEqualTo(1);
      assertThat(json(all).get("missing_references").asInt()).isEqualTo(1);
      assertThat(json(all).get("missing_hypothesis_ids").get(0).asText()).isEqualTo("d4");
      assertThat(json(all).get("missing_reference_ids").get(0).asText()).isEqualTo("d9");
      assertThat(json(all).get("deletions").asLong()).isEqualTo(2);
      assertThat(json(ex).get("deletions").asLong()).isZero();
      assertThat(json(ex).get("utterances").asInt()).isEqualTo(3);
    }

    @Test
    void scoresOneSystemOfAMultiSystemFile() throws IOException {
      Path h = write(dir, "multi.csv", "utt_id,system,rank,text\n"
          + "d1,gray,1,load six crates of pears\nd1,deskew,1,load sick crates of pears\n"
          + "d2,deskew,1,bay four is full\nd2,gray,1,bay for is full\n");
      Path r = write(dir, "r2.csv", "utt_id,text\nd1,load six crates of pears\nd2,bay four is full\n");
      Path gray = dir.resolve("gray.json");
      Path deskew = dir.resolve("deskew.json");
      assertThat(run("score", "--hyps", h.toString(), "--refs", r.toString(), "--system", "gray", "--json", gray.toString()).code()).isZero();
      assertThat(run("score", "--hyps", h.toString(), "--refs", r.toString(), "--system", "deskew", "--json", deskew.toString()).code()).isZero();
      assertThat(json(gray).get("substitutions").asLong()).isEqualTo(1);
      assertThat(json(gray).get("hypotheses_file").asText()).endsWith("system=gray");
      assertThat(json(deskew).get("substitutions").asLong()).isEqualTo(1);
      // A system that never occurs is refused (every utterance would count as missing), naming those present.
      Path none = dir.resolve("none.json");
      Result absent = run("score", "--hyps", h.toString(), "--refs", r.toString(), "--system", "upscale", "--json", none.toString());
      assertThat(absent.code()).isEqualTo(2);
      assertThat(absent.err()).contains("system 'upscale' does not occur").contains("deskew, gray");
      assertThat(none).doesNotExist();
    }

    @Test
    void zeroReferenceTokensGiveANullRateAndAWarning() throws IOException {
      Path refs = write(dir, "empty-refs.csv", "utt_id,text\nd1,\n");
      Path hyps = write(dir, "h1.csv", "utt_id,text\nd1,stray noise\n");
      Path out = dir.resolve("n0.json");
      Result r = run("score", "--hyps", hyps.toString(), "--refs", refs.toString(), "--json", out.toString());
      assertThat(r.code()).as(r.err()).isZero();
      assertThat(json(out).get("error_rate").isNull()).isTrue();
      assertThat(json(out).get("insertions").asLong()).isEqualTo(2);
      assertThat(json(out).get("warnings").toString()).contains("N = 0");
    }
  }

  @Test
  void helpPrintsCleanlyForBothCommands() {
    for (String cmd : List.of("score", "compare")) {
      Result r = run(cmd, "--help");
      assertThat(r.code()).isZero();
      assertThat(r.out()).contains("--refs").contains("95% ");
      assertThat(r.out() + r.err()).doesNotContain("WARN");
    }
  }

  @Nested
  class Refusals {
    @Test
    void refusesAnOutputThatIsAnInput() throws IOException {
      Path refs = refs();
      Result r = run("score", "--hyps", hyps().toString(), "--refs", refs.toString(), "--json", refs.toString());
      assertThat(r.code()).isEqualTo(2);
      assertThat(r.err()).contains("--json").contains("input");
      assertThat(Files.readString(refs)).isEqualTo(REFS);
    }

    @Test
    void rejectsUnknownPolicyAndBadCounts() throws IOException {
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--missing-hyp", "ignore").code()).isEqualTo(2);
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--resamples", "0").code()).isEqualTo(2);
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--pick", "best").code()).isEqualTo(2);
      assertThat(run("score", "--hyps", hyps().toString(), "--refs", refs().toString(), "--pick", "given").code()).isEqualTo(2);
      assertThat(run("score", "--hyps", hyps().toString()).code()).isEqualTo(2);
    }
  }

  @Nested
  class BadInput {
    // Each case: exit code 2, a one-line message naming file and line, and no output file written.
    private void assertRejected(Path hyps, Path refs, String where, String... extra) {
      Path out = dir.resolve("never.json");
      Path csv = dir.resolve("never.csv");
      List<String> args = new ArrayList<>(List.of("score", "--hyps", hyps.toString(), "--refs", refs.toString(),
          "--json", out.toString(), "--csv", csv.toString()));
      args.addAll(List.of(extra));
      Result r = run(args.toArray(new String[0]));
      assertThat(r.code()).as(r.err()).isEqualTo(2);
      assertThat(r.err()).contains(where).doesNotContain("\tat ");
      assertThat(r.out()).isEmpty();
      assertThat(out).doesNotExist();
      assertThat(csv).doesNotExist();
    }

    @Test
    void missingColumn() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,rank\nd1,1\n");
      assertRejected(h, refs(), h + ":1");
    }

    @Test
    void wrongFieldCount() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,rank,text\nd1,1,load six,extra\n");
      assertRejected(h, refs(), h + ":2");
    }

    @Test
    void unterminatedQuote() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,rank,text\nd1,1,\"load six crates\n");
      assertRejected(h, refs(), h + ":2");
    }

    @Test
    void nonNumericScore() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,rank,text,acoustic\nd1,1,load,-1.5\nd2,1,bay,loud\n");
      assertRejected(h, refs(), h + ":3", "--features", "acoustic");
    }

    @Test
    void nanScore() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,rank,text,acoustic\nd1,1,load,NaN\n");
      assertRejected(h, refs(), h + ":2", "--features", "acoustic");
    }

    @Test
    void duplicateUttSystemRank() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,system,rank,text\nd1,a,1,load\nd1,a,1,lode\n");
      assertRejected(h, refs(), h + ":3");
    }

    @Test
    void utteranceThatIsNotContiguous() throws IOException {
      Path h = write(dir, "h.csv", "utt_id,rank,text\nd1,1,load\nd2,1,bay\nd1,2,lode\n");
      assertRejected(h, refs(), h + ":4");
    }

    @Test
    void duplicateUttIdInReferences() throws IOException {
      Path r = write(dir, "r.csv", "utt_id,text\nd1,load\nd1,again\n");
      assertRejected(hyps(), r, r + ":3");
    }

    @Test
    void emptyFile() throws IOException {
      Path h = write(dir, "h.csv", "");
      assertRejected(h, refs(), h.toString());
    }

    @Test
    void invalidUtf8() throws IOException {
      Path h = dir.resolve("h.csv");
      byte[] head = "utt_id,rank,text\nd1,1,load\nd2,1,ba".getBytes(StandardCharsets.UTF_8);
      byte[] bytes = new byte[head.length + 2];
      System.arraycopy(head, 0, bytes, 0, head.length);
      bytes[head.length] = (byte) 0xC3;
      bytes[head.length + 1] = (byte) '\n';
      Files.write(h, bytes);
      assertRejected(h, refs(), h + ":3");
    }
  }

  @Nested
  class RealisticFixtures {
    // Figures from the fixture README (/work/shared/realistic/README.md). Asserted within ±1.5 points for
    // words because normalisation choices (apostrophes, case) may differ slightly from the figures' own.
    @Test
    void asrRankOneAndOracleWordErrorRates() throws IOException {
      Path base = realistic();
      assumeTrue(base != null, "realistic fixtures not found (../shared/realistic): skipped");
      Path h = base.resolve("asr/dev.nbest.csv");
      Path r = base.resolve("asr/dev.refs.csv");
      Path first = dir.resolve("asr-first.json");
      Path oracle = dir.resolve("asr-oracle.json");
      assertThat(run("score", "--hyps", h.toString(), "--refs", r.toString(), "--features", "acoustic,lm", "--fold-case",
          "--json", first.toString()).code()).isZero();
      assertThat(run("score", "--hyps", h.toString(), "--refs", r.toString(), "--fold-case", "--pick", "oracle",
          "--json", oracle.toString()).code()).isZero();
      assertThat(json(first).get("error_rate").asDouble()).isBetween(0.605 - 0.015, 0.605 + 0.015);
      assertThat(json(oracle).get("error_rate").asDouble()).isBetween(0.460 - 0.015, 0.460 + 0.015);
      assertThat(json(first).get("missing_hypotheses").asInt()).isZero();
    }

    @Test
    void ocrRankOneAndOracleCharacterErrorRates() throws IOException {
      // Case and punctuation matter in these lines: no folding, no stripping. With NFKC only the figures are
      // reproduced up to the README's rounding (two decimals of a percentage), hence ±0.05 points.
      Path base = realistic();
      assumeTrue(base != null, "realistic fixtures not found (../shared/realistic): skipped");
      Path h = base.resolve("ocr/dev.nbest.csv");
      Path r = base.resolve("ocr/dev.refs.csv");
      Path first = dir.resolve("ocr-first.json");
      Path oracle = dir.resolve("ocr-oracle.json");
      assertThat(run("score", "--hyps", h.toString(), "--refs", r.toString(), "--unit", "char",
          "--features", "confidence,mean_word_conf:linear:scale=0.01", "--json", first.toString()).code()).isZero();
      assertThat(run("score", "--hyps", h.toString(), "--refs", r.toString(), "--unit", "char", "--pick", "oracle",
          "--json", oracle.toString()).code()).isZero();
      assertThat(json(first).get("error_rate").asDouble()).isBetween(0.0644 - 0.0005, 0.0644 + 0.0005);
      assertThat(json(oracle).get("error_rate").asDouble()).isBetween(0.0501 - 0.0005, 0.0501 + 0.0005);
    }
  }
}
