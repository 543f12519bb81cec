package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * A failed run creates and changes no output file, whichever output fails and whenever: the commands are run
 * through the real command line with every output already present (known content), and fail either on an output
 * path (the last one's directory does not exist) or late, after all outputs were written to their temporary
 * files (the references share no utterance with the hypotheses; a bad row at the end of the hypotheses). Exit
 * code 2, one message line, and the output directory byte for byte as before, with no temporary file left.
 */
class AllOrNothingOutputsTest {
  private static final String HYPS = Fixtures.valid("hyps.csv").toString();
  private static final String REFS = Fixtures.valid("refs.csv").toString();
  private static final String ARPA = Fixtures.valid("small.arpa").toString();
  private static final String CORPUS = Fixtures.valid("corpus.txt").toString();

  /** Commands with several outputs; {@code {out}} is the output directory, {@code {late}} a late-failing input. */
  static Stream<Arguments> commands() {
    return Stream.of(
        Arguments.of("rescore --out --breakdown --json --save-weights", List.of("rescore", "--hyps", HYPS, "--features", "acoustic",
            "--out", "{out}/picks.csv", "--breakdown", "{out}/breakdown.csv", "--json", "{out}/summary.json", "--save-weights", "{out}/w.json")),
        Arguments.of("rescore --refs", List.of("rescore", "--hyps", HYPS, "--refs", REFS, "--features", "acoustic", "--method", "mbr",
            "--out", "{out}/picks.csv", "--json", "{out}/summary.json")),
        Arguments.of("score --csv --json", List.of("score", "--hyps", HYPS, "--refs", REFS, "--csv", "{out}/table.csv", "--json", "{out}/summary.json")),
        Arguments.of("network --dot --arcs --json", List.of("network", "--hyps", HYPS, "--utt", "bay-001",
            "--dot", "{out}/n.dot", "--arcs", "{out}/arcs.csv", "--json", "{out}/n.json")),
        Arguments.of("lm train --out --json", List.of("lm", "train", "--corpus", CORPUS, "--order", "2", "--out", "{out}/m.arpa", "--json", "{out}/t.json")),
        Arguments.of("lm prune --out --json", List.of("lm", "prune", "--lm", ARPA, "--threshold", "1e-3", "--out", "{out}/p.bin", "--json", "{out}/p.json")),
        Arguments.of("lm mix --out --json", List.of("lm", "mix", "--lm", ARPA, "--lm", ARPA, "--text", CORPUS,
            "--out", "{out}/mix.arpa", "--json", "{out}/mix.json")));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("commands")
  void anOutputInAMissingDirectoryLeavesEveryOtherOutputAsItWas(String name, List<String> template, @TempDir Path tmp) throws IOException {
    Path out = Files.createDirectories(tmp.resolve("out"));
    List<String> args = fill(template, out);
    int last = lastOutputIndex(args);
    args.set(last, out.resolve("no-such-dir").resolve(Path.of(args.get(last)).getFileName()).toString());
    assertUnchangedAfterFailure(args, out);
  }

  static Stream<Arguments> lateFailures() {
    Path noShared = Fixtures.badDir().resolve("refs/no-shared-ids.csv");
    return Stream.of(
        Arguments.of("rescore: references share no utterance", List.of("rescore", "--hyps", HYPS, "--refs", noShared.toString(),
            "--features", "acoustic", "--out", "{out}/picks.csv", "--breakdown", "{out}/breakdown.csv", "--json", "{out}/summary.json")),
        Arguments.of("score: references share no utterance", List.of("score", "--hyps", HYPS, "--refs", noShared.toString(),
            "--csv", "{out}/table.csv", "--json", "{out}/summary.json")),
        Arguments.of("rescore: bad last row", List.of("rescore", "--hyps", "{late}", "--features", "acoustic",
            "--out", "{out}/picks.csv", "--breakdown", "{out}/breakdown.csv", "--json", "{out}/summary.json", "--save-weights", "{out}/w.json")));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("lateFailures")
  void aFailureAfterEveryOutputWasWrittenLeavesThemAllAsTheyWere(String name, List<String> template, @TempDir Path tmp) throws IOException {
    Path out = Files.createDirectories(tmp.resolve("out"));
    // Many good utterances, then one bad score on the very last line: the picks of all others are written first.
    StringBuilder late = new StringBuilder("utt_id,text,acoustic\n");
    for (int i = 0; i < 2000; i++) late.append("bay-").append(i).append(",load six crates of apples,-").append(100 + i % 7).append('\n');
    late.append("bay-last,load six crates,NaN\n");
    Path lateFile = Files.writeString(tmp.resolve("late.csv"), late);
    List<String> args = new ArrayList<>();
    for (String a : fill(template, out)) args.add(a.replace("{late}", lateFile.toString()));
    assertUnchangedAfterFailure(args, out);
  }

  /**
   * The demo tunes and rescores two data sets; when the second fails (its references have a duplicate id on the last line),
   * the first one's picks, summary and breakdown must not have replaced the earlier ones either.
   */
  @org.junit.jupiter.api.Test
  void theDemoWritesBothPartsOrNeither(@TempDir Path tmp) throws IOException {
    Path project = Path.of("").toAbsolutePath();
    Path data = Files.createDirectories(tmp.resolve("project/sample-hypotheses"));
    Path models = Files.createDirectories(tmp.resolve("project/models"));
    for (String f : List.of("voice-dev.nbest.csv", "voice-dev.refs.csv", "voice-test.nbest.csv", "voice-test.refs.csv", "voice.rules",
        "dockets-dev.nbest.csv", "dockets-dev.refs.csv", "dockets-test.nbest.csv"))
      Files.createSymbolicLink(data.resolve(f), project.resolve("sample-hypotheses").resolve(f));
    for (String f : List.of("voice-3gram.arpa.gz", "voice-demo.weights.json", "dockets-char-5gram.arpa.gz", "dockets-demo.weights.json"))
      Files.createSymbolicLink(models.resolve(f), project.resolve("models").resolve(f));
    List<String> refs = Files.readAllLines(project.resolve("sample-hypotheses/dockets-test.refs.csv"));
    Files.write(data.resolve("dockets-test.refs.csv"), concat(refs, refs.get(1)));
    Path out = Files.createDirectories(tmp.resolve("demo-out"));
    for (String stem : List.of("voice", "dockets")) {
      for (String kind : List.of(".weights.json", "-dev.tune.json", "-test.picks.csv", "-test.summary.json", "-test.breakdown.csv"))
        Files.writeString(out.resolve(stem + kind), "earlier output of " + stem + kind + "\n");
    }
    Files.writeString(out.resolve("report.html"), "earlier report\n");
    Map<String, String> before = Fixtures.snapshot(out);
    Cli.Result r = Cli.runBuilt("demo", "--data-dir", tmp.resolve("project").toString(), "--out-dir", out.toString(), "--threads", "2");
    assertThat(r.exit()).as("%s", r).isEqualTo(2);
    assertThat(r.err()).contains("dockets-test.refs.csv").contains("twice");
    assertThat(Fixtures.snapshot(out)).as("demo-out as before\n%s", r).isEqualTo(before);
  }

  private static List<String> concat(List<String> lines, String extra) {
    List<String> out = new ArrayList<>(lines);
    out.add(extra);
    return out;
  }

  private static void assertUnchangedAfterFailure(List<String> args, Path out) throws IOException {
    for (String a : args) {
      if (a.startsWith(out.toString()) && Files.isDirectory(Path.of(a).getParent()))
        Files.writeString(Path.of(a), "earlier output of " + Path.of(a).getFileName() + "\n");
    }
    Map<String, String> before = Fixtures.snapshot(out);
    assertThat(before).as("outputs exist before the run").isNotEmpty();

    Cli.Result r = Cli.runBuilt(args.toArray(String[]::new));

    assertThat(r.exit()).as("%s", r).isEqualTo(2);
    assertThat(r.messageLines()).as("one message line\n%s", r).hasSize(1);
    assertThat(r.err()).doesNotContain("Exception").doesNotContain("\tat ");
    assertThat(Fixtures.snapshot(out)).as("every output byte for byte as before, no temporary file\n%s", r).isEqualTo(before);
  }

  private static List<String> fill(List<String> template, Path out) {
    List<String> args = new ArrayList<>();
    for (String a : template) args.add(a.replace("{out}", out.toString()));
    return args;
  }

  private static int lastOutputIndex(List<String> args) {
    for (int i = args.size() - 1; i > 0; i--) {
      if (Arrays.asList("--out", "--json", "--csv", "--breakdown", "--save-weights", "--dot", "--arcs").contains(args.get(i - 1))) return i;
    }
    throw new IllegalArgumentException("no output in " + args);
  }
}
