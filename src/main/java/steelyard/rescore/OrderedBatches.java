package steelyard.rescore;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.Function;

/**
 * Processes a stream in fixed-size batches on a thread pool and hands the results on in input order, so
 * outputs never depend on the thread count. The next batch is read while the current one is processed; at
 * most two batches are held. Reading and the consumer run on the calling thread.
 */
public final class OrderedBatches {
  /** Items per batch: large enough to keep the pool busy, small enough that memory stays flat. */
  public static final int DEFAULT_BATCH = 256;

  /** Receives results in input order; may throw (e.g. an I/O error). */
  @FunctionalInterface
  public interface Sink<R> {
    void accept(R result) throws Exception;
  }

  private OrderedBatches() {}

  /** Runs {@code work} over every item of {@code input} with {@code threads} workers. */
  public static <T, R> void run(Iterator<T> input, Function<T, R> work, int threads, int batchSize, Sink<R> sink)
      throws Exception {
    if (threads <= 1) {
      while (input.hasNext()) sink.accept(work.apply(input.next()));
      return;
    }
    ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
      Thread t = new Thread(r, "steelyard-rescore");
      t.setDaemon(true);
      return t;
    });
    try {
      List<Future<List<R>>> pending = submit(pool, read(input, batchSize), work, threads);
      while (!pending.isEmpty()) {
        List<T> next = read(input, batchSize);
        for (Future<List<R>> f : pending) for (R r : get(f)) sink.accept(r);
        pending = submit(pool, next, work, threads);
      }
    } finally {
      pool.shutdownNow();
    }
  }

  private static <T> List<T> read(Iterator<T> input, int batchSize) {
    List<T> batch = new ArrayList<>(batchSize);
    while (batch.size() < batchSize && input.hasNext()) batch.add(input.next());
    return batch;
  }

  private static <T, R> List<Future<List<R>>> submit(ExecutorService pool, List<T> batch, Function<T, R> work, int threads) {
    List<Future<List<R>>> futures = new ArrayList<>();
    if (batch.isEmpty()) return futures;
    int chunk = (batch.size() + threads - 1) / threads;
    for (int from = 0; from < batch.size(); from += chunk) {
      List<T> part = batch.subList(from, Math.min(batch.size(), from + chunk));
      futures.add(pool.submit(() -> {
        List<R> out = new ArrayList<>(part.size());
        for (T t : part) out.add(work.apply(t));
        return out;
      }));
    }
    return futures;
  }

  private static <R> List<R> get(Future<List<R>> f) throws Exception {
    try {
      return f.get();
    } catch (ExecutionException e) {
      Throwable c = e.getCause();
      if (c instanceof Exception) throw (Exception) c;
      if (c instanceof Error) throw (Error) c;
      throw e;
    }
  }
}
