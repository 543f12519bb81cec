package steelyard.rescore;

/** Unit-cost edit distance between two token-id sequences; an instance may keep work arrays (one per thread). */
@FunctionalInterface
public interface EditDistance {
  int distance(int[] a, int[] b);
}
