package steelyard.eval;

/**
 * How often a token (or a substitution pair) occurred among the errors.
 *
 * @param ref   the reference token; empty for an insertion
 * @param hyp   the hypothesis token; empty for a deletion
 * @param count occurrences
 */
public record TokenTally(String ref, String hyp, long count) {}
