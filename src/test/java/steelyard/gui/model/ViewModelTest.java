package steelyard.gui.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.gui.model.AlignedPair.Kind;
import steelyard.gui.model.Choices.Verdict;
import steelyard.rescore.RescoreMethod;

/**
 * The rows behind each table and the series behind each chart for {@link TinyCorpus}, against values worked
 * out by hand in its javadoc (edit distances by hand; ln P = ln 10 · Σ log10 values of the unigram model).
 */
class ViewModelTest {
  private static final double LN10 = Math.log(10);
  @TempDir Path dir;
  Workspace w;

  @BeforeEach
  void open() throws IOException {
    w = TinyCorpus.open(dir);
  }

  @Nested
  class UtteranceList {
    @Test
    void atLambdaZeroTheSecondUtteranceIsHelped() {
      List<UtteranceRow> rows = UtteranceRow.all(w.corpus(), w.rerank(TinyCorpus.at(w, 0, 0)));
      assertThat(rows).extracting(UtteranceRow::uttId, UtteranceRow::group, UtteranceRow::firstErrors, UtteranceRow::pickErrors,
              UtteranceRow::difference, UtteranceRow::verdict, UtteranceRow::pickText)
          .containsExactly(
              org.assertj.core.groups.Tuple.tuple("a", "spk1", 0, 0, 0, Verdict.SAME, "ten crates"),
              org.assertj.core.groups.Tuple.tuple("b", "spk2", 1, 0, -1, Verdict.HELPED, "day nine"),
              org.assertj.core.groups.Tuple.tuple("c", "spk1", 1, 1, 0, Verdict.SAME, "load pears"));
    }

    @Test
    void filtersKeepOnlyTheirRows() {
      Choices c = w.rerank(TinyCorpus.at(w, 0, 0));
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.CHANGED, ""))).containsExactly("b");
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.HELPED, ""))).containsExactly("b");
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.HURT, ""))).isEmpty();
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.STILL_WRONG, ""))).containsExactly("c");
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.NEW_TRANSCRIPT, ""))).isEmpty();
    }

    @Test
    void searchMatchesIdPickRankOneAndReference() {
      Choices c = w.rerank(TinyCorpus.at(w, 0, 0));
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.ALL, "BAY"))).containsExactly("b");
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.ALL, "the pears"))).containsExactly("c");
      assertThat(ids(UtteranceRow.filtered(w.corpus(), c, UtteranceFilter.ALL, "a"))).containsExactly("a", "b", "c");
    }

    @Test
    void aboveTheFlipWeightNothingChanges() {
      Choices c = w.rerank(TinyCorpus.at(w, TinyCorpus.FLIP + 1e-6, 0));
      assertThat(c.figures()).isEqualTo(new CorpusFigures(3, 3, 7, 2, 2, 1, 0, 0, 0, 0));
      Choices below = w.rerank(TinyCorpus.at(w, TinyCorpus.FLIP - 1e-6, 0));
      assertThat(below.figures()).isEqualTo(new CorpusFigures(3, 3, 7, 1, 2, 1, 1, 1, 0, 0));
    }

    private List<String> ids(List<UtteranceRow> rows) {
      return rows.stream().map(UtteranceRow::uttId).toList();
    }
  }

  @Nested
  class HypothesisTable {
    @Test
    void rowsCarryEveryTermWeightedAndTheNewOrder() {
      var r = w.explain(1, TinyCorpus.at(w, 0.1, 0.5), RescoreMethod.NBEST);
      List<HypothesisRow> rows = HypothesisRow.of(w.corpus(), 1, r);
      // totals: b2 = −7.5 + 0.1·ln10·(−2 −1 −1) + 0.5·2; b1 = −8 + 0.1·ln10·(−1 −1 −1) + 0.5·2
      double b2 = -7.5 + 0.1 * LN10 * -4 + 1;
      double b1 = -8 + 0.1 * LN10 * -3 + 1;
      assertThat(rows).extracting(HypothesisRow::newOrder, HypothesisRow::rank, HypothesisRow::text, HypothesisRow::chosen,
          HypothesisRow::first, HypothesisRow::errors).containsExactly(
              org.assertj.core.groups.Tuple.tuple(1, 2, "day nine", true, false, 0),
              org.assertj.core.groups.Tuple.tuple(2, 1, "bay nine", false, true, 1));
      assertThat(rows.get(0).total()).isCloseTo(b2, within(1e-5));
      assertThat(rows.get(1).total()).isCloseTo(b1, within(1e-5));
      assertThat(rows.get(0).raw()).containsExactly(new double[] {-7.5, -4 * LN10, 0, 2}, within(1e-5));
      assertThat(rows.get(0).weighted()).containsExactly(new double[] {-7.5, -0.4 * LN10, 0, 1}, within(1e-5));
      // posteriors at α = 1: softmax of the totals
      double p2 = 1 / (1 + Math.exp(b1 - b2));
      assertThat(rows.get(0).posterior()).isCloseTo(p2, within(1e-6));
    }

    @Test
    void relativeBreakdownIsZeroForThePickAndTheTotalDifferenceForTheOthers() {
      var r = w.explain(1, TinyCorpus.at(w, 0.1, 0.5), RescoreMethod.NBEST);
      List<HypothesisRow> rows = HypothesisRow.of(w.corpus(), 1, r);
      Breakdown b = Breakdown.of(rows, ScoreTerms.names(w.corpus().featureNames()), true, 10);
      assertThat(b.labels()).containsExactly("#1 · rank 2 (pick)", "#2 · rank 1");
      assertThat(b.terms()).containsExactly("acoustic", "model ln P", "OOV", "length");
      assertThat(b.values()[0]).containsExactly(0, 0, 0, 0);
      assertThat(b.values()[1]).containsExactly(new double[] {-0.5, 0.1 * LN10, 0, 0}, within(1e-5));
      assertThat(java.util.Arrays.stream(b.values()[1]).sum()).isCloseTo(rows.get(1).total() - rows.get(0).total(), within(1e-9));
    }
  }

  @Nested
  class Alignments {
    @Test
    void aDeletionIsMarkedWithItsLetter() {
      var ref = w.corpus().referenceTokens(2);
      List<String> hyp = List.of("load", "pears");
      List<AlignedPair> cols = AlignedPair.columns(w.align(2, hyp, null), ref, hyp, null);
      assertThat(cols).containsExactly(new AlignedPair(Kind.CORRECT, "load", "load"), new AlignedPair(Kind.DELETION, "the", null),
          new AlignedPair(Kind.CORRECT, "pears", "pears"));
      assertThat(cols.get(1).kind().mark()).isEqualTo("D");
      assertThat(AlignedPair.counts(cols)).containsExactly(0, 1, 0);
    }

    @Test
    void substitutionAndInsertionAndIgnoredTokens() {
      var ref = w.corpus().referenceTokens(1);
      List<String> hyp = List.of("uh", "bay", "nine", "crates");
      boolean[] optional = {true, false, false, false};
      List<AlignedPair> cols = AlignedPair.columns(w.align(1, hyp, optional), ref, hyp, optional);
      assertThat(cols).containsExactly(new AlignedPair(Kind.IGNORED, null, "uh"), new AlignedPair(Kind.SUBSTITUTION, "day", "bay"),
          new AlignedPair(Kind.CORRECT, "nine", "nine"), new AlignedPair(Kind.INSERTION, null, "crates"));
      assertThat(cols).extracting(p -> p.kind().mark()).containsExactly("opt", "S", "", "I");
    }
  }

  @Nested
  class OverruleTable {
    @Test
    void theOneOverruleFlipsBackExactlyWhereTheHandWorkedLinesCross() {
      var report = w.audit(TinyCorpus.at(w, 0.1, 0), RescoreMethod.NBEST, TaskProgress.NONE);
      List<OverruleRow> rows = OverruleRow.of(report);
      assertThat(rows).extracting(OverruleRow::uttId, OverruleRow::verdict, OverruleRow::firstErrors, OverruleRow::pickErrors,
          OverruleRow::flipExact).containsExactly(org.assertj.core.groups.Tuple.tuple("b", steelyard.audit.Verdict.HELPED, 1L, 0L, true));
      OverruleRow b = rows.get(0);
      // margin: total(day nine) − total(bay nine) = 0.5 − λ·ln 10 at λ = 0.1
      assertThat(b.margin()).isCloseTo(0.5 - 0.1 * LN10, within(1e-5));
      assertThat(b.flipLow()).isEqualTo(Double.NEGATIVE_INFINITY);
      assertThat(b.flipHigh()).isCloseTo(TinyCorpus.FLIP, within(1e-6));
      assertThat(b.returnWeight()).isCloseTo(TinyCorpus.FLIP, within(1e-6));
      // the only differing token: ln P(day) − ln P(bay) = (−2 − (−1))·ln 10
      assertThat(b.topNgram()).isEqualTo(String.format(java.util.Locale.ROOT, "\"day\" %+.2f", -LN10));
      assertThat(report.total().netErrorChange()).isEqualTo(report.firstErrors() - report.chosenErrors()).isEqualTo(1);
    }
  }

  @Nested
  class Charts {
    @Test
    void errorAndHelpedAlongLambdaStepExactlyAtTheFlipWeight() {
      Sweeps.LambdaSweep s = Sweeps.lambda(w, TinyCorpus.at(w, 0.2, 0), 0, 1);
      assertThat(s.lambdas()).containsExactly(new double[] {0, TinyCorpus.FLIP, 1}, within(1e-9));
      assertThat(s.errorRate()).containsExactly(1 / 7.0, 2 / 7.0, 2 / 7.0);
      assertThat(s.helped()).containsExactly(1, 0, 0);
      assertThat(s.hurt()).containsExactly(0, 0, 0);
      assertThat(s.firstRate()).isEqualTo(2 / 7.0);
      assertThat(s.oracleRate()).isEqualTo(1 / 7.0);
      assertThat(s.current()).isEqualTo(0.2);
    }

    @Test
    void surfaceCellsAreTheErrorAtEachLambdaAndMu() {
      // μ adds μ·2 to both hypotheses of b (two tokens each): it never changes a choice here
      Sweeps.Surface s = Sweeps.surface(w, TinyCorpus.at(w, 0, 0), new double[] {0, 1}, new double[] {-1, 0, 1});
      assertThat(s.errorRate()[0]).containsExactly(1 / 7.0, 1 / 7.0, 1 / 7.0);
      assertThat(s.errorRate()[1]).containsExactly(2 / 7.0, 2 / 7.0, 2 / 7.0);
      assertThat(s.best()).containsExactly(0, 0);
    }

    @Test
    void errorPerGroupSumsTheGroupsUtterances() {
      List<Sweeps.GroupErrors> g = Sweeps.perGroup(w.corpus(), w.rerank(TinyCorpus.at(w, 0, 0)));
      assertThat(g).containsExactly(new Sweeps.GroupErrors("spk1", 5, 0.2, 0.2, 0.2), new Sweeps.GroupErrors("spk2", 2, 0.5, 0, 0));
    }

    @Test
    void gridIsEvenlySpacedWithBothEnds() {
      assertThat(Sweeps.grid(0, 2, 5)).containsExactly(0, 0.5, 1, 1.5, 2);
    }
  }
}
