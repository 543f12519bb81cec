package steelyard.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import steelyard.io.InputException;
import steelyard.lm.LanguageModel;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredSet;
import steelyard.rescore.ScoredUtterance;

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

  /**
   * The utterances of {@code set} that have a reference, as the rescoring service scored them, starting from
   * {@code start}; every reported error comes from {@code session}'s own choice ({@link RescoreSession#withWeights}
   * then {@link RescoreSession#choose}), so {@code rescore --refs} with the tuned weights counts exactly the errors
   * the tuner reports. The one way the {@code tune} command, the demo, the report's charts and the window make a
   * tuning input from loaded data.
   *
   * <p>Builds each utterance's token ids first, under the utterance's lock, so that choices made on other threads
   * meanwhile only read them. Cost: one pass over the hypotheses' tokens.
   *
   * @throws InputException when no utterance of {@code set} has a reference
   */
  public static TuneInput of(ScoredSet set, RescoreSession session, RescoreWeights start) {
    List<DevUtterance> dev = new ArrayList<>();
    for (ScoredSet.Entry e : set.utterances()) {
      if (e.reference() == null) continue;
      ScoredUtterance s = e.scores();
      synchronized (s) {
        s.tokenIds();
      }
      dev.add(new DevUtterance(s, e.reference(), e.group()));
    }
    if (dev.isEmpty())
      throw InputException.option("--refs", "no reference has the utt_id of an utterance with hypotheses",
          "references for the utterances of the hypotheses file");
    ChooserFactory chooser = (w, m) -> session.withWeights(w, m)::choose;
    return new TuneInput(dev, set.featureNames(), session.model(), start, chooser);
  }

  /** With the standard chooser ({@link ChooserFactory#standard}). */
  public static TuneInput of(List<DevUtterance> utterances, List<String> featureNames, LanguageModel model, RescoreWeights start) {
    return new TuneInput(utterances, featureNames, model, start, ChooserFactory.standard(featureNames, model));
  }

  public int size() {
    return utterances.size();
  }
}
