package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static steelyard.rescore.Fixtures.row;
import static steelyard.rescore.Fixtures.utterance;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import steelyard.eval.EditCounts;
import steelyard.eval.PairedComparison;
import steelyard.io.FeatureSpec;

/** The summary's paired test against rank 1 and its collapsed-posterior warning. */
class RescoreSummaryTest {
  @Nested
  class VersusRankOne {
    /** Per-utterance errors (choice, rank 1) through the summary, with 10 reference tokens each. */
    private RescoreSummary summaryOf(int[] chosen, int[] first) {
      RescoreSummary summary = new RescoreSummary();
      UtteranceResult r = plain().rescore(utterance("u", row("", 1, "a", 0.0)));
      for (int i = 0; i < chosen.length; i++) {
        summary.add(r, new UtteranceErrors(new EditCounts(10 - chosen[i], chosen[i], 0, 0), new EditCounts(10 - first[i], first[i], 0, 0),
            EditCounts.ZERO, -1));
      }
      return summary;
    }

    @Test
    void countsBetterWorseAndTiedUtterancesAsABruteForceComparisonDoes() {
      int[] chosen = {0, 1, 3, 2, 0, 5, 1, 1};
      int[] first = {2, 1, 1, 4, 0, 6, 3, 0};
      PairedComparison c = summaryOf(chosen, first).versusFirst(200, 7, 1);
      int better = 0;
      int worse = 0;
      for (int i = 0; i < chosen.length; i++) {
        if (chosen[i] < first[i]) better++;
        if (chosen[i] > first[i]) worse++;
      }
      assertThat(c.bBetter()).isEqualTo(better);
      assertThat(c.aBetter()).isEqualTo(worse);
      assertThat(c.ties()).isEqualTo(chosen.length - better - worse);
      // rate difference = (Σ chosen − Σ first) / Σ reference tokens
      assertThat(c.difference()).isCloseTo((13.0 - 17.0) / 80.0, within(1e-12));
      assertThat(c.paired().difference().low()).isLessThanOrEqualTo(c.difference());
      assertThat(c.paired().difference().high()).isGreaterThanOrEqualTo(c.difference());
    }

    /**
     * The exact two-sided sign test against the binomial sum done in exact integer arithmetic: p = 2·Σ_{i≤k} C(n,i)/2ⁿ
     * (the definition of the test, e.g. Conover, "Practical Nonparametric Statistics", §3.4).
     */
    @Test
    void itsSignTestPValueIsTheExactBinomialTail() {
      int[] chosen = {0, 0, 0, 0, 0, 0, 0, 1, 2, 2};
      int[] first = {1, 1, 1, 1, 1, 1, 1, 0, 2, 2};
      PairedComparison c = summaryOf(chosen, first).versusFirst(100, 3, 1);
      int n = 8;
      BigInteger tail = BigInteger.ZERO;
      for (int i = 0; i <= 1; i++) tail = tail.add(binomial(n, i));
      double exact = new BigDecimal(tail.shiftLeft(1)).divide(new BigDecimal(BigInteger.ONE.shiftLeft(n)), MathContext.DECIMAL64).doubleValue();
      assertThat(c.signTestP()).isCloseTo(exact, within(1e-12)); // 2·9/256 = 0.0703125
    }

    private BigInteger binomial(int n, int k) {
      BigInteger r = BigInteger.ONE;
      for (int i = 0; i < k; i++) r = r.multiply(BigInteger.valueOf(n - i)).divide(BigInteger.valueOf(i + 1));
      return r;
    }
  }

  @Nested
  class CollapsedPosteriors {
    /** Two hypotheses whose totals differ by {@code gap} nats: the top one holds 1/(1+e^(−α·gap)) of the mass. */
    private UtteranceResult result(RescoreSession s, String id, double gap) {
      return s.rescore(utterance(id, row("", 1, "ten crates", 0.0), row("", 2, "ten crate", -gap)));
    }

    private RescoreSummary summary(RescoreMethod method, double... gaps) {
      RescoreSession s = plain().withWeights(plain().weights(), method);
      RescoreSummary sum = new RescoreSummary();
      for (int i = 0; i < gaps.length; i++) sum.add(result(s, "u" + i, gaps[i]), null);
      return sum;
    }

    @Test
    void warnsWhenMostUtterancesPutNearlyAllTheMassOnOneHypothesis() {
      // gap 10 nats: top mass 1/(1+e^−10) ≈ 0.99995 > 0.999; gap 1: ≈ 0.731
      RescoreSummary s = summary(RescoreMethod.MBR, 10, 10, 1);
      assertThat(s.collapsedUtterances()).isEqualTo(2);
      assertThat(s.warnings()).singleElement().asString().contains("posteriors are nearly all 0 or 1").contains("--posterior-sharpness");
    }

    @Test
    void doesNotWarnAtExactlyHalfOrForNBest() {
      assertThat(summary(RescoreMethod.CONSENSUS, 10, 1).warnings()).isEmpty();
      assertThat(summary(RescoreMethod.NBEST, 10, 10, 10).warnings()).isEmpty();
    }

    @Test
    void judgesEachSystemOnItsOwnMassBecauseSystemsAreMixedByWeight() {
      RescoreSession s = plain().withWeights(plain().weights(), RescoreMethod.CONSENSUS);
      RescoreSummary sum = new RescoreSummary();
      // system a collapsed, system b a single reading (nothing to collapse): collapsed although a holds only 1/2 overall
      sum.add(s.rescore(utterance("u1", row("a", 1, "ten crates", 0.0), row("a", 2, "ten crate", -10.0), row("b", 1, "ten crates", 0.0))), null);
      // system a collapsed, system b not (gap 1 nat): not collapsed
      sum.add(s.rescore(utterance("u2", row("a", 1, "ten crates", 0.0), row("a", 2, "ten crate", -10.0),
          row("b", 1, "ten crates", 0.0), row("b", 2, "tan crates", -1.0))), null);
      // one reading per system only: the utterance does not count
      sum.add(s.rescore(utterance("u3", row("a", 1, "ten crates", 0.0), row("b", 1, "ten crate", 0.0))), null);
      assertThat(sum.posteriorUtterances()).isEqualTo(2);
      assertThat(sum.collapsedUtterances()).isEqualTo(1);
    }

    @Test
    void theThresholdSitsBetweenNeighbouringGaps() {
      // 1/(1+e^−g) > 0.999 ⇔ g > ln 999 ≈ 6.907 (solve the logistic function)
      double edge = Math.log(999);
      assertThat(summary(RescoreMethod.LATTICE, edge + 0.01, edge + 0.01).posteriorsCollapsed()).isTrue();
      assertThat(summary(RescoreMethod.LATTICE, edge - 0.01, edge - 0.01).posteriorsCollapsed()).isFalse();
    }
  }

  private static RescoreSession plain() {
    return RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).build());
  }
}
