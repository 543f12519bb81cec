package steelyard.bench;

import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import steelyard.eval.Bootstrap;
import steelyard.eval.EditCounts;
import steelyard.history.HistoryRecording;
import steelyard.history.InputFile;
import steelyard.history.RunFilter;
import steelyard.history.RunHistory;
import steelyard.history.RunRecord;
import steelyard.history.RunSummary;
import steelyard.history.RunText;
import steelyard.history.UtteranceCounts;
import steelyard.history.UtteranceStatus;
import steelyard.text.Unit;

/**
 * Run-history timings (a {@code main}, not part of the test suite; wall clock, so rerun on a quiet machine):
 *
 * <ol>
 *   <li>recording one run of 100 000 utterances through {@link HistoryRecording#record} (open or create the file,
 *       hash a small input, insert the run and its rows in one transaction, commit, close), each time into a
 *       history that already holds 20 such runs; target ≤ 1 s;
 *   <li>listing 10 000 runs (300 utterances each) with {@link RunHistory#list}, and open + list + render the
 *       table + close (what {@code runs list} does after the JVM has started); target ≤ 200 ms.
 * </ol>
 *
 * <p>Each figure is given as wall time and as the calling thread's CPU time, which other processes on a busy
 * machine disturb less (SQLite works in the calling thread; waiting for the disk is not CPU time).
 *
 * <pre>
 * mvn -o -q -B test-compile
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.HistoryBench [dir]
 * </pre>
 */
public final class HistoryBench {
  private static final int BIG_RUN = 100_000;
  private static final int LISTED_RUNS = 10_000;
  private static final int ROWS_PER_LISTED_RUN = 300;
  private static final int ROUNDS = 7;

  private static final java.lang.management.ThreadMXBean CPU = java.lang.management.ManagementFactory.getThreadMXBean();

  private HistoryBench() {}

  public static void main(String[] args) throws Exception {
    Path dir = args.length > 0 ? Files.createDirectories(Path.of(args[0])) : Files.createTempDirectory("history-bench");
    Path refs = dir.resolve("refs.csv");
    Files.writeString(refs, "utt_id,text\ntpc-v-000001,pallet nine to bay four\n");
    System.out.println("load average before: " + loadAverage());
    recording(dir, refs);
    listing(dir, refs);
    System.out.println("load average after: " + loadAverage());
  }

  private static void recording(Path dir, Path refs) {
    UtteranceCounts big = rows(1, BIG_RUN);
    Path db = dir.resolve("big.db");
    for (int i = 0; i < 20; i++) HistoryRecording.record(db, System.err, run(refs, big, i));
    double[] ms = new double[ROUNDS];
    double[] cpu = new double[ROUNDS];
    for (int i = 0; i < ROUNDS; i++) {
      RunRecord.Builder b = run(refs, big, i);
      long t0 = System.nanoTime();
      long c0 = CPU.getCurrentThreadCpuTime();
      List<Long> ids = HistoryRecording.record(db, System.err, b);
      ms[i] = (System.nanoTime() - t0) / 1e6;
      cpu[i] = (CPU.getCurrentThreadCpuTime() - c0) / 1e6;
      if (ids.size() != 1) throw new AssertionError("not recorded");
    }
    report("record a run of " + BIG_RUN + " utterances (history of 20–26 such runs, " + mb(db) + "), wall", ms);
    report("record a run of " + BIG_RUN + " utterances, thread CPU", cpu);
  }

  private static void listing(Path dir, Path refs) {
    Path db = dir.resolve("many.db");
    long t0 = System.nanoTime();
    try (RunHistory h = RunHistory.open(db)) {
      List<RunRecord> batch = new ArrayList<>();
      for (int i = 0; i < LISTED_RUNS; i++) {
        batch.add(run(refs, rows(i, ROWS_PER_LISTED_RUN), i).build());
        if (batch.size() == 500) {
          h.recordAll(batch);
          batch.clear();
        }
      }
    }
    System.out.printf(Locale.ROOT, "filled %d runs × %d utterances in %.1f s (%s)%n", LISTED_RUNS, ROWS_PER_LISTED_RUN,
        (System.nanoTime() - t0) / 1e9, mb(db));
    double[] api = new double[ROUNDS];
    double[] apiCpu = new double[ROUNDS];
    double[] command = new double[ROUNDS];
    double[] commandCpu = new double[ROUNDS];
    PrintStream sink = new PrintStream(PrintStream.nullOutputStream());
    for (int i = 0; i < ROUNDS + 2; i++) {
      long wall = System.nanoTime();
      long cpu = CPU.getCurrentThreadCpuTime();
      List<RunSummary> runs;
      try (RunHistory h = RunHistory.openExisting(db)) {
        long listWall = System.nanoTime();
        long listCpu = CPU.getCurrentThreadCpuTime();
        runs = h.list(RunFilter.ALL);
        if (i >= 2) {
          api[i - 2] = (System.nanoTime() - listWall) / 1e6;
          apiCpu[i - 2] = (CPU.getCurrentThreadCpuTime() - listCpu) / 1e6;
        }
        sink.print(RunText.table(runs));
      }
      if (i >= 2) {
        command[i - 2] = (System.nanoTime() - wall) / 1e6;
        commandCpu[i - 2] = (CPU.getCurrentThreadCpuTime() - cpu) / 1e6;
      }
      if (runs.size() != LISTED_RUNS) throw new AssertionError("listed " + runs.size());
    }
    report("RunHistory.list over " + LISTED_RUNS + " runs, wall", api);
    report("RunHistory.list over " + LISTED_RUNS + " runs, thread CPU", apiCpu);
    report("open + list + table text + close, wall", command);
    report("open + list + table text + close, thread CPU", commandCpu);
  }

  private static RunRecord.Builder run(Path refs, UtteranceCounts rows, int i) {
    long errors = 0;
    long n = 0;
    for (int r = 0; r < rows.size(); r++) {
      errors += rows.errors(r);
      n += rows.referenceTokens(r);
    }
    Instant start = Instant.parse("2026-12-02T00:00:00Z").plusSeconds(60L * i);
    return RunRecord.builder("score", start, Clock.systemUTC()).commandLine(List.of("score", "--refs", refs.toString()))
        .method(i % 2 == 0 ? "first" : "nbest").unit(Unit.WORD, "nfkc").totals(new EditCounts(n - Math.min(n, errors), Math.min(n, errors), 0, 0))
        .interval(new Bootstrap.Interval(0.1, 0.2), 1000, 20261202L).utterances(rows).input(InputFile.REFERENCES, refs, rows.size());
  }

  private static UtteranceCounts rows(long seed, int n) {
    SplittableRandom rnd = new SplittableRandom(seed);
    UtteranceCounts.Builder b = new UtteranceCounts.Builder(n);
    for (int i = 0; i < n; i++) b.add(String.format(Locale.ROOT, "tpc-v-%06d", i), UtteranceStatus.SCORED, rnd.nextInt(4), 1 + rnd.nextInt(20));
    return b.build();
  }

  private static void report(String what, double[] ms) {
    double[] s = ms.clone();
    Arrays.sort(s);
    System.out.printf(Locale.ROOT, "%s: median %.1f ms (min %.1f, max %.1f, %d rounds)%n", what, s[s.length / 2], s[0], s[s.length - 1], s.length);
  }

  private static String mb(Path p) {
    try {
      return String.format(Locale.ROOT, "%.1f MB", Files.size(p) / 1e6);
    } catch (java.io.IOException e) {
      return "size unknown";
    }
  }

  private static String loadAverage() {
    return String.format(Locale.ROOT, "%.2f", java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
  }
}
