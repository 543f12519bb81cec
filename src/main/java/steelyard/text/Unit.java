package steelyard.text;

/** The token unit that alignment, error rates and language models work in. */
public enum Unit {
  /** Whitespace-separated words after normalisation (WER). */
  WORD,
  /** User-perceived characters: extended grapheme clusters, {@code \X} (CER). */
  CHAR
}
