package steelyard.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static steelyard.audit.AuditFixtures.LN10;
import static steelyard.audit.AuditFixtures.row;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import steelyard.audit.ScoreBreakdown.Kind;
import steelyard.eval.TokenTally;
import steelyard.lm.BackoffModel;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.UtteranceResult;

/**
 * A hand-worked three-hypothesis N-best list under a unigram model (log10 P: a −1, b −2, {@code </s>} 0), with
 * L = ln 10: rank 1 "b b" (acoustic 0, ln P −4L), "a" (acoustic −2L, ln P −L), "" (acoustic −8L, ln P 0). With
 * acoustic weight 1 and μ = 0 the totals are the lines 0 − 4L·λ, −2L − L·λ and −8L; solving the pairwise
 * crossings by hand: "b b" wins below λ = 2/3, "a" between 2/3 and 6, "" above 6 (check at λ = 3: −12L, −5L, −8L).
 */
class OverruleAuditorTest {
  static final BackoffModel LM = AuditFixtures.unigrams(Map.of("a", -1.0, "b", -2.0, "</s>", 0.0, "<unk>", -3.0));

  static UtteranceResult rescored(double lambda) {
    RescoreWeights w = AuditFixtures.weights(lambda, 0, 1, 0, 0);
    return AuditFixtures.rescorer(LM, w, RescoreMethod.NBEST)
        .rescore(AuditFixtures.utterance("u1", "spk01", row("b b", 0), row("a", -2 * LN10), row("", -8 * LN10)));
  }

  static Overrule audit(double lambda, String reference) {
    UtteranceResult r = rescored(lambda);
    OverruleAuditor auditor = new OverruleAuditor(AuditFixtures.settings(LM, AuditFixtures.weights(lambda, 0, 1, 0, 0)));
    return auditor.audit(AuditInput.of(r, reference == null ? null : AuditFixtures.tokens(reference)));
  }

  @Test
  void aPickEqualToRankOneIsNoOverrule() {
    assertThat(audit(0.5, "a")).isNull();
  }

  @Nested
  class AtLambdaOne {
    final Overrule o = audit(1, "a");

    @Test
    void picksTheMiddleHypothesisOverRankOne() {
      assertThat(o.pick().text()).isEqualTo("a");
      assertThat(o.first().text()).isEqualTo("b b");
      assertThat(o.first().rank()).isEqualTo(1);
    }

    @Test
    void flipWeightsAreTheHandWorkedBreakpoints() {
      FlipWeights f = o.flip();
      assertThat(f.basis()).isEqualTo(FlipWeights.Basis.EXACT);
      assertThat(f.weight()).isEqualTo(1.0);
      assertThat(f.lower()).isCloseTo(2.0 / 3, within(1e-12));
      assertThat(f.upper()).isCloseTo(6.0, within(1e-12));
      assertThat(f.belowTokens()).containsExactly("b", "b");
      assertThat(f.aboveTokens()).isEmpty();
      assertThat(f.firstLow()).isEqualTo(Double.NEGATIVE_INFINITY);
      assertThat(f.firstHigh()).isCloseTo(2.0 / 3, within(1e-12));
      assertThat(f.returnWeight()).isCloseTo(2.0 / 3, within(1e-12));
      assertThat(f.distance()).isCloseTo(1.0 / 3, within(1e-12));
      assertThat(f.lines()).isEqualTo(3);
    }

    @Test
    void breakdownShowsEveryTermAndTheMargin() {
      ScoreBreakdown b = o.breakdown();
      assertThat(b.term(Kind.FEATURE).delta()).isCloseTo(-2 * LN10, within(1e-12));
      assertThat(b.term(Kind.LM).delta()).isCloseTo(3 * LN10, within(1e-12));
      assertThat(b.term(Kind.LM).pickValue()).isCloseTo(-LN10, within(1e-12));
      assertThat(b.term(Kind.OOV).delta()).isZero();
      assertThat(b.term(Kind.LENGTH).pickValue()).isEqualTo(1);
      assertThat(b.term(Kind.LENGTH).firstValue()).isEqualTo(2);
      assertThat(b.margin()).isCloseTo(LN10, within(1e-12));
      assertThat(b.terms().stream().mapToDouble(ScoreBreakdown.Term::pickWeighted).sum()).isCloseTo(b.pickTotal(), within(1e-12));
    }

    @Test
    void decisiveNgramsListTheDeletedAndTheSubstitutedWord() {
      DecisiveNgrams d = o.ngrams();
      assertThat(d.delta()).isCloseTo(3 * LN10, within(1e-12));
      assertThat(d.regions()).isEqualTo(1);
      // alignment of rank 1 "b b" to the pick "a": b deleted, then b → a; </s> has the same (empty) context
      assertThat(d.contributions()).hasSize(2);
      assertThat(d.contributions().get(0).pick()).isNull();
      assertThat(d.contributions().get(0).first().ngram()).containsExactly("b");
      assertThat(d.contributions().get(0).difference()).isCloseTo(2 * LN10, within(1e-12));
      assertThat(d.contributions().get(1).pick().ngram()).containsExactly("a");
      assertThat(d.contributions().get(1).difference()).isCloseTo(LN10, within(1e-12));
      assertThat(d.listedSum()).isCloseTo(d.delta(), within(1e-12));
    }

    @Test
    void errorPairsRankOneLostAreListedAsFixed() {
      // reference "a" against "b b": the backtrace takes the substitution a → b last, the insertion of b first
      assertThat(o.fixed()).containsExactly(new TokenTally("", "b", 1), new TokenTally("a", "b", 1));
      assertThat(o.broken()).isEmpty();
      assertThat(o.errorChange()).isEqualTo(2);
      assertThat(o.group()).isEqualTo("spk01");
    }
  }

  @ParameterizedTest(name = "[{index}] reference ''{0}'' → {1}")
  @CsvSource({"a, HELPED, 0, 2", "b b, HURT, 2, 0", "a b, NEUTRAL, 1, 1", "c, HELPED, 1, 2"})
  void verdictComparesTheErrorCounts(String reference, Verdict verdict, long pickErrors, long firstErrors) {
    Overrule o = audit(1, reference);
    assertThat(o.verdict()).isEqualTo(verdict);
    assertThat(o.pick().errors()).isEqualTo(pickErrors);
    assertThat(o.first().errors()).isEqualTo(firstErrors);
  }

  @Test
  void withoutAReferenceTheOverruleIsUnverified() {
    Overrule o = audit(1, null);
    assertThat(o.verdict()).isEqualTo(Verdict.UNVERIFIED);
    assertThat(o.errorChange()).isZero();
    assertThat(o.fixed()).isEmpty();
    assertThat(o.reference()).isNull();
  }

  @Test
  void summaryCountsAndTiesTheNetChangeToTheCorpusErrors() {
    OverruleAuditor auditor = new OverruleAuditor(AuditFixtures.settings(LM, AuditFixtures.weights(1, 0, 1, 0, 0)));
    UtteranceResult r = rescored(1);
    AuditReport report = auditor.auditAll(List.of(
        AuditInput.of(r, AuditFixtures.tokens("a")), new AuditInput(r, AuditFixtures.tokens("b b"), "spk02"),
        AuditInput.of(r, null), AuditInput.of(rescored(0.5), AuditFixtures.tokens("a"))));
    assertThat(report.utterances()).isEqualTo(4);
    assertThat(report.total().overrules()).isEqualTo(3);
    assertThat(report.total().helped()).isEqualTo(1);
    assertThat(report.total().hurt()).isEqualTo(1);
    assertThat(report.total().unverified()).isEqualTo(1);
    assertThat(report.total().netErrorChange()).isEqualTo(0);
    // rank 1 "b b": 2 + 0 + 2 errors; picks "a", "a", "b b": 0 + 2 + 2
    assertThat(report.firstErrors() - report.chosenErrors()).isEqualTo(report.total().netErrorChange());
    assertThat(report.groups()).extracting(AuditCounts::group).containsExactly("spk01", "spk02");
    assertThat(report.groups().get(1).hurt()).isEqualTo(1);
    assertThat(report.groups().get(1).mostBroken()).containsExactly(new TokenTally("b", "", 1), new TokenTally("b", "a", 1));
  }
}
