package steelyard.text;

import java.util.List;

/**
 * A snapshot of how many tokens each rule of the rules file touched, in file order.
 *
 * <p>Counts are in words, whatever the unit: an {@code equate} rule counts the words it rewrote, a
 * {@code drop} rule the words it removed, an {@code optional} rule the words it flagged (including
 * canonical forms produced by an {@code equate} rule). Every call of {@link Normaliser#tokens} or
 * {@link Normaliser#tokenList} counts, so a text normalised twice counts twice.
 *
 * @param rules one entry per rule line, in file order (rules that touched nothing have count 0)
 */
public record RuleUsage(List<RuleCount> rules) {
  public RuleUsage {
    rules = List.copyOf(rules);
  }

  /** No rules file. */
  public static final RuleUsage NONE = new RuleUsage(List.of());

  /**
   * One rule's count.
   *
   * @param line   1-based line of the rule in the rules file
   * @param kind   the rule's kind
   * @param rule   the rule as written (trimmed line)
   * @param tokens words this rule touched
   */
  public record RuleCount(int line, RuleKind kind, String rule, long tokens) {
    /** {@code line N: RULE}, a stable label for reports. */
    public String description() {
      return "line " + line + ": " + rule;
    }
  }

  /** Total words touched by all rules. */
  public long total() {
    long t = 0;
    for (RuleCount c : rules) t += c.tokens();
    return t;
  }
}
