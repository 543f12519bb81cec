package steelyard.tune;

import java.util.List;
import java.util.Objects;
import steelyard.lm.LanguageModel;
import steelyard.rescore.RescoreWeights;

/**
 * The dev data and starting point of a tuning run, all in memory.
 *
 * <p>The tuner reads each {@link DevUtterance#scores()} from its worker threads (one utterance per thread at a
 * time; {@link steelyard.rescore.ScoredUtterance#idsOf} keeps a lazily built vocabulary), so the caller must not
 * use the same utterances from other threads while a run lasts.
 *
 * @param utterances   the dev utterances with references (at least one reference token in all)
 * @param featureNames the feature columns, aligned with every utterance's features
 * @param model        the model for the lattice search (and whose ln P the hypotheses carry); null when none,
 *                     then λ, ω and λ′ stay at their start values
 * @param start        the starting weights (e.g. from the command line or a weights file)
 * @param chooser      the choice with given weights, e.g. {@link ChooserFactory#standard}
 */
public record TuneInput(
    List<DevUtterance> utterances, List<String> featureNames, LanguageModel model, RescoreWeights start, ChooserFactory chooser) {
  public TuneInput {
    utterances = List.copyOf(utterances);
    featureNames = List.copyOf(featureNames);
    Objects.requireNonNull(start, "start");
    Objects.requireNonNull(chooser, "chooser");
    if (utterances.isEmpty()) throw new IllegalArgumentException("no dev utterances");
    for (DevUtterance u : utterances)
      if (u.scores().featureCount() != featureNames.size())
        throw new IllegalArgumentException(u.scores().uttId() + " has " + u.scores().featureCount() + " features, expected "
            + featureNames.size());
  }

  /** With the standard chooser ({@link ChooserFactory#standard}). */
  public static TuneInput of(List<DevUtterance> utterances, List<String> featureNames, LanguageModel model, RescoreWeights start) {
    return new TuneInput(utterances, featureNames, model, start, ChooserFactory.standard(featureNames, model));
  }

  public int size() {
    return utterances.size();
  }
}
