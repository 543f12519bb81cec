package steelyard.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.BooleanSupplier;

/**
 * The tuner's threads and its cancel check. Work over utterances is cut into fixed blocks of consecutive
 * indices ({@link #BLOCK}); each block writes only its own slots or its own buffer, and callers combine blocks
 * in block order, so results never depend on the thread count or on which thread ran a block.
 *
 * <p>{@link #check()} polls the cancel supplier and throws {@link CancellationException}; it runs before every
 * block. One instance per tuning run; {@link #close()} stops its threads.
 */
final class Workers implements AutoCloseable {
  /** Utterances per block. */
  static final int BLOCK = 128;

  /** Work on the index range [from, to) of block {@code block}. */
  @FunctionalInterface
  interface Body {
    void run(int block, int from, int to);
  }

  private final int threads;
  private final BooleanSupplier cancelled;
  private final ExecutorService pool;

  Workers(int threads, BooleanSupplier cancelled) {
    if (threads < 1) throw new IllegalArgumentException("threads must be >= 1: " + threads);
    this.threads = threads;
    this.cancelled = cancelled;
    this.pool = threads == 1 ? null : Executors.newFixedThreadPool(threads, r -> {
      Thread t = new Thread(r, "steelyard-tune");
      t.setDaemon(true);
      return t;
    });
  }

  /** A single-threaded instance that is never cancelled (for sweeps and tests). */
  static Workers single() {
    return new Workers(1, () -> false);
  }

  int threads() {
    return threads;
  }

  /** Throws {@link CancellationException} when the caller asked to stop. */
  void check() {
    if (cancelled.getAsBoolean()) throw new CancellationException("tuning cancelled");
  }

  /** Number of blocks that {@link #blocks} cuts {@code n} items into. */
  static int blockCount(int n) {
    return (n + BLOCK - 1) / BLOCK;
  }

  /** Runs {@code body} over [0, n) in blocks of {@link #BLOCK}, on every thread, and waits for all. */
  void blocks(int n, Body body) {
    int count = blockCount(n);
    if (pool == null || count <= 1) {
      for (int b = 0; b < count; b++) {
        check();
        body.run(b, b * BLOCK, Math.min(n, (b + 1) * BLOCK));
      }
      return;
    }
    List<Future<?>> futures = new ArrayList<>(count);
    for (int b = 0; b < count; b++) {
      int block = b;
      futures.add(pool.submit(() -> {
        check();
        body.run(block, block * BLOCK, Math.min(n, (block + 1) * BLOCK));
      }));
    }
    join(futures);
  }

  private static void join(List<Future<?>> futures) {
    RuntimeException failure = null;
    for (Future<?> f : futures) {
      try {
        f.get();
      } catch (ExecutionException e) {
        if (failure == null) failure = unwrap(e.getCause());
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        futures.forEach(x -> x.cancel(true));
        throw new CancellationException("interrupted");
      }
    }
    if (failure != null) throw failure;
  }

  private static RuntimeException unwrap(Throwable t) {
    if (t instanceof RuntimeException r) return r;
    if (t instanceof Error e) throw e;
    return new IllegalStateException(t);
  }

  @Override
  public void close() {
    if (pool != null) pool.shutdownNow();
  }
}
