package steelyard.bench;

import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.StringWriter;
import java.io.Writer;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.reflect.Method;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;

/**
 * Big-input check (outside the default test run): generates a hypotheses file of about 1 GB and its
 * references, then runs {@code score} and {@code rescore --method nbest} on it, each in a child JVM with
 * {@code -Xmx512m}, and prints wall time, exit code and peak heap: the JVM's own per-pool peak usage summed
 * over heap pools (an upper bound of the true peak, garbage included), the largest heap-in-use seen by
 * polling every 20 ms, and the largest heap-in-use right after a collection (close to the live set).
 * Streaming commands must finish with exit 0 under that limit.
 *
 * <pre>
 * mvn -o -q -B test-compile
 * mvn -o -q dependency:build-classpath -Dmdep.outputFile=cp.txt -Dmdep.includeScope=test
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.BigInputCheck [--gb 1] [--dir /tmp/big] [--lm M] [--keep]
 * </pre>
 *
 * <p>The hypotheses come from {@code steelyard.io.SyntheticHypotheses} (20 per utterance) when it is
 * built, else from a small generator here; the references are the rank-1 texts. Files go to a fresh
 * directory under /tmp and are deleted afterwards unless {@code --keep}.
 */
public final class BigInputCheck {
  private BigInputCheck() {}

  public static void main(String[] args) throws Exception {
    double gb = 1.0;
    Path dir = null;
    String lm = null;
    boolean keep = false;
    for (int i = 0; i < args.length; i++) {
      switch (args[i]) {
        case "--gb" -> gb = Double.parseDouble(args[++i]);
        case "--dir" -> dir = Path.of(args[++i]);
        case "--lm" -> lm = args[++i];
        case "--keep" -> keep = true;
        default -> throw new IllegalArgumentException("unknown argument " + args[i]);
      }
    }
    if (dir == null) dir = Files.createTempDirectory(Path.of("/tmp"), "steelyard-big-");
    Files.createDirectories(dir);
    Path hyps = dir.resolve("big-hyps.csv");
    Path refs = dir.resolve("big-refs.csv");
    try {
      long t0 = System.nanoTime();
      long bytes = (long) (gb * (1L << 30));
      generate(hyps, bytes);
      long utterances = writeReferences(hyps, refs);
      System.out.printf(Locale.ROOT, "generated %s: %.2f GB, %d utterances, references %.1f MB, in %.1f s%n", hyps,
          Files.size(hyps) / (double) (1L << 30), utterances, Files.size(refs) / 1e6, (System.nanoTime() - t0) / 1e9);

      run("score", List.of("score", "--hyps", hyps.toString(), "--refs", refs.toString(), "--features", "acoustic,lm",
          "--json", dir.resolve("score.json").toString()));
      List<String> rescore = new ArrayList<>(List.of("rescore", "--hyps", hyps.toString(), "--features", "acoustic,lm",
          "--method", "nbest", "--out", dir.resolve("picks.csv").toString(), "--json", dir.resolve("rescore.json").toString()));
      if (lm != null) rescore.addAll(List.of("--lm", lm, "--lm-weight", "1"));
      run("rescore --method nbest", rescore);
    } finally {
      if (!keep) deleteTree(dir);
    }
  }

  private static void run(String label, List<String> args) throws Exception {
    List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        "-Xmx512m", "-cp", System.getProperty("java.class.path"), HeapWatch.class.getName()));
    cmd.addAll(args);
    long t0 = System.nanoTime();
    Process p = new ProcessBuilder(cmd).redirectOutput(ProcessBuilder.Redirect.DISCARD)
        .redirectError(ProcessBuilder.Redirect.INHERIT).start();
    int exit = p.waitFor();
    System.out.printf(Locale.ROOT, "%s: exit %d, %.1f s wall (heap figures above, from the child)%n", label, exit, (System.nanoTime() - t0) / 1e9);
  }

  /** Writes about {@code bytes} bytes of hypotheses. */
  private static void generate(Path hyps, long bytes) throws Exception {
    Class<?> synthetic;
    try {
      synthetic = Class.forName("steelyard.io.SyntheticHypotheses");
    } catch (ClassNotFoundException e) {
      synthetic = null;
    }
    if (synthetic != null) {
      Method toWriter = synthetic.getMethod("write", Writer.class, long.class, int.class, long.class);
      StringWriter sample = new StringWriter();
      toWriter.invoke(null, sample, 20_000L, 20, 1L);
      double perRow = sample.toString().getBytes(StandardCharsets.UTF_8).length / 20_000.0;
      long rows = (long) (bytes / perRow);
      synthetic.getMethod("write", Path.class, long.class, int.class, long.class).invoke(null, hyps, rows, 20, 1L);
      return;
    }
    SplittableRandom r = new SplittableRandom(1);
    String[] words = {"load", "six", "crates", "of", "apples", "pears", "to", "bay", "four", "before", "noon", "cold", "store", "pallets"};
    try (BufferedWriter w = Files.newBufferedWriter(hyps, StandardCharsets.UTF_8)) {
      w.write("utt_id,rank,text,acoustic,lm\n");
      long written = 0;
      for (long u = 1; written < bytes; u++) {
        for (int k = 1; k <= 20; k++) {
          StringBuilder sb = new StringBuilder("dock-").append(u).append(',').append(k).append(',');
          for (int i = 0; i < 15; i++) sb.append(i == 0 ? "" : " ").append(words[r.nextInt(words.length)]);
          sb.append(',').append(-100 - k).append(".5,").append(-30 - r.nextInt(9)).append(".25\n");
          w.write(sb.toString());
          written += sb.length();
        }
      }
    }
  }

  /** References = the rank-1 text of every utterance (columns utt_id, rank, text first in both generators). */
  private static long writeReferences(Path hyps, Path refs) throws IOException {
    long n = 0;
    try (BufferedReader in = Files.newBufferedReader(hyps, StandardCharsets.UTF_8);
        BufferedWriter out = Files.newBufferedWriter(refs, StandardCharsets.UTF_8)) {
      in.readLine();
      out.write("utt_id,text\n");
      for (String line = in.readLine(); line != null; line = in.readLine()) {
        int a = line.indexOf(',');
        int b = line.indexOf(',', a + 1);
        int c = line.indexOf(',', b + 1);
        if (line.startsWith("1,", a + 1)) {
          out.write(line, 0, a + 1);
          out.write(line, b + 1, c - b - 1);
          out.write('\n');
          n++;
        }
      }
    }
    return n;
  }

  private static void deleteTree(Path dir) throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      for (Path p : (Iterable<Path>) s.sorted(Comparator.reverseOrder())::iterator) Files.deleteIfExists(p);
    }
  }

  /** Runs the command line in this JVM and reports its peak heap; used as the child's main class. */
  public static final class HeapWatch {
    private HeapWatch() {}

    public static void main(String[] args) throws Exception {
      AtomicLong polled = new AtomicLong();
      AtomicLong afterGc = new AtomicLong();
      Thread poll = new Thread(() -> {
        while (true) {
          long used = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
          polled.accumulateAndGet(used, Math::max);
          afterGc.accumulateAndGet(usedAfterLastGc(), Math::max);
          try {
            Thread.sleep(20);
          } catch (InterruptedException e) {
            return;
          }
        }
      }, "heap-poll");
      poll.setDaemon(true);
      poll.start();
      int exit = steelyard.cli.Main.run(args);
      long peakPools = 0;
      for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
        if (pool.getType() == MemoryType.HEAP) peakPools += pool.getPeakUsage().getUsed();
      }
      afterGc.accumulateAndGet(usedAfterLastGc(), Math::max);
      System.err.printf(Locale.ROOT,
          "heap: max %d MB, peak (sum of pool peaks) %d MB, largest polled in-use %d MB, largest after a collection %d MB%n",
          Runtime.getRuntime().maxMemory() >> 20, peakPools >> 20, polled.get() >> 20, afterGc.get() >> 20);
      System.exit(exit);
    }

    /** Heap in use right after the most recent collection, summed over heap pools: close to the live set. */
    private static long usedAfterLastGc() {
      long sum = 0;
      for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
        if (pool.getType() == MemoryType.HEAP && pool.getCollectionUsage() != null) sum += pool.getCollectionUsage().getUsed();
      }
      return sum;
    }
  }
}
