package steelyard.tune;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.BooleanSupplier;
import steelyard.io.Reference;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredSet;
import steelyard.rescore.TuningRecord;
import steelyard.rescore.WeightsSpec;

/**
 * Weight tuning on dev files through the rescoring service: load the dev set ({@link #load}), tune
 * ({@link #run}), and the weights file that records where the weights came from ({@link #weightsFile}). What the
 * {@code tune} command and the demo call; a window that already holds a {@link ScoredSet} makes its input with
 * {@link TuneInput#of(ScoredSet, RescoreSession, RescoreWeights)}, runs {@link Tuner#tune} and saves
 * {@link #weightsFile}.
 *
 * <pre>{@code
 * RescoreSession session = RescoreSession.open(config);            // features, start weights, model, unit
 * TuneJob.Dev dev = TuneJob.load(session, devHyps, devRefs, threads, LoadListener.NONE, () -> false);
 * TuneJob.Outcome o = TuneJob.run(dev, TuneSettings.defaults().withThreads(threads), progress, () -> false);
 * WeightsFile.save(Path.of("tuned.weights.json"), o.weights());
 * RescoreSession tuned = session.withWeights(o.result().weights(), o.result().method());
 * }</pre>
 */
public final class TuneJob {
  private TuneJob() {}

  /**
   * A dev set in memory, ready to tune.
   *
   * @param session    the session that scored it (features, start weights, model, unit, normalisation)
   * @param hypotheses the dev hypotheses file
   * @param references the dev references file
   * @param set        every utterance as scored, with references
   * @param referenceOrder the references file's ids in file order
   * @param input      the utterances with a reference, from the session's weights
   * @param warnings   what the load left out: utterances without a reference, references without hypotheses
   */
  public record Dev(RescoreSession session, Path hypotheses, Path references, ScoredSet set, List<String> referenceOrder,
      TuneInput input, List<String> warnings) {
    public Dev {
      referenceOrder = List.copyOf(referenceOrder);
      warnings = List.copyOf(warnings);
    }
  }

  /**
   * A finished tuning run.
   *
   * @param dev     what was tuned on
   * @param result  the tuner's result
   * @param weights the weights file to save: the tuned weights with unit, model identity, method and
   *                {@link TuningRecord}
   */
  public record Outcome(Dev dev, TuneResult result, WeightsSpec weights) {
    /** The session's warnings (from opening it), the load's, then the tuner's. */
    public List<String> warnings() {
      List<String> w = new ArrayList<>(dev.session().warnings());
      w.addAll(dev.warnings());
      w.addAll(result.warnings());
      return w;
    }
  }

  /**
   * Reads and scores the dev hypotheses and references with {@code session} ({@link RescoreSession#loadAll}).
   * Utterances without a reference and references without hypotheses cannot be tuned on; they are left out
   * with a warning each (a dev set where no reference matches is an {@link steelyard.io.InputException}).
   */
  public static Dev load(RescoreSession session, Path hyps, Path refs, int threads, RescoreSession.LoadListener listener,
      BooleanSupplier cancelled) {
    Map<String, Reference> references = session.readReferences(refs);
    ScoredSet set = session.loadWithReferences(hyps, references, threads, listener, cancelled);
    TuneInput input = TuneInput.of(set, session, session.weights());
    List<String> warnings = new ArrayList<>();
    int noRef = set.missingReferences().size();
    if (noRef > 0)
      warnings.add(String.format(Locale.ROOT, "%d utterances of %s have no reference and are left out of tuning (first: %s)",
          noRef, hyps, set.missingReferences().get(0)));
    int noHyps = set.missingHypotheses().size();
    if (noHyps > 0)
      warnings.add(String.format(Locale.ROOT, "%d references of %s have no hypotheses and are left out of tuning (first: %s); "
          + "rescore --refs counts them as all deletions", noHyps, refs, set.missingHypotheses().get(0).uttId()));
    return new Dev(session, hyps, refs, set, new ArrayList<>(references.keySet()), input, warnings);
  }

  /**
   * Tunes on {@code dev} ({@link Tuner#tune}): {@code progress} hears from the calling thread, {@code cancelled}
   * is polled before every block of work.
   *
   * @throws java.util.concurrent.CancellationException when cancelled (nothing is returned, nothing written)
   */
  public static Outcome run(Dev dev, TuneSettings settings, TuneProgress progress, BooleanSupplier cancelled) {
    TuneResult r = Tuner.tune(dev.input(), settings, progress, cancelled);
    return new Outcome(dev, r, weightsFile(dev.session(), dev.input(), r, dev.hypotheses(), dev.references()));
  }

  /**
   * The weights file of a tuning result: every weight of {@code r}'s method, the session's unit and model identity
   * (the model file is hashed once), the method, and a {@link TuningRecord} with the dev files' names, sizes and
   * SHA-256 (read once each now), the utterance and token counts and the dev figures.
   */
  public static WeightsSpec weightsFile(RescoreSession session, TuneInput input, TuneResult r, Path hyps, Path refs) {
    WeightsSpec s = WeightsSpec.of(r.weights(), session.unit(), session.config().modelPath() == null ? null : session.modelIdentity());
    s.method = r.method();
    s.tuning = new TuningRecord(TuningRecord.DataFile.of(hyps), TuningRecord.DataFile.of(refs), r.utterances(), r.referenceTokens(),
        changed(input, input.start(), r.weights()), r.devErrorRate(), r.cvErrorRate(), r.folds(), r.seed());
    return s;
  }

  /** The names of the weights whose value differs between {@code from} and {@code to}, in {@link Tuner#tunableNames} order. */
  static List<String> changed(TuneInput input, RescoreWeights from, RescoreWeights to) {
    List<String> out = new ArrayList<>();
    for (String n : Tuner.tunableNames(input))
      if (Double.compare(WeightNames.valueOf(from, n), WeightNames.valueOf(to, n)) != 0) out.add(n);
    return out;
  }
}
