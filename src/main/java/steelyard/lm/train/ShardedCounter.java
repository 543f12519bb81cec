package steelyard.lm.train;

import java.util.Arrays;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Counts n-grams on {@link #SHARDS} worker threads: shard i owns the n-grams whose first token id is ≡ i
 * (mod {@link #SHARDS}), so the shards' tries are disjoint and need no locking; {@link NgramCounts#merge}
 * joins them. The calling thread (which reads and normalises the corpus) hands over sentences in batches
 * of about 64 k token ids through bounded queues, so at most a few batches (≈ 2 MB) are in flight.
 *
 * <p>The shard count is fixed, independent of the number of cores, so the result (and its entry order) is
 * the same on every machine. Not thread-safe on the calling side: one producer.
 */
final class ShardedCounter implements AutoCloseable {
  static final int SHARDS = 2;
  private static final int BATCH_TOKENS = 1 << 16;
  private static final Batch END = new Batch(new int[0], new int[0], 0);

  private record Batch(int[] tokens, int[] ends, int sentences) {}

  private final NgramCounts[] shards = new NgramCounts[SHARDS];
  private final Thread[] workers = new Thread[SHARDS];
  private final BlockingQueue<Batch>[] queues;
  private final AtomicReference<Throwable> failure = new AtomicReference<>();
  private int[] tokens = new int[BATCH_TOKENS + 64];
  private int[] ends = new int[4096];
  private int tokenCount;
  private int sentenceCount;
  private boolean finished;

  @SuppressWarnings("unchecked")
  ShardedCounter(int order) {
    queues = new BlockingQueue[SHARDS];
    for (int i = 0; i < SHARDS; i++) {
      shards[i] = new NgramCounts(order);
      queues[i] = new ArrayBlockingQueue<>(4);
      int shard = i;
      workers[i] = new Thread(() -> work(shard), "counting-shard-" + i);
      workers[i].setDaemon(true);
      workers[i].start();
    }
  }

  /** Queues one framed sentence ({@code <s>} … {@code </s>}) for counting. */
  void addSentence(int[] ids, int length) {
    checkFailure();
    if (tokenCount + length > tokens.length) tokens = Arrays.copyOf(tokens, Math.max(tokens.length * 2, tokenCount + length));
    if (sentenceCount == ends.length) ends = Arrays.copyOf(ends, ends.length * 2);
    System.arraycopy(ids, 0, tokens, tokenCount, length);
    tokenCount += length;
    ends[sentenceCount++] = tokenCount;
    if (tokenCount >= BATCH_TOKENS) flush();
  }

  /** Waits for the workers and returns the merged, frozen counts. */
  NgramCounts finish() {
    flush();
    for (BlockingQueue<Batch> q : queues) put(q, END);
    for (Thread t : workers) {
      try {
        t.join();
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        throw new IllegalStateException("interrupted while counting", e);
      }
    }
    finished = true;
    checkFailure();
    NgramCounts merged = NgramCounts.merge(shards);
    Arrays.fill(shards, null);
    return merged;
  }

  /** Stops the workers when counting was abandoned (an input error); no effect after {@link #finish()}. */
  @Override
  public void close() {
    if (finished) return;
    for (Thread t : workers) t.interrupt();
  }

  private void flush() {
    if (sentenceCount == 0) return;
    Batch b = new Batch(tokens, ends, sentenceCount);
    for (BlockingQueue<Batch> q : queues) put(q, b);
    tokens = new int[tokens.length];
    ends = new int[ends.length];
    tokenCount = 0;
    sentenceCount = 0;
  }

  private void put(BlockingQueue<Batch> q, Batch b) {
    try {
      while (!q.offer(b, 100, java.util.concurrent.TimeUnit.MILLISECONDS)) checkFailure();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while counting", e);
    }
  }

  private void work(int shard) {
    NgramCounts counts = shards[shard];
    try {
      for (Batch b = queues[shard].take(); b != END; b = queues[shard].take()) {
        int from = 0;
        for (int i = 0; i < b.sentences(); i++) {
          counts.addSentenceShard(b.tokens(), from, b.ends()[i], shard, SHARDS);
          from = b.ends()[i];
        }
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    } catch (Throwable t) {
      failure.compareAndSet(null, t);
    }
  }

  private void checkFailure() {
    Throwable t = failure.get();
    if (t instanceof OutOfMemoryError oom) throw oom;
    if (t != null) throw new IllegalStateException("n-gram counting failed", t);
  }
}
