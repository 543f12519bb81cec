package steelyard.text;

/** The three kinds of user rule a rules file can hold. */
public enum RuleKind {
  /** Several spellings rewritten to one canonical form ({@code equate ok = okay | o.k.}). */
  EQUATE("equate"),
  /** Kept but flagged: never an error whether present or absent ({@code optional uh | um | [noise]}). */
  OPTIONAL("optional"),
  /** Removed from every text before scoring ({@code drop [crosstalk]}). */
  DROP("drop");

  private final String keyword;

  RuleKind(String keyword) {
    this.keyword = keyword;
  }

  /** The keyword that starts such a rule in a rules file. */
  public String keyword() {
    return keyword;
  }

  static RuleKind ofKeyword(String word) {
    for (RuleKind k : values()) if (k.keyword.equals(word)) return k;
    return null;
  }
}
