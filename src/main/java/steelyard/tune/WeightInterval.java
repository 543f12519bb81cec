package steelyard.tune;

/**
 * The open interval of one weight, the others fixed at their tuned values, over which the dev error stays what
 * it is at the tuned value: the best interval of the last exact line search along that weight. The tuned value
 * is its middle when both ends are finite.
 *
 * @param low    left end (may be −∞, or the weight's range limit)
 * @param high   right end (may be +∞, or the weight's range limit)
 * @param chosen the tuned value
 * @param exact  true over all N-best hypotheses; false when computed over the lattice method's path pools
 *               (exact over the pooled paths, which need not hold every path the search could find)
 */
public record WeightInterval(double low, double high, double chosen, boolean exact) {}
