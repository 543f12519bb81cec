package steelyard.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.lm.BackoffModel;
import steelyard.lm.CompactModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.RandomModels;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.UtteranceResult;

/**
 * The audit's identities and flip weights on seeded random N-best problems: random back-off models (with
 * and without suffix-closed n-grams, unknown words in the texts), random lists with duplicate texts, random
 * weights, some utterances without a reference. Each check names its source in {@link AuditChecks}.
 */
class AuditPropertiesTest {
  static final int VOCAB = 10;

  @Test
  void nbestAuditsHoldTheIdentitiesAndExactFlipWeights() {
    long seed = 20261204L;
    SplittableRandom rnd = new SplittableRandom(seed);
    int overrules = 0;
    int edges = 0;
    for (int run = 0; run < 40; run++) {
      LanguageModel lm = model(rnd);
      double mu = rnd.nextDouble(-2, 2);
      RescoreWeights w = AuditFixtures.weights(rnd.nextDouble(0, 4), mu, 1, 0, 0);
      Run r = run(rnd, lm, w, RescoreMethod.NBEST, 30);
      AuditChecks.countsAndNetChange(r.report, r.inputs, r.refs, AuditFixtures.WHITESPACE);
      AuditChecks.ngramSums(r.report, r.results, lm);
      edges += AuditChecks.nbestFlips(r.report, r.results, mu);
      overrules += r.report.overrules().size();
    }
    System.out.printf("seed %d: %d N-best overrules, %d flip edges checked%n", seed, overrules, edges);
    assertThat(edges).as("seed %d", seed).isGreaterThan(200);
  }

  @Test
  void latticeAuditsHoldTheIdentitiesAndPoolFlipWeights() {
    long seed = 20261205L;
    SplittableRandom rnd = new SplittableRandom(seed);
    int edges = 0;
    for (int run = 0; run < 20; run++) {
      LanguageModel lm = model(rnd);
      RescoreWeights w = AuditFixtures.weights(0, 0, rnd.nextDouble(0.05, 1), rnd.nextDouble(0, 2), rnd.nextDouble(-1, 1));
      Run r = run(rnd, lm, w, RescoreMethod.LATTICE, 15);
      AuditChecks.countsAndNetChange(r.report, r.inputs, r.refs, AuditFixtures.WHITESPACE);
      AuditChecks.ngramSums(r.report, r.results, lm);
      edges += AuditChecks.networkFlips(r.report, r.results, w, lm);
      for (Overrule o : r.report.overrules()) {
        assertThat(o.path()).isNotNull();
        if (o.path().first() != null && Double.isFinite(o.path().margin()))
          assertThat(o.path().margin()).as("the search's pick scores at least rank 1's own path").isGreaterThanOrEqualTo(-1e-9);
      }
    }
    System.out.printf("seed %d: %d lattice flip edges checked%n", seed, edges);
    assertThat(edges).as("seed %d", seed).isGreaterThan(50);
  }

  @Test
  void mbrAuditsHoldTheIdentitiesWithoutFlipWeights() {
    long seed = 20261206L;
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int run = 0; run < 10; run++) {
      LanguageModel lm = model(rnd);
      Run r = run(rnd, lm, AuditFixtures.weights(rnd.nextDouble(0, 4), 0, 0.3, 0, 0), RescoreMethod.MBR, 20);
      AuditChecks.countsAndNetChange(r.report, r.inputs, r.refs, AuditFixtures.WHITESPACE);
      AuditChecks.ngramSums(r.report, r.results, lm);
      assertThat(r.report.overrules()).allSatisfy(o -> assertThat(o.flip()).isNull());
    }
  }

  private static LanguageModel model(SplittableRandom rnd) {
    BackoffModel m = RandomModels.model(rnd, 2 + rnd.nextInt(3), VOCAB, 40, true, rnd.nextBoolean());
    return rnd.nextBoolean() ? m : CompactModel.of(m);
  }

  private record Run(AuditReport report, List<AuditInput> inputs, List<String> refs, Map<String, UtteranceResult> results) {}

  private static Run run(SplittableRandom rnd, LanguageModel lm, RescoreWeights w, RescoreMethod method, int utterances) {
    NbestRescorer rescorer = AuditFixtures.rescorer(lm, w, method);
    List<AuditInput> inputs = new ArrayList<>();
    List<String> refs = new ArrayList<>();
    Map<String, UtteranceResult> results = new HashMap<>();
    for (int u = 0; u < utterances; u++) {
      UtteranceResult r = rescorer.rescore(utterance(rnd, "u" + u));
      String ref = rnd.nextInt(5) == 0 ? null : sentence(rnd);
      inputs.add(new AuditInput(r, ref == null ? null : AuditFixtures.tokens(ref), rnd.nextInt(4) == 0 ? null : "g" + rnd.nextInt(3)));
      refs.add(ref);
      results.put(r.uttId(), r);
    }
    AuditReport report = new OverruleAuditor(AuditFixtures.settings(lm, w)).auditAll(inputs);
    return new Run(report, inputs, refs, results);
  }

  /** 1–12 hypotheses, rank = row; a quarter of the later rows repeat an earlier text (with another score). */
  private static UtteranceHypotheses utterance(SplittableRandom rnd, String id) {
    int n = 1 + rnd.nextInt(12);
    List<Hypothesis> hyps = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      String text = i > 0 && rnd.nextInt(4) == 0 ? hyps.get(rnd.nextInt(i)).text() : sentence(rnd);
      hyps.add(new Hypothesis(id, "", i + 1, text, new double[] {rnd.nextDouble(-30, 0)}, "h" + rnd.nextInt(2), i, i + 2));
    }
    return new UtteranceHypotheses(id, hyps, 0);
  }

  private static String sentence(SplittableRandom rnd) {
    return String.join(" ", RandomModels.sentence(rnd, VOCAB, rnd.nextInt(8)));
  }
}
