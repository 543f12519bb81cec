package steelyard.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import picocli.CommandLine.Option;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.WeightsSpec;

/**
 * The weights layers of the rescoring commands: {@code --weights FILE} (the lower layer) and one option per
 * weight (the upper layer); each weight is "not given" unless used, so the weights file can supply it.
 */
public final class RescoreWeightOptions {
  @Option(names = "--weights", paramLabel = "FILE", description = "Weights file (JSON) to start from; options given here override it.")
  public Path weightsFile;

  @Option(names = "--weight", paramLabel = "NAME=V", description = "Weight of a feature column (repeatable; default 1 for every listed feature).")
  Map<String, String> features = new LinkedHashMap<>();

  @Option(names = "--lm-weight", paramLabel = "λ", description = "Weight of the model's ln P(sentence) (default 0).")
  Double lmWeight;

  @Option(names = "--oov-weight", paramLabel = "ω", description = "Added per out-of-vocabulary token (default 0).")
  Double oovWeight;

  @Option(names = "--length-weight", paramLabel = "μ", description = "Added per token; negative penalises long hypotheses (default 0).")
  Double lengthWeight;

  @Option(names = "--posterior-sharpness", paramLabel = "α", description = "Sharpness of the posteriors: totals are multiplied by α before the softmax; above 1 sharper, below 1 flatter (default 1).")
  Double posteriorScale;

  @Option(names = "--system-weight", paramLabel = "NAME=V", description = "Weight of a system when mixing posteriors (repeatable; default equal).")
  Map<String, String> systems = new LinkedHashMap<>();

  @Option(names = "--mbr-max-hyps", paramLabel = "N", description = "Cap on distinct texts entering the MBR sum, by posterior (default 100).")
  Integer mbrMaxHyps;

  @Option(names = "--lattice-lm-weight", paramLabel = "λ′", description = "LM weight of the confusion-network search (default 0).")
  Double latticeLmWeight;

  @Option(names = "--lattice-length-weight", paramLabel = "μ′", description = "Per-token weight of the confusion-network search (default 0).")
  Double latticeLengthWeight;

  @Option(names = "--beam", paramLabel = "N", description = "States kept per slot in the confusion-network search.")
  Integer beam;

  @Option(names = "--lattice-max-hyps", paramLabel = "N", description = "Cap on hypotheses entering one confusion network, by posterior.")
  Integer latticeMaxHyps;

  @Option(names = "--vote-confidence", paramLabel = "NAME",
      description = "Feature column (one of --features) whose natural-log confidence weighs each hypothesis's vote in consensus/lattice.")
  String voteConfidence;

  /**
   * The options given on the command line that {@code method} does not use, e.g. {@code --beam} with
   * {@code nbest}; each deserves a warning, since the run silently differs from what the user asked for.
   */
  List<String> ignoredBy(RescoreMethod method) {
    List<String> out = new ArrayList<>();
    if (mbrMaxHyps != null && method != RescoreMethod.MBR) out.add("--mbr-max-hyps");
    boolean search = method == RescoreMethod.LATTICE;
    if (latticeLmWeight != null && !search) out.add("--lattice-lm-weight");
    if (latticeLengthWeight != null && !search) out.add("--lattice-length-weight");
    if (beam != null && !search) out.add("--beam");
    if (latticeMaxHyps != null && !method.usesNetwork()) out.add("--lattice-max-hyps");
    return out;
  }

  /**
   * The options as a partial weights spec (the upper layer of a {@link steelyard.rescore.RescoreConfig}, which
   * checks that {@code --weight} and {@code --vote-confidence} name features of the run).
   */
  WeightsSpec spec() {
    WeightsSpec s = new WeightsSpec();
    for (Map.Entry<String, String> e : features.entrySet()) s.features.put(e.getKey(), finite("--weight " + e.getKey(), e.getValue()));
    for (Map.Entry<String, String> e : systems.entrySet()) {
      double v = finite("--system-weight " + e.getKey(), e.getValue());
      if (!(v > 0)) throw InputException.option("--system-weight", e.getKey() + " is " + v, "a weight > 0");
      s.systemWeights.put(e.getKey(), v);
    }
    s.lmWeight = check("--lm-weight", lmWeight);
    s.oovWeight = check("--oov-weight", oovWeight);
    s.lengthWeight = check("--length-weight", lengthWeight);
    s.posteriorScale = check("--posterior-sharpness", posteriorScale);
    if (posteriorScale != null && !(posteriorScale > 0))
      throw InputException.option("--posterior-sharpness", "is " + posteriorScale, "a number > 0");
    s.latticeLmWeight = check("--lattice-lm-weight", latticeLmWeight);
    s.latticeLengthWeight = check("--lattice-length-weight", latticeLengthWeight);
    s.mbrMaxHypotheses = positive("--mbr-max-hyps", mbrMaxHyps);
    s.beam = positive("--beam", beam);
    s.latticeMaxHypotheses = positive("--lattice-max-hyps", latticeMaxHyps);
    s.voteConfidence = voteConfidence;
    return s;
  }

  private static double finite(String option, String text) {
    try {
      double v = Double.parseDouble(text.trim());
      if (Double.isFinite(v)) return v;
    } catch (NumberFormatException e) {
      // reported below
    }
    throw InputException.option(option, "'" + text + "' is not a number", "a finite number");
  }

  private static Double check(String option, Double v) {
    if (v != null && !Double.isFinite(v)) throw InputException.option(option, "is " + v, "a finite number");
    return v;
  }

  private static Integer positive(String option, Integer v) {
    if (v != null && v < 1) throw InputException.option(option, "is " + v, "a number >= 1");
    return v;
  }
}
