package steelyard.text;

import java.util.List;

/**
 * Turns raw transcript text into the token sequence that scoring and language models see.
 *
 * <p>Pipeline, in order: NFKC; case folding; punctuation stripping; hyphen splitting; whitespace
 * tokenisation into words; user rules (equivalences map a word to its canonical form, dropped words vanish,
 * optionally-deletable words are kept but flagged so alignment never counts them as an error whether present or
 * absent). At {@link Unit#CHAR} the resulting words are split into extended grapheme clusters ({@code \X})
 * joined by {@link #SPACE_TOKEN} (unless whitespace is ignored).
 *
 * <p>Immutable once built; thread-safe. Rule usage counts are kept per instance in thread-safe counters.
 */
public final class Normaliser {
  /** The visible token that stands for a run of whitespace at character level. */
  public static final String SPACE_TOKEN = "<sp>";

  private Normaliser() {}

  /** Builds a normaliser; reads the rules file when one is given (bad rules: {@code InputException}). */
  public static Normaliser create(NormalisationOptions options) {
    throw new UnsupportedOperationException("not built yet");
  }

  public NormalisationOptions options() {
    throw new UnsupportedOperationException("not built yet");
  }

  /** Normalised tokens of {@code raw} in the given unit, with optionally-deletable flags. */
  public TokenSequence tokens(String raw, Unit unit) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** Normalised tokens of {@code raw} in the given unit (optional flags dropped: for language models). */
  public List<String> tokenList(String raw, Unit unit) {
    throw new UnsupportedOperationException("not built yet");
  }
}
