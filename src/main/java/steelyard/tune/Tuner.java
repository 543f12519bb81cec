package steelyard.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;

/**
 * The tuning service: chooses the weights (and, unless restricted, the method) with the fewest errors on a dev
 * set with references, and says how far that figure can be trusted on held-out data.
 *
 * <ol>
 *   <li>N-best weights (features, λ, ω, μ) by minimum-error training: exact line searches
 *       ({@link LineSearch}, Och 2003 §5) in coordinate ascent with random directions and restarts
 *       ({@link LinearTuner}, Cer, Jurafsky &amp; Manning 2008). They also feed the posteriors of the network
 *       methods, so they are tuned first.</li>
 *   <li>Each network method: α and system weights by a coarse-to-fine grid ({@link NetworkTuning}); for the
 *       lattice method λ′ and μ′ at each grid point over merged k-best path pools ({@link LatticeRound}).</li>
 *   <li>k-fold cross-validation over utterances ({@link Folds}): every fold is tuned on the other folds and
 *       scored on its own utterances; the result carries the cross-validated rate beside the in-sample one and
 *       warns when it lies outside the in-sample rate's 95 % bootstrap interval.</li>
 * </ol>
 *
 * <p>Every reported error comes from the chooser of {@link TuneInput#chooser()}; weights that do not beat the
 * starting ones on the dev set are not kept. Results are the same for any thread count and depend only on the
 * inputs and the seed.
 *
 * <pre>{@code
 * TuneResult r = Tuner.tune(TuneInput.of(dev, features, model, start), TuneSettings.builder().threads(2).build(),
 *     (done, what) -> bar.update(done, what), () -> cancelled.get());
 * }</pre>
 */
public final class Tuner {
  private Tuner() {}

  /**
   * Tunes; {@code progress} hears from the calling thread, {@code cancelled} is polled before every block of
   * work.
   *
   * @throws InputException        when {@code settings.tune()} names an unknown weight, or λ, ω or λ′ without a model
   * @throws CancellationException when {@code cancelled} answered true (nothing is returned)
   */
  public static TuneResult tune(TuneInput input, TuneSettings settings, TuneProgress progress, BooleanSupplier cancelled) {
    checkNames(input, settings);
    try (Workers workers = new Workers(settings.threads(), cancelled)) {
      return new TuneRun(input, settings, progress, workers).run();
    }
  }

  /** Every weight the run could move, in the order {@code --tune} lists them in its help. */
  public static List<String> tunableNames(TuneInput input) {
    List<String> names = new ArrayList<>(NbestTuning.columnNames(input.featureNames()));
    names.add(WeightNames.POSTERIOR_SHARPNESS);
    for (String s : NetworkData.systems(input)) names.add(WeightNames.system(s));
    names.add(WeightNames.LATTICE_LM);
    names.add(WeightNames.LATTICE_LENGTH);
    return names;
  }

  private static void checkNames(TuneInput input, TuneSettings settings) {
    if (settings.tune() == null) return;
    List<String> known = tunableNames(input);
    for (String n : new java.util.TreeSet<>(settings.tune())) {
      if (!known.contains(n)) throw InputException.option("--tune", "names '" + n + "'", "one of " + String.join(", ", known));
      boolean needsModel = n.equals(WeightNames.LM) || n.equals(WeightNames.OOV) || n.equals(WeightNames.LATTICE_LM);
      if (needsModel && input.model() == null)
        throw InputException.option("--tune", "names '" + n + "' but no model is loaded", "--lm FILE, or a list without it");
    }
  }

  /** The methods in the order they are tuned and reported. */
  static List<RescoreMethod> order(TuneSettings s) {
    List<RescoreMethod> out = new ArrayList<>();
    for (RescoreMethod m : RescoreMethod.values()) if (s.methods().contains(m)) out.add(m);
    return out;
  }
}
