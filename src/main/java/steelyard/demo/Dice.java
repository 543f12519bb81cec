package steelyard.demo;

import java.util.SplittableRandom;

/**
 * The generator's only source of randomness: a {@link SplittableRandom} used through {@code nextLong()} alone,
 * with the derived draws (bounded integers, Gaussians) computed here with {@link StrictMath}, so that the
 * demo data is byte-identical across JDK versions and platforms (the JDK's own bounded and Gaussian draws
 * are not specified to stay the same between releases).
 */
final class Dice {
  private final SplittableRandom random;

  Dice(long seed) {
    this.random = new SplittableRandom(seed);
  }

  /**
   * A seed for an independent stream named {@code name}, so that each generated file depends only on the master
   * seed and its own name, not on how much randomness other files consumed. Uses the string's specified
   * {@code hashCode} and a 64-bit finaliser (SplitMix64).
   */
  static long derive(long seed, String name) {
    long z = seed ^ (0x9E3779B97F4A7C15L * (name.hashCode() + 0x632BE59BD9B4E019L));
    z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
    z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
    return z ^ (z >>> 31);
  }

  /** Uniform in [0, 1). */
  double uniform() {
    return (random.nextLong() >>> 11) * 0x1.0p-53;
  }

  /** Uniform in [0, n) for n ≥ 1 (bias below 2^-40 for the small n used here). */
  int below(int n) {
    return (int) ((random.nextLong() >>> 1) % n);
  }

  /** Uniform in [lo, hi]. */
  int between(int lo, int hi) {
    return lo + below(hi - lo + 1);
  }

  boolean chance(double p) {
    return uniform() < p;
  }

  /** Standard normal by the Box–Muller transform. */
  double gaussian() {
    double u1 = 1.0 - uniform();
    double u2 = uniform();
    return StrictMath.sqrt(-2.0 * StrictMath.log(u1)) * StrictMath.cos(2.0 * StrictMath.PI * u2);
  }

  double normal(double mean, double sd) {
    return mean + sd * gaussian();
  }

  <T> T pick(T[] items) {
    return items[below(items.length)];
  }
}
