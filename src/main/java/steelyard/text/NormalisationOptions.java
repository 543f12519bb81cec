package steelyard.text;

import java.nio.file.Path;

/**
 * The text normalisation applied identically to references, hypotheses and LM training text.
 * Unicode NFKC is always applied first; everything else is optional.
 *
 * @param foldCase          lower-case with {@link java.util.Locale#ROOT} after NFKC
 * @param stripPunctuation  remove Unicode punctuation characters (category P*) inside and around words
 * @param splitHyphens      split words at hyphens ({@code cold-store} → {@code cold store})
 * @param ignoreWhitespace  character unit only: whitespace is not a character (by default a run of
 *                          whitespace counts as one character)
 * @param rulesFile         optional user rules file (equivalences, optionally-deletable and dropped tokens); null for none
 */
public record NormalisationOptions(
    boolean foldCase, boolean stripPunctuation, boolean splitHyphens, boolean ignoreWhitespace, Path rulesFile) {

  /** NFKC only: case, punctuation and hyphens kept, whitespace a character, no rules. */
  public static final NormalisationOptions EXACT = new NormalisationOptions(false, false, false, false, null);
}
