package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Mutated inputs through whole commands, in-process: whatever the bytes, a command ends with exit code 0
 * (outputs written) or 2 (one message line, no stack trace, outputs untouched), never 1: an internal error
 * on some input is a bug, in the reader or in the command behind it. Each failure names its case seed;
 * the bytes are {@code Mutator.mutate(seedFile, new SplittableRandom(caseSeed))}. Whole commands are slower
 * than readers, so the default run has 360 cases; {@code -Dsteelyard.fuzz.scale=K} multiplies them (a
 * run with K = 6 passed when this test was written).
 */
class CommandFuzzTest {
  private static final long BASE_SEED = 0xC0FFEE_5EEDL;
  private static final double SCALE = Double.parseDouble(System.getProperty("steelyard.fuzz.scale", "1"));

  /** Which input gets mutated, and the command around it ({@code {file}}, {@code {valid}}, {@code {out}}, {@code {method}}). */
  record Target(String name, int cases, String mutated, String extension, String command) {
    @Override
    public String toString() {
      return name + " (" + cases + " cases)";
    }
  }

  static Stream<Arguments> targets() {
    return Stream.of(
        Arguments.of(new Target("score, hypotheses", scaled(60), "valid/hyps.csv", ".csv",
            "score --hyps {file} --refs {valid}/refs.csv --features acoustic,lm --resamples 50 --json {out}/s.json --csv {out}/t.csv")),
        Arguments.of(new Target("score, references", scaled(40), "valid/refs.csv", ".csv",
            "score --hyps {valid}/hyps.csv --refs {file} --pick oracle --resamples 50 --json {out}/s.json --csv {out}/t.csv")),
        Arguments.of(new Target("rescore, hypotheses", scaled(60), "valid/hyps.csv", ".csv",
            "rescore --hyps {file} --refs {valid}/refs.csv --lm {valid}/small.arpa --lm-weight 0.5 --features acoustic,lm"
                + " --method {method} --out {out}/p.csv --json {out}/s.json")),
        Arguments.of(new Target("rescore, model", scaled(40), "valid/trigram-pruned.arpa", ".arpa",
            "rescore --hyps {valid}/hyps.csv --lm {file} --lm-weight 0.5 --lattice-lm-weight 0.2 --features acoustic"
                + " --method {method} --out {out}/p.csv --json {out}/s.json")),
        Arguments.of(new Target("rescore, weights file", scaled(40), "weights/ok-control.json", ".json",
            "rescore --hyps {valid}/hyps.csv --lm {valid}/small.arpa --features acoustic --weights {file}"
                + " --method {method} --out {out}/p.csv --json {out}/s.json")),
        Arguments.of(new Target("score, rules file", scaled(40), "valid/good.rules", ".rules",
            "score --hyps {valid}/hyps.csv --refs {valid}/refs.csv --rules {file} --resamples 20 --json {out}/s.json")),
        Arguments.of(new Target("lm train, corpus", scaled(40), "valid/corpus.txt", ".txt",
            "lm train --corpus {file} --order 3 --out {out}/m.arpa --json {out}/s.json")),
        Arguments.of(new Target("lm perplexity, text", scaled(40), "valid/corpus.txt", ".txt",
            "lm perplexity --lm {valid}/trigram-pruned.arpa --text {file} --json {out}/s.json")));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("targets")
  void commandsEndWithZeroOrTwoNeverAnInternalError(Target t, @TempDir Path tmp) throws IOException {
    byte[] seed = Files.readAllBytes(Fixtures.badDir().resolve(t.mutated()));
    Path out = Files.createDirectories(tmp.resolve("out"));
    Cli.requireBuilt(Cli.run(args(t, Fixtures.badDir().resolve(t.mutated()), out, "nbest")), t.command().split(" "));
    String[] methods = {"nbest", "mbr", "consensus", "lattice"};
    List<String> failures = new ArrayList<>();
    for (int i = 0; i < t.cases() && failures.size() < 5; i++) {
      long caseSeed = BASE_SEED + i * 0x9E3779B97F4A7C15L;
      SplittableRandom r = new SplittableRandom(caseSeed);
      Path file = tmp.resolve("case" + t.extension());
      Files.write(file, Mutator.mutate(seed, r));
      clear(out);
      Cli.Result res = Cli.run(args(t, file, out, methods[i % methods.length]));
      String problem = check(res, out);
      if (problem != null) failures.add(t.name() + " case " + i + " seed " + caseSeed + "L: " + problem + "\n" + res);
    }
    assertThat(failures).as("cases ending other than with exit 0 or a clean exit 2").isEmpty();
  }

  private static String check(Cli.Result r, Path out) throws IOException {
    if (r.exit() == 0) return null;
    if (r.exit() != 2) return "exit " + r.exit();
    if (r.err().contains("Exception") || r.err().contains("\tat ")) return "stack trace";
    if (r.messageLines().size() != 1) return r.messageLines().size() + " message lines";
    if (!Fixtures.snapshot(out).isEmpty()) return "output written although the run failed: " + Fixtures.snapshot(out).keySet();
    return null;
  }

  private static String[] args(Target t, Path file, Path out, String method) {
    return Stream.of(t.command().split(" "))
        .map(a -> a.replace("{file}", file.toString()).replace("{valid}", Fixtures.validDir().toString())
            .replace("{out}", out.toString()).replace("{method}", method))
        .toArray(String[]::new);
  }

  private static int scaled(int n) {
    return (int) Math.max(1, Math.round(n * SCALE));
  }

  private static void clear(Path dir) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      for (Path p : (Iterable<Path>) s::iterator) Files.delete(p);
    }
  }
}
