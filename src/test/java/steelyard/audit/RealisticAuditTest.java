package steelyard.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import steelyard.eval.Aligner;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.lattice.LatticeSettings;
import steelyard.lm.LanguageModel;
import steelyard.lm.train.CorpusFile;
import steelyard.lm.train.Smoothing;
import steelyard.lm.train.Trainer;
import steelyard.lm.train.TrainingOptions;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.Tokenizer;
import steelyard.rescore.UtteranceResult;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * The audit on real recogniser output (../shared/realistic/asr, see its README): 80 utterances × 20 hypotheses,
 * a word 3-gram (interpolated modified Kneser-Ney) trained in memory on the set's corpus, as in
 * {@code rescore.RealisticRescoreTest}. N-best at λ = 10, μ = 0 (the weights DEVELOPERS.md reports for this
 * set) and the lattice search at α = 0.05, λ′ = 2 (the setting the tuning issue found): the identities and
 * the flip weights of {@link AuditChecks} hold on every overrule. Skipped when the folder is absent.
 */
class RealisticAuditTest {
  static LanguageModel lm;
  static List<ScoredUtterance> scored;
  static List<String> references;
  static final Normaliser EXACT = Normaliser.create(NormalisationOptions.EXACT);
  static final Tokenizer WORDS = raw -> EXACT.tokens(raw, Unit.WORD);

  static Path realistic() {
    for (String p : new String[] {"../shared/realistic", "../../shared/realistic", "/work/shared/realistic"}) {
      Path d = Path.of(p, "asr");
      if (Files.isDirectory(d)) return d;
    }
    return null;
  }

  @BeforeAll
  static void load() {
    Path base = realistic();
    assumeTrue(base != null, "realistic fixtures not found (../shared/realistic/asr)");
    TrainingOptions training = new TrainingOptions(3, Unit.WORD, NormalisationOptions.EXACT, Smoothing.MKN, 0, 0, new int[0], 1.0);
    lm = new Trainer(training).train(new CorpusFile(base.resolve("corpus.txt"), EXACT, Unit.WORD)).model();
    ImportOptions options = ImportOptions.strict(List.of(FeatureSpec.parse("acoustic")));
    Map<String, Reference> refs = ReferencesReader.readAll(base.resolve("dev.refs.csv"), options);
    HypothesisScorer scorer = new HypothesisScorer(lm, WORDS, WORDS, 1, 0);
    scored = new ArrayList<>();
    references = new ArrayList<>();
    try (HypothesesReader r = HypothesesReader.open(base.resolve("dev.nbest.csv"), options)) {
      while (r.hasNext()) {
        ScoredUtterance s = scorer.score(r.next());
        scored.add(s);
        references.add(refs.get(s.uttId()).text());
      }
    }
  }

  @Test
  void nbestOverrulesHoldTheIdentitiesAndExactFlipWeights() {
    RescoreWeights w = weights(10, 0, 1, 0);
    Audited a = audit(w, RescoreMethod.NBEST);
    int edges = AuditChecks.nbestFlips(a.report, a.results, 0);
    print("N-best", a.report.total(), edges);
    assertThat(a.report.total().overrules()).isGreaterThan(20);
    assertThat(a.report.total().netErrorChange()).as("λ = 10 helps on this set").isPositive();
  }

  @Test
  void latticeOverrulesHoldTheIdentitiesAndPoolFlipWeights() {
    RescoreWeights w = weights(0, 0, 0.05, 2);
    Audited a = audit(w, RescoreMethod.LATTICE);
    int edges = AuditChecks.networkFlips(a.report, a.results, w, lm);
    print("lattice", a.report.total(), edges);
    assertThat(edges).isGreaterThan(20);
  }

  private static void print(String method, AuditCounts c, int edges) {
    System.out.printf("realistic asr %s: %d overrules (%d helped, %d hurt), net %d errors, %d flip edges checked%n",
        method, c.overrules(), c.helped(), c.hurt(), c.netErrorChange(), edges);
  }

  private record Audited(AuditReport report, List<AuditInput> inputs, Map<String, UtteranceResult> results) {}

  /** Rescores every utterance, audits the run and checks its counts, net change and n-gram sums. */
  private static Audited audit(RescoreWeights w, RescoreMethod method) {
    NbestRescorer rescorer = new NbestRescorer(null, List.of("acoustic"), w, method, lm, () -> new Aligner()::distance);
    List<AuditInput> inputs = new ArrayList<>();
    Map<String, UtteranceResult> results = new HashMap<>();
    for (int k = 0; k < scored.size(); k++) {
      UtteranceResult r = rescorer.choose(scored.get(k));
      inputs.add(AuditInput.of(r, WORDS.tokenize(references.get(k))));
      results.put(r.uttId(), r);
    }
    AuditSettings settings = new AuditSettings(List.of("acoustic"), Unit.WORD, lm, WORDS, w.latticeSettings(),
        AuditSettings.DEFAULT_POOL_SIZE, AuditSettings.DEFAULT_TOP_PAIRS);
    AuditReport report = new OverruleAuditor(settings).auditAll(inputs);
    AuditChecks.countsAndNetChange(report, inputs, references, WORDS);
    AuditChecks.ngramSums(report, results, lm);
    return new Audited(report, inputs, results);
  }

  private static RescoreWeights weights(double lambda, double mu, double alpha, double latticeLambda) {
    return new RescoreWeights(Map.of("acoustic", 1.0), lambda, 0, mu, alpha, Map.of(), RescoreWeights.DEFAULT_MBR_MAX_HYPOTHESES,
        latticeLambda, 0, LatticeSettings.DEFAULT_BEAM, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
  }
}
