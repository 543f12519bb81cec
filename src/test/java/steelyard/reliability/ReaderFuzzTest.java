package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.ReferencesReader;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * Seeded fuzzing of every reader of user files: random and mutated bytes ({@link Mutator}) from valid seed
 * files go into the CSV importer (hypotheses and references), the ARPA reader, the binary-model reader and
 * the rules-file reader. Only {@link InputException} may escape; anything else (an unchecked exception, an
 * {@link Error} such as running out of memory on a forged length) fails the test with the case's seed; each
 * case is bounded to {@value #CASE_SECONDS} s so a hang fails too (a bound on hangs, not a speed check).
 *
 * <p>Replay a failing case: its seed alone determines the bytes ({@code Mutator.mutate(seedFile, new
 * SplittableRandom(caseSeed))} plus the gzip choice in {@link #caseBytes}). {@code -Dsteelyard.fuzz.scale=K}
 * multiplies the case counts (default 1: 12 500 cases, 10 000 of them in the CSV and rules readers).
 */
class ReaderFuzzTest {
  private static final int CASE_SECONDS = 5;
  private static final long BASE_SEED = 0x5EED_F022L;
  private static final double SCALE = Double.parseDouble(System.getProperty("steelyard.fuzz.scale", "1"));
  private static final AtomicLong RAN = new AtomicLong();
  /** File name stem of cases read in lenient mode ({@code --max-bad-rows 3}), so the skipping paths are fuzzed too. */
  private static final String LENIENT = "lenient-case";

  @TempDir static Path work;
  private static ExecutorService worker = newWorker();

  /** A reader under test: its seeds, file extension, case count and how to read a whole file. */
  record Target(String name, int cases, String extension, boolean gzipAllowed, List<byte[]> seeds, Reading reading) {
    @Override
    public String toString() {
      return name + " (" + cases + " cases)";
    }
  }

  @FunctionalInterface
  interface Reading {
    void read(Path file) throws Exception;
  }

  static Stream<Arguments> targets() throws IOException {
    return Stream.of(
        Arguments.of(new Target("hypotheses CSV", scaled(3000), ".csv", true, List.of(
            read(Fixtures.valid("hyps.csv")), read(Fixtures.badDir().resolve("hyps/ok-rank-gaps.csv")),
            utf8("\uFEFFutt_id,rank,text,acoustic,lm,group\r\n\"bay,1\",1,\"say \"\"ok\"\", then\nload\",-1.5,-2,dock-a\r\n"
                + "\"bay,1\",2,,-2.5,-3e1,dock-a\r\nbay-2,1,cold store,-0.5,-1,dock-b\r\n")),
            ReaderFuzzTest::readHypotheses)),
        Arguments.of(new Target("references CSV", scaled(3500), ".csv", true, List.of(
            read(Fixtures.valid("refs.csv")),
            utf8("\uFEFFutt_id,text,group\r\nbay-1,\"load, then \"\"stop\"\"\",dock-a\r\nbay-2,,dock-b\r\n")),
            ReaderFuzzTest::readReferences)),
        Arguments.of(new Target("rules file", scaled(3500), ".rules", true, List.of(
            read(Fixtures.valid("good.rules")), utf8("\uFEFF# dock\r\nequate no. = number | nr\r\noptional hmm\r\ndrop [breath]\r\n")),
            ReaderFuzzTest::readRules)),
        Arguments.of(new Target("ARPA model", scaled(1500), ".arpa", true,
            List.of(read(Fixtures.valid("small.arpa")), read(Fixtures.valid("trigram-pruned.arpa"))),
            ReaderFuzzTest::readArpa)),
        Arguments.of(new Target("binary model", scaled(1000), ".bin", false, List.of(), ReaderFuzzTest::readBinary)));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("targets")
  void onlyInputExceptionEscapesAndNoCaseHangs(Target t) throws Exception {
    List<byte[]> seeds = t.seeds().isEmpty() ? List.of(binarySeed()) : t.seeds();
    Path dir = Files.createDirectories(work.resolve(t.name().replace(' ', '-')));
    for (int i = 0; i < seeds.size(); i++) {
      Path p = dir.resolve("seed-" + i + t.extension());
      Files.write(p, seeds.get(i));
      t.reading().read(p);
    }

    List<String> failures = new ArrayList<>();
    {
      for (int i = 0; i < t.cases(); i++) {
        long caseSeed = BASE_SEED + i * 0x9E3779B97F4A7C15L;
        SplittableRandom r = new SplittableRandom(caseSeed);
        boolean gz = t.gzipAllowed() && r.nextInt(8) == 0;
        String name = (r.nextInt(3) == 0 ? LENIENT : "case") + t.extension() + (gz ? ".gz" : "");
        Path file = dir.resolve(name);
        Files.write(file, caseBytes(seeds, r, gz));
        Throwable bad = bounded(() -> readOnce(t, file));
        if (bad != null && failures.size() < 10) failures.add(describe(t, i, caseSeed, bad));
        RAN.incrementAndGet();
      }
    }
    assertThat(failures).as("%s: cases where something other than InputException escaped (or timed out)", t.name()).isEmpty();
  }

  @AfterAll
  static void reportCount() {
    worker.shutdownNow();
    System.out.println("reader fuzzing: " + RAN.get() + " cases ran");
  }

  /**
   * Runs one case on the worker thread, waiting at most {@value #CASE_SECONDS} s (what
   * {@code assertTimeoutPreemptively} does, without a new thread per case); a case that hangs is reported and
   * its thread abandoned.
   */
  private static Throwable bounded(Callable<Throwable> body) throws InterruptedException {
    Future<Throwable> f = worker.submit(body);
    try {
      return f.get(CASE_SECONDS, TimeUnit.SECONDS);
    } catch (TimeoutException e) {
      f.cancel(true);
      worker.shutdownNow();
      worker = newWorker();
      return new AssertionError("no result after " + CASE_SECONDS + " s (hang?)");
    } catch (ExecutionException e) {
      return e.getCause();
    }
  }

  private static ExecutorService newWorker() {
    return Executors.newSingleThreadExecutor(r -> {
      Thread th = new Thread(r, "reader-fuzz");
      th.setDaemon(true);
      return th;
    });
  }

  private static Throwable readOnce(Target t, Path file) {
    try {
      t.reading().read(file);
      return null;
    } catch (InputException expected) {
      assertThat(expected.getMessage()).startsWith(expected.file());
      return null;
    } catch (Throwable other) {
      return other;
    }
  }

  /** The bytes of one case: a mutated seed, gzipped before or after mutating when {@code gz}. */
  static byte[] caseBytes(List<byte[]> seeds, SplittableRandom r, boolean gz) throws IOException {
    byte[] seed = seeds.get(r.nextInt(seeds.size()));
    if (!gz) return Mutator.mutate(seed, r);
    return r.nextBoolean() ? BadInputCorpusTest.gzip(Mutator.mutate(seed, r)) : Mutator.mutate(BadInputCorpusTest.gzip(seed), r);
  }

  private static String describe(Target t, int i, long caseSeed, Throwable e) {
    StackTraceElement at = e.getStackTrace().length > 0 ? e.getStackTrace()[0] : null;
    return t.name() + " case " + i + " seed " + caseSeed + "L: " + e + (at == null ? "" : " at " + at);
  }

  private static void readHypotheses(Path file) {
    ImportOptions options = new ImportOptions(FeatureSpec.parseList("acoustic,lm"), null, maxBadRows(file), w -> {}, s -> {});
    try (HypothesesReader r = HypothesesReader.open(file, options)) {
      while (r.hasNext()) r.next();
    }
  }

  private static void readReferences(Path file) {
    ReferencesReader.readAll(file, new ImportOptions(List.of(), null, maxBadRows(file), w -> {}, s -> {}));
  }

  private static int maxBadRows(Path file) {
    return file.getFileName().toString().startsWith(LENIENT) ? 3 : 0;
  }

  private static void readRules(Path file) {
    Normaliser n = Normaliser.create(new NormalisationOptions(true, false, true, false, file));
    n.tokenList("Okay uh load the cold-store kilos [noise] a equals b", Unit.WORD);
    n.tokenList("okay uh", Unit.CHAR);
  }

  /** Default loading with the readers' warnings dropped (the fuzzing produces many). */
  private static final ModelFiles.LoadOptions QUIET = new ModelFiles.LoadOptions(steelyard.lm.BackoffModel.DEFAULT_UNKNOWN_FLOOR_LOG10, w -> { }, null);

  private static void readArpa(Path file) {
    ModelFiles.loadExact(file, QUIET);
  }

  private static void readBinary(Path file) {
    LanguageModel lm = ModelFiles.load(file, QUIET);
    queryAFewWords(lm);
  }

  /** Scoring after loading: a forged file must not load "successfully" and then fail on the first query. */
  private static void queryAFewWords(LanguageModel lm) {
    double ln = lm.sentenceLogProb(List.of("load", "six", "crates", "pears"));
    assertThat(ln).as("log-probability of a sentence").isLessThanOrEqualTo(0.0).isGreaterThan(Double.NEGATIVE_INFINITY);
  }

  private static byte[] binarySeed() throws IOException {
    Path bin = work.resolve("seed-model.bin");
    if (!Files.exists(bin)) {
      ModelFiles.save(ModelFiles.loadExact(Fixtures.valid("trigram-pruned.arpa")), bin);
    }
    return Files.readAllBytes(bin);
  }

  private static int scaled(int n) {
    return (int) Math.max(1, Math.round(n * SCALE));
  }

  private static byte[] read(Path p) throws IOException {
    return Files.readAllBytes(p);
  }

  private static byte[] utf8(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }
}
