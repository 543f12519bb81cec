package steelyard.text;

/** The token unit that alignment, error rates and language models work in. */
public enum Unit {
  /** Whitespace-separated words after normalisation (WER). */
  WORD,
  /** User-perceived characters: extended grapheme clusters, {@code \X} (CER). */
  CHAR;

  /** The unit's name as the command line, weights files and JSON outputs spell it: {@code word} or {@code char}. */
  public String label() {
    return this == WORD ? "word" : "char";
  }
}
