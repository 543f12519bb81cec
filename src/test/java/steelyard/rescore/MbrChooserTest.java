package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static steelyard.rescore.Fixtures.row;
import static steelyard.rescore.Fixtures.utterance;

import org.junit.jupiter.api.Test;

/** MBR choice (Stolcke, Konig &amp; Weintraub 1997; Goel &amp; Byrne 2000) with L = word edit distance. */
class MbrChooserTest {
  private final MbrChooser mbr = new MbrChooser(Fixtures::referenceDistance, 100);

  private static ScoredUtterance scores(Object[]... rows) {
    return new HypothesisScorer(null, Fixtures.WHITESPACE, Fixtures.WHITESPACE, 1, 0).score(utterance("u", rows));
  }

  private static int[] ties(ScoredUtterance s) {
    int[] t = new int[s.size()];
    for (int i = 0; i < t.length; i++) t[i] = s.tieOrder(i);
    return t;
  }

  @Test
  void identicalHypothesesGiveThatHypothesis() {
    ScoredUtterance s = scores(row("a", 1, "six pallets of leeks", 0), row("b", 1, "six pallets of leeks", 0),
        row("c", 1, "six pallets of leeks", 0));
    MbrChoice c = mbr.choose(s.tokenIds(), new double[] {0.2, 0.5, 0.3}, ties(s));
    assertThat(s.hypothesis(c.chosen()).text()).isEqualTo("six pallets of leeks");
    assertThat(c.chosen()).as("the member with the most mass stands for the merged text").isEqualTo(1);
    assertThat(c.expectedErrors()).isEqualTo(0.0);
    assertThat(c.distinctTexts()).isEqualTo(1);
    assertThat(c.capped()).isFalse();
  }

  /**
   * Worked by hand. A "bay nine shut" p 0.40; B "load bay nine" p 0.32; C "load bay five" p 0.28.
   * Edit distances: L(A,B) = 2 (insert load, delete shut);
   * L(A,C) = 3 (insert load, nine→five, delete shut); L(B,C) = 1 (nine→five).
   * Expected errors: A = 0.32·2 + 0.28·3 = 1.48; B = 0.40·2 + 0.28·1 = 1.08; C = 0.40·3 + 0.32·1 = 1.52.
   * MBR picks B although A has the highest posterior.
   */
  @Test
  void differsFromTheTopPosteriorWhenTheTopIsAnOutlier() {
    ScoredUtterance s = scores(row("", 1, "bay nine shut", 0), row("", 2, "load bay nine", 0), row("", 3, "load bay five", 0));
    MbrChoice c = mbr.choose(s.tokenIds(), new double[] {0.40, 0.32, 0.28}, ties(s));
    assertThat(c.chosen()).isEqualTo(1);
    assertThat(c.expectedErrors()).isCloseTo(1.08, within(1e-12));
  }

  /**
   * Worked by hand: B and B′ are the same text from two systems (0.3 + 0.3 = 0.6 merged), A differs in every
   * word (L = 2). Expected errors: A = 0.6·2 = 1.2; B = 0.4·2 = 0.8 → B, whose mass only wins once merged.
   */
  @Test
  void identicalTextsMergeTheirMassFirst() {
    ScoredUtterance s = scores(row("x", 1, "crate ten", 0), row("x", 2, "great hen", 0), row("y", 1, "great hen", 0));
    MbrChoice c = mbr.choose(s.tokenIds(), new double[] {0.4, 0.3, 0.3}, ties(s));
    assertThat(s.hypothesis(c.chosen()).text()).isEqualTo("great hen");
    assertThat(c.chosen()).as("equal mass: the earlier tie order (rank 1 of system y) stands for the text").isEqualTo(2);
    assertThat(c.expectedErrors()).isCloseTo(0.8, within(1e-12));
  }

  @Test
  void saysWhenTheCapApplied() {
    ScoredUtterance s = scores(row("", 1, "a", 0), row("", 2, "b", 0), row("", 3, "c", 0));
    MbrChoice c = new MbrChooser(Fixtures::referenceDistance, 2).choose(s.tokenIds(), new double[] {0.5, 0.3, 0.2}, ties(s));
    assertThat(c.capped()).isTrue();
    assertThat(c.distinctTexts()).isEqualTo(3);
    // within the two kept texts (renormalised 0.625 / 0.375) both have expected errors ≥ 0.375: the heavier wins
    assertThat(c.chosen()).isEqualTo(0);
    assertThat(c.expectedErrors()).isCloseTo(0.375, within(1e-12));
  }

  @Test
  void equalExpectedErrorsGoToTheRecognisersOrder() {
    ScoredUtterance s = scores(row("", 2, "b", 0), row("", 1, "a", 0));
    MbrChoice c = mbr.choose(s.tokenIds(), new double[] {0.5, 0.5}, ties(s));
    assertThat(s.hypothesis(c.chosen()).text()).isEqualTo("a");
  }
}
