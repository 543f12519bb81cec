package steelyard.tune;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.io.UtteranceHypotheses;
import steelyard.lm.LanguageModel;
import steelyard.lm.train.CorpusFile;
import steelyard.lm.train.Smoothing;
import steelyard.lm.train.Trainer;
import steelyard.lm.train.TrainingOptions;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.Tokenizer;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * The lattice tuner on real recogniser output (../shared/realistic/asr, see its README: 80 utterances of
 * 20-best lists, rank 1 WER 60.5 %, N-best oracle 46.0 %), with a word 3-gram (modified Kneser-Ney) trained on
 * its corpus as in {@code rescore.RealisticRescoreTest}. The check: the tuner's dev error is at least as low as
 * a plain grid over the same parameters (α, λ′, μ′), with the N-best weights the tuner chose (brute force over
 * the grid, each point scored by the rescorer itself). Skips when the fixtures are absent.
 */
class RealisticTuneTest {
  static final List<String> FEATURES = List.of("acoustic");
  static final double[] SCALES = {0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1};
  static final double[] LATTICE_LM = {0, 0.5, 1, 1.5, 2, 3, 4};
  static final double[] LATTICE_LENGTH = {-2, -1, 0, 1, 2, 4};

  private static TuneInput input;

  static Path realistic() {
    for (String p : new String[] {"../shared/realistic", "../../shared/realistic", "/work/shared/realistic"}) {
      Path d = Path.of(p);
      if (Files.isDirectory(d.resolve("asr"))) return d.resolve("asr");
    }
    return null;
  }

  @BeforeAll
  static void load() {
    Path asr = realistic();
    if (asr == null) return;
    TrainingOptions training = new TrainingOptions(3, Unit.WORD, NormalisationOptions.EXACT, Smoothing.MKN, 0, 0, new int[0], 1.0);
    LanguageModel lm = new Trainer(training)
        .train(new CorpusFile(asr.resolve("corpus.txt"), Normaliser.create(NormalisationOptions.EXACT), Unit.WORD)).model();
    Normaliser norm = Normaliser.create(NormalisationOptions.EXACT);
    Tokenizer words = raw -> norm.tokens(raw, Unit.WORD);
    ImportOptions options = ImportOptions.strict(List.of(FeatureSpec.parse("acoustic")));
    Map<String, Reference> refs = ReferencesReader.readAll(asr.resolve("dev.refs.csv"), options);
    HypothesisScorer scorer = new HypothesisScorer(lm, words, words, 1, 0);
    List<DevUtterance> dev = new ArrayList<>();
    try (HypothesesReader r = HypothesesReader.open(asr.resolve("dev.nbest.csv"), options)) {
      while (r.hasNext()) {
        UtteranceHypotheses u = r.next();
        dev.add(new DevUtterance(scorer.score(u), words.tokenize(refs.get(u.uttId()).text()), refs.get(u.uttId()).group()));
      }
    }
    input = TuneInput.of(dev, FEATURES, lm, RescoreWeights.defaults(FEATURES));
  }

  @Test
  void latticeTunerReachesAtLeastTheBestPointOfAPlainGridOverTheSameParameters() {
    assumeTrue(input != null, "realistic fixtures not found (../shared/realistic/asr); skipped");
    TuneSettings settings = TuneSettings.builder().methods(Set.of(RescoreMethod.LATTICE)).threads(2).build();
    TuneResult r = Tuner.tune(input, settings, TuneProgress.NONE, () -> false);
    MethodFigures f = r.figures(RescoreMethod.LATTICE);
    RescoreWeights w = f.weights();
    long gridBest = Long.MAX_VALUE;
    String gridAt = "";
    for (double a : SCALES) {
      for (double l : LATTICE_LM) {
        for (double m : LATTICE_LENGTH) {
          long e = DevErrors.score(input, NetworkTuning.with(w, a, w.systemWeights(), l, m), RescoreMethod.LATTICE, 2).errors();
          if (e < gridBest) {
            gridBest = e;
            gridAt = String.format(Locale.ROOT, "α=%s λ′=%s μ′=%s", a, l, m);
          }
        }
      }
    }
    System.out.printf(Locale.ROOT,
        "realistic asr lattice tuning: rank 1 %.2f %%, tuned %.2f %% (CV %.2f %%) at α=%s λ′=%.3f μ′=%.3f, λ=%.3f μ=%.3f; "
            + "grid best %.2f %% at %s; %d rounds%n",
        100 * r.devFirstErrorRate(), 100 * f.devErrorRate(), 100 * f.cvErrorRate(), w.posteriorScale(), w.latticeLmWeight(),
        w.latticeLengthWeight(), w.lmWeight(), w.lengthWeight(), 100.0 * gridBest / r.referenceTokens(), gridAt, f.iterations());
    assertThat(f.devErrors()).as("tuned vs grid best at " + gridAt).isLessThanOrEqualTo(gridBest);
  }
}
