package steelyard.lm;

import java.nio.file.Path;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * The one rule for how text is tokenised for a model, followed by every consumer ({@code lm perplexity},
 * {@code lm sentence-scores}, rescoring, the lattice search): the model's recorded unit and normalisation flags
 * (case folding, punctuation, hyphens, whitespace; see {@link ModelMetadata}), plus a rules file, which a model
 * file cannot record (a path is machine-specific): the user's when one is given, else the model's own (always
 * none for a model read from a file). The user's case/punctuation/hyphen/space options never change the
 * model's tokens: the text is normalised as the model was trained.
 *
 * <pre>{@code
 * Normaliser n = ModelText.normaliser(model, rulesFile);
 * List<String> tokens = n.tokenList(line, model.unit());
 * }</pre>
 */
public final class ModelText {
  private ModelText() {}

  /** The normalisation text gets before it meets {@code model}; {@code userRules} may be null. */
  public static NormalisationOptions options(LanguageModel model, Path userRules) {
    NormalisationOptions m = model.normalisation();
    return new NormalisationOptions(m.foldCase(), m.stripPunctuation(), m.splitHyphens(), m.ignoreWhitespace(),
        userRules != null ? userRules : m.rulesFile());
  }

  /** A normaliser of {@link #options}; tokenise with {@code model.unit()}. Reads the rules file once. */
  public static Normaliser normaliser(LanguageModel model, Path userRules) {
    return Normaliser.create(options(model, userRules));
  }

  /**
   * Whether text normalised with {@code scoring} at {@code unit} is already exactly what the model gets (same
   * unit, flags and rules file), so one tokenisation can serve both.
   */
  public static boolean sameAsScoring(LanguageModel model, NormalisationOptions scoring, Unit unit) {
    return model.unit() == unit && options(model, scoring.rulesFile()).equals(scoring);
  }

  /** {@code raw} as the model sees it (a convenience for one-off calls; keep a {@link #normaliser} for many). */
  public static TokenSequence tokens(LanguageModel model, Path userRules, String raw) {
    return normaliser(model, userRules).tokens(raw, model.unit());
  }
}
