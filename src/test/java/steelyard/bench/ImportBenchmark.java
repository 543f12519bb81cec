package steelyard.bench;

import java.io.IOException;
import com.sun.management.GarbageCollectionNotificationInfo;
import com.sun.management.GcInfo;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;
import java.lang.management.MemoryUsage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.locks.LockSupport;
import javax.management.NotificationEmitter;
import javax.management.openmbean.CompositeData;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.SyntheticHypotheses;
import steelyard.io.UtteranceHypotheses;

/**
 * Import throughput of a generated 1 M-row hypotheses file (50 000 utterances × 20, features acoustic and
 * lm), reported by JMH as rows per second. {@link #main} is a separate heap check: run it with a small heap
 * ({@code -Xmx256m}) to see that streaming import does not hold the file.
 *
 * <pre>
 * java -cp ... org.openjdk.jmh.Main ImportBenchmark -f 1 -wi 2 -i 3
 * java -Xmx256m -cp ... steelyard.bench.ImportBenchmark [FILE] [ROWS]
 * </pre>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class ImportBenchmark {
  static final int ROWS = 1_000_000;
  static final long SEED = 1L;

  @Param({"csv", "csv.gz"})
  public String format;

  private Path file;

  @Setup(Level.Trial)
  public void generate() throws IOException {
    file = Files.createTempFile("steelyard-import-bench-", "." + format);
    SyntheticHypotheses.write(file, ROWS, 20, SEED);
  }

  @TearDown(Level.Trial)
  public void delete() throws IOException {
    Files.deleteIfExists(file);
  }

  /** One operation = one row; the invocation imports the whole file. */
  @Benchmark
  @OperationsPerInvocation(ROWS)
  public long importAllRows() {
    return importAll(file);
  }

  static long importAll(Path file) {
    ImportOptions options = ImportOptions.strict(FeatureSpec.parseList("acoustic,lm"));
    long rows = 0;
    double checksum = 0;
    try (HypothesesReader r = HypothesesReader.open(file, options)) {
      while (r.hasNext()) {
        UtteranceHypotheses u = r.next();
        rows += u.size();
        checksum += u.first().feature(0);
      }
    }
    if (Double.isNaN(checksum)) throw new AssertionError();
    return rows;
  }

  /**
   * Heap check: imports FILE (generated with ROWS rows when absent) and prints rows/s, the peak of heap used
   * sampled every millisecond through {@link java.lang.management.MemoryMXBean} (live data plus garbage not
   * yet collected), and the largest heap still in use right after a garbage collection (the live set),
   * from the collectors' notifications.
   */
  public static void main(String[] args) throws Exception {
    Path f = Path.of(args.length > 0 ? args[0] : System.getProperty("java.io.tmpdir") + "/steelyard-import-1M.csv");
    long want = args.length > 1 ? Long.parseLong(args[1]) : ROWS;
    if (!Files.exists(f)) SyntheticHypotheses.write(f, want, 20, SEED);
    importAll(f); // warm-up pass
    System.gc();
    MemoryMXBean memory = ManagementFactory.getMemoryMXBean();
    AtomicLong peakSampled = new AtomicLong();
    AtomicLong peakAfterGc = new AtomicLong();
    for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
      ((NotificationEmitter) gc).addNotificationListener((n, h) -> {
        if (!n.getType().equals(GarbageCollectionNotificationInfo.GARBAGE_COLLECTION_NOTIFICATION)) return;
        GcInfo info = GarbageCollectionNotificationInfo.from((CompositeData) n.getUserData()).getGcInfo();
        long after = info.getMemoryUsageAfterGc().values().stream().mapToLong(MemoryUsage::getUsed).sum();
        peakAfterGc.accumulateAndGet(after, Math::max);
      }, null, null);
    }
    AtomicBoolean running = new AtomicBoolean(true);
    Thread sampler = new Thread(() -> {
      while (running.get()) {
        peakSampled.accumulateAndGet(memory.getHeapMemoryUsage().getUsed(), Math::max);
        LockSupport.parkNanos(1_000_000);
      }
    });
    sampler.setDaemon(true);
    sampler.start();
    long t0 = System.nanoTime();
    long rows = importAll(f);
    double seconds = (System.nanoTime() - t0) / 1e9;
    running.set(false);
    sampler.join();
    System.out.printf(Locale.ROOT,
        "file %s (%d bytes): %d rows in %.2f s = %.0f rows/s; heap used: sampled peak %.1f MiB, largest after GC %.1f MiB (non-heap metaspace excluded), max heap %.0f MiB%n",
        f, Files.size(f), rows, seconds, rows / seconds, peakSampled.get() / 1048576.0, peakAfterGc.get() / 1048576.0,
        Runtime.getRuntime().maxMemory() / 1048576.0);
  }
}
