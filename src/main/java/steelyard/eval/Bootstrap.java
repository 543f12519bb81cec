package steelyard.eval;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

/**
 * Bootstrap resampling of utterances (Efron &amp; Tibshirani 1993) for corpus error rates, and the paired
 * bootstrap for two systems on the same utterances (Bisani &amp; Ney 2004; Koehn 2004).
 *
 * <p>Each resample draws as many utterances as there are, uniformly with replacement, and its rate is
 * Σ errors / Σ reference tokens over the drawn utterances (not a mean of per-utterance rates). A resample whose
 * drawn utterances have no reference token has rate 0 when it has no error and +∞ otherwise.
 *
 * <p>Interval: the percentile interval by nearest rank: with the B resample rates sorted ascending as
 * r(1) … r(B), the 95 % interval is [r(⌈0.025·B⌉), r(⌈0.975·B⌉)] (for B = 1000: r(25) and r(975)).
 *
 * <p>Determinism: resamples are split into fixed blocks of {@value #BLOCK} in order; block b draws from the b-th
 * {@link SplittableRandom#split()} of {@code new SplittableRandom(seed)}, made in order before any work starts.
 * Which thread runs a block does not matter, so results depend on the seed only, never on the thread count.
 * Memory: one {@code double} per resample (8·B bytes) plus the caller's per-utterance arrays.
 */
public final class Bootstrap {
  /** Resamples per seeded block. */
  static final int BLOCK = 50;
  /** The default number of resamples. */
  public static final int DEFAULT_RESAMPLES = 1000;

  private Bootstrap() {}

  /** A closed interval; both ends NaN when undefined (no utterance, or no resample). */
  public record Interval(double low, double high) {
    public static final Interval UNDEFINED = new Interval(Double.NaN, Double.NaN);

    public boolean contains(double x) {
      return low <= x && x <= high;
    }
  }

  /**
   * The paired-bootstrap result for systems A and B.
   *
   * @param difference   95 % interval of rate(B) − rate(A); negative means B makes fewer errors
   * @param probBBetter  share of resamples in which B has strictly fewer errors than A
   * @param probABetter  share of resamples in which A has strictly fewer errors than B
   * @param resamples    number of resamples
   */
  public record Paired(Interval difference, double probBBetter, double probABetter, int resamples) {}

  /** 95 % percentile interval of the corpus rate Σ errors / Σ refTokens. */
  public static Interval corpusRate(int[] errors, int[] refTokens, int resamples, long seed, int threads) {
    checkArgs(errors, refTokens, resamples);
    if (errors.length == 0) return Interval.UNDEFINED;
    double[] rates = new double[resamples];
    run(resamples, seed, threads, (rnd, from, to) -> {
      int n = errors.length;
      for (int b = from; b < to; b++) {
        long e = 0;
        long t = 0;
        for (int k = 0; k < n; k++) {
          int u = rnd.nextInt(n);
          e += errors[u];
          t += refTokens[u];
        }
        rates[b] = rate(e, t);
      }
    });
    return percentile(rates);
  }

  /** Paired bootstrap: the same drawn utterances for both systems in every resample. */
  public static Paired paired(int[] errorsA, int[] errorsB, int[] refTokens, int resamples, long seed, int threads) {
    checkArgs(errorsA, refTokens, resamples);
    checkArgs(errorsB, refTokens, resamples);
    if (refTokens.length == 0) return new Paired(Interval.UNDEFINED, Double.NaN, Double.NaN, resamples);
    double[] diffs = new double[resamples];
    byte[] winner = new byte[resamples];
    run(resamples, seed, threads, (rnd, from, to) -> {
      int n = refTokens.length;
      for (int b = from; b < to; b++) {
        long ea = 0;
        long eb = 0;
        long t = 0;
        for (int k = 0; k < n; k++) {
          int u = rnd.nextInt(n);
          ea += errorsA[u];
          eb += errorsB[u];
          t += refTokens[u];
        }
        diffs[b] = t == 0 ? Double.NaN : (double) (eb - ea) / t;
        winner[b] = (byte) Long.compare(ea, eb);
      }
    });
    int bBetter = 0;
    int aBetter = 0;
    for (byte w : winner) {
      if (w > 0) bBetter++;
      if (w < 0) aBetter++;
    }
    double[] finite = Arrays.stream(diffs).filter(d -> !Double.isNaN(d)).toArray();
    Interval diff = finite.length == 0 ? Interval.UNDEFINED : percentile(finite);
    return new Paired(diff, (double) bBetter / resamples, (double) aBetter / resamples, resamples);
  }

  private static double rate(long errors, long tokens) {
    if (tokens == 0) return errors == 0 ? 0.0 : Double.POSITIVE_INFINITY;
    return (double) errors / tokens;
  }

  /** Nearest-rank 95 % percentile interval of {@code values} (sorted in place). */
  static Interval percentile(double[] values) {
    Arrays.sort(values);
    int b = values.length;
    int lo = (int) Math.ceil(0.025 * b) - 1;
    int hi = (int) Math.ceil(0.975 * b) - 1;
    return new Interval(values[Math.max(0, lo)], values[Math.max(0, hi)]);
  }

  private static void checkArgs(int[] errors, int[] refTokens, int resamples) {
    if (errors.length != refTokens.length)
      throw new IllegalArgumentException("errors " + errors.length + " != reference lengths " + refTokens.length);
    if (resamples < 1) throw new IllegalArgumentException("resamples must be >= 1: " + resamples);
  }

  @FunctionalInterface
  private interface BlockBody {
    void run(SplittableRandom rnd, int from, int to);
  }

  private static void run(int resamples, long seed, int threads, BlockBody body) {
    SplittableRandom root = new SplittableRandom(seed);
    int blocks = (resamples + BLOCK - 1) / BLOCK;
    SplittableRandom[] gens = new SplittableRandom[blocks];
    for (int b = 0; b < blocks; b++) gens[b] = root.split();
    if (threads <= 1 || blocks == 1) {
      for (int b = 0; b < blocks; b++) body.run(gens[b], b * BLOCK, Math.min(resamples, (b + 1) * BLOCK));
      return;
    }
    ExecutorService pool = Executors.newFixedThreadPool(Math.min(threads, blocks));
    try {
      List<Future<?>> futures = new ArrayList<>(blocks);
      for (int b = 0; b < blocks; b++) {
        int block = b;
        futures.add(pool.submit(() -> body.run(gens[block], block * BLOCK, Math.min(resamples, (block + 1) * BLOCK))));
      }
      for (Future<?> f : futures) f.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("bootstrap interrupted", e);
    } catch (ExecutionException e) {
      throw new IllegalStateException("bootstrap failed", e.getCause());
    } finally {
      pool.shutdownNow();
    }
  }
}
