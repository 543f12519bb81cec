package steelyard.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/** Options shared by every command that normalises text (NFKC is always applied). */
public final class NormalisationInput {
  @Option(names = "--unit", paramLabel = "word|char", defaultValue = "word", description = "Token unit: word (WER) or char (CER, grapheme clusters). Default ${DEFAULT-VALUE}.")
  public Unit unit;

  @Option(names = "--fold-case", description = "Lower-case before comparing.")
  public boolean foldCase;

  @Option(names = "--strip-punct", description = "Remove punctuation before comparing.")
  public boolean stripPunctuation;

  @Option(names = "--split-hyphens", description = "Split words at hyphens.")
  public boolean splitHyphens;

  @Option(names = "--ignore-space", description = "Character unit: whitespace is not a character.")
  public boolean ignoreWhitespace;

  @Option(names = "--rules", paramLabel = "FILE", description = "Normalisation rules file (equivalences, optional and dropped tokens).")
  public Path rules;

  public NormalisationOptions options() {
    return new NormalisationOptions(foldCase, stripPunctuation, splitHyphens, ignoreWhitespace, rules);
  }
}
